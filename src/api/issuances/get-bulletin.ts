import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { bulletinSchema } from '../../../shared/contracts/issuances';
import { issuancesKeys } from './issuances-keys';

export const getBulletin = (signal?: AbortSignal) => apiClient.get('/api/public/bulletin', bulletinSchema, signal);

export const bulletinQuery = () =>
  queryOptions({
    queryKey: issuancesKeys.current(),
    queryFn: ({ signal }) => getBulletin(signal),
  });

/** The current issuance of each day (Day 1–3), for everyone. */
export function useBulletin() {
  return useQuery(bulletinQuery());
}
