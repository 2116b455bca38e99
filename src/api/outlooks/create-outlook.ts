import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { outlookSchema, type CreateOutlookInput } from '../../../shared/contracts/outlooks';
import { outlooksKeys } from './outlooks-keys';

export const createOutlook = (input: CreateOutlookInput) => apiClient.post('/api/outlooks', input, outlookSchema);

/** Starts a draft; the server computes its valid period from the office time zone. */
export function useCreateOutlook() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createOutlook,
    onSuccess: (outlook) => {
      queryClient.setQueryData(outlooksKeys.detail(outlook.id), outlook);
      void queryClient.invalidateQueries({ queryKey: outlooksKeys.lists() });
    },
  });
}
