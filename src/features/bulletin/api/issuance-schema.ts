import { z } from 'zod';
import { issuanceStates } from '../../../../shared/contracts/workflow';
import { riskAreaSchema } from '../../../../shared/contracts/outlooks';

/**
 * The public shape of an issuance, as `/api/public/*` sends it. The snapshot is frozen at
 * publication; fields are lenient where older snapshots may lack them (defaults, nullable).
 */
const ladderStepSchema = z.object({ key: z.string(), label: z.string(), colour: z.string(), meaning: z.string().default('') });

const evidenceSummarySchema = z.object({
  areaId: z.string(),
  levelKey: z.string(),
  count: z.number(),
  medians: z.record(z.string(), z.number().nullable()),
  support: z.object({ result: z.enum(['supported', 'thin', 'exceeds', 'none']), reasons: z.array(z.string()) }),
});
export type IssuanceEvidence = z.infer<typeof evidenceSummarySchema>;

export const issuanceSnapshotSchema = z.object({
  office: z.object({ name: z.string(), timeZone: z.string(), region: z.object({ west: z.number(), south: z.number(), east: z.number(), north: z.number() }).optional() }),
  riskLadder: z.array(ladderStepSchema),
  day: z.number(),
  validFrom: z.string(),
  validUntil: z.string(),
  headline: z.string(),
  discussion: z.string().default(''),
  hazardNotes: z.record(z.string(), z.string()).default({}),
  areas: z.array(riskAreaSchema.partial({ sortOrder: true })),
  evidence: z.array(evidenceSummarySchema).default([]),
  authorName: z.string().nullable().default(null),
  approverName: z.string().nullable().default(null),
  publisherName: z.string().nullable().default(null),
  publishedAt: z.string(),
});
export type IssuanceSnapshot = z.infer<typeof issuanceSnapshotSchema>;

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

export const issuanceSchema = issuanceBaseSchema.extend({ snapshot: issuanceSnapshotSchema });
export type Issuance = z.infer<typeof issuanceSchema>;

export const archiveEntrySchema = issuanceBaseSchema.extend({ headline: z.string() });
export type ArchiveEntry = z.infer<typeof archiveEntrySchema>;
