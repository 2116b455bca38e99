import { z } from 'zod';
import { reportHazards, reportSources } from '../reports/storm-report';

/** A storm report sent by a pipeline (JSON API): the same fields as a CSV row, in camelCase. */
export const stormReportInputSchema = z.object({
  time: z.string().max(40),
  latitude: z.number(),
  longitude: z.number(),
  hazard: z.string().max(20),
  hailCm: z.number().nullable().optional(),
  gustKmh: z.number().nullable().optional(),
  gustMeasured: z.boolean().nullable().optional(),
  efRating: z.number().int().nullable().optional(),
  source: z.string().max(40),
  remark: z.string().max(500).optional(),
});

export type StormReportInput = z.infer<typeof stormReportInputSchema>;

export const stormReportsInputSchema = z.object({
  reports: z.array(stormReportInputSchema).min(1, { message: 'Send at least one report.' }).max(10_000, { message: 'Send at most 10,000 reports at once.' }),
});

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'Use a date like 2027-04-18.' });

export const stormReportsQuerySchema = z.object({
  from: isoDate.optional(),
  to: isoDate.optional(),
  issuance: z.string().regex(/^\d{4}-\d{4}$/).optional(),
});

export const stormReportSchema = z.object({
  id: z.string(),
  time: z.string(),
  latitude: z.number(),
  longitude: z.number(),
  hazard: z.enum(reportHazards),
  hailCm: z.number().nullable(),
  gustKmh: z.number().nullable(),
  gustMeasured: z.boolean().nullable(),
  efRating: z.number().nullable(),
  source: z.enum(reportSources),
  remark: z.string(),
});
export type StormReportView = z.infer<typeof stormReportSchema>;

const contingencySchema = z.object({ hits: z.number(), falseAlarms: z.number(), misses: z.number(), correctNegatives: z.number() });
const scoresSchema = z.object({ pod: z.number().nullable(), successRatio: z.number().nullable(), csi: z.number().nullable(), bias: z.number().nullable() });

export const verificationResultSchema = z.object({
  method: z.object({ gridSpacingKm: z.number(), observedRadiusKm: z.number(), smoothingLengthKm: z.number() }),
  window: z.object({ from: z.string(), until: z.string() }),
  cells: z.number(),
  reportsUsed: z.number(),
  levels: z.array(z.object({ levelKey: z.string(), table: contingencySchema, scores: scoresSchema })),
  hazards: z.array(z.object({ hazard: z.enum(reportHazards), significant: z.boolean(), table: contingencySchema, scores: scoresSchema, reports: z.number() })),
  practicallyPerfect: z.object({ max: z.number(), insideShareByLevel: z.record(z.string(), z.number().nullable()) }),
});
export type VerificationResult = z.infer<typeof verificationResultSchema>;

/** An issuance's verification as the issuance page shows it. */
export const issuanceVerificationSchema = z.object({
  issuanceNumber: z.string(),
  status: z.enum(['pending', 'scored', 'not_scored']),
  reason: z.string().nullable(),
  computedAt: z.string().nullable(),
  result: verificationResultSchema.nullable(),
  reports: z.array(stormReportSchema),
});
export type IssuanceVerification = z.infer<typeof issuanceVerificationSchema>;

export const verificationSummaryQuerySchema = z.object({
  day: z.enum(['1', '2', '3']).optional(),
  level: z.string().max(40).optional(),
  hazard: z.enum(reportHazards).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
});
export type VerificationSummaryQuery = z.infer<typeof verificationSummaryQuerySchema>;

/** One scored issuance on the Verification page: per level and per hazard, the table and scores. */
export const verificationSummaryRowSchema = z.object({
  issuanceNumber: z.string(),
  day: z.number(),
  validFrom: z.string(),
  validUntil: z.string(),
  /** The office shift the issuance was published in (local time): night, morning, afternoon, evening. */
  shift: z.string(),
  levels: z.array(z.object({ levelKey: z.string(), table: contingencySchema, scores: scoresSchema })),
  hazards: z.array(z.object({ hazard: z.enum(reportHazards), significant: z.boolean(), table: contingencySchema, scores: scoresSchema })),
});
export type VerificationSummaryRow = z.infer<typeof verificationSummaryRowSchema>;

export const verificationSummarySchema = z.object({
  rows: z.array(verificationSummaryRowSchema),
  /** Not scored (withdrawn), listed with the reason. */
  notScored: z.array(z.object({ issuanceNumber: z.string(), reason: z.string() })),
  ladder: z.array(z.object({ key: z.string(), label: z.string(), colour: z.string() })),
});
export type VerificationSummary = z.infer<typeof verificationSummarySchema>;

export const reportIntakeResultSchema = z.object({ stored: z.number(), merged: z.number(), rescored: z.array(z.string()) });
export type ReportIntakeResult = z.infer<typeof reportIntakeResultSchema>;
