import { z } from 'zod';

/**
 * GET /api/outlooks/:outlookId/evidence-candidates: the soundings the server's evidence report
 * would read for the outlook's saved period, with their stored key figures, so the workspace
 * can preview evidence and the support check while a vertex moves. Compact: each sounding's
 * figures are one array in the order of `figureKeys` (SI units, null when the sounding cannot
 * give the figure).
 */
export const evidenceCandidateSchema = z.object({
  id: z.string(),
  stationId: z.string(),
  longitude: z.number(),
  latitude: z.number(),
  validTime: z.string(),
  source: z.enum(['observed', 'model', 'unknown']),
  /** The model run of a grid sounding; null for observed and uploaded soundings. */
  runId: z.string().nullable(),
  figures: z.array(z.number().nullable()),
  flagCount: z.number(),
});
export type EvidenceCandidate = z.infer<typeof evidenceCandidateSchema>;

export const evidenceCandidatesSchema = z.object({
  validFrom: z.string(),
  validUntil: z.string(),
  figureKeys: z.array(z.string()),
  /** True when the period holds more soundings than `limit`: none are sent and there is no live preview. */
  truncated: z.boolean(),
  limit: z.number(),
  soundings: z.array(evidenceCandidateSchema),
});
export type EvidenceCandidates = z.infer<typeof evidenceCandidatesSchema>;
