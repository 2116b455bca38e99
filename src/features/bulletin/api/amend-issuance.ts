import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { amendmentResultSchema } from '../../../../shared/contracts/issuances';

export const amendIssuance = (issuanceNumber: string) =>
  apiClient.post(`/api/issuances/${encodeURIComponent(issuanceNumber)}/amend`, {}, amendmentResultSchema);

/** Starts an amendment: a new draft with the issuance's content. Publishing it supersedes the issuance. */
export function useAmendIssuance(issuanceNumber: string) {
  return useMutation({ mutationFn: () => amendIssuance(issuanceNumber) });
}
