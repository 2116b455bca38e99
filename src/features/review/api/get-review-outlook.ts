import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { outlookSchema } from '../../../../shared/contracts/outlooks';
import { reviewKeys } from './review-keys';

export const getReviewOutlook = (outlookId: string, signal?: AbortSignal) => apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}`, outlookSchema, signal);

export const reviewOutlookQuery = (outlookId: string) =>
  queryOptions({
    queryKey: reviewKeys.outlook(outlookId),
    queryFn: ({ signal }) => getReviewOutlook(outlookId, signal),
  });

/** The outlook under review, with its version (sent back with every action). */
export function useReviewOutlook(outlookId: string) {
  return useQuery(reviewOutlookQuery(outlookId));
}
