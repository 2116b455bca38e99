import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { adminKeys } from './admin-keys';

const resendSchema = z.object({ id: z.string(), status: z.string() });

export const resendOutboxMessage = (messageId: string) => apiClient.post(`/api/mail-outbox/${encodeURIComponent(messageId)}/resend`, {}, resendSchema);

/** Puts a failed message back in the queue (409 for any other status), then refreshes the outbox. */
export function useResendOutboxMessage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendOutboxMessage,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.outbox() }),
  });
}
