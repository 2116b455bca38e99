import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../lib/api-client';
import { officeSettingsSchema } from '../../shared/contracts/office';

/** Keys for the office settings (name, region, time zone, risk ladder); read by every page. */
export const officeKeys = {
  all: ['office'] as const,
  detail: () => [...officeKeys.all, 'detail'] as const,
};

export const getOffice = (signal?: AbortSignal) => apiClient.get('/api/office', officeSettingsSchema, signal);

export const officeQueryOptions = () =>
  queryOptions({
    queryKey: officeKeys.detail(),
    queryFn: ({ signal }) => getOffice(signal),
  });

export function useOffice() {
  return useQuery(officeQueryOptions());
}
