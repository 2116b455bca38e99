import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

const amendmentSchema = z.object({ outlookId: z.string() });

export const amendIssuance = (issuanceNumber: string) =>
  apiClient.post(`/api/issuances/${encodeURIComponent(issuanceNumber)}/amend`, {}, amendmentSchema);

/** Starts an amendment: a new draft with the issuance's content. Publishing it supersedes the issuance. */
export function useAmendIssuance(issuanceNumber: string) {
  return useMutation({ mutationFn: () => amendIssuance(issuanceNumber) });
}
