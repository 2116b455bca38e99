import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { verificationSummarySchema, type VerificationSummaryQuery } from '../../../../shared/contracts/verification';
import { apiClient } from '../../../lib/api-client';
import { verificationKeys } from './verification-keys';

/** The query string of a summary query (also used for the CSV download link). */
export function summarySearch(query: VerificationSummaryQuery): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value) params.set(key, String(value));
  const text = params.toString();
  return text ? `?${text}` : '';
}

export const verificationSummaryQuery = (query: VerificationSummaryQuery) =>
  queryOptions({
    queryKey: verificationKeys.summary(query),
    queryFn: ({ signal }) => apiClient.get(`/api/verification${summarySearch(query)}`, verificationSummarySchema, signal),
    placeholderData: keepPreviousData,
  });

/** The office's scored issuances (and those not scored) for the filters. */
export function useVerificationSummary(query: VerificationSummaryQuery) {
  return useQuery(verificationSummaryQuery(query));
}
