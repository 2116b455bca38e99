import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { bulletinSchema } from '../../../shared/contracts/issuances';
import { issuancesKeys } from './issuances-keys';

export type { BulletinDay } from '../../../shared/contracts/issuances';

export const getBulletin = (signal?: AbortSignal) => apiClient.get('/api/public/bulletin', bulletinSchema, signal);

export const bulletinQuery = () =>
  queryOptions({
    queryKey: issuancesKeys.current(),
    queryFn: ({ signal }) => getBulletin(signal),
    // The server judges "in force" at the time of the request: ask again each minute so an
    // issuance that expires while the page is open leaves it.
    refetchInterval: 60_000,
  });

/** Per outlook day (Day 1–3), the issuance in force, for everyone. */
export function useBulletin() {
  return useQuery(bulletinQuery());
}
