import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { caughtMailSchema } from '../../../../shared/contracts/mail';
import { adminKeys } from './admin-keys';

export const getMailMessage = (messageId: string, signal?: AbortSignal) =>
  apiClient.get(`/api/mail-messages/${encodeURIComponent(messageId)}`, caughtMailSchema, signal);

export const mailMessageQueryOptions = (messageId: string) =>
  queryOptions({
    queryKey: adminKeys.mailDetail(messageId),
    queryFn: ({ signal }) => getMailMessage(messageId, signal),
    staleTime: Infinity,
  });

export function useMailMessage(messageId: string | null) {
  return useQuery({ ...mailMessageQueryOptions(messageId ?? ''), enabled: messageId !== null });
}
