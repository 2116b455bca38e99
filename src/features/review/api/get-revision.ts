import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { riskAreaSchema } from '../../../../shared/contracts/outlooks';
import { reviewKeys } from './review-keys';

const revisionSchema = z.object({
  id: z.string(),
  revisionNumber: z.number(),
  authorName: z.string().nullable(),
  createdAt: z.string(),
  snapshot: z.object({ areas: z.array(riskAreaSchema.partial({ id: true, sortOrder: true })).default([]) }).loose(),
});
export type Revision = z.infer<typeof revisionSchema>;

export const getRevision = (revisionId: string, signal?: AbortSignal) =>
  apiClient.get(`/api/outlook-revisions/${encodeURIComponent(revisionId)}`, revisionSchema, signal);

export const revisionQuery = (revisionId: string) =>
  queryOptions({
    queryKey: reviewKeys.revision(revisionId),
    queryFn: ({ signal }) => getRevision(revisionId, signal),
    staleTime: Infinity,
  });

/** One saved revision (revisions never change once written). Disabled without an id. */
export function useRevision(revisionId: string | null) {
  return useQuery({ ...revisionQuery(revisionId ?? ''), enabled: revisionId !== null });
}
