import { z } from 'zod';
import { parseValidTime } from '../sounding/validate';

/** An ISO 8601 time with a zone that exists on the calendar (30 February is refused). */
const validTimeSchema = z
  .string()
  .datetime({ offset: true, message: 'Valid time must be ISO 8601, e.g. 2027-04-18T18:00:00Z.' })
  .refine((value) => parseValidTime(value) !== null, { message: 'That valid time does not exist on the calendar (check the day of the month).' });

/** Upload limits (docs/sounding-format.md): 2 MB per file, 5,000 levels per sounding, 500 files per batch. */
export const soundingLimits = { maxFileBytes: 2 * 1024 * 1024, maxLevels: 5000, maxFilesPerBatch: 500 } as const;

export const soundingSourceSchema = z.enum(['observed', 'model', 'unknown'], { message: 'Source must be "observed", "model" or "unknown".' });

const finite = (label: string) => z.number({ message: `${label} must be a number.` }).refine(Number.isFinite, { message: `${label} must be a finite number.` });

/** One level as the JSON API takes it (same units as the engine). */
export const soundingLevelInputSchema = z.object({
  pressureHpa: finite('Pressure'),
  heightM: finite('Height').nullable().optional(),
  temperatureC: finite('Temperature'),
  dewpointC: finite('Dewpoint').nullable().optional(),
  uMs: finite('Wind u').nullable().optional(),
  vMs: finite('Wind v').nullable().optional(),
});

export const soundingInputSchema = z.object({
  metadata: z.object({
    station: z.string().trim().min(1, { message: 'A station id is required.' }).max(16, { message: 'Keep the station id under 16 characters.' }),
    name: z.string().trim().max(120).default(''),
    latitude: finite('Latitude').pipe(z.number().min(-90, { message: 'Latitude must be between -90 and 90.' }).max(90, { message: 'Latitude must be between -90 and 90.' })),
    longitude: finite('Longitude').pipe(
      z.number().min(-180, { message: 'Longitude must be between -180 and 180.' }).max(180, { message: 'Longitude must be between -180 and 180.' }),
    ),
    elevationM: finite('Elevation').pipe(z.number().min(-500).max(9000, { message: 'Elevation must be between -500 and 9000 m.' })),
    validTime: validTimeSchema,
    source: soundingSourceSchema,
  }),
  levels: z.array(soundingLevelInputSchema).min(1, { message: 'A sounding needs levels.' }).max(soundingLimits.maxLevels, { message: `At most ${soundingLimits.maxLevels} levels per sounding.` }),
});
export type SoundingInput = z.infer<typeof soundingInputSchema>;

export const soundingBatchInputSchema = z.object({
  soundings: z.array(soundingInputSchema).min(1, { message: 'Send at least one sounding.' }).max(soundingLimits.maxFilesPerBatch, { message: `At most ${soundingLimits.maxFilesPerBatch} soundings per batch.` }),
});

export const soundingIssueSchema = z.object({
  severity: z.enum(['error', 'warning']),
  code: z.string(),
  message: z.string(),
  line: z.number().optional(),
  column: z.string().optional(),
  levelIndex: z.number().optional(),
});
export type SoundingIssueDto = z.infer<typeof soundingIssueSchema>;

/**
 * The result of one file or one sounding of a batch: stored (maybe with warnings), a duplicate
 * of one already stored (same content: nothing new stored, `soundingId` is the stored one), or
 * rejected. `missingForEvidence` lists the metadata a stored sounding still needs (station,
 * latitude, longitude, validTime) before it counts as evidence.
 */
export const uploadResultSchema = z.object({
  fileName: z.string(),
  status: z.enum(['accepted', 'accepted-with-warnings', 'duplicate', 'rejected']),
  soundingId: z.string().nullable(),
  issues: z.array(soundingIssueSchema),
  missingForEvidence: z.array(z.enum(['station', 'latitude', 'longitude', 'validTime'])).default([]),
});
export type UploadResult = z.infer<typeof uploadResultSchema>;
export const uploadResponseSchema = z.object({ results: z.array(uploadResultSchema), accepted: z.number(), duplicates: z.number().default(0), rejected: z.number() });
export type UploadResponse = z.infer<typeof uploadResponseSchema>;

/** Key figures shown in the library and on the map (SI units; null when they do not exist). */
export const soundingKeyFiguresSchema = z.object({
  mlCape: z.number().nullable(),
  muCape: z.number().nullable(),
  mlCin: z.number().nullable(),
  mlLclHeightM: z.number().nullable(),
  precipitableWaterMm: z.number().nullable(),
  bulkShear0to6kmMs: z.number().nullable(),
  srh0to1km: z.number().nullable(),
  stp: z.number().nullable(),
  scp: z.number().nullable(),
  surfaceDewpointC: z.number().nullable(),
  surfaceMixingRatioGkg: z.number().nullable(),
  // Ingredients behind the hazard rules (issue 14). Units are in the names; null when the
  // sounding cannot give the figure (too shallow, no winds, no positive area…).
  /** Storm-relative helicity 0–500 m AGL, right mover (left mover south of the equator), m²/s². */
  srh0to500m: z.number().nullable(),
  /** Critical angle between the 0–500 m shear vector and the storm-relative inflow at the surface, degrees. */
  criticalAngleDeg: z.number().nullable(),
  /** Height of the mixed-layer LFC above its LCL, m. */
  mlLclLfcGapM: z.number().nullable(),
  /** Temperature lapse rates, °C/km (positive when temperature falls with height). */
  lapseRate0to3kmCKm: z.number().nullable(),
  lapseRate3to6kmCKm: z.number().nullable(),
  lapseRate850to500CKm: z.number().nullable(),
  lapseRate700to500CKm: z.number().nullable(),
  /** Most-unstable parcel CAPE between the −10 °C and −30 °C environmental levels, J/kg. */
  muCapeHailZone: z.number().nullable(),
  /** Height of the 0 °C environmental level above ground, m. */
  freezingLevelM: z.number().nullable(),
  /** Effective bulk shear, m/s. */
  effectiveBulkShearMs: z.number().nullable(),
  /** 0–8 km bulk shear, m/s. */
  bulkShear0to8kmMs: z.number().nullable(),
  /** Downdraft CAPE, J/kg (positive number). */
  dcape: z.number().nullable(),
  /** 0–6 km pressure-weighted mean wind speed, m/s. */
  meanWind0to6kmMs: z.number().nullable(),
  /** Corfidi upwind and downwind propagation vector speeds, m/s. */
  corfidiUpwindMs: z.number().nullable(),
  corfidiDownwindMs: z.number().nullable(),
  /** Warm-cloud depth: from the LCL to the freezing level, m. */
  warmCloudDepthM: z.number().nullable(),
  /** How many quality flags the analysis raised (0: none). */
  flagCount: z.number().default(0),
});
export type SoundingKeyFigures = z.infer<typeof soundingKeyFiguresSchema>;

export const soundingSummarySchema = z.object({
  id: z.string(),
  /** Station id; empty when the uploaded file did not give one. */
  stationId: z.string(),
  stationName: z.string(),
  latitude: z.number().nullable(),
  longitude: z.number().nullable(),
  elevationM: z.number().nullable(),
  validTime: z.string().nullable(),
  source: soundingSourceSchema,
  modifiedFromId: z.string().nullable(),
  modificationName: z.string().nullable(),
  uploadedBy: z.string().nullable(),
  uploadedByName: z.string().nullable(),
  createdAt: z.string(),
  figures: soundingKeyFiguresSchema,
});
export type SoundingSummary = z.infer<typeof soundingSummarySchema>;

export const soundingSortKeys = ['validTime', 'stationId', 'source', 'mlCape', 'muCape', 'mlCin', 'mlLclHeightM', 'precipitableWaterMm', 'bulkShear0to6kmMs', 'srh0to1km', 'stp', 'createdAt'] as const;

export const soundingListQuerySchema = z.object({
  page: z.coerce.number().int().min(1, { message: 'Page starts at 1.' }).max(100_000, { message: 'Page must be at most 100,000.' }).default(1),
  pageSize: z.coerce.number().int().min(1).max(500, { message: 'At most 500 rows per page.' }).default(50),
  sort: z.enum(soundingSortKeys, { message: `Sort by one of: ${soundingSortKeys.join(', ')}.` }).default('validTime'),
  order: z.enum(['asc', 'desc']).default('desc'),
  source: soundingSourceSchema.optional(),
  station: z.string().trim().max(16).optional(),
  validFrom: z.string().datetime({ offset: true, message: 'validFrom must be ISO 8601.' }).optional(),
  validTo: z.string().datetime({ offset: true, message: 'validTo must be ISO 8601.' }).optional(),
  modified: z.enum(['include', 'exclude', 'only']).default('include'),
});
export type SoundingListQuery = z.infer<typeof soundingListQuerySchema>;

export const soundingListSchema = z.object({
  soundings: z.array(soundingSummarySchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});
export type SoundingList = z.infer<typeof soundingListSchema>;

/** A what-if (modified) sounding saved from the editor. */
export const saveModifiedSoundingInputSchema = z.object({
  name: z.string().trim().min(1, { message: 'Give the modified sounding a name.' }).max(80, { message: 'Keep the name under 80 characters.' }),
  note: z.string().trim().max(500).default(''),
  surfaceTemperatureC: finite('Surface temperature').optional(),
  surfaceDewpointC: finite('Surface dewpoint').optional(),
  parcelStartPressureHpa: finite('Parcel start pressure').optional(),
});
export type SaveModifiedSoundingInput = z.infer<typeof saveModifiedSoundingInputSchema>;

/** The metadata an author fills in (or corrects) in the library; all four evidence fields are required here. */
export const updateSoundingMetadataInputSchema = z.object({
  station: z.string().trim().min(1, { message: 'A station id is required.' }).max(16, { message: 'Keep the station id under 16 characters.' }),
  name: z.string().trim().max(120, { message: 'Keep the name under 120 characters.' }).default(''),
  latitude: finite('Latitude').pipe(z.number().min(-90, { message: 'Latitude must be between -90 and 90.' }).max(90, { message: 'Latitude must be between -90 and 90.' })),
  longitude: finite('Longitude').pipe(z.number().min(-180, { message: 'Longitude must be between -180 and 180.' }).max(180, { message: 'Longitude must be between -180 and 180.' })),
  elevationM: finite('Elevation').pipe(z.number().min(-500, { message: 'Elevation must be between -500 and 9000 m.' }).max(9000, { message: 'Elevation must be between -500 and 9000 m.' })).nullable().optional(),
  validTime: validTimeSchema,
  source: soundingSourceSchema,
});
export type UpdateSoundingMetadataInput = z.infer<typeof updateSoundingMetadataInputSchema>;
