import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { revisionListSchema } from '../../../shared/contracts/outlooks';
import { outlooksKeys } from './outlooks-keys';

export const getRevisions = (outlookId: string, signal?: AbortSignal) => apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/revisions`, revisionListSchema, signal);

export const revisionsQuery = (outlookId: string) =>
  queryOptions({
    queryKey: outlooksKeys.revisions(outlookId),
    queryFn: ({ signal }) => getRevisions(outlookId, signal),
  });

/** Saved revisions of the outlook, newest first. */
export function useRevisions(outlookId: string) {
  return useQuery(revisionsQuery(outlookId));
}
