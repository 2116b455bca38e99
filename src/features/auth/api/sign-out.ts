import { useMutation, useQueryClient } from '@tanstack/react-query';
import { authClient } from '../../../lib/auth-client';
import { apiErrorFromAuth } from './auth-errors';

/** Ends the session and forgets every cached answer, so the next person sees nothing of ours. */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (): Promise<void> => {
      const result = await authClient.signOut();
      if (result.error) throw apiErrorFromAuth(result.error);
    },
    onSettled: () => {
      queryClient.clear();
    },
  });
}
