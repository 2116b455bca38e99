import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { outlookEvidenceSchema } from '../../../shared/contracts/outlooks';
import { outlooksKeys, type EvidenceSource } from './outlooks-keys';

export const getOutlookEvidence = (outlookId: string, source: EvidenceSource, signal?: AbortSignal) =>
  apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/evidence${source === 'all' ? '' : `?source=${source}`}`, outlookEvidenceSchema, signal);

export const outlookEvidenceQuery = (outlookId: string, source: EvidenceSource = 'all') =>
  queryOptions({
    queryKey: outlooksKeys.evidence(outlookId, source),
    queryFn: ({ signal }) => getOutlookEvidence(outlookId, source, signal),
  });

/** Evidence, support check and geometry checks of every area, computed by the server on the saved document. */
export function useOutlookEvidence(outlookId: string, source: EvidenceSource = 'all') {
  return useQuery({ ...outlookEvidenceQuery(outlookId, source), placeholderData: keepPreviousData });
}
