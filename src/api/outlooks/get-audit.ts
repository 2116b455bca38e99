import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { auditTrailSchema } from '../../../shared/contracts/workflow';
import { outlooksKeys } from './outlooks-keys';

export const getAudit = (outlookId: string, signal?: AbortSignal) => apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/audit`, auditTrailSchema, signal);

export const auditQuery = (outlookId: string) =>
  queryOptions({
    queryKey: outlooksKeys.audit(outlookId),
    queryFn: ({ signal }) => getAudit(outlookId, signal),
  });

/** The append-only audit trail of the outlook, newest first. */
export function useAudit(outlookId: string) {
  return useQuery(auditQuery(outlookId));
}
