import { z } from 'zod';

/** OGC API – Features Part 1 (Core): the collections Stormdraft serves. */
export const ogcCollectionIds = ['risk-areas', 'issuances'] as const;
export type OgcCollectionId = (typeof ogcCollectionIds)[number];

export const ogcCollectionParamsSchema = z.object({
  collectionId: z.enum(ogcCollectionIds, { message: 'There is no such collection; use risk-areas or issuances.' }),
});
export const ogcFeatureParamsSchema = ogcCollectionParamsSchema.extend({
  featureId: z.string().max(64, { message: 'A feature id is at most 64 characters.' }),
});

/** Largest page; a larger `limit` is served as this many (the standard asks servers not to fail on it). */
export const ogcMaxLimit = 1000;
export const ogcDefaultLimit = 100;

const integerText = (label: string, min: number) =>
  z
    .string()
    .max(12, { message: `${label} is too long.` })
    .regex(/^\d+$/, { message: `${label} must be a whole number.` })
    .transform(Number)
    .refine((n) => n >= min, { message: `${label} must be at least ${min}.` });

/** bbox: minLon,minLat,maxLon,maxLat (CRS84), or the 6-number form with heights (which are ignored). */
export type Bbox = [number, number, number, number];
const bboxSchema = z
  .string()
  .max(200, { message: 'bbox is too long.' })
  .transform((text, ctx): Bbox => {
    const parts = text.split(',').map((p) => Number(p.trim()));
    if ((parts.length !== 4 && parts.length !== 6) || parts.some((n) => !Number.isFinite(n))) {
      ctx.addIssue({ code: 'custom', message: 'bbox must be 4 numbers (minLon,minLat,maxLon,maxLat) or 6 with heights.' });
      return z.NEVER;
    }
    const [minLon = 0, minLat = 0, maxLon = 0, maxLat = 0] = parts.length === 4 ? parts : [parts[0], parts[1], parts[3], parts[4]];
    if (Math.abs(minLon) > 180 || Math.abs(maxLon) > 180 || Math.abs(minLat) > 90 || Math.abs(maxLat) > 90) {
      ctx.addIssue({ code: 'custom', message: 'bbox longitudes must be within ±180 and latitudes within ±90 (CRS84).' });
      return z.NEVER;
    }
    if (minLat > maxLat) {
      ctx.addIssue({ code: 'custom', message: 'bbox: the lower latitude must not exceed the upper latitude.' });
      return z.NEVER;
    }
    return [minLon, minLat, maxLon, maxLat];
  });

/** datetime: an RFC 3339 instant, or an interval start/end where either end may be open (".." or empty). */
export interface TimeInterval {
  start: Date | null;
  end: Date | null;
}
const rfc3339 = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?(Z|[+-]\d{2}:\d{2})$/i;
const datetimeSchema = z
  .string()
  .max(100, { message: 'datetime is too long.' })
  .transform((text, ctx): TimeInterval => {
    const fail = () => {
      ctx.addIssue({ code: 'custom', message: 'datetime must be an RFC 3339 time (2027-04-18T12:00:00Z) or an interval start/end, with ".." for an open end.' });
      return z.NEVER;
    };
    const parts = text.split('/');
    if (parts.length > 2) return fail();
    const parse = (part: string, open: boolean): Date | null | undefined => {
      if (open && (part === '..' || part === '')) return null;
      if (!rfc3339.test(part)) return undefined;
      const time = new Date(part);
      return Number.isNaN(time.getTime()) ? undefined : time;
    };
    if (parts.length === 1) {
      const instant = parse(parts[0] ?? '', false);
      return instant ? { start: instant, end: instant } : fail();
    }
    const start = parse(parts[0] ?? '', true);
    const end = parse(parts[1] ?? '', true);
    if (start === undefined || end === undefined || (start === null && end === null)) return fail();
    if (start && end && start > end) return fail();
    return { start, end };
  });

/**
 * The items query: only these parameters exist (an unknown one is a 400, as Part 1 requires);
 * `offset` carries the `next` link's paging.
 */
const unknownParameter = (accepted: string) => ({
  error: (issue: { code?: string; keys?: string[] }) => (issue.code === 'unrecognized_keys' ? `Unknown query parameter ${(issue.keys ?? []).join(', ')}: ${accepted}` : undefined),
});

/** `f`: the encoding; only JSON (GeoJSON for items) is offered. Clients that always send f=json are served. */
const formatSchema = z.enum(['json'], { message: 'Only JSON is offered here: leave f out or use f=json.' }).optional();

export const ogcItemsQuerySchema = z.strictObject(
  {
    f: formatSchema,
    limit: integerText('limit', 1)
      .transform((n) => Math.min(n, ogcMaxLimit))
      .optional(),
    offset: integerText('offset', 0).optional(),
    bbox: bboxSchema.optional(),
    datetime: datetimeSchema.optional(),
  },
  unknownParameter('this collection accepts limit, offset, bbox, datetime and f.'),
);
export type OgcItemsQuery = z.infer<typeof ogcItemsQuerySchema>;

/** Pages that take no parameters still refuse unknown ones. */
export const ogcNoQuerySchema = z.strictObject({ f: formatSchema }, unknownParameter('this resource takes only f=json.'));
