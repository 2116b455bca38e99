import { useQueries } from '@tanstack/react-query';
import type { OutlookState, OutlookSummary } from '../../../../shared/contracts/outlooks';
import { outlooksListQuery } from '../../../api/outlooks/get-outlooks';

/** What waits for a lead: drafts in review, and approved ones waiting to be published. */
export const reviewQueueStates = ['in_review', 'approved'] as const satisfies readonly OutlookState[];

/** The list queries the queue is made of (one per state, from the outlooks resource). */
export const reviewQueueQueries = () => reviewQueueStates.map((state) => outlooksListQuery({ state }));

/** Outlooks in the queue's states, oldest update first: first come, first reviewed. */
export function useReviewQueue() {
  return useQueries({
    queries: reviewQueueQueries(),
    combine: (results) => {
      const error = results.find((r) => r.error)?.error ?? null;
      const data: OutlookSummary[] | undefined = results.every((r) => r.data)
        ? results.flatMap((r) => r.data?.outlooks ?? []).sort((a, b) => a.updatedAt.localeCompare(b.updatedAt))
        : undefined;
      return { data, error, isError: error !== null, isSuccess: data !== undefined, isPending: error === null && data === undefined };
    },
  });
}
