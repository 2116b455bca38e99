import type { QueryClient } from '@tanstack/react-query';
import { ChevronLeft, ChevronRight, FileUp, Map as MapIcon } from 'lucide-react';
import { useCallback, useState } from 'react';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { Button, ButtonLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import type { SoundingListQuery, SoundingSummary } from '../../../../shared/contracts/soundings';
import { useMe } from '../../../hooks/use-me';
import { useOffice } from '../../../hooks/use-office';
import { useUnits } from '../../../hooks/use-units';
import { formFailureFrom } from '../../../utils/form';
import { useDeleteSounding } from '../api/delete-sounding';
import { soundingsListQuery, useSoundings } from '../api/get-soundings';
import { DeleteSoundingDialog } from '../components/delete-sounding-dialog';
import { LibraryFilterBar } from '../components/library-filter-bar';
import { ModelRunsPanel } from '../components/model-runs-panel';
import { SoundingsTable } from '../components/soundings-table';
import { filtersFromSearchParams, pageCount, searchParamsFromFilters, withFilterChange } from '../utils/library-filters';
import { canDeleteSounding, canWriteSoundings } from '../utils/sounding-permissions';

/** Warms the page of the library the address asks for. */
export const soundingLibraryLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    queryClient.prefetchQuery(soundingsListQuery(filtersFromSearchParams(new URL(request.url).searchParams)));

export function SoundingLibraryPage() {
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = filtersFromSearchParams(searchParams);
  const soundings = useSoundings(filters);
  const me = useMe();
  const office = useOffice();
  const units = useUnits();
  const deleteSounding = useDeleteSounding();
  const [deleting, setDeleting] = useState<SoundingSummary | null>(null);
  const [deleteProblem, setDeleteProblem] = useState<string | null>(null);
  const [deletedNote, setDeletedNote] = useState<string | null>(null);

  const viewer = me.data?.user;
  const mayWrite = viewer !== undefined && canWriteSoundings(viewer.role);

  const setFilters = useCallback(
    (update: (current: SoundingListQuery) => SoundingListQuery) =>
      setSearchParams((current) => searchParamsFromFilters(update(filtersFromSearchParams(current))), { replace: true }),
    [setSearchParams],
  );
  const changeFilters = useCallback((change: Partial<SoundingListQuery>) => setFilters((current) => withFilterChange(current, change)), [setFilters]);
  const canDelete = useCallback((sounding: SoundingSummary) => (viewer ? canDeleteSounding(viewer, sounding) : false), [viewer]);
  const askToDelete = useCallback((sounding: SoundingSummary) => {
    setDeleteProblem(null);
    setDeleting(sounding);
  }, []);

  function confirmDelete(sounding: SoundingSummary) {
    deleteSounding.mutate(sounding.id, {
      onSuccess: ({ deleted }) => {
        setDeleting(null);
        setDeletedNote(
          `Deleted ${sounding.stationId}${deleted > 1 ? ` and ${deleted - 1} modified ${deleted - 1 === 1 ? 'sounding' : 'soundings'} made from it` : ''}.`,
        );
      },
      onError: (error) => setDeleteProblem(formFailureFrom(error).message),
    });
  }

  const data = soundings.data;
  const pages = data ? pageCount(data.total, data.pageSize) : 1;
  const filtered = filters.station !== undefined || filters.source !== undefined || filters.validFrom !== undefined || filters.validTo !== undefined || filters.modified !== 'include';

  return (
    <>
      <PageHeader
        title="Sounding library"
        description="Observed and model soundings for this office, with the figures that back a risk area. Open one to read it on the diagram and try a what-if."
        actions={
          <>
            <ButtonLink to="/soundings/map" variant="secondary">
              <MapIcon aria-hidden className="size-4" />
              Map
            </ButtonLink>
            {mayWrite ? (
              <ButtonLink to="/soundings/upload">
                <FileUp aria-hidden className="size-4" />
                Upload soundings
              </ButtonLink>
            ) : null}
          </>
        }
      />
      <div className="space-y-3">
        <LibraryFilterBar filters={filters} onChange={changeFilters} onClear={() => setFilters(() => withFilterChange(filtersFromSearchParams(new URLSearchParams()), {}))} />
        <ModelRunsPanel
          runId={searchParams.get('run') ?? undefined}
          onRunChange={(runId) =>
            setSearchParams((current) => {
              const next = new URLSearchParams(current);
              if (runId) next.set('run', runId);
              else next.delete('run');
              return next;
            }, { replace: true })
          }
          role={viewer?.role}
          units={units}
        />
        {deletedNote ? (
          <Notice tone="success" actions={<Button size="sm" variant="ghost" onClick={() => setDeletedNote(null)}>Dismiss</Button>}>
            {deletedNote}
          </Notice>
        ) : null}
        {soundings.isPending ? <Loading label="Loading soundings…" /> : null}
        {soundings.isError ? (
          <Notice tone="error" title="We could not load the soundings">
            {soundings.error.message}
          </Notice>
        ) : null}
        {data && data.total === 0 && !filtered ? (
          <EmptyState
            icon={<FileUp aria-hidden className="size-5" />}
            title="No soundings yet"
            actions={mayWrite ? <ButtonLink to="/soundings/upload">Upload soundings</ButtonLink> : null}
          >
            {mayWrite
              ? 'Upload observed or model soundings as exchange-CSV files. They appear here with their key figures and open on the diagram.'
              : 'Forecasters and leads upload soundings. Once they do, they appear here with their key figures.'}
          </EmptyState>
        ) : null}
        {data && data.total === 0 && filtered ? (
          <EmptyState title="No soundings match these filters">Widen the valid-time range, clear the station search, or clear all filters.</EmptyState>
        ) : null}
        {data && data.total > 0 ? (
          <>
            <SoundingsTable
              soundings={data.soundings}
              sort={filters.sort}
              order={filters.order}
              onSortChange={(sort, order) => changeFilters({ sort, order })}
              units={units}
              timeZone={office.data?.timeZone ?? 'UTC'}
              canDelete={canDelete}
              onDelete={askToDelete}
              busy={deleteSounding.isPending}
            />
            <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3 text-sm text-ink-muted">
              <p>
                {(data.page - 1) * data.pageSize + 1}–{Math.min(data.page * data.pageSize, data.total)} of {data.total} soundings
                {soundings.isFetching ? <span className="ml-2 text-ink-faint">Updating…</span> : null}
              </p>
              <div className="flex items-center gap-2">
                <label htmlFor="library-page-size" className="text-[13px]">
                  Rows
                </label>
                <select
                  id="library-page-size"
                  className="rounded-md border border-line-strong bg-panel px-2 py-1 text-sm text-ink"
                  value={filters.pageSize}
                  onChange={(event) => changeFilters({ pageSize: Number(event.target.value) })}
                >
                  {[25, 50, 100, 200].map((size) => (
                    <option key={size} value={size}>
                      {size}
                    </option>
                  ))}
                </select>
                <Button size="sm" variant="secondary" disabled={data.page <= 1} onClick={() => changeFilters({ page: data.page - 1 })}>
                  <ChevronLeft aria-hidden className="size-3.5" />
                  Previous
                </Button>
                <span className="text-[13px]">
                  Page {data.page} of {pages}
                </span>
                <Button size="sm" variant="secondary" disabled={data.page >= pages} onClick={() => changeFilters({ page: data.page + 1 })}>
                  Next
                  <ChevronRight aria-hidden className="size-3.5" />
                </Button>
              </div>
            </nav>
          </>
        ) : null}
      </div>
      <DeleteSoundingDialog
        sounding={deleting}
        busy={deleteSounding.isPending}
        problem={deleteProblem}
        onConfirm={confirmDelete}
        onCancel={() => setDeleting(null)}
      />
    </>
  );
}
