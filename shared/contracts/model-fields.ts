import { z } from 'zod';
import { keyFigureKeys } from '../sounding/key-figures';
import { modelRunSummarySchema } from './model-runs';
import { versionSchema } from './primitives';

/** Runs an author may pick for one outlook's evidence (and the default takes at most as many). */
export const MAX_EVIDENCE_RUNS = 4;

/** A model run as pickers, legends and the evidence panel name it (a part of the runs API's summary). */
export const runBriefSchema = modelRunSummarySchema.pick({ id: true, model: true, cycleTime: true, forecastHour: true, validTime: true, gridKind: true, nx: true, ny: true, soundingCount: true });
export type RunBrief = z.infer<typeof runBriefSchema>;

/** GET /api/model-fields: the ready runs whose fields can be drawn, newest valid time first. */
export const fieldRunListSchema = z.object({ runs: z.array(runBriefSchema) });
export type FieldRunList = z.infer<typeof fieldRunListSchema>;

export const fieldQuerySchema = z.object({
  figure: z
    .string({ message: 'Name the key figure to draw in "figure", e.g. figure=mlCape.' })
    .max(60, { message: 'The figure name is at most 60 characters.' })
    .superRefine((v, context) => {
      if (!(keyFigureKeys as readonly string[]).includes(v)) context.addIssue({ code: 'custom', message: `Unknown figure "${v}": use one of ${keyFigureKeys.join(', ')}.` });
    }),
});

const bandSchema = z.object({ index: z.number(), from: z.number(), to: z.number().nullable(), colour: z.string() });

/** GET /api/model-runs/:runId/field?figure=… */
export const modelFieldSchema = z.object({
  run: runBriefSchema,
  figure: z.string(),
  label: z.string(),
  /** SI unit of the breaks ('' when dimensionless); the client shows display units where they apply. */
  unit: z.string(),
  quantity: z.string(),
  sense: z.enum(['above', 'below']),
  bands: z.array(bandSchema),
  /** Grid points with a value of this figure. */
  valuedPoints: z.number(),
  /** 1 at full resolution; 2, 4 … when the grid was thinned to keep the answer small. */
  stride: z.number(),
  /** One MultiPolygon per band (the area at or beyond its break), lowest band first. */
  features: z.object({
    type: z.literal('FeatureCollection'),
    features: z.array(
      z.object({
        type: z.literal('Feature'),
        geometry: z.object({ type: z.literal('MultiPolygon'), coordinates: z.array(z.array(z.array(z.array(z.number())))) }),
        properties: z.object({ band: z.number(), from: z.number(), to: z.number().nullable(), colour: z.string() }),
      }),
    ),
  }),
});
export type ModelField = z.infer<typeof modelFieldSchema>;

/** GET /api/outlooks/:outlookId/evidence-runs */
export const evidenceRunSelectionSchema = z.object({
  outlookId: z.string(),
  version: z.number(),
  /** 'chosen': the author's pick; 'default': the newest ready runs valid in the outlook period. */
  mode: z.enum(['chosen', 'default']),
  /** The runs that feed the evidence now. */
  runs: z.array(runBriefSchema),
  /** Ready runs valid in the outlook period that may be picked. */
  available: z.array(runBriefSchema),
});
export type EvidenceRunSelection = z.infer<typeof evidenceRunSelectionSchema>;

/** PATCH /api/outlooks/:outlookId/evidence-runs (an empty list returns to the default). */
export const updateEvidenceRunsInputSchema = z.object({
  version: versionSchema,
  runIds: z
    .array(z.string().uuid({ message: 'Each run id must be an id (UUID).' }), { message: 'Send the picked runs as a list of run ids in "runIds".' })
    .max(MAX_EVIDENCE_RUNS, { message: `Pick at most ${MAX_EVIDENCE_RUNS} runs for the evidence.` })
    .refine((ids) => new Set(ids).size === ids.length, { message: 'A run is listed twice; list each run once.' }),
});
export type UpdateEvidenceRunsInput = z.infer<typeof updateEvidenceRunsInputSchema>;

/** Per area of the evidence: how many soundings inside came from each run (runId null: observed or uploaded). */
export const evidenceSourceCountSchema = z.object({ runId: z.string().nullable(), count: z.number() });
export type EvidenceSourceCount = z.infer<typeof evidenceSourceCountSchema>;
