import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { AreaOfInterestInput } from '../../../../shared/contracts/subscriptions';
import { subscriptionSchema } from './subscription-schemas';
import { subscriptionsKeys } from './subscriptions-keys';

export const addAreaOfInterest = (input: AreaOfInterestInput) => apiClient.post('/api/areas-of-interest', input, subscriptionSchema);

/** Adds a drawn area, a county or a state to the subscriber's areas of interest. */
export function useAddAreaOfInterest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addAreaOfInterest,
    onSuccess: (subscription) => {
      queryClient.setQueryData(subscriptionsKeys.mine(), subscription);
      return queryClient.invalidateQueries({ queryKey: subscriptionsKeys.all });
    },
  });
}
