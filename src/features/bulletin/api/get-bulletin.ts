import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { bulletinKeys } from './bulletin-keys';
import { issuanceSchema } from './issuance-schema';

/** One outlook day on the bulletin: what is in force, or since when nothing is, and any withdrawal to announce. */
const bulletinDaySchema = z.object({
  day: z.number(),
  status: z.enum(['in_force', 'none_in_force']),
  issuanceNumber: z.string().nullable(),
  since: z.string().nullable(),
  withdrawn: z.object({ number: z.string(), reason: z.string().nullable(), withdrawnAt: z.string().nullable(), validUntil: z.string() }).nullable(),
});
export type BulletinDay = z.infer<typeof bulletinDaySchema>;

const bulletinSchema = z.object({ issuances: z.array(issuanceSchema), days: z.array(bulletinDaySchema).default([]), caution: z.string() });

export const getBulletin = (signal?: AbortSignal) => apiClient.get('/api/public/bulletin', bulletinSchema, signal);

export const bulletinQuery = () =>
  queryOptions({
    queryKey: bulletinKeys.current(),
    queryFn: ({ signal }) => getBulletin(signal),
    // The server judges "in force" at the time of the request: ask again each minute so an
    // issuance that expires while the page is open leaves it.
    refetchInterval: 60_000,
  });

/** Per outlook day (Day 1–3), the issuance in force, for everyone. */
export function useBulletin() {
  return useQuery(bulletinQuery());
}
