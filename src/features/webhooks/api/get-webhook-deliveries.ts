import { queryOptions, useQuery } from '@tanstack/react-query';
import { webhookDeliveryListSchema } from '../../../../shared/contracts/webhooks';
import { apiClient } from '../../../lib/api-client';
import { webhooksKeys } from './webhooks-keys';

export const getWebhookDeliveries = (endpointId: string, signal?: AbortSignal) =>
  apiClient.get(`/api/webhook-endpoints/${encodeURIComponent(endpointId)}/deliveries`, webhookDeliveryListSchema, signal);

export const webhookDeliveriesQueryOptions = (endpointId: string) =>
  queryOptions({ queryKey: webhooksKeys.deliveries(endpointId), queryFn: ({ signal }) => getWebhookDeliveries(endpointId, signal), refetchInterval: 5000 });

/** One endpoint's delivery log, refreshed every few seconds while shown. */
export function useWebhookDeliveries(endpointId: string) {
  return useQuery(webhookDeliveriesQueryOptions(endpointId));
}
