import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { subscriberSchema } from './subscription-schemas';
import { subscriptionsKeys } from './subscriptions-keys';

const subscribersSchema = z.object({ count: z.number().int(), subscribers: z.array(subscriberSchema) });

export const getSubscribers = (signal?: AbortSignal) => apiClient.get('/api/subscriptions', subscribersSchema, signal);

export const subscribersQueryOptions = () =>
  queryOptions({
    queryKey: subscriptionsKeys.list(),
    queryFn: ({ signal }) => getSubscribers(signal),
  });

/** Every subscriber with their settings and areas (leads and admins). */
export function useSubscribers() {
  return useQuery(subscribersQueryOptions());
}
