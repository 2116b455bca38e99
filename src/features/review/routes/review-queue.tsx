import type { QueryClient } from '@tanstack/react-query';
import { ClipboardCheck } from 'lucide-react';
import { Link } from 'react-router';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { formatTimestampUtc } from '../../../utils/time';
import { useQueueSupport } from '../api/get-queue-support';
import { outlookStateLabels } from '../../../../shared/workflow/states';
import { reviewQueueQueries, useReviewQueue } from '../api/get-review-queue';
import { supportSummary } from '../utils/support-summary';

/** Warms the queue without holding up navigation (the page shows its own loading state). */
export const reviewQueueLoader = (queryClient: QueryClient) => () => {
  for (const query of reviewQueueQueries()) void queryClient.prefetchQuery(query);
  return Promise.resolve();
};

/** The lead forecaster's home: drafts submitted for review, and approved ones waiting to go out. */
export function ReviewQueuePage() {
  const queue = useReviewQueue();
  const outlooks = queue.data ?? [];
  const support = useQueueSupport(outlooks.map((o) => o.id));

  return (
    <>
      <PageHeader
        title="Review queue"
        description="Drafts submitted by forecasters, waiting for you to return them with comments or approve and publish."
      />
      {queue.isPending ? <Loading label="Loading the queue…" /> : null}
      {queue.error ? <Notice tone="error" title="The queue could not be loaded">{queue.error.message}</Notice> : null}
      {queue.isSuccess && outlooks.length === 0 ? (
        <EmptyState icon={<ClipboardCheck aria-hidden className="size-5" />} title="No outlooks in review.">
          When a forecaster submits a draft, it appears here with its risk areas and evidence. You cannot approve a version whose
          content you edited; another lead reviews those.
        </EmptyState>
      ) : null}
      {outlooks.length > 0 ? (
        <div className="relative overflow-x-auto rounded-lg border border-line bg-panel">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-line bg-sunken text-[13px] text-ink-muted">
              <tr>
                <th className="px-3 py-2 font-medium">Outlook</th>
                <th className="px-3 py-2 font-medium">State</th>
                <th className="px-3 py-2 font-medium">Valid (UTC)</th>
                <th className="px-3 py-2 font-medium">Last edited by</th>
                <th className="px-3 py-2 font-medium">Support check</th>
              </tr>
            </thead>
            <tbody>
              {outlooks.map((outlook, index) => {
                const report = support[index];
                return (
                  <tr key={outlook.id} className="border-b border-line align-top last:border-0">
                    <td className="px-3 py-2">
                      <Link to={`/review/${outlook.id}`} className="font-semibold text-accent hover:underline">
                        Day {outlook.day}: {outlook.headline || 'No headline'}
                      </Link>
                      <span className="block text-[12px] text-ink-muted">
                        {outlook.areaCount} risk area{outlook.areaCount === 1 ? '' : 's'}
                      </span>
                    </td>
                    <td className="px-3 py-2 whitespace-nowrap">{outlookStateLabels[outlook.state]}</td>
                    <td className="px-3 py-2 text-[13px] whitespace-nowrap">
                      {formatTimestampUtc(outlook.validFrom)}
                      <span className="block text-ink-muted">to {formatTimestampUtc(outlook.validUntil)}</span>
                    </td>
                    <td className="px-3 py-2">{outlook.lastEditedByName ?? '—'}</td>
                    <td className="px-3 py-2 text-[13px]">
                      {report?.data ? supportSummary(report.data.areas.map((a) => a.support.result)) : report?.isError ? 'Not available' : 'Checking…'}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}
    </>
  );
}
