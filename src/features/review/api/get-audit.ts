import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

const auditEventSchema = z.object({
  id: z.string(),
  action: z.string(),
  fromState: z.string().nullable(),
  toState: z.string().nullable(),
  comment: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  actorName: z.string().nullable(),
  createdAt: z.string(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

const auditSchema = z.object({ events: z.array(auditEventSchema) });

export const getAudit = (outlookId: string, signal?: AbortSignal) => apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/audit`, auditSchema, signal);

export const auditQuery = (outlookId: string) =>
  queryOptions({
    queryKey: reviewKeys.audit(outlookId),
    queryFn: ({ signal }) => getAudit(outlookId, signal),
  });

/** The append-only audit trail of the outlook, newest first. */
export function useAudit(outlookId: string) {
  return useQuery(auditQuery(outlookId));
}
