import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { outlooksKeys, type EvidenceSource } from './outlooks-keys';

const statsSchema = z.object({
  count: z.number(),
  min: z.number(),
  median: z.number(),
  p90: z.number(),
  max: z.number(),
  histogram: z.array(z.object({ from: z.number(), to: z.number(), count: z.number() })),
});

const areaEvidenceReportSchema = z.object({
  areaId: z.string(),
  levelKey: z.string(),
  evidence: z.object({ count: z.number(), flaggedCount: z.number().default(0), soundingIds: z.array(z.string()), stats: z.record(z.string(), statsSchema) }),
  support: z.object({ result: z.enum(['supported', 'thin', 'exceeds', 'none']), reasons: z.array(z.string()) }),
  checks: z.array(
    z.object({
      code: z.enum(['SELF_INTERSECTION', 'OUTSIDE_REGION', 'SLIVER', 'NOT_NESTED']),
      severity: z.enum(['error', 'warning']),
      message: z.string(),
      fix: z.enum(['unkink', 'clip-to-region', 'expand-lower-level']).optional(),
    }),
  ),
});
export type AreaEvidenceReport = z.infer<typeof areaEvidenceReportSchema>;
export type ParameterStatsReport = z.infer<typeof statsSchema>;

const outlookEvidenceSchema = z.object({ soundingCount: z.number(), areas: z.array(areaEvidenceReportSchema) });
export type OutlookEvidence = z.infer<typeof outlookEvidenceSchema>;

export const getOutlookEvidence = (outlookId: string, source: EvidenceSource, signal?: AbortSignal) =>
  apiClient.get(`/api/outlooks/${encodeURIComponent(outlookId)}/evidence${source === 'all' ? '' : `?source=${source}`}`, outlookEvidenceSchema, signal);

export const outlookEvidenceQuery = (outlookId: string, source: EvidenceSource) =>
  queryOptions({
    queryKey: outlooksKeys.evidence(outlookId, source),
    queryFn: ({ signal }) => getOutlookEvidence(outlookId, source, signal),
  });

/** Evidence and support of every area, computed by the server on the saved document. */
export function useOutlookEvidence(outlookId: string, source: EvidenceSource) {
  return useQuery({ ...outlookEvidenceQuery(outlookId, source), placeholderData: keepPreviousData });
}
