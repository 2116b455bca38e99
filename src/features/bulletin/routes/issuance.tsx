import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { useMe } from '../../../hooks/use-me';
import { isApiError } from '../../../lib/api-client';
import { issuanceQuery, useIssuance } from '../api/get-issuance';
import { IssuanceDetails } from '../components/issuance-details';
import { IssuanceLeadActions } from '../components/issuance-lead-actions';
import { IssuanceRecord } from '../components/issuance-record';
import { issuanceStanding } from '../components/issuance-state-badge';
import { useNow } from '../../../hooks/use-now';
import { VerificationPanel } from '../components/verification-panel';
import { formatInstant } from '../utils/issuance-format';

export const issuanceLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.issuanceNumber) void queryClient.prefetchQuery(issuanceQuery(params.issuanceNumber));
    return null;
  };

/** The permanent page of one issuance, readable whatever became of it. */
export function IssuancePage() {
  const issuanceNumber = useParams().issuanceNumber ?? '';
  const issuance = useIssuance(issuanceNumber);
  const me = useMe();
  const isLead = me.data?.user.role === 'lead';
  const now = useNow();
  const officeZone = issuance.data?.snapshot.office.timeZone ?? 'UTC';

  return (
    <div className="space-y-5">
      <nav aria-label="Breadcrumb" className="text-sm text-ink-muted">
        <Link to="/bulletin" className="hover:text-ink">
          Bulletin
        </Link>{' '}
        /{' '}
        <Link to="/archive" className="hover:text-ink">
          Archive
        </Link>{' '}
        / <span className="text-ink">{issuanceNumber}</span>
      </nav>
      <h1 className="text-2xl font-semibold tracking-tight">Outlook issuance {issuanceNumber}</h1>

      {issuance.isPending ? <Loading label="Loading the issuance…" /> : null}
      {issuance.isError ? (
        <Notice tone="error" title={isApiError(issuance.error) && issuance.error.status === 404 ? 'No such issuance' : 'The issuance could not be loaded'}>
          {issuance.error.message} <Link to="/archive" className="text-accent hover:underline">Search the archive.</Link>
        </Notice>
      ) : null}

      {issuance.data ? (
        <>
          {issuance.data.state === 'superseded' ? (
            <Notice tone="warning" title="This issuance has been superseded">
              A newer outlook replaces it
              {issuance.data.supersededByNumber ? (
                <>
                  {': '}
                  <Link to={`/issuances/${issuance.data.supersededByNumber}`} className="font-semibold text-accent hover:underline">
                    issuance {issuance.data.supersededByNumber}
                  </Link>
                </>
              ) : null}
              . It stays here as a record.
            </Notice>
          ) : null}
          {issuance.data.state === 'withdrawn' ? (
            <Notice tone="error" title="This issuance has been withdrawn">
              {issuance.data.withdrawnAt ? `Withdrawn ${formatInstant(issuance.data.withdrawnAt)}. ` : null}
              Reason: {issuance.data.withdrawnReason ?? 'none given'}. Do not use it for planning.
            </Notice>
          ) : null}
          {issuance.data.supersedesNumber ? (
            <p className="text-sm text-ink-muted">
              This issuance amends{' '}
              <Link to={`/issuances/${issuance.data.supersedesNumber}`} className="text-accent hover:underline">
                issuance {issuance.data.supersedesNumber}
              </Link>
              .
            </p>
          ) : null}
          {issuanceStanding(issuance.data, now) === 'expired' ? (
            <Notice tone="warning" title="This outlook has expired">
              Its valid period ended {formatInstant(issuance.data.validUntil)}
              {officeZone !== 'UTC' ? ` (${formatInstant(issuance.data.validUntil, officeZone)})` : ''}. It is no longer in force and stays here as a record.{' '}
              <Link to="/bulletin" className="font-semibold text-accent hover:underline">
                See what is in force now.
              </Link>
            </Notice>
          ) : null}
          <IssuanceDetails issuance={issuance.data} variant="page" now={now}>
            <IssuanceRecord issuance={issuance.data} />
          </IssuanceDetails>
          <VerificationPanel issuance={issuance.data} />
          {isLead && issuance.data.state === 'published' ? <IssuanceLeadActions issuance={issuance.data} /> : null}
        </>
      ) : null}
    </div>
  );
}
