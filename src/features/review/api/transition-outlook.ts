import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { outlookStates } from '../../../../shared/contracts/outlooks';
import type { TransitionInput, WorkflowAction } from '../../../../shared/contracts/workflow';
import { issuancesPrefix, outlooksPrefix, reviewKeys } from './review-keys';

const transitionResultSchema = z.object({ outlookId: z.string(), state: z.enum(outlookStates), version: z.number(), issuanceNumber: z.string().optional() });
export type TransitionResult = z.infer<typeof transitionResultSchema>;

export const transitionOutlook = (outlookId: string, action: WorkflowAction, input: TransitionInput) =>
  apiClient.post(`/api/outlooks/${encodeURIComponent(outlookId)}/${action}`, input, transitionResultSchema);

/** Submit, return, approve or publish, with the version the person looked at. */
export function useTransitionOutlook(outlookId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ action, input }: { action: WorkflowAction; input: TransitionInput }) => transitionOutlook(outlookId, action, input),
    onSettled: async () => {
      // A 409 also means our copy is stale: refresh it either way.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: reviewKeys.all }),
        queryClient.invalidateQueries({ queryKey: outlooksPrefix }),
        queryClient.invalidateQueries({ queryKey: issuancesPrefix }),
      ]);
    },
  });
}
