import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { subscriptionSchema } from './subscription-schemas';
import { subscriptionsKeys } from './subscriptions-keys';

export const getMySubscription = (signal?: AbortSignal) => apiClient.get('/api/subscriptions/me', subscriptionSchema, signal);

export const mySubscriptionQueryOptions = () =>
  queryOptions({
    queryKey: subscriptionsKeys.mine(),
    queryFn: ({ signal }) => getMySubscription(signal),
  });

/** The signed-in subscriber's alert settings and areas of interest (created with defaults on first visit). */
export function useMySubscription() {
  return useQuery(mySubscriptionQueryOptions());
}
