import { queryOptions, useQuery } from '@tanstack/react-query';
import { issuanceVerificationSchema } from '../../../../shared/contracts/verification';
import { apiClient } from '../../../lib/api-client';
import { issuancesKeys } from '../../../api/issuances/issuances-keys';

export const getIssuanceVerification = (issuanceNumber: string, signal?: AbortSignal) =>
  apiClient.get(`/api/public/issuances/${encodeURIComponent(issuanceNumber)}/verification`, issuanceVerificationSchema, signal);

export const issuanceVerificationQuery = (issuanceNumber: string) =>
  queryOptions({
    queryKey: issuancesKeys.verification(issuanceNumber),
    queryFn: ({ signal }) => getIssuanceVerification(issuanceNumber, signal),
  });

/** The storm reports and scores of one issuance, once its valid period has ended. */
export function useIssuanceVerification(issuanceNumber: string) {
  return useQuery(issuanceVerificationQuery(issuanceNumber));
}
