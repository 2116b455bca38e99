import { analyzeComposites, type CompositesAnalysis } from './composites';
import { analyzeEnvironment, type EnvironmentAnalysis } from './environment';
import { analyzeIngredients, type IngredientsAnalysis } from './ingredients';
import { analyzeKinematics, type KinematicsAnalysis, type WindVector } from './kinematics';
import {
  levelStart,
  liftParcelOnProfile,
  liftParcelWithEffectiveDecision,
  mixedLayerStart,
  mostUnstableLevelIndex,
  surfaceBasedStart,
  type ParcelOptions,
  type ParcelResult,
} from './parcel';
import { buildProfile, type Profile } from './profile';
import { qualityFlags, type QualityFlag } from './quality-flags';
import type { SoundingLevel } from './types';
import { ENGINE_VERSION } from './version';

/** The full analysis of a sounding. The first keys are the contract of docs/analysis.md. */
export interface SoundingAnalysis {
  surfaceBased: ParcelResult;
  mixedLayer: ParcelResult;
  mostUnstable: ParcelResult;
  /** Precipitable water, mm. */
  precipitableWater: number;
  /** 0–6 km bulk wind difference, m s⁻¹. */
  bulkShear0to6km: number | null;
  /** Bunkers right-mover motion, m s⁻¹. */
  stormMotionRight: WindVector | null;
  /** Storm-relative helicity, m² s⁻² (right mover). */
  srh0to1km: number | null;
  srh0to3km: number | null;
  environment: EnvironmentAnalysis;
  kinematics: KinematicsAnalysis;
  composites: CompositesAnalysis;
  /** The ingredients behind the hazard rules (docs/analysis.md, "Hazard ingredients"). */
  ingredients: IngredientsAnalysis;
  /** Quality flags: what in the data or the results deserves caution (never NaN, never silent). */
  flags: QualityFlag[];
  /** Version of the engine that made this analysis (cache key). */
  engineVersion: string;
}

/** A parcel result that shares nothing with the original (its trace is copied). */
function copyParcel(parcel: ParcelResult): ParcelResult {
  return parcel.trace ? { ...parcel, trace: parcel.trace.map((point) => ({ ...point })) } : { ...parcel };
}

/** Options of {@link analyzeSounding}. */
export interface AnalysisOptions extends ParcelOptions {
  /** Latitude, degrees north: below 0 the left mover is the cyclonic deviant one (Bunkers2000). */
  latitude?: number | null;
}

/**
 * Analyse a sounding: three parcels, environment, kinematics and composites.
 *
 * @param levels - validated sounding levels (any order; see parseSoundingCsv / validateSounding)
 * @param options - `{trace: true}` adds parcel traces; `moistAscent: 'reference'` uses the
 *   slow RK4 integration instead of the table; `latitude` picks the hemisphere's deviant mover
 * @returns {@link SoundingAnalysis}: numbers or null, never NaN
 * @example analyzeSounding(parsed.levels).mostUnstable.cape // → J kg⁻¹
 * Notes: methods and sources per quantity in docs/analysis.md.
 */
export function analyzeSounding(levels: readonly SoundingLevel[], options: AnalysisOptions = {}): SoundingAnalysis {
  const pooled = pooledStorage;
  pooledStorage = undefined; // in use until this analysis ends
  let kept = pooled;
  try {
    const profile = buildProfile(levels, pooled);
    if (profile.count <= POOLED_LEVELS_MAX && (!kept || profile.storage.length > kept.length)) kept = profile.storage;
    return analyzeProfile(profile, options);
  } finally {
    pooledStorage = kept;
  }
}

/**
 * Storage of a past analysis's profile, reused by the next: the profile never leaves
 * analyzeSounding (results hold numbers and new objects only) and the analysis is
 * synchronous, so one buffer serves every call; allocating typed arrays costs more than a
 * small analysis. Profiles above POOLED_LEVELS_MAX levels get storage of their own.
 */
let pooledStorage: Float64Array | undefined;
const POOLED_LEVELS_MAX = 2000;

function analyzeProfile(profile: Profile, options: AnalysisOptions): SoundingAnalysis {
  const surface = liftParcelWithEffectiveDecision(profile, surfaceBasedStart(profile), options);
  const surfaceBased = surface.result;
  const mixedLayer = liftParcelOnProfile(profile, mixedLayerStart(profile, 100), options);
  const mostUnstableIndex = mostUnstableLevelIndex(profile, 300);
  // The surface level is often the most unstable one: its start, hence its ascent, is the
  // surface-based parcel's (levelStart(0) equals surfaceBasedStart), so it is not lifted again.
  const lifted = mostUnstableIndex === 0 ? { result: copyParcel(surfaceBased), meetsEffectiveCriteria: surface.meetsEffectiveCriteria } : liftParcelWithEffectiveDecision(profile, levelStart(profile, mostUnstableIndex), options);
  const mostUnstable = lifted.result;
  const environment = analyzeEnvironment(profile);
  // Decisions the effective-layer search would otherwise get by lifting these levels again.
  const knownEffective: { index: number; meets: boolean }[] = [];
  if (surface.meetsEffectiveCriteria !== null) knownEffective.push({ index: 0, meets: surface.meetsEffectiveCriteria });
  if (lifted.meetsEffectiveCriteria !== null) knownEffective.push({ index: mostUnstableIndex, meets: lifted.meetsEffectiveCriteria });
  const kinematics = analyzeKinematics(profile, mostUnstable, { latitude: options.latitude ?? null, mostUnstableIndex, knownEffective });
  const composites = analyzeComposites({ surfaceBased, mixedLayer, mostUnstable }, kinematics);
  const ingredients = analyzeIngredients(profile, { mixedLayer, mostUnstable, mostUnstableStart: levelStart(profile, mostUnstableIndex), environment, kinematics });
  const flags = qualityFlags(profile, { surfaceBased, mixedLayer, mostUnstable }, kinematics);
  return {
    surfaceBased,
    mixedLayer,
    mostUnstable,
    precipitableWater: environment.precipitableWater,
    bulkShear0to6km: kinematics.bulkShear0to6km,
    stormMotionRight: kinematics.stormMotionRight,
    srh0to1km: kinematics.srh0to1km,
    srh0to3km: kinematics.srh0to3km,
    environment,
    kinematics,
    composites,
    ingredients,
    flags,
    engineVersion: ENGINE_VERSION,
  };
}
