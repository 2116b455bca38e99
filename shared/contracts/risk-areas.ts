import { z } from 'zod';
import { countVertices, MAX_VERTICES_PER_AREA, tooManyVerticesMessage } from '../geometry/limits';

/**
 * Risk areas, hazards and the support check result: the parts of the outlook contract that a
 * published issuance carries too. Kept apart from the authoring payloads (outlooks.ts) so the
 * public bulletin loads only what it reads.
 */

export const hazardKinds = ['tornado', 'hail', 'wind', 'flood'] as const;
export type HazardKind = (typeof hazardKinds)[number];
export const hazardLabels: Record<HazardKind, string> = { tornado: 'Tornado', hail: 'Large hail', wind: 'Damaging wind', flood: 'Flash flooding' };

export const hazardFlagSchema = z.object({
  hazard: z.enum(hazardKinds, { message: 'Hazard must be tornado, hail, wind or flood.' }),
  significant: z.boolean().default(false),
});

const position = z.tuple([z.number().min(-180).max(180), z.number().min(-90).max(90)], { message: 'A position is [longitude, latitude] in degrees.' });
const ring = z.array(position).min(4, { message: 'A polygon ring needs at least 4 positions (the first repeated last).' }).refine(
  (r) => {
    const first = r[0];
    const last = r[r.length - 1];
    return !!first && !!last && first[0] === last[0] && first[1] === last[1];
  },
  { message: 'A polygon ring must end where it starts.' },
);

/** RFC 7946 Polygon or MultiPolygon in WGS 84 longitude/latitude. */
export const areaGeometrySchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('Polygon'), coordinates: z.array(ring).min(1, { message: 'A polygon needs an outer ring.' }) }),
  z.object({ type: z.literal('MultiPolygon'), coordinates: z.array(z.array(ring).min(1)).min(1, { message: 'A multipolygon needs at least one polygon.' }) }),
]);

/** An area geometry within `limit` points (issue 11: unbounded outlines froze the server). */
export const boundedAreaGeometrySchema = (limit: number, what: string) =>
  areaGeometrySchema.superRefine((geometry, context) => {
    const count = countVertices(geometry);
    if (count > limit) context.addIssue({ code: 'custom', message: tooManyVerticesMessage(what, count, limit), path: ['coordinates'] });
  });
export type AreaGeometry = z.infer<typeof areaGeometrySchema>;

export const riskAreaInputSchema = z.object({
  id: z.string().uuid().optional(),
  levelKey: z.string().min(1, { message: 'Choose a risk level.' }),
  hazards: z.array(hazardFlagSchema).max(4).default([]),
  geometry: boundedAreaGeometrySchema(MAX_VERTICES_PER_AREA, 'This area'),
  label: z.string().trim().max(80, { message: 'Keep the area label under 80 characters.' }).default(''),
});
export type RiskAreaInput = z.infer<typeof riskAreaInputSchema>;

export const riskAreaSchema = riskAreaInputSchema.extend({ id: z.string(), sortOrder: z.number() });
export type RiskArea = z.infer<typeof riskAreaSchema>;

export const supportResults = ['supported', 'thin', 'exceeds', 'none'] as const;
/**
 * How one set of rules (the level's, or one hazard's) judged the soundings inside an area: which
 * soundings back it (meet every rule at once), which fail a rule, and which lack a value a rule
 * uses (they are not counted either way). Ids are sounding ids (grid soundings: `runId:pointIndex`).
 */
export const ruleJudgementSchema = z.object({
  result: z.enum(supportResults),
  reasons: z.array(z.string()),
  backing: z.array(z.string()).default([]),
  failing: z.array(z.string()).default([]),
  lacking: z.array(z.string()).default([]),
});
export type RuleJudgement = z.infer<typeof ruleJudgementSchema>;

/** The support check of an area: its level's judgement plus one per hazard flag on the area. */
export const supportCheckSchema = ruleJudgementSchema.extend({
  hazards: z.array(ruleJudgementSchema.extend({ hazard: z.enum(hazardKinds), significant: z.boolean() })).default([]),
});
export type SupportCheckResult = z.infer<typeof supportCheckSchema>;
