import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { caughtMailSummarySchema } from '../../../../shared/contracts/mail';
import { adminKeys } from './admin-keys';

const mailListSchema = z.object({ messages: z.array(caughtMailSummarySchema) });

export const getMailMessages = (signal?: AbortSignal) => apiClient.get('/api/mail-messages', mailListSchema, signal);

export const mailMessagesQueryOptions = () =>
  queryOptions({
    queryKey: adminKeys.mailList(),
    queryFn: ({ signal }) => getMailMessages(signal),
    refetchInterval: 10_000,
  });

export function useMailMessages() {
  return useQuery(mailMessagesQueryOptions());
}
