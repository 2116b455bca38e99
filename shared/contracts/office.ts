import { z } from 'zod';
import { keyFigureKeys } from '../sounding/key-figures';
import { versionSchema } from './primitives';
import { hazardKinds } from './risk-areas';

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

/** Most rules one level or one hazard form may hold. */
export const MAX_RULES_PER_SET = 12;
/** Most soundings a rule set may ask for before an area counts as supported. */
export const MAX_MINIMUM_COUNT = 500;

/**
 * One rule of the office guidance: a key figure (SI units, as `soundingKeyFiguresSchema` names
 * it) with a minimum ("at least") or a maximum ("at most"). A sounding meets the rule when its
 * figure is on the allowed side of the value (equal counts as meeting it).
 */
export const guidanceRuleSchema = z.object({
  figure: z.enum(keyFigureKeys, { message: 'Choose a key figure for this rule.' }),
  bound: z.enum(['min', 'max'], { message: 'A rule is a minimum ("at least") or a maximum ("at most").' }),
  value: z
    .number({ message: 'The rule needs a number.' })
    .refine(Number.isFinite, { message: 'The rule needs a finite number.' })
    .pipe(z.number().min(-100_000, { message: 'Keep the value above −100,000.' }).max(100_000, { message: 'Keep the value under 100,000.' })),
});
export type GuidanceRule = z.infer<typeof guidanceRuleSchema>;

/**
 * The rules of one level (or one hazard form), checked jointly: a sounding backs them when it
 * meets every rule at once. `minimumSharePercent` is the share of judged soundings that must
 * back them (null: at least half); `minimumCount` is how many soundings must have every value
 * the rules use before the area can count as supported.
 */
export const guidanceRuleSetSchema = z
  .object({
    rules: z.array(guidanceRuleSchema).max(MAX_RULES_PER_SET, { message: `At most ${MAX_RULES_PER_SET} rules per level or hazard.` }),
    minimumSharePercent: z
      .number({ message: 'The minimum share is a percentage.' })
      .min(1, { message: 'The minimum share is between 1 and 100 %.' })
      .max(100, { message: 'The minimum share is between 1 and 100 %.' })
      .nullable()
      .default(null),
    minimumCount: z
      .number({ message: 'The minimum count is a whole number of soundings.' })
      .int({ message: 'The minimum count is a whole number of soundings.' })
      .min(1, { message: 'The minimum count is at least 1 sounding.' })
      .max(MAX_MINIMUM_COUNT, { message: `The minimum count is at most ${MAX_MINIMUM_COUNT} soundings.` })
      .default(3),
  })
  .superRefine((set, context) => {
    const seen = new Map<string, number>();
    set.rules.forEach((rule, index) => {
      const key = `${rule.figure}:${rule.bound}`;
      if (seen.has(key)) context.addIssue({ code: 'custom', path: ['rules', index, 'figure'], message: `This ${rule.bound === 'min' ? 'minimum' : 'maximum'} is set twice for the same figure: keep one.` });
      seen.set(key, index);
    });
    set.rules.forEach((rule, index) => {
      if (rule.bound !== 'max') return;
      const minimum = set.rules.find((other) => other.figure === rule.figure && other.bound === 'min');
      if (minimum && minimum.value > rule.value) {
        context.addIssue({ code: 'custom', path: ['rules', index, 'value'], message: 'This maximum is below the minimum set for the same figure, so no sounding could back the rules.' });
      }
    });
  });
export type GuidanceRuleSet = z.infer<typeof guidanceRuleSetSchema>;

/** The rules of one hazard: its ordinary form and its "significant" form (either may be absent). */
export const hazardGuidanceSchema = z.object({ ordinary: guidanceRuleSetSchema.optional(), significant: guidanceRuleSetSchema.optional() });
export type HazardGuidance = z.infer<typeof hazardGuidanceSchema>;

/**
 * The office's support-check guidance: rules per ladder level key and per hazard. Figures,
 * labels, published bases and the invented demo defaults are in shared/evidence/guidance.ts.
 */
export const supportGuidanceSchema = z.object({
  levels: z.record(z.string(), guidanceRuleSetSchema).refine((levels) => Object.keys(levels).length <= 12, { message: 'Guidance is set for at most 12 levels.' }),
  hazards: z.partialRecord(z.enum(hazardKinds), hazardGuidanceSchema).default({}),
});
export type SupportGuidance = z.infer<typeof supportGuidanceSchema>;
export type SupportGuidanceInput = z.input<typeof supportGuidanceSchema>;

/**
 * Guidance stored before issue 14 (minimum medians per level). Read only: converted to
 * minimum rules by `supportGuidanceFromStored` in shared/evidence/guidance.ts.
 */
export const legacyGuidanceThresholdsSchema = z.record(z.string(), z.record(z.string(), z.number()));
export type LegacyGuidanceThresholds = z.infer<typeof legacyGuidanceThresholdsSchema>;

export const officeSettingsInputSchema = z.object({
  name: z.string().trim().min(2, { message: 'The office name needs at least 2 characters.' }).max(120, { message: 'Keep the office name under 120 characters.' }),
  region: regionSchema,
  timeZone: timeZoneSchema,
  riskLadder: riskLadderSchema,
  /** Support-check guidance (rules per level and per hazard); left as it is when absent. */
  guidance: supportGuidanceSchema.optional(),
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
  guidance: supportGuidanceSchema,
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
