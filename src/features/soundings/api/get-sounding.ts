import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { soundingIssueSchema, soundingSummarySchema } from '../../../../shared/contracts/soundings';
import { soundingsKeys } from './soundings-keys';

/** A stored level as the server sends it (SI units; heights above mean sea level). */
const storedLevelSchema = z.object({
  pressureHpa: z.number(),
  heightM: z.number(),
  temperatureC: z.number(),
  dewpointC: z.number().nullable(),
  uMs: z.number().nullable(),
  vMs: z.number().nullable(),
});

/**
 * `GET /api/soundings/:soundingId`: the summary plus levels, validation warnings and the cached
 * analysis. The analysis is recomputed in the browser by the diagram kit, so it is not parsed
 * field by field here.
 */
export const soundingDetailSchema = soundingSummarySchema.extend({
  levels: z.array(storedLevelSchema),
  warnings: z.array(soundingIssueSchema),
  analysis: z.unknown(),
  engineVersion: z.string(),
  modificationNote: z.string().nullable(),
});
export type SoundingDetail = z.infer<typeof soundingDetailSchema>;

export const getSounding = (soundingId: string, signal?: AbortSignal) =>
  apiClient.get(`/api/soundings/${encodeURIComponent(soundingId)}`, soundingDetailSchema, signal);

export const soundingQuery = (soundingId: string) =>
  queryOptions({
    queryKey: soundingsKeys.detail(soundingId),
    queryFn: ({ signal }) => getSounding(soundingId, signal),
  });

export function useSounding(soundingId: string) {
  return useQuery(soundingQuery(soundingId));
}
