import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { evidenceCandidatesSchema } from '../../../shared/contracts/evidence-candidates';
import { outlooksKeys } from './outlooks-keys';

export const getEvidenceCandidates = (outlookId: string, signal?: AbortSignal) =>
  apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/evidence-candidates`, evidenceCandidatesSchema, signal);

/**
 * The soundings the server's evidence report reads for the outlook's saved period (the period is
 * in the key, so a saved period change loads a new set). Kept a minute: saves do not refetch it.
 */
export const evidenceCandidatesQuery = (outlookId: string, validFrom: string, validUntil: string) =>
  queryOptions({
    queryKey: outlooksKeys.evidenceCandidates(outlookId, validFrom, validUntil),
    queryFn: ({ signal }) => getEvidenceCandidates(outlookId, signal),
    staleTime: 60_000,
  });

export function useEvidenceCandidates(outlookId: string, validFrom: string, validUntil: string) {
  return useQuery(evidenceCandidatesQuery(outlookId, validFrom, validUntil));
}
