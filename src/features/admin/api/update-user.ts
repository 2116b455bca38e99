import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { userSummarySchema, type UpdateUserInput } from '../../../../shared/contracts/users';
import { adminKeys } from './admin-keys';

export const updateUser = ({ userId, changes }: { userId: string; changes: UpdateUserInput }) =>
  apiClient.patch(`/api/users/${encodeURIComponent(userId)}`, changes, userSummarySchema);

/** Changes a user's role or disables/enables them, then refreshes every user list. */
export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.users() }),
  });
}
