import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { webhooksKeys } from './webhooks-keys';

export const retryWebhookDelivery = (deliveryId: string) => apiClient.post(`/api/webhook-deliveries/${encodeURIComponent(deliveryId)}/retry`, {}, z.object({ id: z.string(), status: z.string() }));

/** Queues a failed delivery again (same webhook-id and body). */
export function useRetryWebhookDelivery() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retryWebhookDelivery,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: webhooksKeys.all }),
  });
}
