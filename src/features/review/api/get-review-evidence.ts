import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

const areaReportSchema = z.object({
  areaId: z.string(),
  levelKey: z.string(),
  evidence: z.object({ count: z.number(), stats: z.record(z.string(), z.object({ median: z.number() }).loose()) }).loose(),
  support: z.object({ result: z.enum(['supported', 'thin', 'exceeds', 'none']), reasons: z.array(z.string()) }),
  checks: z.array(z.object({ code: z.string(), severity: z.enum(['error', 'warning']), message: z.string() }).loose()),
});
export type AreaReport = z.infer<typeof areaReportSchema>;

const evidenceSchema = z.object({ areas: z.array(areaReportSchema) }).loose();

export const getReviewEvidence = (outlookId: string, signal?: AbortSignal) =>
  apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/evidence`, evidenceSchema, signal);

export const reviewEvidenceQuery = (outlookId: string) =>
  queryOptions({
    queryKey: reviewKeys.evidence(outlookId),
    queryFn: ({ signal }) => getReviewEvidence(outlookId, signal),
  });

/** Evidence count, support check and geometry checks of every area, computed by the server. */
export function useReviewEvidence(outlookId: string) {
  return useQuery(reviewEvidenceQuery(outlookId));
}
