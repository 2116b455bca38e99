import Flatbush from 'flatbush';
import { bbox } from '@turf/turf';
import type { EvidenceSourceCount, RunBrief } from '../../shared/contracts/model-fields';
import type { AreaGeometry } from '../../shared/contracts/outlooks';
import type { SoundingKeyFigures } from '../../shared/contracts/soundings';
import type { EvidenceSounding } from '../../shared/evidence/evidence';
import { keyFigureKeys, type KeyFigureKey } from '../../shared/sounding/key-figures';
import { evidencePool, type EvidencePool } from '../../shared/evidence/area-report';
import { buildEvidenceReport, type AreaEvidenceReport, type EvidenceReportInput } from './evidence-report';

/**
 * Evidence over model grids, as plain functions for the geometry worker pool. A run travels to a
 * worker as typed arrays (one per key figure, plus positions and the Flatbush index's buffer), a
 * few megabytes copied at once instead of tens of thousands of objects; the worker picks the grid
 * points inside each area's bounding box through the index, makes evidence soundings of those
 * alone and runs the ordinary evidence report over them and the observed soundings.
 */

export interface RunFigures {
  run: RunBrief;
  count: number;
  pointIndex: Int32Array;
  latitude: Float64Array;
  longitude: Float64Array;
  flagCount: Uint16Array;
  /** NaN where the figure is missing. */
  figures: Record<KeyFigureKey, Float32Array>;
  index: Flatbush;
}

/** A run's figures as sent to a worker: the index travels as its buffer. */
export type PackedRunFigures = Omit<RunFigures, 'index'> & { indexData: ArrayBuffer | SharedArrayBuffer };

export function packRunFigures(figures: RunFigures): PackedRunFigures {
  const { index, ...rest } = figures;
  return { ...rest, indexData: index.data };
}

export function unpackRunFigures(packed: PackedRunFigures): RunFigures {
  const { indexData, ...rest } = packed;
  return { ...rest, index: Flatbush.from(indexData) };
}

type FigureRow = { pointIndex: number; latitude: number; longitude: number; flagCount: number } & Record<KeyFigureKey, number | null>;

/** Typed arrays and a spatial index from rows of one run (also used by the bench and tests). */
export function runFiguresFromRows(run: RunBrief, rows: readonly FigureRow[]): RunFigures {
  const count = rows.length;
  const pointIndex = new Int32Array(count);
  const latitude = new Float64Array(count);
  const longitude = new Float64Array(count);
  const flagCount = new Uint16Array(count);
  // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- built from keyFigureKeys, one array per key.
  const figures = Object.fromEntries(keyFigureKeys.map((key) => [key, new Float32Array(count)])) as Record<KeyFigureKey, Float32Array>;
  const index = new Flatbush(Math.max(1, count));
  rows.forEach((row, i) => {
    pointIndex[i] = row.pointIndex;
    latitude[i] = row.latitude;
    longitude[i] = row.longitude;
    flagCount[i] = row.flagCount;
    for (const key of keyFigureKeys) figures[key][i] = row[key] ?? NaN;
    index.add(row.longitude, row.latitude, row.longitude, row.latitude);
  });
  if (count === 0) index.add(0, 0, 0, 0); // Flatbush needs one item; the empty run has no points to find.
  index.finish();
  return { run, count, pointIndex, latitude, longitude, flagCount, figures, index };
}

const gridSoundingId = (runId: string, pointIndex: number) => `${runId}:${pointIndex}`;

/**
 * Evidence soundings of the grid points that may lie inside any of the areas: those inside an
 * area's bounding box, found through each run's spatial index. The evidence report then tests
 * each against the polygon itself, so the answer matches testing every grid point.
 */
export function gridCandidates(runs: readonly RunFigures[], geometries: readonly AreaGeometry[]): EvidenceSounding[] {
  const boxes = geometries.map((g) => bbox(g));
  const candidates: EvidenceSounding[] = [];
  for (const figures of runs) {
    const picked = new Uint8Array(figures.count);
    for (const [west, south, east, north] of boxes) {
      if (figures.count === 0) break;
      for (const i of figures.index.search(west, south, east, north)) picked[i] = 1;
    }
    const soundings = materializedSoundings(figures);
    for (let i = 0; i < figures.count; i++) {
      const sounding = picked[i] ? soundings[i] : undefined;
      if (sounding) candidates.push(sounding);
    }
  }
  return candidates;
}

/**
 * Runs whose evidence soundings a worker keeps made (about 16 MB each for 40,000 points). A
 * ready run never changes, and only runs the server asks for are read, so a deleted run is
 * simply never asked for again and drops out as newer runs come in.
 */
export const MAX_MATERIALIZED_RUNS = 4;
const materialized = new Map<string, EvidenceSounding[]>();

/** Every grid point of a run as an evidence sounding, made once per run and worker (or process). */
export function materializedSoundings(figures: RunFigures): EvidenceSounding[] {
  let soundings = materialized.get(figures.run.id);
  if (soundings && soundings.length === figures.count) {
    materialized.delete(figures.run.id); // re-insert: most recently used last
  } else {
    soundings = Array.from({ length: figures.count }, (_, i) => gridEvidenceSounding(figures, i));
  }
  materialized.set(figures.run.id, soundings);
  while (materialized.size > MAX_MATERIALIZED_RUNS) {
    const oldest = materialized.keys().next().value;
    if (oldest === undefined) break;
    materialized.delete(oldest);
  }
  return soundings;
}

const value = (column: Float32Array, i: number): number | null => {
  const v = column[i];
  return v === undefined || Number.isNaN(v) ? null : v;
};

/**
 * One grid point as an evidence sounding. The figures are written as one literal (not key by
 * key) so every object shares one shape, which keeps reading them in the evidence report fast.
 */
function gridEvidenceSounding(figures: RunFigures, i: number): EvidenceSounding {
  const f = figures.figures;
  const keyFigures: SoundingKeyFigures = {
    mlCape: value(f.mlCape, i),
    muCape: value(f.muCape, i),
    mlCin: value(f.mlCin, i),
    mlLclHeightM: value(f.mlLclHeightM, i),
    precipitableWaterMm: value(f.precipitableWaterMm, i),
    bulkShear0to6kmMs: value(f.bulkShear0to6kmMs, i),
    srh0to1km: value(f.srh0to1km, i),
    stp: value(f.stp, i),
    scp: value(f.scp, i),
    surfaceDewpointC: value(f.surfaceDewpointC, i),
    surfaceMixingRatioGkg: value(f.surfaceMixingRatioGkg, i),
    srh0to500m: value(f.srh0to500m, i),
    criticalAngleDeg: value(f.criticalAngleDeg, i),
    mlLclLfcGapM: value(f.mlLclLfcGapM, i),
    lapseRate0to3kmCKm: value(f.lapseRate0to3kmCKm, i),
    lapseRate3to6kmCKm: value(f.lapseRate3to6kmCKm, i),
    lapseRate850to500CKm: value(f.lapseRate850to500CKm, i),
    lapseRate700to500CKm: value(f.lapseRate700to500CKm, i),
    muCapeHailZone: value(f.muCapeHailZone, i),
    freezingLevelM: value(f.freezingLevelM, i),
    effectiveBulkShearMs: value(f.effectiveBulkShearMs, i),
    bulkShear0to8kmMs: value(f.bulkShear0to8kmMs, i),
    dcape: value(f.dcape, i),
    meanWind0to6kmMs: value(f.meanWind0to6kmMs, i),
    corfidiUpwindMs: value(f.corfidiUpwindMs, i),
    corfidiDownwindMs: value(f.corfidiDownwindMs, i),
    warmCloudDepthM: value(f.warmCloudDepthM, i),
    flagCount: figures.flagCount[i] ?? 0,
  };
  const pointIndex = figures.pointIndex[i] ?? 0;
  return {
    id: gridSoundingId(figures.run.id, pointIndex),
    stationId: figures.run.model, // one shared string per run; the id names the grid point
    latitude: figures.latitude[i] ?? 0,
    longitude: figures.longitude[i] ?? 0,
    validTime: figures.run.validTime,
    source: 'model',
    modified: false,
    runId: figures.run.id,
    figures: keyFigures,
  };
}

/** Per area: how many of the soundings inside came from each run (null: observed or uploaded), in run order. */
export function evidenceSources(areas: readonly { areaId: string; evidence: { soundingIds: readonly string[] } }[], runs: readonly RunBrief[]): Record<string, EvidenceSourceCount[]> {
  const result: Record<string, EvidenceSourceCount[]> = {};
  for (const area of areas) {
    // Grid sounding ids are `${runId}:${pointIndex}`; comparing prefixes allocates nothing.
    const counts = new Array<number>(runs.length).fill(0);
    let other = 0;
    for (const id of area.evidence.soundingIds) {
      const r = id.length > 36 && id.charCodeAt(36) === 58 ? runs.findIndex((run) => id.startsWith(run.id)) : -1;
      if (r >= 0) counts[r] = (counts[r] ?? 0) + 1;
      else other++;
    }
    const sources: EvidenceSourceCount[] = other > 0 ? [{ runId: null, count: other }] : [];
    runs.forEach((run, r) => {
      const count = counts[r] ?? 0;
      if (count > 0) sources.push({ runId: run.id, count });
    });
    result[area.areaId] = sources;
  }
  return result;
}

export interface GridEvidenceReportInput extends EvidenceReportInput {
  runs: PackedRunFigures[];
}

export interface GridEvidenceReport {
  areas: AreaEvidenceReport[];
  sourcesByArea: Record<string, EvidenceSourceCount[]>;
}

/** The evidence report over the observed candidates plus the grid soundings of the runs (worker task). */
export function buildGridEvidenceReport(input: GridEvidenceReportInput): GridEvidenceReport {
  const { runs, ...report } = input;
  const figures = runs.map(unpackRunFigures);
  const from = Date.parse(input.outlook.validFrom);
  const until = Date.parse(input.outlook.validUntil);
  // A run's grid soundings share its valid time: the whole run is in the period or none of it.
  const pools = input.source === 'observed' ? [] : figures.filter((f) => inRange(Date.parse(f.run.validTime), from, until)).map(runPool);
  const areas = buildEvidenceReport({ ...report, pools });
  return { areas, sourcesByArea: evidenceSources(areas, figures.map((f) => f.run)) };
}

const inRange = (t: number, from: number, until: number) => t >= from && t <= until;

/** Evidence pools of runs (sorted, figures gathered), made once per run and worker like its soundings. */
const runPools = new Map<string, EvidencePool>();

function runPool(figures: RunFigures): EvidencePool {
  const id = figures.run.id;
  let pool = runPools.get(id);
  if (pool && pool.soundings.length === figures.count) {
    runPools.delete(id); // re-insert: most recently used last
  } else {
    pool = evidencePool(materializedSoundings(figures), { validFrom: figures.run.validTime, validUntil: figures.run.validTime });
  }
  runPools.set(id, pool);
  while (runPools.size > MAX_MATERIALIZED_RUNS) {
    const oldest = runPools.keys().next().value;
    if (oldest === undefined) break;
    runPools.delete(oldest);
  }
  return pool;
}
