import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { webhooksKeys } from './webhooks-keys';

export const deleteWebhookEndpoint = (endpointId: string) =>
  apiRequest(`/api/webhook-endpoints/${encodeURIComponent(endpointId)}`, { method: 'DELETE', schema: z.object({ id: z.string() }) });

/** Removes an endpoint and its delivery log. */
export function useDeleteWebhookEndpoint() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteWebhookEndpoint,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: webhooksKeys.all }),
  });
}
