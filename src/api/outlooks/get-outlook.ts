import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { outlookSchema } from '../../../shared/contracts/outlooks';
import { outlooksKeys } from './outlooks-keys';

export const getOutlook = (outlookId: string, signal?: AbortSignal) => apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}`, outlookSchema, signal);

export const outlookQuery = (outlookId: string) =>
  queryOptions({
    queryKey: outlooksKeys.detail(outlookId),
    queryFn: ({ signal }) => getOutlook(outlookId, signal),
    // The workspace owns the document once loaded; refetching behind its back would fight autosave.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export function useOutlook(outlookId: string) {
  return useQuery(outlookQuery(outlookId));
}
