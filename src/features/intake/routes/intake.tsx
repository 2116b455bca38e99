import type { QueryClient } from '@tanstack/react-query';
import { FolderInput } from 'lucide-react';
import { hasRole, intakeManagerRoles } from '../../../../shared/workflow/roles';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { useMe } from '../../../hooks/use-me';
import { intakeFilesQueryOptions, useIntakeFiles } from '../api/get-intake-files';
import { intakeStatusQueryOptions, useIntakeStatus } from '../api/get-intake-status';
import { EccodesNotice } from '../components/eccodes-notice';
import { IntakeFilesTable } from '../components/intake-files-table';
import { PullSourcesPanel } from '../components/pull-sources-panel';

export const intakeLoader = (queryClient: QueryClient) => () => Promise.all([queryClient.prefetchQuery(intakeFilesQueryOptions()), queryClient.prefetchQuery(intakeStatusQueryOptions())]);

/** The intake: files taken in from the watched folder and scheduled pulls, with progress and reasons. */
export function IntakePage() {
  const files = useIntakeFiles();
  const status = useIntakeStatus();
  const me = useMe();
  const isManager = me.data ? hasRole(me.data.user.role, intakeManagerRoles) : false;
  const list = files.data?.files ?? [];

  return (
    <>
      <PageHeader
        title="Intake"
        description="Model fields (GRIB2), radiosonde observations (BUFR) and sounding CSV files are taken in on their own: dropped in the intake folder or fetched by a scheduled pull. Each file is recognised by its content, taken in once and moved to done/ or failed/."
      />
      {status.data ? <EccodesNotice status={status.data} /> : null}
      {status.data ? (
        <p className="mb-3 text-[13px] text-ink-muted">
          {status.data.folder.watching && status.data.folder.path ? (
            <>
              Intake folder: <code className="font-mono">{status.data.folder.path}</code> (watched)
            </>
          ) : (
            'No intake folder is watched on this server (set INTAKE_DIR or DATA_DIR).'
          )}
          {status.data.eccodes.available && status.data.eccodes.version ? ` · ecCodes ${status.data.eccodes.version}` : ''}
        </p>
      ) : null}
      {files.isPending ? <Loading label="Loading the intake…" /> : null}
      {files.isError ? (
        <Notice tone="error" title="We could not load the intake">
          {files.error.message}
        </Notice>
      ) : null}
      {files.data && files.data.active > 0 ? (
        <p className="mb-2 text-[13px] text-ink-muted" aria-live="polite">
          {files.data.active} file{files.data.active === 1 ? '' : 's'} being taken in…
        </p>
      ) : null}
      {files.data && list.length === 0 ? (
        <EmptyState icon={<FolderInput aria-hidden className="size-5" />} title="Nothing taken in yet.">
          Drop a GRIB2, BUFR or sounding CSV file in the intake folder, or add a scheduled pull.
        </EmptyState>
      ) : null}
      {list.length > 0 ? <IntakeFilesTable files={list} /> : null}
      {isManager ? <PullSourcesPanel /> : null}
    </>
  );
}
