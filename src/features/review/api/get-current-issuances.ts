import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { riskAreaSchema } from '../../../../shared/contracts/outlooks';
import { reviewKeys } from './review-keys';

/** Only what the review needs from the public bulletin: each day's current issuance and its areas. */
const currentIssuancesSchema = z.object({
  issuances: z.array(
    z.object({
      number: z.string(),
      day: z.number(),
      validFrom: z.string(),
      validUntil: z.string(),
      snapshot: z.object({ headline: z.string().default(''), areas: z.array(riskAreaSchema.partial({ sortOrder: true })).default([]) }).loose(),
    }),
  ),
});
export type CurrentIssuance = z.infer<typeof currentIssuancesSchema>['issuances'][number];

export const getCurrentIssuances = (signal?: AbortSignal) => apiClient.get('/api/public/bulletin', currentIssuancesSchema, signal);

export const currentIssuancesQuery = () =>
  queryOptions({
    queryKey: reviewKeys.currentIssuances(),
    queryFn: ({ signal }) => getCurrentIssuances(signal),
  });

export function useCurrentIssuances() {
  return useQuery(currentIssuancesQuery());
}
