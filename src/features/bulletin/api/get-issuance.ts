import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { issuancesKeys } from '../../../api/issuances/issuances-keys';
import { issuanceSchema } from './issuance-schema';

export const getIssuance = (issuanceNumber: string, signal?: AbortSignal) =>
  apiClient.get(`/api/public/issuances/${encodeURIComponent(issuanceNumber)}`, issuanceSchema, signal);

export const issuanceQuery = (issuanceNumber: string) =>
  queryOptions({
    queryKey: issuancesKeys.detail(issuanceNumber),
    queryFn: ({ signal }) => getIssuance(issuanceNumber, signal),
  });

/** One issuance by its permanent number, whatever its state. */
export function useIssuance(issuanceNumber: string) {
  return useQuery(issuanceQuery(issuanceNumber));
}
