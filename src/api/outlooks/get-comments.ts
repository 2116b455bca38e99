import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { commentListSchema } from '../../../shared/contracts/workflow';
import { outlooksKeys } from './outlooks-keys';

export const getComments = (outlookId: string, signal?: AbortSignal) => apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/comments`, commentListSchema, signal);

export const commentsQuery = (outlookId: string) =>
  queryOptions({
    queryKey: outlooksKeys.comments(outlookId),
    queryFn: ({ signal }) => getComments(outlookId, signal),
  });

/** The review thread, oldest first: general comments and comments pinned to an area. */
export function useComments(outlookId: string) {
  return useQuery(commentsQuery(outlookId));
}
