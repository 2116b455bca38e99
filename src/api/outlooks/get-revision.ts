import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { outlookRevisionSchema } from '../../../shared/contracts/outlooks';
import { outlooksKeys } from './outlooks-keys';

export const getRevision = (revisionId: string, signal?: AbortSignal) => apiClient.get(`/api/outlook-revisions/${encodeURIComponent(revisionId)}`, outlookRevisionSchema, signal);

export const revisionQuery = (revisionId: string) =>
  queryOptions({
    queryKey: outlooksKeys.revision(revisionId),
    queryFn: ({ signal }) => getRevision(revisionId, signal),
    // Revisions never change once written.
    staleTime: Infinity,
  });

/** One saved revision; disabled without an id. */
export function useRevision(revisionId: string | null) {
  return useQuery({ ...revisionQuery(revisionId ?? ''), enabled: revisionId !== null });
}
