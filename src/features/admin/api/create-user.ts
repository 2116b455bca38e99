import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { userSummarySchema, type CreateUserInput } from '../../../../shared/contracts/users';
import { adminKeys } from './admin-keys';

export const createUser = (input: CreateUserInput) => apiClient.post('/api/users', input, userSummarySchema);

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.users() }),
  });
}
