import { z } from 'zod';

/** What became of a file the intake received. */
export const intakeFileStates = ['received', 'processing', 'done', 'failed', 'duplicate'] as const;
export const intakeFileStateSchema = z.enum(intakeFileStates);
export type IntakeFileState = z.infer<typeof intakeFileStateSchema>;

export const intakeFormatSchema = z.enum(['grib2', 'bufr', 'csv', 'unknown']);

/** One file in the intake list. */
export const intakeFileSchema = z.object({
  id: z.string(),
  origin: z.enum(['folder', 'pull']),
  sourceName: z.string(),
  fileName: z.string(),
  sizeBytes: z.number(),
  format: intakeFormatSchema,
  state: intakeFileStateSchema,
  progressDone: z.number(),
  progressTotal: z.number(),
  soundingCount: z.number(),
  duplicateSoundingCount: z.number(),
  runIds: z.array(z.string()),
  notes: z.array(z.string()),
  failure: z.string().nullable(),
  receivedAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  /** Time taken, ms; null while still running. */
  durationMs: z.number().nullable(),
});
export type IntakeFile = z.infer<typeof intakeFileSchema>;

/** How many of the latest files the list shows. */
export const intakeFileListLimit = 200;

export const intakeFileListSchema = z.object({ files: z.array(intakeFileSchema), active: z.number() });
export type IntakeFileList = z.infer<typeof intakeFileListSchema>;

export const intakeStatusSchema = z.object({
  eccodes: z.object({ available: z.boolean(), version: z.string().nullable(), installHint: z.string() }),
  folder: z.object({ watching: z.boolean(), path: z.string().nullable() }),
});
export type IntakeStatus = z.infer<typeof intakeStatusSchema>;

/** A scheduled pull as the API shows it: the credentials never leave the server, only whether they are set. */
export const intakeSourceSchema = z.object({
  id: z.string(),
  name: z.string(),
  urlTemplate: z.string(),
  cycleHours: z.array(z.number()),
  forecastHours: z.array(z.number()),
  delayMinutes: z.number(),
  intervalMinutes: z.number(),
  model: z.string().nullable(),
  hasAuthorization: z.boolean(),
  enabled: z.boolean(),
  lastPolledAt: z.string().nullable(),
  lastError: z.string().nullable(),
});
export type IntakeSource = z.infer<typeof intakeSourceSchema>;

export const intakeSourceListSchema = z.object({ sources: z.array(intakeSourceSchema) });

const hoursList = (max: number, what: string, maxCount: number) =>
  z
    .array(z.number({ message: `Each ${what} must be a whole number.` }).int({ message: `Each ${what} must be a whole number.` }).min(0, { message: `A ${what} cannot be negative.` }).max(max, { message: `A ${what} is at most ${max}.` }), { message: `Give the ${what}s as a list.` })
    .min(1, { message: `Give at least one ${what}.` })
    .max(maxCount, { message: `Give at most ${maxCount} ${what}s.` })
    .refine((list) => new Set(list).size === list.length, { message: `A ${what} is listed twice.` });

export const createIntakeSourceInputSchema = z.strictObject({
  name: z.string({ message: 'Give the source a name.' }).trim().min(1, { message: 'Give the source a name.' }).max(80, { message: 'Keep the name under 80 characters.' }),
  urlTemplate: z.string({ message: 'Enter the address template.' }).trim().min(1, { message: 'Enter the address template.' }).max(2000, { message: 'Keep the address under 2000 characters.' }),
  cycleHours: hoursList(23, 'cycle hour', 24),
  forecastHours: hoursList(384, 'forecast hour', 100),
  delayMinutes: z.number().int().min(0).max(2880, { message: 'The delay is at most 2880 minutes (two days).' }).default(0),
  intervalMinutes: z.number().int().min(1, { message: 'Check at most once a minute.' }).max(1440, { message: 'Check at least once a day (1440 minutes).' }).default(15),
  model: z.string().trim().min(1).max(40, { message: 'Keep the model name under 40 characters.' }).optional(),
  /** The Authorization header value, e.g. "Bearer …"; stored on the server, never shown again. */
  authorization: z.string().trim().min(1).max(2000, { message: 'Keep the authorization value under 2000 characters.' }).optional(),
  enabled: z.boolean().default(true),
});
export type CreateIntakeSourceInput = z.infer<typeof createIntakeSourceInputSchema>;

export const updateIntakeSourceInputSchema = z.strictObject({
  enabled: z.boolean({ message: 'Say whether the source is on (true) or off (false).' }),
});
export type UpdateIntakeSourceInput = z.infer<typeof updateIntakeSourceInputSchema>;

export const pullResultSchema = z.object({ fetched: z.number(), alreadyFetched: z.number(), notYetAvailable: z.number(), errors: z.array(z.string()) });
export type PullResult = z.infer<typeof pullResultSchema>;
