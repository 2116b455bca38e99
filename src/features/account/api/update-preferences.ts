import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { meKeys, meQueryOptions } from '../../../hooks/use-me';
import { preferencesSchema, type Preferences } from '../../../../shared/contracts/users';

export const updatePreferences = (preferences: Preferences) => apiClient.put('/api/me/preferences', preferences, preferencesSchema);

/** Saves display units; the cached `Me` is updated at once, then the `me` prefix is refetched. */
export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePreferences,
    onSuccess: (preferences) => {
      queryClient.setQueryData(meQueryOptions().queryKey, (me) => (me ? { ...me, preferences } : me));
      return queryClient.invalidateQueries({ queryKey: meKeys.all });
    },
  });
}
