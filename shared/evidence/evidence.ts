import { bbox, booleanPointInPolygon } from '@turf/turf';
import type { AreaGeometry } from '../contracts/outlooks';
import type { SoundingKeyFigures } from '../contracts/soundings';
import { keyFigureKeys, type KeyFigureKey } from '../sounding/key-figures';

/** A sounding as the evidence panel needs it: where, when, and its key figures (SI units). */
export interface EvidenceSounding {
  id: string;
  stationId: string;
  latitude: number;
  longitude: number;
  validTime: string;
  source: 'observed' | 'model' | 'unknown';
  modified: boolean;
  /** The model run a grid sounding belongs to; null for observed and uploaded soundings. */
  runId?: string | null;
  figures: SoundingKeyFigures;
}

export type EvidenceParameterKey = Exclude<keyof SoundingKeyFigures, 'flagCount'>;

/** The parameters summarised for each area, in display order, with their SI units. */
export const evidenceParameters: { key: EvidenceParameterKey; label: string; unit: string }[] = [
  { key: 'mlCape', label: 'MLCAPE', unit: 'J/kg' },
  { key: 'muCape', label: 'MUCAPE', unit: 'J/kg' },
  { key: 'mlCin', label: 'MLCIN', unit: 'J/kg' },
  { key: 'mlLclHeightM', label: 'LCL height', unit: 'm' },
  { key: 'surfaceDewpointC', label: 'Surface dewpoint', unit: '°C' },
  { key: 'surfaceMixingRatioGkg', label: 'Surface mixing ratio', unit: 'g/kg' },
  { key: 'precipitableWaterMm', label: 'Precipitable water', unit: 'mm' },
  { key: 'bulkShear0to6kmMs', label: '0–6 km shear', unit: 'm/s' },
  { key: 'srh0to1km', label: '0–1 km SRH', unit: 'm²/s²' },
  { key: 'stp', label: 'STP', unit: '' },
  { key: 'scp', label: 'SCP', unit: '' },
  // Hazard ingredients (docs/analysis.md, "Hazard ingredients"): tornado, hail, damaging wind, flash flooding.
  { key: 'srh0to500m', label: '0–500 m SRH', unit: 'm²/s²' },
  { key: 'criticalAngleDeg', label: 'Critical angle', unit: '°' },
  { key: 'mlLclLfcGapM', label: 'LCL–LFC gap', unit: 'm' },
  { key: 'effectiveBulkShearMs', label: 'Effective shear', unit: 'm/s' },
  { key: 'muCapeHailZone', label: 'Hail-zone CAPE', unit: 'J/kg' },
  { key: 'freezingLevelM', label: 'Freezing level', unit: 'm' },
  { key: 'lapseRate700to500CKm', label: '700–500 hPa lapse rate', unit: '°C/km' },
  { key: 'lapseRate850to500CKm', label: '850–500 hPa lapse rate', unit: '°C/km' },
  { key: 'lapseRate3to6kmCKm', label: '3–6 km lapse rate', unit: '°C/km' },
  { key: 'bulkShear0to8kmMs', label: '0–8 km shear', unit: 'm/s' },
  { key: 'dcape', label: 'DCAPE', unit: 'J/kg' },
  { key: 'meanWind0to6kmMs', label: '0–6 km mean wind', unit: 'm/s' },
  { key: 'lapseRate0to3kmCKm', label: '0–3 km lapse rate', unit: '°C/km' },
  { key: 'corfidiUpwindMs', label: 'Corfidi upwind', unit: 'm/s' },
  { key: 'corfidiDownwindMs', label: 'Corfidi downwind', unit: 'm/s' },
  { key: 'warmCloudDepthM', label: 'Warm-cloud depth', unit: 'm' },
];

export interface HistogramBin {
  from: number;
  to: number;
  count: number;
}

export interface ParameterStats {
  count: number;
  min: number;
  median: number;
  p90: number;
  max: number;
  histogram: HistogramBin[];
}

export interface AreaEvidence {
  areaId: string;
  count: number;
  /** How many of the soundings inside carry quality flags (they still count as evidence). */
  flaggedCount: number;
  soundingIds: string[];
  stats: Partial<Record<EvidenceParameterKey, ParameterStats>>;
}

/**
 * Quantile of sorted values by linear interpolation between closest ranks (Hyndman and Fan
 * 1996, definition 7; the default of R and numpy — common practice).
 */
export function quantile(sorted: ArrayLike<number>, q: number): number {
  if (sorted.length === 0) throw new Error('quantile of no values');
  const position = (sorted.length - 1) * q;
  const lower = Math.floor(position);
  const upper = Math.ceil(position);
  const a = sorted[lower] ?? 0;
  const b = sorted[upper] ?? a;
  return a + (b - a) * (position - lower);
}

/** Equal-width histogram with `bins` bins spanning min..max (one bin when all values are equal). */
export function histogram(sorted: ArrayLike<number>, bins = 8): HistogramBin[] {
  const min = sorted[0];
  const max = sorted[sorted.length - 1];
  if (min === undefined || max === undefined) return [];
  return binValues(sorted, min, max, bins);
}

/** Equal-width bins of values in any order whose smallest and largest are min and max. */
function binValues(values: ArrayLike<number>, min: number, max: number, bins: number): HistogramBin[] {
  if (max === min) return [{ from: min, to: max, count: values.length }];
  const width = (max - min) / bins;
  const result = Array.from({ length: bins }, (_, i) => ({ from: min + i * width, to: min + (i + 1) * width, count: 0 }));
  for (let i = 0; i < values.length; i++) {
    const value = values[i] ?? min;
    const index = Math.min(bins - 1, Math.floor((value - min) / width));
    const bin = result[index];
    if (bin) bin.count++;
  }
  return result;
}

/**
 * Puts the k-th smallest value at index k, smaller ones before and larger ones after
 * (Hoare's quickselect, median-of-three pivot): linear time on average, where a full sort is
 * n log n; the statistics of areas over whole model grids need only a few ranks.
 */
function selectKth(values: Float64Array, k: number): number {
  let left = 0;
  let right = values.length - 1;
  while (right > left) {
    const middle = (left + right) >> 1;
    const a = values[left] ?? 0;
    const b = values[middle] ?? 0;
    const c = values[right] ?? 0;
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    let i = left;
    let j = right;
    while (i <= j) {
      while ((values[i] ?? 0) < pivot) i++;
      while ((values[j] ?? 0) > pivot) j--;
      if (i <= j) {
        const t = values[i] ?? 0;
        values[i] = values[j] ?? 0;
        values[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else break;
  }
  return values[k] ?? 0;
}

/** quantile() on values in any order (reorders them); the same definition, without sorting. */
function quantileUnsorted(values: Float64Array, q: number): number {
  const position = (values.length - 1) * q;
  const lower = Math.floor(position);
  const a = selectKth(values, lower);
  if (position === lower) return a;
  let b = Infinity;
  for (let i = lower + 1; i < values.length; i++) b = Math.min(b, values[i] ?? Infinity);
  return a + (b - a) * (position - lower);
}

export function summarise(values: ArrayLike<number>): ParameterStats | undefined {
  return summariseInPlace(Float64Array.from(values));
}

/** summarise() of a buffer it may reorder. */
function summariseInPlace(values: Float64Array): ParameterStats | undefined {
  if (values.length === 0) return undefined;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i] ?? 0;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { count: values.length, min, median: quantileUnsorted(values, 0.5), p90: quantileUnsorted(values, 0.9), max, histogram: binValues(values, min, max, 8) };
}

/**
 * Soundings whose station lies inside the geometry (bounding-box prefilter, then Turf
 * point-in-polygon). A station exactly on the outline counts as inside; one in a hole does not.
 */
export function soundingsInside<T extends Pick<EvidenceSounding, 'latitude' | 'longitude'>>(geometry: AreaGeometry, soundings: readonly T[]): T[] {
  const [west, south, east, north] = bbox(geometry);
  return soundings.filter(
    (s) => s.longitude >= west && s.longitude <= east && s.latitude >= south && s.latitude <= north && booleanPointInPolygon([s.longitude, s.latitude], geometry),
  );
}

/**
 * The key figures of the soundings inside an area as columns: `values[column[key] + i]` is the
 * figure of the i-th sounding, NaN when it has none. Gathered once per area in one pass over the
 * soundings (named property reads, so each stays fast on tens of thousands of soundings) and read
 * by both the statistics and the support check.
 */
export interface FigureColumns {
  count: number;
  /** Start of each figure's column in `values`. */
  column: Record<KeyFigureKey, number>;
  values: Float64Array;
}

const finite = (v: number | null | undefined): number => (v !== null && v !== undefined && Number.isFinite(v) ? v : NaN);

// gatherFigures writes each figure at its place in keyFigureKeys; this list must follow that order.
const gatheredOrder = ['mlCape', 'muCape', 'mlCin', 'mlLclHeightM', 'precipitableWaterMm', 'bulkShear0to6kmMs', 'srh0to1km', 'stp', 'scp', 'surfaceDewpointC', 'surfaceMixingRatioGkg', 'srh0to500m', 'criticalAngleDeg', 'mlLclLfcGapM', 'lapseRate0to3kmCKm', 'lapseRate3to6kmCKm', 'lapseRate850to500CKm', 'lapseRate700to500CKm', 'muCapeHailZone', 'freezingLevelM', 'effectiveBulkShearMs', 'bulkShear0to8kmMs', 'dcape', 'meanWind0to6kmMs', 'corfidiUpwindMs', 'corfidiDownwindMs', 'warmCloudDepthM'];
if (gatheredOrder.join() !== keyFigureKeys.join()) throw new Error('gatherFigures does not follow keyFigureKeys');

export function gatherFigures(inside: readonly EvidenceSounding[], reuse?: Float64Array): FigureColumns {
  const n = inside.length;
  const column = Object.fromEntries(keyFigureKeys.map((key, k) => [key, k * n])) as Record<KeyFigureKey, number>;
  // `reuse`: a buffer from an earlier call whose columns are no longer read (saves garbage).
  const values = reuse && reuse.length >= keyFigureKeys.length * n ? reuse : new Float64Array(keyFigureKeys.length * n);
  for (let i = 0; i < n; i++) {
    const f = (inside[i] as EvidenceSounding).figures; // i < n
    values[0 * n + i] = finite(f.mlCape);
    values[1 * n + i] = finite(f.muCape);
    values[2 * n + i] = finite(f.mlCin);
    values[3 * n + i] = finite(f.mlLclHeightM);
    values[4 * n + i] = finite(f.precipitableWaterMm);
    values[5 * n + i] = finite(f.bulkShear0to6kmMs);
    values[6 * n + i] = finite(f.srh0to1km);
    values[7 * n + i] = finite(f.stp);
    values[8 * n + i] = finite(f.scp);
    values[9 * n + i] = finite(f.surfaceDewpointC);
    values[10 * n + i] = finite(f.surfaceMixingRatioGkg);
    values[11 * n + i] = finite(f.srh0to500m);
    values[12 * n + i] = finite(f.criticalAngleDeg);
    values[13 * n + i] = finite(f.mlLclLfcGapM);
    values[14 * n + i] = finite(f.lapseRate0to3kmCKm);
    values[15 * n + i] = finite(f.lapseRate3to6kmCKm);
    values[16 * n + i] = finite(f.lapseRate850to500CKm);
    values[17 * n + i] = finite(f.lapseRate700to500CKm);
    values[18 * n + i] = finite(f.muCapeHailZone);
    values[19 * n + i] = finite(f.freezingLevelM);
    values[20 * n + i] = finite(f.effectiveBulkShearMs);
    values[21 * n + i] = finite(f.bulkShear0to8kmMs);
    values[22 * n + i] = finite(f.dcape);
    values[23 * n + i] = finite(f.meanWind0to6kmMs);
    values[24 * n + i] = finite(f.corfidiUpwindMs);
    values[25 * n + i] = finite(f.corfidiDownwindMs);
    values[26 * n + i] = finite(f.warmCloudDepthM);
  }
  return { count: n, column, values };
}

/** The evidence of one area: which soundings lie inside and the statistics of each parameter. */
export function areaEvidence(areaId: string, geometry: AreaGeometry, soundings: readonly EvidenceSounding[]): AreaEvidence {
  return evidenceOfSoundings(areaId, soundingsInside(geometry, soundings));
}

/**
 * The columns of the soundings at `positions` of one or more larger sets' columns, one set after
 * the other (`reuse` as in gatherFigures).
 */
export function pickFigures(picks: readonly { columns: FigureColumns; positions: readonly number[] }[], reuse?: Float64Array): FigureColumns {
  const n = picks.reduce((sum, p) => sum + p.positions.length, 0);
  const column = Object.fromEntries(keyFigureKeys.map((key, k) => [key, k * n])) as Record<KeyFigureKey, number>;
  const values = reuse && reuse.length >= keyFigureKeys.length * n ? reuse : new Float64Array(keyFigureKeys.length * n);
  for (const key of keyFigureKeys) {
    let to = column[key];
    for (const { columns, positions } of picks) {
      const from = columns.column[key];
      for (let j = 0; j < positions.length; j++) values[to + j] = columns.values[from + (positions[j] ?? 0)] ?? NaN;
      to += positions.length;
    }
  }
  return { count: n, column, values };
}

/**
 * The statistics of each parameter over soundings already known to lie inside an area. Given
 * `columns`, it reorders values inside them (the statistics need no order): read them before.
 */
export function evidenceOfSoundings(areaId: string, inside: readonly EvidenceSounding[], columns: FigureColumns = gatherFigures(inside)): AreaEvidence {
  const stats: AreaEvidence['stats'] = {};
  const { values } = columns;
  for (const { key } of evidenceParameters) {
    // Move the values that exist to the front of the figure's own column, then summarise them there.
    const start = columns.column[key];
    let count = 0;
    for (let i = 0; i < columns.count; i++) {
      const v = values[start + i] ?? NaN;
      if (v === v) values[start + count++] = v; // NaN: no value
    }
    const summary = summariseInPlace(values.subarray(start, start + count));
    if (summary) stats[key] = summary;
  }
  const flaggedCount = inside.filter((s) => s.figures.flagCount > 0).length;
  return { areaId, count: inside.length, flaggedCount, soundingIds: inside.map((s) => s.id), stats };
}

/** Soundings valid within [validFrom, validUntil] (inclusive), optionally of one source. */
export function soundingsInPeriod<T extends Pick<EvidenceSounding, 'validTime' | 'source'>>(soundings: readonly T[], validFrom: string, validUntil: string, source?: 'observed' | 'model'): T[] {
  const from = Date.parse(validFrom);
  const until = Date.parse(validUntil);
  // Grid soundings of one run share one valid time: parse each distinct time once.
  let lastText = '';
  let lastTime = NaN;
  return soundings.filter((s) => {
    if (s.validTime !== lastText) {
      lastText = s.validTime;
      lastTime = Date.parse(s.validTime);
    }
    const t = lastTime;
    return t >= from && t <= until && (!source || s.source === source);
  });
}
