import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createdWebhookEndpointSchema, type CreateWebhookEndpointInput } from '../../../../shared/contracts/webhooks';
import { apiClient } from '../../../lib/api-client';
import { webhookEndpointsQueryOptions } from './get-webhook-endpoints';

export const createWebhookEndpoint = (input: CreateWebhookEndpointInput) => apiClient.post('/api/webhook-endpoints', input, createdWebhookEndpointSchema);

/** Registers an endpoint; the answer holds the signing secret, shown once. */
export function useCreateWebhookEndpoint() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createWebhookEndpoint,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: webhookEndpointsQueryOptions().queryKey }),
  });
}
