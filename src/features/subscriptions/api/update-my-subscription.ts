import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { SubscriptionSettingsInput } from '../../../../shared/contracts/subscriptions';
import { subscriptionSchema } from './subscription-schemas';
import { subscriptionsKeys } from './subscriptions-keys';

export const updateMySubscription = (input: SubscriptionSettingsInput) => apiClient.put('/api/subscriptions/me', input, subscriptionSchema);

/** Saves the alert settings (a stale version answers 409); saving also re-subscribes. */
export function useUpdateMySubscription() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMySubscription,
    onSuccess: (subscription) => {
      queryClient.setQueryData(subscriptionsKeys.mine(), subscription);
      return queryClient.invalidateQueries({ queryKey: subscriptionsKeys.all });
    },
  });
}
