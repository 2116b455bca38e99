import { useMutation } from '@tanstack/react-query';
import { authClient } from '../../../lib/auth-client';
import { apiErrorFromAuth } from './auth-errors';

export function useResetPassword() {
  return useMutation({
    mutationFn: async (input: { newPassword: string; token: string }): Promise<void> => {
      const result = await authClient.resetPassword({ newPassword: input.newPassword, token: input.token });
      if (result.error) throw apiErrorFromAuth(result.error);
    },
  });
}
