import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { placeSchema } from './subscription-schemas';
import { subscriptionsKeys } from './subscriptions-keys';

const placesSchema = z.object({ places: z.array(placeSchema) });

export const getPlaces = (query: string, kind: 'county' | 'state' | undefined, signal?: AbortSignal) => {
  const search = new URLSearchParams({ q: query });
  if (kind) search.set('kind', kind);
  return apiClient.get(`/api/places?${search.toString()}`, placesSchema, signal);
};

export const placesQueryOptions = (query: string, kind: 'county' | 'state' | undefined) =>
  queryOptions({
    queryKey: subscriptionsKeys.places(query, kind),
    queryFn: ({ signal }) => getPlaces(query, kind, signal),
    enabled: query.trim().length >= 2,
    staleTime: 5 * 60_000,
  });

/** Counties and states whose name starts with or contains the query (2 letters or more). */
export function usePlaces(query: string, kind: 'county' | 'state' | undefined) {
  return useQuery(placesQueryOptions(query.trim(), kind));
}
