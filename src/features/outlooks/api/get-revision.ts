import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { riskAreaSchema } from '../../../../shared/contracts/outlooks';
import { outlooksKeys } from './outlooks-keys';

const revisionSchema = z.object({
  id: z.string(),
  outlookId: z.string(),
  revisionNumber: z.number(),
  authorName: z.string().nullable(),
  createdAt: z.string(),
  snapshot: z.object({
    day: z.number().optional(),
    state: z.string().optional(),
    headline: z.string(),
    discussion: z.string(),
    hazardNotes: z.record(z.string(), z.string()).default({}),
    validFrom: z.string(),
    validUntil: z.string(),
    areas: z.array(riskAreaSchema.partial({ id: true, sortOrder: true })),
  }),
});
export type OutlookRevision = z.infer<typeof revisionSchema>;

export const getRevision = (revisionId: string, signal?: AbortSignal) => apiClient.get(`/api/outlook-revisions/${encodeURIComponent(revisionId)}`, revisionSchema, signal);

export const revisionQuery = (revisionId: string) =>
  queryOptions({
    queryKey: outlooksKeys.revision(revisionId),
    queryFn: ({ signal }) => getRevision(revisionId, signal),
    staleTime: Infinity,
  });

export function useRevision(revisionId: string) {
  return useQuery(revisionQuery(revisionId));
}
