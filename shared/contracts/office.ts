import { z } from 'zod';
import { versionSchema } from './primitives';

const hexColour = z.string().regex(/^#[0-9a-fA-F]{6}$/, { message: 'Use a colour like #4a63c4.' });

export const riskLevelSchema = z.object({
  key: z
    .string()
    .trim()
    .regex(/^[a-z][a-z0-9_-]{0,31}$/, { message: 'Use lower-case letters, digits, - or _ (start with a letter).' }),
  label: z.string().trim().min(1, { message: 'A label is required.' }).max(60, { message: 'Keep the label under 60 characters.' }),
  colour: hexColour,
  meaning: z.string().trim().max(200, { message: 'Keep the meaning under 200 characters.' }).default(''),
});
export type RiskLevel = z.infer<typeof riskLevelSchema>;

/** Ordered from lowest to highest risk; order is the array order. */
export const riskLadderSchema = z
  .array(riskLevelSchema)
  .min(1, { message: 'The risk ladder needs at least one level.' })
  .max(12, { message: 'The risk ladder has at most 12 levels.' })
  .superRefine((ladder, ctx) => {
    const seen = new Set<string>();
    ladder.forEach((level, index) => {
      if (seen.has(level.key)) {
        ctx.addIssue({ code: 'custom', path: [index, 'key'], message: `The key "${level.key}" is used twice.` });
      }
      seen.add(level.key);
    });
  });
export type RiskLadder = z.infer<typeof riskLadderSchema>;

export const regionSchema = z
  .object({
    west: z.number().min(-180, { message: 'West must be at least -180.' }).max(180, { message: 'West must be at most 180.' }),
    south: z.number().min(-90, { message: 'South must be at least -90.' }).max(90, { message: 'South must be at most 90.' }),
    east: z.number().min(-180, { message: 'East must be at least -180.' }).max(180, { message: 'East must be at most 180.' }),
    north: z.number().min(-90, { message: 'North must be at least -90.' }).max(90, { message: 'North must be at most 90.' }),
  })
  .refine((r) => r.east > r.west, { message: 'East must be greater than west.', path: ['east'] })
  .refine((r) => r.north > r.south, { message: 'North must be greater than south.', path: ['north'] });
export type Region = z.infer<typeof regionSchema>;

function isTimeZone(value: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: value });
    return true;
  } catch {
    return false;
  }
}

export const timeZoneSchema = z
  .string()
  .trim()
  .min(1, { message: 'A time zone is required.' })
  .refine(isTimeZone, { message: 'Use an IANA time zone such as America/Chicago.' });

/** Parameters an office may set a guidance threshold for (minimum medians per level, SI units); labels and units in shared/evidence/support-check.ts. */
export const thresholdParameterKeys = ['mlCape', 'muCape', 'bulkShear0to6kmMs', 'srh0to1km', 'stp', 'scp'] as const;
export type ThresholdParameterKey = (typeof thresholdParameterKeys)[number];

export const guidanceThresholdsSchema = z.record(
  z.string(),
  z.partialRecord(z.enum(thresholdParameterKeys), z.number({ message: 'Thresholds are numbers.' }).min(0, { message: 'Thresholds are 0 or more.' }).max(100_000)),
);
/** Per ladder key, the minimum median of each parameter expected at that level. */
export type GuidanceThresholds = z.infer<typeof guidanceThresholdsSchema>;

export const officeSettingsInputSchema = z.object({
  name: z.string().trim().min(2, { message: 'The office name needs at least 2 characters.' }).max(120, { message: 'Keep the office name under 120 characters.' }),
  region: regionSchema,
  timeZone: timeZoneSchema,
  riskLadder: riskLadderSchema,
  /** Support-check guidance per ladder key; left as it is when absent. */
  guidanceThresholds: guidanceThresholdsSchema.optional(),
  /** Relaxes the four-eyes rule (one-person night shift); each use is audited. Left as it is when absent. */
  allowSelfApproval: z.boolean().optional(),
  /** Optimistic concurrency: the version the editor loaded. */
  version: versionSchema,
});
export type OfficeSettingsInput = z.infer<typeof officeSettingsInputSchema>;

/** The base map under every map: a tile URL template from the installation's configuration, or none (offline outlines only). */
export const baseMapSchema = z.object({ tileUrl: z.string().nullable(), attribution: z.string().nullable() });
export type BaseMap = z.infer<typeof baseMapSchema>;

export const officeSettingsSchema = officeSettingsInputSchema.extend({
  id: z.string(),
  updatedAt: z.string(),
  guidanceThresholds: guidanceThresholdsSchema,
  allowSelfApproval: z.boolean(),
  /** Set by TILE_URL and TILE_ATTRIBUTION, not by admins. */
  baseMap: baseMapSchema,
});
export type OfficeSettings = z.infer<typeof officeSettingsSchema>;

/** Defaults from the product brief; used to seed a new office and to reset the ladder. */
export const defaultRiskLadder: RiskLadder = [
  { key: 'thunder', label: 'Thunderstorms', colour: '#dbe4ee', meaning: 'thunderstorms expected, severe ones unlikely' },
  { key: 'level1', label: 'Level 1 · Isolated', colour: '#a9c6e8', meaning: 'a few severe storms possible' },
  { key: 'level2', label: 'Level 2 · Scattered', colour: '#6f9fd8', meaning: 'scattered severe storms expected' },
  { key: 'level3', label: 'Level 3 · Numerous', colour: '#4a63c4', meaning: 'numerous severe storms, some intense' },
  { key: 'level4', label: 'Level 4 · Widespread', colour: '#6b3aa6', meaning: 'widespread severe storms, several intense' },
  { key: 'level5', label: 'Level 5 · Outbreak', colour: '#3b0a45', meaning: 'an outbreak of intense, long-lived severe storms' },
];

/** Text colour with enough contrast on a ladder colour (WCAG relative luminance). */
export function textColourOn(background: string): '#ffffff' | '#111827' {
  const channel = (hex: string) => {
    const c = parseInt(hex, 16) / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  const h = background.replace('#', '');
  const luminance = 0.2126 * channel(h.slice(0, 2)) + 0.7152 * channel(h.slice(2, 4)) + 0.0722 * channel(h.slice(4, 6));
  return luminance < 0.2 ? '#ffffff' : '#111827';
}
