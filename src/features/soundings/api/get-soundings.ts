import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { soundingListSchema, type SoundingListQuery } from '../../../../shared/contracts/soundings';
import { searchParamsFromFilters } from '../utils/library-filters';
import { soundingsKeys } from './soundings-keys';

export const getSoundings = (filters: SoundingListQuery, signal?: AbortSignal) => {
  const search = searchParamsFromFilters(filters).toString();
  return apiClient.get(`/api/soundings${search ? `?${search}` : ''}`, soundingListSchema, signal);
};

export const soundingsListQuery = (filters: SoundingListQuery) =>
  queryOptions({
    queryKey: soundingsKeys.list(filters),
    queryFn: ({ signal }) => getSoundings(filters, signal),
  });

/** One server page of the library; the previous page stays on screen while the next loads. */
export function useSoundings(filters: SoundingListQuery) {
  return useQuery({ ...soundingsListQuery(filters), placeholderData: keepPreviousData });
}
