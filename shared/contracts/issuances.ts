import { z } from 'zod';
import { regionSchema, riskLevelSchema, supportGuidanceSchema } from './office';

/** The states of a published issuance: in force until superseded by an amendment or withdrawn. */
export const issuanceStates = ['published', 'superseded', 'withdrawn'] as const;
export type IssuanceState = (typeof issuanceStates)[number];
import { riskAreaSchema, supportCheckSchema } from './risk-areas';

/** Per area of an issuance: the evidence as it stood at publication (medians only). */
export const issuanceEvidenceSchema = z.object({
  areaId: z.string(),
  levelKey: z.string(),
  count: z.number(),
  medians: z.record(z.string(), z.number().nullable()),
  support: supportCheckSchema,
});
export type IssuanceEvidence = z.infer<typeof issuanceEvidenceSchema>;

/**
 * The frozen content of an issuance, written once at publication and read by the public pages,
 * exports and mail. Lenient (defaults, optional) only where snapshots written by earlier
 * versions lack a field.
 */
export const issuanceSnapshotSchema = z.object({
  number: z.string().optional(),
  office: z.object({ name: z.string(), timeZone: z.string(), region: regionSchema.optional() }),
  riskLadder: z.array(riskLevelSchema),
  day: z.number(),
  validFrom: z.string(),
  validUntil: z.string(),
  headline: z.string(),
  discussion: z.string().default(''),
  hazardNotes: z.record(z.string(), z.string()).default({}),
  areas: z.array(riskAreaSchema.partial({ sortOrder: true })),
  evidence: z.array(issuanceEvidenceSchema).default([]),
  /** The support-check guidance the outlook was checked against when published (absent in issuances before issue 14). */
  guidance: supportGuidanceSchema.optional(),
  authorName: z.string().nullable().default(null),
  approverName: z.string().nullable().default(null),
  publisherName: z.string().nullable().default(null),
  publishedAt: z.string(),
});
export type IssuanceSnapshot = z.infer<typeof issuanceSnapshotSchema>;
/** What publishing writes (every field present). */
export type IssuanceSnapshotInput = z.input<typeof issuanceSnapshotSchema>;

const issuanceBaseSchema = z.object({
  id: z.string(),
  number: z.string(),
  day: z.number(),
  state: z.enum(issuanceStates),
  validFrom: z.string(),
  validUntil: z.string(),
  publishedAt: z.string(),
  supersedesNumber: z.string().nullable(),
  supersededByNumber: z.string().nullable(),
  withdrawnReason: z.string().nullable(),
  withdrawnAt: z.string().nullable(),
  caution: z.string(),
});

/** GET /api/public/issuances/:number */
export const issuanceSchema = issuanceBaseSchema.extend({ snapshot: issuanceSnapshotSchema });
export type Issuance = z.infer<typeof issuanceSchema>;

export const archiveEntrySchema = issuanceBaseSchema.extend({ headline: z.string() });
export type ArchiveEntry = z.infer<typeof archiveEntrySchema>;

/** GET /api/public/bulletin */
/** One outlook day on the bulletin: what is in force, or since when nothing is, and any withdrawal to announce. */
export const bulletinDaySchema = z.object({
  day: z.number(),
  status: z.enum(['in_force', 'none_in_force']),
  issuanceNumber: z.string().nullable(),
  since: z.string().nullable(),
  withdrawn: z.object({ number: z.string(), reason: z.string().nullable(), withdrawnAt: z.string().nullable(), validUntil: z.string() }).nullable(),
});
export type BulletinDay = z.infer<typeof bulletinDaySchema>;

export const bulletinSchema = z.object({ issuances: z.array(issuanceSchema), days: z.array(bulletinDaySchema).default([]), asOf: z.string().optional(), caution: z.string() });
export type Bulletin = z.infer<typeof bulletinSchema>;

/** GET /api/public/issuances (the archive) */
export const archiveSchema = z.object({ issuances: z.array(archiveEntrySchema), total: z.number(), caution: z.string() });
export type Archive = z.infer<typeof archiveSchema>;

/** POST /api/issuances/:number/amend: the draft that amends the issuance (new, or the one already open). */
export const amendmentResultSchema = z.object({ outlookId: z.string() });
export type AmendmentResult = z.infer<typeof amendmentResultSchema>;
