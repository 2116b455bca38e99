import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { transitionResultSchema, type TransitionInput, type WorkflowAction } from '../../../shared/contracts/workflow';
import { issuancesKeys } from '../issuances/issuances-keys';
import { outlooksKeys } from './outlooks-keys';

export const transitionOutlook = (outlookId: string, action: WorkflowAction, input: TransitionInput) =>
  apiClient.post(`/api/outlooks/${encodeURIComponent(outlookId)}/${action}`, input, transitionResultSchema);

/** Submit, return, approve or publish, with the version the person looked at. */
export function useTransitionOutlook(outlookId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ action, input }: { action: WorkflowAction; input: TransitionInput }) => transitionOutlook(outlookId, action, input),
    onSettled: async () => {
      // A 409 also means our copy is stale: refresh it either way. Publishing changes the issuances.
      await Promise.all([queryClient.invalidateQueries({ queryKey: outlooksKeys.all }), queryClient.invalidateQueries({ queryKey: issuancesKeys.all })]);
    },
  });
}
