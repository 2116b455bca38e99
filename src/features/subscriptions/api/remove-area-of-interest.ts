import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { subscriptionSchema } from './subscription-schemas';
import { subscriptionsKeys } from './subscriptions-keys';

export const removeAreaOfInterest = (areaId: string) =>
  apiRequest(`/api/areas-of-interest/${encodeURIComponent(areaId)}`, { method: 'DELETE', schema: subscriptionSchema });

/** Removes one area of interest. */
export function useRemoveAreaOfInterest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeAreaOfInterest,
    onSuccess: (subscription) => {
      queryClient.setQueryData(subscriptionsKeys.mine(), subscription);
      return queryClient.invalidateQueries({ queryKey: subscriptionsKeys.all });
    },
  });
}
