import { queryOptions, useQuery } from '@tanstack/react-query';
import { webhookEndpointListSchema } from '../../../../shared/contracts/webhooks';
import { apiClient } from '../../../lib/api-client';
import { webhooksKeys } from './webhooks-keys';

export const getWebhookEndpoints = (signal?: AbortSignal) => apiClient.get('/api/webhook-endpoints', webhookEndpointListSchema, signal);

export const webhookEndpointsQueryOptions = () => queryOptions({ queryKey: webhooksKeys.list(), queryFn: ({ signal }) => getWebhookEndpoints(signal) });

/** The signed-in account's webhook endpoints (an admin sees all). */
export function useWebhookEndpoints() {
  return useQuery(webhookEndpointsQueryOptions());
}
