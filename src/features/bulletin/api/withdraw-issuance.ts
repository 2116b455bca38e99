import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { withdrawInputSchema } from '../../../../shared/contracts/workflow';
import { issuancesKeys } from '../../../api/issuances/issuances-keys';
import { issuanceSchema } from './issuance-schema';

export type WithdrawInput = z.infer<typeof withdrawInputSchema>;

export const withdrawIssuance = (issuanceNumber: string, input: WithdrawInput) =>
  apiClient.post(`/api/issuances/${encodeURIComponent(issuanceNumber)}/withdraw`, input, issuanceSchema);

/** Lead only: withdraws a current issuance with a reason the public sees. */
export function useWithdrawIssuance(issuanceNumber: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: WithdrawInput) => withdrawIssuance(issuanceNumber, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: issuancesKeys.all }),
  });
}
