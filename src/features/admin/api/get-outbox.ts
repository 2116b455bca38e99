import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { adminKeys } from './admin-keys';

export const outboxMessageSchema = z.object({
  id: z.string(),
  toAddress: z.string(),
  subject: z.string(),
  status: z.enum(['queued', 'sending', 'sent', 'failed']),
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  nextAttemptAt: z.string(),
  sentAt: z.string().nullable(),
  createdAt: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

const outboxSchema = z.object({ messages: z.array(outboxMessageSchema) });

export const getOutbox = (signal?: AbortSignal) => apiClient.get('/api/mail-outbox', outboxSchema, signal);

export const outboxQueryOptions = () =>
  queryOptions({
    queryKey: adminKeys.outboxList(),
    queryFn: ({ signal }) => getOutbox(signal),
    refetchInterval: 3_000,
  });

/** The durable outbox, newest first; refreshed every 3 s while the page is open. */
export function useOutbox() {
  return useQuery(outboxQueryOptions());
}
