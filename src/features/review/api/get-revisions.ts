import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { revisionSummarySchema } from '../../../../shared/contracts/outlooks';
import { reviewKeys } from './review-keys';

const revisionListSchema = z.object({ revisions: z.array(revisionSummarySchema) });

export const getRevisions = (outlookId: string, signal?: AbortSignal) =>
  apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/revisions`, revisionListSchema, signal);

export const revisionsQuery = (outlookId: string) =>
  queryOptions({
    queryKey: reviewKeys.revisions(outlookId),
    queryFn: ({ signal }) => getRevisions(outlookId, signal),
  });

/** Saved revisions of the outlook, newest first. */
export function useRevisions(outlookId: string) {
  return useQuery(revisionsQuery(outlookId));
}
