import { useMutation, useQueryClient } from '@tanstack/react-query';
import { authClient } from '../../../lib/auth-client';
import { meKeys, meQueryOptions } from '../../../hooks/use-me';
import type { Me } from '../../../../shared/contracts/users';
import type { RegisterInput } from '../../../../shared/contracts/auth';
import { apiErrorFromAuth } from './auth-errors';

/**
 * Self-registration. The server makes every self-registered account a subscriber. Returns the
 * new session's `Me`, or `null` when the server did not sign the new account in straight away.
 */
export function useRegister() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: RegisterInput): Promise<Me | null> => {
      // The confirmation link in the e-mail signs the new subscriber in and opens their alerts.
      const result = await authClient.signUp.email({ name: input.name, email: input.email, password: input.password, callbackURL: '/alerts' });
      if (result.error) throw apiErrorFromAuth(result.error);
      queryClient.removeQueries({ queryKey: meKeys.all });
      // No session until the address is confirmed.
      if (!result.data?.token) return null;
      return queryClient.fetchQuery(meQueryOptions());
    },
  });
}
