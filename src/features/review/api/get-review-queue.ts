import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { outlookSummarySchema, type OutlookState } from '../../../../shared/contracts/outlooks';
import { reviewKeys } from './review-keys';

const outlookListSchema = z.object({ outlooks: z.array(outlookSummarySchema) });

/** Outlooks in the given states (one request per state), oldest update first: first come, first reviewed. */
export const getReviewQueue = async (states: readonly OutlookState[], signal?: AbortSignal) => {
  const lists = await Promise.all(states.map((state) => apiClient.get(`/api/outlooks?state=${state}`, outlookListSchema, signal)));
  return lists.flatMap((l) => l.outlooks).sort((a, b) => a.updatedAt.localeCompare(b.updatedAt));
};

export const reviewQueueStates = ['in_review', 'approved'] as const satisfies readonly OutlookState[];

export const reviewQueueQuery = (states: readonly OutlookState[] = reviewQueueStates) =>
  queryOptions({
    queryKey: reviewKeys.queue(states),
    queryFn: ({ signal }) => getReviewQueue(states, signal),
  });

export function useReviewQueue() {
  return useQuery(reviewQueueQuery());
}
