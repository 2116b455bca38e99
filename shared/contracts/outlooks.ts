import { z } from 'zod';
import { calendarDateSchema, isoTimeSchema, versionSchema } from './primitives';
import { countVertices, MAX_VERTICES_PER_OUTLOOK, tooManyVerticesMessage } from '../geometry/limits';
import { hazardKinds, riskAreaInputSchema, riskAreaSchema, supportCheckSchema } from './risk-areas';
import { evidenceSourceCountSchema, runBriefSchema } from './model-fields';

export * from './risk-areas';

export const outlookDays = [1, 2, 3] as const;
export const outlookStates = ['draft', 'in_review', 'returned', 'approved', 'published'] as const;
export type OutlookState = (typeof outlookStates)[number];


const isoTime = isoTimeSchema;

export const createOutlookInputSchema = z.object({
  day: z.number({ message: 'Day must be 1, 2 or 3.' }).int().min(1, { message: 'Day must be 1, 2 or 3.' }).max(3, { message: 'Day must be 1, 2 or 3.' }),
  /** When the outlook is issued; the valid period is computed from it (default: now). */
  issuanceTime: isoTime('Issuance time').optional(),
  headline: z.string().trim().max(200, { message: 'Keep the headline under 200 characters.' }).default(''),
});
export type CreateOutlookInput = z.infer<typeof createOutlookInputSchema>;

/** A full save of the draft (autosave sends the whole document with the version it was loaded at). */
export const saveOutlookInputSchema = z
  .object({
    version: versionSchema,
    headline: z.string().trim().max(200, { message: 'Keep the headline under 200 characters.' }),
    discussion: z.string().max(20_000, { message: 'Keep the discussion under 20,000 characters.' }),
    hazardNotes: z.partialRecord(z.enum(hazardKinds), z.string().max(2000, { message: 'Keep each hazard note under 2,000 characters.' })).default({}),
    validFrom: isoTime('Valid from'),
    validUntil: isoTime('Valid until'),
    areas: z
      .array(riskAreaInputSchema)
      .max(60, { message: 'At most 60 risk areas per outlook.' })
      .superRefine((areas, context) => {
        const count = areas.reduce((sum, area) => sum + countVertices(area.geometry), 0);
        if (count > MAX_VERTICES_PER_OUTLOOK) context.addIssue({ code: 'custom', message: tooManyVerticesMessage('Together the risk areas', count, MAX_VERTICES_PER_OUTLOOK) });
      }),
  })
  .refine((v) => new Date(v.validUntil) > new Date(v.validFrom), { message: 'The valid period must end after it starts.', path: ['validUntil'] })
  .superRefine((v, ctx) => {
    const seen = new Set<string>();
    v.areas.forEach((area, index) => {
      if (area.id === undefined) return;
      if (seen.has(area.id)) ctx.addIssue({ code: 'custom', path: ['areas', index, 'id'], message: 'This risk-area id is used twice in the save; each area needs its own.' });
      seen.add(area.id);
    });
  });
export type SaveOutlookInput = z.infer<typeof saveOutlookInputSchema>;

export const outlookSummarySchema = z.object({
  id: z.string(),
  day: z.number(),
  state: z.enum(outlookStates),
  validFrom: z.string(),
  validUntil: z.string(),
  headline: z.string(),
  version: z.number(),
  areaCount: z.number(),
  highestLevelKey: z.string().nullable(),
  createdBy: z.string().nullable(),
  lastEditedBy: z.string().nullable(),
  lastEditedByName: z.string().nullable(),
  updatedAt: z.string(),
});
export type OutlookSummary = z.infer<typeof outlookSummarySchema>;

export const outlookSchema = outlookSummarySchema.extend({
  discussion: z.string(),
  hazardNotes: z.record(z.string(), z.string()),
  areas: z.array(riskAreaSchema),
  amendsIssuanceId: z.string().nullable(),
  /**
   * Everyone who edited the content of the version under review (authors of the revisions since
   * the last approval or return): the four-eyes rule keeps them from approving it.
   */
  reviewEditorIds: z.array(z.string()),
});
export type Outlook = z.infer<typeof outlookSchema>;

export const outlookListQuerySchema = z.object({
  state: z.enum(outlookStates).optional(),
  day: z.coerce.number().int().min(1).max(3).optional(),
  date: calendarDateSchema('Date').optional(),
});
export type OutlookListQuery = z.infer<typeof outlookListQuerySchema>;

export const outlookListSchema = z.object({ outlooks: z.array(outlookSummarySchema) });
export type OutlookList = z.infer<typeof outlookListSchema>;

export const revisionSummarySchema = z.object({ id: z.string(), revisionNumber: z.number(), authorId: z.string().nullable(), authorName: z.string().nullable(), createdAt: z.string() });
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;

export const revisionListSchema = z.object({ revisions: z.array(revisionSummarySchema) });
export type RevisionList = z.infer<typeof revisionListSchema>;

/**
 * The full content of an outlook at one revision, as every save (and the start of an amendment)
 * stores it. Written and read through this one schema, so a revision always opens.
 */
export const revisionSnapshotSchema = z.object({
  day: z.number(),
  state: z.enum(outlookStates),
  headline: z.string(),
  discussion: z.string(),
  hazardNotes: z.record(z.string(), z.string()),
  validFrom: z.string(),
  validUntil: z.string(),
  areas: z.array(riskAreaSchema),
  /** The issuance number an amendment started from (its first revision only). */
  amends: z.string().optional(),
});
export type RevisionSnapshot = z.infer<typeof revisionSnapshotSchema>;

export const outlookRevisionSchema = z.object({
  id: z.string(),
  outlookId: z.string(),
  revisionNumber: z.number(),
  authorName: z.string().nullable(),
  createdAt: z.string(),
  snapshot: revisionSnapshotSchema,
});
export type OutlookRevision = z.infer<typeof outlookRevisionSchema>;


const parameterStatsSchema = z.object({
  count: z.number(),
  min: z.number(),
  median: z.number(),
  p90: z.number(),
  max: z.number(),
  histogram: z.array(z.object({ from: z.number(), to: z.number(), count: z.number() })),
});
export type ParameterStatsReport = z.infer<typeof parameterStatsSchema>;

export const areaCheckSchema = z.object({
  code: z.enum(['SELF_INTERSECTION', 'OUTSIDE_REGION', 'SLIVER', 'NOT_NESTED']),
  severity: z.enum(['error', 'warning']),
  message: z.string(),
  fix: z.enum(['unkink', 'clip-to-region', 'expand-lower-level']).optional(),
});

export const areaEvidenceReportSchema = z.object({
  areaId: z.string(),
  levelKey: z.string(),
  evidence: z.object({ areaId: z.string(), count: z.number(), flaggedCount: z.number().default(0), soundingIds: z.array(z.string()), stats: z.partialRecord(z.string(), parameterStatsSchema) }),
  support: supportCheckSchema,
  checks: z.array(areaCheckSchema),
});
export type AreaEvidenceReport = z.infer<typeof areaEvidenceReportSchema>;

/** GET /api/outlooks/:outlookId/evidence */
export const outlookEvidenceSchema = z.object({
  soundingCount: z.number(),
  areas: z.array(areaEvidenceReportSchema),
  /** The model runs whose grid soundings fed this evidence. */
  runs: z.array(runBriefSchema).default([]),
  /** Per area id: soundings inside by run (runId null: observed or uploaded soundings). */
  sourcesByArea: z.record(z.string(), z.array(evidenceSourceCountSchema)).default({}),
});
export type OutlookEvidence = z.infer<typeof outlookEvidenceSchema>;

export const areaImportResultSchema = z.object({ areas: z.array(riskAreaInputSchema) });
export type AreaImportResult = z.infer<typeof areaImportResultSchema>;

export const evidenceQuerySchema = z.object({ source: z.enum(['observed', 'model'], { message: 'Source must be observed or model.' }).optional() });

export const areaImportInputSchema = z.object({ geojson: z.unknown().refine((v) => v !== undefined, { message: 'Send the GeoJSON document in "geojson".' }) });
