import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { bulletinKeys } from './bulletin-keys';
import { issuanceSchema } from './issuance-schema';

const bulletinSchema = z.object({ issuances: z.array(issuanceSchema), caution: z.string() });

export const getBulletin = (signal?: AbortSignal) => apiClient.get('/api/public/bulletin', bulletinSchema, signal);

export const bulletinQuery = () =>
  queryOptions({
    queryKey: bulletinKeys.current(),
    queryFn: ({ signal }) => getBulletin(signal),
  });

/** The current issuance of each day (Day 1–3), for everyone. */
export function useBulletin() {
  return useQuery(bulletinQuery());
}
