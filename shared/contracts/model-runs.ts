import { z } from 'zod';

/** Where a run is: decoding the file, analysing its soundings, ready, or failed (with a reason). */
export const modelRunStateSchema = z.enum(['decoding', 'analysing', 'ready', 'failed']);
export type ModelRunState = z.infer<typeof modelRunStateSchema>;

/** One model run as the library and the runs API show it. */
export const modelRunSummarySchema = z.object({
  id: z.string(),
  model: z.string(),
  cycleTime: z.string(),
  forecastHour: z.number(),
  validTime: z.string(),
  gridKind: z.string(),
  nx: z.number(),
  ny: z.number(),
  levelCount: z.number(),
  soundingCount: z.number(),
  /** Bytes stored for the run's grid soundings (levels and figures, as PostgreSQL counts them). */
  storedBytes: z.number(),
  bytesPerSounding: z.number().nullable(),
  state: modelRunStateSchema,
  failure: z.string().nullable(),
  createdAt: z.string(),
});
export type ModelRunSummary = z.infer<typeof modelRunSummarySchema>;

export const modelRunListQuerySchema = z.object({
  model: z.string().trim().min(1).max(64, { message: 'Keep the model name under 64 characters.' }).optional(),
});

/** Office setting: how many runs of each model are kept (older ones are deleted in the background). */
export const modelRunRetentionSchema = z.object({
  runsKeptPerModel: z
    .number({ message: 'runsKeptPerModel must be a number.' })
    .int({ message: 'runsKeptPerModel must be a whole number.' })
    .min(1, { message: 'Keep at least 1 run per model.' })
    .max(200, { message: 'Keep at most 200 runs per model.' }),
});
export type ModelRunRetention = z.infer<typeof modelRunRetentionSchema>;

/** A grid sounding's id: `${runId}:${pointIndex}`. */
export const gridSoundingIdSchema = z
  .string()
  .regex(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}:\d{1,9}$/i, { message: 'A grid sounding id is the run id, a colon and the point number.' });

/** Query of the grid soundings of one run (paged). */
export const gridSoundingListQuerySchema = z.object({
  offset: z.coerce.number().int().min(0, { message: 'offset must be 0 or more.' }).max(10_000_000).default(0),
  limit: z.coerce.number().int().min(1, { message: 'limit must be at least 1.' }).max(500, { message: 'limit must be at most 500.' }).default(100),
});

const figure = z.number().nullable();

/** A grid sounding in its run's list. */
export const gridSoundingSummarySchema = z.object({
  id: z.string(),
  runId: z.string(),
  pointIndex: z.number(),
  latitude: z.number(),
  longitude: z.number(),
  elevationM: z.number().nullable(),
  keyFigures: z.record(z.string(), figure),
});
export type GridSoundingSummaryView = z.infer<typeof gridSoundingSummarySchema>;

export const gridSoundingPageSchema = z.object({ total: z.number(), items: z.array(gridSoundingSummarySchema) });

/** A grid sounding opened on its own page (levels in engine units, heights above sea level). */
export const gridSoundingDetailSchema = gridSoundingSummarySchema.extend({
  model: z.string(),
  cycleTime: z.string(),
  forecastHour: z.number(),
  validTime: z.string(),
  levels: z.array(z.object({ pressureHpa: z.number(), heightM: z.number(), temperatureC: z.number(), dewpointC: figure, uMs: figure, vMs: figure })),
  analysis: z.unknown(),
});
export type GridSoundingDetailView = z.infer<typeof gridSoundingDetailSchema>;
