import { bbox, booleanPointInPolygon, point } from '@turf/turf';
import type { AreaGeometry } from '../contracts/outlooks';
import type { SoundingKeyFigures } from '../contracts/soundings';

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
  if (max === min) return [{ from: min, to: max, count: sorted.length }];
  const width = (max - min) / bins;
  const result = Array.from({ length: bins }, (_, i) => ({ from: min + i * width, to: min + (i + 1) * width, count: 0 }));
  for (let i = 0; i < sorted.length; i++) {
    const value = sorted[i] ?? min;
    const index = Math.min(bins - 1, Math.floor((value - min) / width));
    const bin = result[index];
    if (bin) bin.count++;
  }
  return result;
}

export function summarise(values: ArrayLike<number>): ParameterStats | undefined {
  if (values.length === 0) return undefined;
  // A typed array sorts numerically without a comparator call per pair (several times faster;
  // the live preview summarises on every animation frame of a drag).
  return summariseSorted(new Float64Array(values).sort());
}

/** The statistics of values already sorted ascending (at least one). */
function summariseSorted(sorted: Float64Array): ParameterStats {
  return {
    count: sorted.length,
    min: sorted[0] ?? 0,
    median: quantile(sorted, 0.5),
    p90: quantile(sorted, 0.9),
    max: sorted[sorted.length - 1] ?? 0,
    histogram: histogram(sorted),
  };
}

/**
 * Soundings whose station lies inside the geometry (bounding-box prefilter, then Turf
 * point-in-polygon). A station exactly on the outline counts as inside; one in a hole does not.
 */
export function soundingsInside<T extends Pick<EvidenceSounding, 'latitude' | 'longitude'>>(geometry: AreaGeometry, soundings: readonly T[]): T[] {
  const [west, south, east, north] = bbox(geometry);
  return soundings.filter(
    (s) => s.longitude >= west && s.longitude <= east && s.latitude >= south && s.latitude <= north && booleanPointInPolygon(point([s.longitude, s.latitude]), geometry),
  );
}

/** The evidence of one area: which soundings lie inside and the statistics of each parameter. */
export function areaEvidence(areaId: string, geometry: AreaGeometry, soundings: readonly EvidenceSounding[]): AreaEvidence {
  return evidenceOfSoundings(areaId, soundingsInside(geometry, soundings));
}

/** The statistics of each parameter over soundings already known to lie inside an area. */
export function evidenceOfSoundings(areaId: string, inside: readonly EvidenceSounding[]): AreaEvidence {
  const stats: AreaEvidence['stats'] = {};
  // One scratch buffer for every parameter: runs on every animation frame of a drag.
  const buffer = new Float64Array(inside.length);
  for (const { key } of evidenceParameters) {
    let count = 0;
    for (const sounding of inside) {
      const value = sounding.figures[key];
      if (value !== null && Number.isFinite(value)) buffer[count++] = value;
    }
    if (count > 0) stats[key] = summariseSorted(buffer.slice(0, count).sort());
  }
  const flaggedCount = inside.filter((s) => s.figures.flagCount > 0).length;
  return { areaId, count: inside.length, flaggedCount, soundingIds: inside.map((s) => s.id), stats };
}

/** Soundings valid within [validFrom, validUntil] (inclusive), optionally of one source. */
export function soundingsInPeriod<T extends Pick<EvidenceSounding, 'validTime' | 'source'>>(soundings: readonly T[], validFrom: string, validUntil: string, source?: 'observed' | 'model'): T[] {
  const from = Date.parse(validFrom);
  const until = Date.parse(validUntil);
  return soundings.filter((s) => {
    const t = Date.parse(s.validTime);
    return t >= from && t <= until && (!source || s.source === source);
  });
}
