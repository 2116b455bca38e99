import { mkdtemp, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pino from 'pino';
import psychrolib from 'psychrolib';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateGribFixture, gribPresets, type GeneratedField, type GribFixtureSpec } from '../../../tests/fixtures/grib/generate-grib';
import { openDatabase, type DatabaseHandle } from '../../db/client';
import { gridSoundings, modelRuns, offices } from '../../db/schema';
import { ensureOffice } from '../../services/seed.service';
import { applyRunRetention, listModelRuns, runRetentionIdle, setRunRetention } from '../../services/model-runs.service';
import { closeSoundingPool } from '../../workers/sounding-pool';
import { levelsFromBytes, unpackLevels } from './build-soundings';
import { listGribMessages, streamGribValues } from './decode-grib';
import { ingestGribFile } from './ingest-grib';

/** psychrolib with the one function this file uses beyond the shared type declarations. */
const psychro = psychrolib as typeof psychrolib & {
  /** Dewpoint, °C, from dry-bulb temperature (°C) and relative humidity (0..1). */
  GetTDewPointFromRelHum(temperatureC: number, relativeHumidity: number): number;
};

const logger = pino({ level: 'silent' });
let handle: DatabaseHandle;
let dir: string;
let officeId: string;

beforeAll(async () => {
  handle = await openDatabase({});
  await ensureOffice(handle.db);
  const [office] = await handle.db.select({ id: offices.id }).from(offices);
  officeId = office?.id ?? '';
  dir = await mkdtemp(join(tmpdir(), 'grib-test-'));
}, 30_000);

afterAll(async () => {
  await runRetentionIdle();
  await closeSoundingPool();
  await handle.close();
  await rm(dir, { recursive: true, force: true });
});

async function fixture(name: string, spec: GribFixtureSpec): Promise<{ path: string; fields: GeneratedField[] }> {
  const path = join(dir, name);
  return { path, fields: await generateGribFixture(spec, path) };
}

/** Largest error of simple packing with `bits` bits over the field's range (WMO FM 92 simple packing: R + X·2^E, X < 2^bits). */
function packingTolerance(values: Float64Array, bits: number): number {
  let min = Infinity, max = -Infinity;
  for (const value of values) { min = Math.min(min, value); max = Math.max(max, value); }
  return (max - min) / 2 ** (bits - 1) + 1e-6 * Math.max(Math.abs(min), Math.abs(max));
}

describe('GRIB2 fixtures made with ecCodes', () => {
  it('When the small fixture is decoded, then every value matches what the generator wrote (within the packing precision)', async () => {
    const { path, fields } = await fixture('roundtrip.grib2', gribPresets.small);
    const listed = await listGribMessages(path);
    if (!listed.ok) throw new Error(listed.error.reason);
    expect(listed.value.map((m) => [m.shortName, m.forecastHour])).toEqual(fields.map((f) => [f.shortName, f.forecastHour]));
    expect(listed.value.filter((m) => m.typeOfLevel === 'isobaricInhPa').map((m) => m.level)).toEqual(fields.filter((f) => f.typeOfLevel === 'isobaricInhPa').map((f) => f.level));
    const decoded = fields.map((f) => new Float64Array(f.values.length));
    let latitudes: Float64Array = new Float64Array(0);
    const result = await streamGribValues(path, listed.value, {
      onCoordinates(lat) { latitudes = lat; return null; },
      slotOf: (point) => point,
      onValue(message, slot, value) { (decoded[message] as Float64Array)[slot] = value; },
    });
    expect(result.ok).toBe(true);
    // Generator rows run north to south from 42 °N, 1° apart.
    expect(latitudes[0]).toBeCloseTo(42, 3);
    expect(latitudes[6]).toBeCloseTo(41, 3);
    for (const [index, field] of fields.entries()) {
      const tolerance = packingTolerance(field.values, gribPresets.small.bitsPerValue);
      const worst = Math.max(...Array.from(field.values, (value, i) => Math.abs(value - ((decoded[index] as Float64Array)[i] as number))));
      expect(worst, `${field.shortName} at ${field.level}`).toBeLessThanOrEqual(tolerance);
    }
  });

  it('When the generator runs twice with the same spec, then the files are byte for byte the same', async () => {
    const a = await fixture('a.grib2', gribPresets.lambert);
    const b = await fixture('b.grib2', gribPresets.lambert);
    expect(Buffer.compare(await readFile(a.path), await readFile(b.path))).toBe(0);
  });
});

describe('ingestGribFile', () => {
  it('When a regular lat-lon run with surface fields is taken in, then each forecast hour is a ready run with one sounding per point in the region', async () => {
    const { path, fields } = await fixture('small.grib2', gribPresets.small);
    const progress: number[] = [];
    const result = await ingestGribFile({ db: handle.db, logger }, { officeId, filePath: path, model: 'TESTLL', onProgress: (done) => progress.push(done) });
    if (!result.ok) throw new Error(result.error.reason);
    // Office region 35.5..41.5 °N, 96.5..87.5 °W (seed); the grid spans 38..42 °N, 100..95 °W:
    // rows 41, 40, 39, 38 and columns −96, −95 → 4 × 2 points per run, two runs.
    expect(result.value.runIds).toHaveLength(2);
    expect(result.value.soundingCount).toBe(16);
    expect(progress.at(-1)).toBe(16);
    const runs = await handle.db.select().from(modelRuns).where(eq(modelRuns.model, 'TESTLL')).orderBy(modelRuns.forecastHour);
    expect(runs.map((r) => [r.state, r.forecastHour, r.nx, r.ny, r.soundingCount, r.validTime.toISOString()])).toEqual([
      ['ready', 6, 2, 4, 8, '2027-04-18T18:00:00.000Z'],
      ['ready', 9, 2, 4, 8, '2027-04-18T21:00:00.000Z'],
    ]);
    expect(result.value.storedBytes).toBe(runs.reduce((sum, r) => sum + r.storedBytes, 0));

    // The point at 41 °N, 96 °W: column 4, row 1 of the source grid (6 columns).
    const rows = await handle.db.select().from(gridSoundings).where(eq(gridSoundings.runId, runs[0]?.id ?? ''));
    const point = rows.find((r) => Math.abs(r.latitude - 41) < 1e-3 && Math.abs(r.longitude + 96) < 1e-3);
    if (!point) throw new Error('no sounding at 41 N 96 W');
    const source = 1 * 6 + 4;
    const value = (shortName: string, level = 0) => fields.find((f) => f.shortName === shortName && f.forecastHour === 6 && (level === 0 || f.level === level))?.values[source] ?? NaN;
    const levels = unpackLevels(levelsFromBytes(point.levels));
    // Surface level first: sp, orography, 2 m temperature and dewpoint, 10 m wind.
    expect(levels[0]?.pressureHpa).toBeCloseTo(value('sp') / 100, 2);
    expect(levels[0]?.heightM).toBeCloseTo(value('orog'), 1);
    expect(levels[0]?.temperatureC).toBeCloseTo(value('2t') - 273.15, 3);
    expect(levels[0]?.dewpointC).toBeCloseTo(value('2d') - 273.15, 3);
    expect(levels[0]?.uMs).toBeCloseTo(value('10u'), 3);
    // The 700 hPa level: temperature and height as written; dewpoint from RH checked against
    // psychrolib (ASHRAE Handbook of Fundamentals 2017, ch. 1), an independent implementation.
    const at700 = levels.find((l) => l.pressureHpa === 700);
    expect(at700?.temperatureC).toBeCloseTo(value('t', 700) - 273.15, 3);
    expect(at700?.heightM).toBeCloseTo(value('gh', 700), 1);
    psychro.SetUnitSystem(psychro.SI);
    // At 850 hPa the dewpoint is above 0 °C, where psychrolib also works over liquid water.
    const at850 = levels.find((l) => l.pressureHpa === 850);
    const expectedDewpoint = psychro.GetTDewPointFromRelHum(value('t', 850) - 273.15, value('r', 850) / 100);
    expect(expectedDewpoint).toBeGreaterThan(0);
    expect(Math.abs((at850?.dewpointC ?? NaN) - expectedDewpoint)).toBeLessThan(0.1);
    expect(point.mlCape).not.toBeNull();
    expect(point.precipitableWaterMm ?? 0).toBeGreaterThan(0);
  }, 60_000);

  it('When the ground is high, then isobaric levels below the surface pressure are dropped', async () => {
    const runs = await handle.db.select().from(modelRuns).where(eq(modelRuns.model, 'TESTLL'));
    const rows = await handle.db.select().from(gridSoundings).where(eq(gridSoundings.runId, runs[0]?.id ?? ''));
    for (const row of rows) {
      const levels = unpackLevels(levelsFromBytes(row.levels));
      const surface = levels[0]?.pressureHpa ?? 0;
      expect(levels.slice(1).every((level) => level.pressureHpa < surface), `point ${row.pointIndex}`).toBe(true);
      expect(levels[0]?.heightM).toBeCloseTo(row.elevationM ?? NaN, 3);
    }
    // Column −95 °W is the last source column: orography 1,350 m, surface pressure about 862 hPa
    // (generator: 1013.25 hPa · exp(−1350/8400)), so 1000–875 hPa levels are gone there.
    const high = rows.find((r) => Math.abs(r.longitude + 95) < 1e-3);
    const highLevels = unpackLevels(levelsFromBytes(high?.levels ?? new Uint8Array()));
    expect(highLevels[0]?.pressureHpa).toBeCloseTo(1013.25 * Math.exp(-1350 / 8400), 1);
    expect(highLevels.map((l) => l.pressureHpa).filter((p) => p >= 900)).toEqual([]);
  });

  it('When a Lambert conformal run with specific humidity and geopotential is taken in, then its points are placed and their levels derived', async () => {
    const { path, fields } = await fixture('lambert.grib2', gribPresets.lambert);
    const result = await ingestGribFile({ db: handle.db, logger }, { officeId, filePath: path, model: 'TESTLAM' });
    if (!result.ok) throw new Error(result.error.reason);
    const [run] = await handle.db.select().from(modelRuns).where(eq(modelRuns.id, result.value.runIds[0] ?? ''));
    expect(run?.gridKind).toBe('lambert');
    const rows = await handle.db.select().from(gridSoundings).where(eq(gridSoundings.runId, run?.id ?? '')).orderBy(gridSoundings.pointIndex);
    expect(rows.length).toBeGreaterThan(10);
    // The first grid point is the south-west corner given to the generator (36 °N, 98 °W) — outside
    // the region (west of 96.5 °W); every stored point is inside it.
    for (const row of rows) {
      expect(row.latitude).toBeGreaterThanOrEqual(35.5);
      expect(row.longitude).toBeGreaterThanOrEqual(-96.5);
    }
    const sample = rows[0];
    const levels = unpackLevels(levelsFromBytes(sample?.levels ?? new Uint8Array()));
    const z500 = fields.filter((f) => f.shortName === 'z' && f.level === 500);
    const heights = z500[0]?.values ?? new Float64Array();
    const at500 = levels.find((l) => l.pressureHpa === 500);
    // Height from geopotential / 9.80665 (WMO standard gravity) matches one of the written points.
    expect(Array.from(heights).some((z) => Math.abs(z / 9.80665 - (at500?.heightM ?? 0)) < 0.5)).toBe(true);
    // Dewpoint from specific humidity is never above the temperature and exists on every level.
    expect(levels.every((l) => l.dewpointC !== null && l.dewpointC <= l.temperatureC)).toBe(true);
  }, 60_000);

  it('When thinning to about 200 km on a 1° grid, then every second point is kept', async () => {
    const { path } = await fixture('thin.grib2', { ...gribPresets.small, forecastHours: [12] });
    const result = await ingestGribFile({ db: handle.db, logger }, { officeId, filePath: path, model: 'TESTTHIN', thinningKm: 200 });
    if (!result.ok) throw new Error(result.error.reason);
    const rows = await handle.db.select().from(gridSoundings).where(eq(gridSoundings.runId, result.value.runIds[0] ?? ''));
    // Region rows 41, 40, 39, 38 °N and columns 96, 95 °W; 1° of latitude ≈ 111 km, so a
    // stride of 2 keeps rows 41 and 39 in column 96 °W only.
    expect(rows.map((r) => [Math.round(r.latitude), Math.round(r.longitude)]).sort()).toEqual([[39, -96], [41, -96]]);
  }, 60_000);

  it('When the file is truncated, corrupt or not GRIB, then the result is a failure with a reason and no run is left behind', async () => {
    const { path } = await fixture('whole.grib2', { ...gribPresets.small, forecastHours: [15] });
    const bytes = await readFile(path);
    const truncated = join(dir, 'truncated.grib2');
    await writeFile(truncated, bytes.subarray(0, Math.floor(bytes.length * 0.6)));
    const corrupt = join(dir, 'corrupt.grib2');
    const damaged = Buffer.from(bytes);
    for (let i = 200; i < damaged.length; i += 97) damaged[i] = 0xff;
    await writeFile(corrupt, damaged);
    const text = join(dir, 'text.grib2');
    await writeFile(text, 'pressure_hPa,height_m\n1000,0\n');
    const before = (await handle.db.select().from(modelRuns)).length;
    const reasons: string[] = [];
    for (const filePath of [truncated, corrupt, text, join(dir, 'missing.grib2')]) {
      const result = await ingestGribFile({ db: handle.db, logger }, { officeId, filePath, model: 'TESTBAD' });
      reasons.push(result.ok ? 'stored' : result.error.reason);
    }
    expect(reasons[0]).toMatch(/truncated or damaged/);
    expect(reasons[1]).toMatch(/^ecCodes could not read the file as GRIB: .{5,}/);
    expect(reasons[2]).toMatch(/^ecCodes could not read the file as GRIB: .{5,}/);
    expect(reasons[3]).toBe('The file could not be found or is not a regular file.');
    expect((await handle.db.select().from(modelRuns)).length).toBe(before);
    expect((await stat(truncated)).size).toBeGreaterThan(0);
  }, 60_000);

  it('When the intake is cancelled part-way, then the result says so and the run is marked failed', async () => {
    const { path } = await fixture('cancel.grib2', { ...gribPresets.small, forecastHours: [18] });
    const controller = new AbortController();
    const result = await ingestGribFile(
      { db: handle.db, logger, gribTuning: { batchSize: 2 } },
      { officeId, filePath: path, model: 'TESTCANCEL', signal: controller.signal, onProgress: (done) => (done > 0 ? controller.abort() : undefined) },
    );
    expect(result).toEqual({ ok: false, error: { reason: 'The intake was cancelled.' } });
    const runs = await handle.db.select().from(modelRuns).where(eq(modelRuns.model, 'TESTCANCEL'));
    expect(runs.map((r) => [r.state, r.failure])).toEqual([['failed', 'The intake was cancelled.']]);
    // The soundings stored before the cancel are removed: part of a run is not evidence.
    expect(await handle.db.select().from(gridSoundings).where(eq(gridSoundings.runId, runs[0]?.id ?? ''))).toEqual([]);
  }, 60_000);

  it('When the office keeps two runs per model, then older runs and their grid soundings are deleted', async () => {
    for (const hour of [21, 24, 27]) {
      const { path } = await fixture(`keep-${hour}.grib2`, { ...gribPresets.small, forecastHours: [hour] });
      const result = await ingestGribFile({ db: handle.db, logger }, { officeId, filePath: path, model: 'TESTKEEP' });
      if (!result.ok) throw new Error(result.error.reason);
    }
    await runRetentionIdle();
    expect((await listModelRuns(handle.db, { model: 'TESTKEEP' })).ok).toBe(true);
    await setRunRetention(handle.db, logger, { runsKeptPerModel: 2 });
    await runRetentionIdle();
    const left = await listModelRuns(handle.db, { model: 'TESTKEEP' });
    expect(left.ok && left.value.map((r) => r.forecastHour)).toEqual([27, 24]);
    const orphans = await handle.db.select({ runId: gridSoundings.runId }).from(gridSoundings).leftJoin(modelRuns, eq(modelRuns.id, gridSoundings.runId)).where(eq(modelRuns.model, 'TESTKEEP'));
    expect(new Set(orphans.map((o) => o.runId)).size).toBe(2);
    expect(await applyRunRetention(handle.db, officeId)).toEqual([]);
  }, 90_000);
});
