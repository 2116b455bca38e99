import { useMutation, useQueryClient } from '@tanstack/react-query';
import { authClient } from '../../../lib/auth-client';
import { ApiError } from '../../../lib/api-client';
import { meKeys, meQueryOptions } from '../../../hooks/use-me';
import type { Me } from '../../../../shared/contracts/users';
import type { SignInInput } from '../../../../shared/contracts/auth';
import { apiErrorFromAuth } from './auth-errors';

export async function signIn(input: SignInInput): Promise<void> {
  const result = await authClient.signIn.email({ email: input.email, password: input.password });
  if (result.error) throw apiErrorFromAuth(result.error);
}

/** Signs in, then loads `/api/me` afresh so the caller can send the person to their role's home. */
export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: SignInInput): Promise<Me> => {
      await signIn(input);
      queryClient.removeQueries({ queryKey: meKeys.all });
      const me = await queryClient.fetchQuery(meQueryOptions());
      if (me === null) {
        throw new ApiError({
          status: 401,
          code: 'UNAUTHENTICATED',
          message: 'You were signed in, but the session did not stick. Allow cookies for this site and try again.',
        });
      }
      return me;
    },
  });
}
