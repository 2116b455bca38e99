import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { soundingListSchema } from '../../../../shared/contracts/soundings';
import { outlooksKeys } from '../../../api/outlooks/outlooks-keys';

/** The soundings layer: up to 500 soundings valid within the outlook period. */
export const getPeriodSoundings = (validFrom: string, validUntil: string, signal?: AbortSignal) => {
  const search = new URLSearchParams({ validFrom, validTo: validUntil, pageSize: '500', modified: 'exclude' });
  return apiClient.get(`/api/soundings?${search.toString()}`, soundingListSchema, signal);
};

export const periodSoundingsQuery = (validFrom: string, validUntil: string) =>
  queryOptions({
    queryKey: outlooksKeys.soundings(validFrom, validUntil),
    queryFn: ({ signal }) => getPeriodSoundings(validFrom, validUntil, signal),
    staleTime: 60_000,
  });

export function usePeriodSoundings(validFrom: string, validUntil: string) {
  return useQuery(periodSoundingsQuery(validFrom, validUntil));
}
