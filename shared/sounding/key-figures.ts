import type { SoundingKeyFigures } from '../contracts/soundings';
import type { SoundingAnalysis } from './analyze';
import type { IngredientsAnalysis } from './ingredients';

/**
 * The key figures of a sounding: what the library, the map, the evidence panel and the support
 * check read, in SI units. Stored beside each sounding (and in columns for grid soundings) so
 * evidence never needs a full analysis. Null when the sounding cannot give the figure.
 */
export const keyFigureKeys = [
  'mlCape', 'muCape', 'mlCin', 'mlLclHeightM', 'precipitableWaterMm', 'bulkShear0to6kmMs', 'srh0to1km', 'stp', 'scp',
  'surfaceDewpointC', 'surfaceMixingRatioGkg',
  'srh0to500m', 'criticalAngleDeg', 'mlLclLfcGapM', 'lapseRate0to3kmCKm', 'lapseRate3to6kmCKm', 'lapseRate850to500CKm',
  'lapseRate700to500CKm', 'muCapeHailZone', 'freezingLevelM', 'effectiveBulkShearMs', 'bulkShear0to8kmMs', 'dcape',
  'meanWind0to6kmMs', 'corfidiUpwindMs', 'corfidiDownwindMs', 'warmCloudDepthM',
] as const satisfies readonly Exclude<keyof SoundingKeyFigures, 'flagCount'>[];
export type KeyFigureKey = (typeof keyFigureKeys)[number];

/** Every figure null, no flags: the figures of a sounding with no analysis. */
export function emptyKeyFigures(): SoundingKeyFigures {
  const figures = { flagCount: 0 } as Record<string, number | null>;
  for (const key of keyFigureKeys) figures[key] = null;
  return figures as SoundingKeyFigures;
}

/**
 * An analysis as stored: one made by an engine before the hazard ingredients (2.1.0) has no
 * `ingredients` until it is analysed again, and must not break the readers meanwhile.
 */
export type StoredAnalysis = Omit<SoundingAnalysis, 'ingredients'> & { ingredients?: IngredientsAnalysis };

/** The key figures read from a full analysis (null analysis: every figure null; no ingredients: those null). */
export function keyFiguresFromAnalysis(analysis: StoredAnalysis | null): SoundingKeyFigures {
  if (!analysis) return emptyKeyFigures();
  const ingredients = analysis.ingredients;
  return {
    ...emptyKeyFigures(),
    mlCape: analysis.mixedLayer.cape,
    muCape: analysis.mostUnstable.cape,
    mlCin: analysis.mixedLayer.cin,
    mlLclHeightM: analysis.mixedLayer.lclHeight,
    precipitableWaterMm: analysis.precipitableWater,
    bulkShear0to6kmMs: analysis.bulkShear0to6km,
    srh0to1km: analysis.srh0to1km,
    stp: analysis.composites.significantTornado,
    scp: analysis.composites.supercellComposite,
    surfaceDewpointC: analysis.environment.surfaceDewpointC,
    surfaceMixingRatioGkg: analysis.environment.surfaceMixingRatio, // already g/kg
    srh0to500m: ingredients?.srh0to500m ?? null,
    criticalAngleDeg: ingredients?.criticalAngleDeg ?? null,
    mlLclLfcGapM: ingredients?.mlLclLfcGap ?? null,
    lapseRate0to3kmCKm: analysis.environment.lapseRate0to3km,
    lapseRate3to6kmCKm: ingredients?.lapseRate3to6km ?? null,
    lapseRate850to500CKm: ingredients?.lapseRate850to500hPa ?? null,
    lapseRate700to500CKm: analysis.environment.lapseRate700to500hPa,
    muCapeHailZone: ingredients?.muCapeHailZone ?? null,
    freezingLevelM: analysis.environment.freezingLevelHeight,
    effectiveBulkShearMs: analysis.kinematics.effectiveBulkShear,
    bulkShear0to8kmMs: ingredients?.bulkShear0to8km ?? null,
    dcape: analysis.environment.downdraftCape,
    meanWind0to6kmMs: ingredients?.meanWind0to6kmSpeed ?? null,
    corfidiUpwindMs: ingredients?.corfidiUpwindSpeed ?? null,
    corfidiDownwindMs: ingredients?.corfidiDownwindSpeed ?? null,
    warmCloudDepthM: ingredients?.warmCloudDepth ?? null,
    flagCount: Array.isArray(analysis.flags) ? analysis.flags.length : 0,
  };
}
