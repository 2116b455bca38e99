import { bigint, customType, doublePrecision, index, integer, pgTable, primaryKey, real, smallint, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { offices } from './offices';

/** Raw bytes (PostgreSQL bytea); used for the packed levels of grid soundings. */
export const bytea = customType<{ data: Uint8Array; driverData: Uint8Array }>({ dataType: () => 'bytea' });

/**
 * One model run as the office receives it: a model, a cycle (initialisation) time and a forecast
 * hour, whose grid points inside the office region became grid soundings. `state` moves
 * decoding → analysing → ready (or failed, with `failure` in words).
 */
export const modelRuns = pgTable(
  'model_runs',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    model: text().notNull(),
    cycleTime: timestamp({ withTimezone: true }).notNull(),
    forecastHour: integer().notNull(),
    validTime: timestamp({ withTimezone: true }).notNull(),
    /** 'regular_ll' or 'lambert'. */
    gridKind: text().notNull(),
    /** Grid size after cropping to the region and thinning (columns × rows). */
    nx: integer().notNull(),
    ny: integer().notNull(),
    levelCount: integer().notNull(),
    soundingCount: integer().notNull().default(0),
    /** Bytes stored for this run's grid soundings (levels and figures). */
    storedBytes: bigint({ mode: 'number' }).notNull().default(0),
    state: text().notNull().default('decoding'),
    failure: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('model_runs_office_run_idx').on(t.officeId, t.model, t.cycleTime, t.forecastHour), index().on(t.officeId, t.validTime)],
);

/**
 * A model sounding at one grid point of a run. Key figures sit in columns so evidence reads them
 * without any analysis; the levels are packed little-endian Float32 values, six per level
 * (pressure hPa, height m, temperature °C, dewpoint °C, wind u and v m/s; NaN when missing),
 * lowest level first. `pointIndex` = row × nx + column of the cropped grid.
 */
export const gridSoundings = pgTable(
  'grid_soundings',
  {
    runId: uuid()
      .notNull()
      .references(() => modelRuns.id, { onDelete: 'cascade' }),
    pointIndex: integer().notNull(),
    latitude: doublePrecision().notNull(),
    longitude: doublePrecision().notNull(),
    elevationM: real(),
    levels: bytea().notNull(),
    flagCount: smallint().notNull().default(0),
    mlCape: real(),
    muCape: real(),
    mlCin: real(),
    mlLclHeightM: real(),
    precipitableWaterMm: real(),
    bulkShear0to6kmMs: real(),
    srh0to1km: real(),
    stp: real(),
    scp: real(),
    surfaceDewpointC: real(),
    surfaceMixingRatioGkg: real(),
    srh0to500m: real(),
    criticalAngleDeg: real(),
    mlLclLfcGapM: real(),
    lapseRate0to3kmCKm: real(),
    lapseRate3to6kmCKm: real(),
    lapseRate850to500CKm: real(),
    lapseRate700to500CKm: real(),
    muCapeHailZone: real(),
    freezingLevelM: real(),
    effectiveBulkShearMs: real(),
    bulkShear0to8kmMs: real(),
    dcape: real(),
    meanWind0to6kmMs: real(),
    corfidiUpwindMs: real(),
    corfidiDownwindMs: real(),
    warmCloudDepthM: real(),
  },
  (t) => [primaryKey({ columns: [t.runId, t.pointIndex] })],
);

/**
 * The office's model-run settings: how many runs per model to keep (older runs and their grid
 * soundings are deleted in the background after each intake).
 */
export const modelRunSettings = pgTable('model_run_settings', {
  officeId: uuid()
    .primaryKey()
    .references(() => offices.id, { onDelete: 'cascade' }),
  runsKeptPerModel: integer().notNull().default(4),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});
