import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../lib/api-client';
import { outlookListSchema, type OutlookListQuery } from '../../../shared/contracts/outlooks';
import { outlooksKeys } from './outlooks-keys';

export const getOutlooks = (filters: OutlookListQuery, signal?: AbortSignal) => {
  const search = new URLSearchParams();
  if (filters.state) search.set('state', filters.state);
  if (filters.day) search.set('day', String(filters.day));
  if (filters.date) search.set('date', filters.date);
  const query = search.toString();
  return apiClient.get(`/api/outlooks${query ? `?${query}` : ''}`, outlookListSchema, signal);
};

export const outlooksListQuery = (filters: OutlookListQuery) =>
  queryOptions({
    queryKey: outlooksKeys.list(filters),
    queryFn: ({ signal }) => getOutlooks(filters, signal),
  });

export function useOutlooks(filters: OutlookListQuery) {
  return useQuery({ ...outlooksListQuery(filters), placeholderData: keepPreviousData });
}
