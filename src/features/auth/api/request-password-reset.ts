import { useMutation } from '@tanstack/react-query';
import { authClient } from '../../../lib/auth-client';
import type { ForgotPasswordInput } from '../../../../shared/contracts/auth';
import { apiErrorFromAuth } from './auth-errors';

/** Asks for a reset e-mail. The link in it lands on `/reset-password?token=…`. */
export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: async (input: ForgotPasswordInput): Promise<void> => {
      const result = await authClient.requestPasswordReset({ email: input.email, redirectTo: '/reset-password' });
      if (result.error) throw apiErrorFromAuth(result.error);
    },
  });
}
