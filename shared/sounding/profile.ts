import * as constants from './constants';
import { lclTemperature } from './lcl';
import { moistAdiabatTemperature, OUTSIDE_TABLE_STEP_HPA, pseudoAdiabatTable, tablePressureCoordinates } from './moist-adiabat';
import { equivalentPotentialTemperatureFromMixingRatio } from './thermo';
import type { SoundingLevel } from './types';

// Constants copied once at load (fast access in hot loops).
const { EPSILON, GRAVITY, KAPPA, RD, ZERO_CELSIUS_K } = constants;

/**
 * The environment prepared once per analysis: plain arrays in engine units, sorted by
 * decreasing pressure, heights above ground level. Internal to the engine (not exported
 * from index.ts); NaN marks a missing value here and never leaves the engine.
 */
export interface Profile {
  count: number;
  pressureHpa: Float64Array;
  logPressure: Float64Array;
  /** Height above the lowest level, m. */
  heightAglM: Float64Array;
  temperatureK: Float64Array;
  /** Dewpoint, K; NaN above the top of the moisture data. Bracketed gaps are filled. */
  dewpointK: Float64Array;
  /** Mixing ratio, kg kg⁻¹; 0 above the top of the moisture data. */
  mixingRatio: Float64Array;
  /** Virtual temperature, K (equal to T where there is no moisture data). */
  virtualTemperatureK: Float64Array;
  /** Wind components, m s⁻¹; NaN where not reported. */
  uMs: Float64Array;
  vMs: Float64Array;
  /** Index of the highest level with moisture data (−1: none). */
  moistureTopIndex: number;
  /** Elevation of the lowest level above mean sea level, m. */
  groundElevationM: number;
  /**
   * Largest difference between a reported height above ground and the hypsometric one, m;
   * when it exceeds {@link heightTolerance} the hypsometric heights are used instead.
   */
  largestHeightDifferenceM: number;
  /** Whether the reported heights were replaced by the hypsometric ones. */
  heightsReplaced: boolean;
  /** Pressure of the level with the largest height difference, hPa. */
  largestHeightDifferencePressureHpa: number;
  /** Per-level moist thermodynamics, computed on first use (see {@link levelThermodynamics}). */
  thermodynamics?: LevelThermodynamics;
  /** Pseudo-adiabat table coordinates of the levels' pressures, computed on first use (see {@link levelTableCoordinates}). */
  tableCoordinates?: { node: Int32Array; fraction: Float64Array };
  /** (p/1000 hPa)^κ of each level (a dry parcel's T = θ times it), NaN until first needed (see {@link levelExner}). */
  exner?: Float64Array;
  /** Room for the per-level arrays computed on first use (6 × count values, one allocation with the rest). */
  spare: Float64Array;
  /** The whole storage every array above is a view of. */
  storage: Float64Array;
}

/** The levels' pseudo-adiabat table coordinates, computed once per profile. */
export function levelTableCoordinates(profile: Profile): { node: Int32Array; fraction: Float64Array } {
  const n = profile.count;
  profile.tableCoordinates ??= tablePressureCoordinates(
    profile.logPressure,
    new Int32Array(profile.spare.buffer, profile.spare.byteOffset, n),
    profile.spare.subarray(n, 2 * n),
  );
  return profile.tableCoordinates;
}

const LOG_1000 = Math.log(1000);

/**
 * The profile's cache of exp(κ (ln p − ln 1000)) per level: NaN where not yet computed (only
 * the levels below some parcel's LCL are ever needed); use {@link exnerAt}.
 */
export function levelExner(profile: Profile): Float64Array {
  if (profile.exner) return profile.exner;
  const exner = profile.spare.subarray(2 * profile.count, 3 * profile.count);
  exner.fill(NaN);
  profile.exner = exner;
  return exner;
}

/**
 * exp(κ (ln p − ln 1000)) of level k, from the cache or computed into it.
 * @param exner - the cache of {@link levelExner}
 * @param logPressure - the profile's ln p
 * @param k - level index
 */
export function exnerAt(exner: Float64Array, logPressure: Float64Array, k: number): number {
  let value = exner[k] as number;
  if (Number.isNaN(value)) {
    value = Math.exp(KAPPA * ((logPressure[k] as number) - LOG_1000));
    exner[k] = value;
  }
  return value;
}

/**
 * Per-level values several parts of the analysis need (most-unstable level, downdraft
 * source), computed once per profile for the levels from the ground up to
 * {@link LevelThermodynamics.count}.
 */
export interface LevelThermodynamics {
  /** Number of levels covered (from index 0). */
  count: number;
  /** Temperature at each level's LCL, K (Bolton1980 eq. 15). */
  lclTemperatureK: Float64Array;
  /** Equivalent potential temperature, K (Bolton1980 eq. 39). */
  thetaE: Float64Array;
  /**
   * Wet-bulb potential temperature, K: the label of the pseudo-adiabat through the level's
   * LCL; NaN until asked for with {@link levelThetaW} or {@link levelThetaWInTable}.
   */
  thetaW: Float64Array;
}

/** How deep above the ground per-level moist thermodynamics are kept, hPa (the downdraft search reach). */
export const LEVEL_THERMODYNAMICS_DEPTH_HPA = 500;

/**
 * Index of the last level the per-level moist thermodynamics cover: the moist levels within
 * {@link LEVEL_THERMODYNAMICS_DEPTH_HPA} of the ground plus the first one above (−1: none).
 */
export function levelThermodynamicsTop(profile: Profile): number {
  const reach = (profile.pressureHpa[0] as number) - LEVEL_THERMODYNAMICS_DEPTH_HPA;
  let top = profile.moistureTopIndex;
  while (top > 1 && (profile.pressureHpa[top - 1] as number) < reach) top--;
  return top;
}

/**
 * The profile's per-level moist thermodynamics, computed on first use and kept on the profile.
 * @param profile - the prepared environment
 * @returns LCL temperature, θₑ and θ_w of the levels 0…levelThermodynamicsTop
 */
export function levelThermodynamics(profile: Profile): LevelThermodynamics {
  if (profile.thermodynamics) return profile.thermodynamics;
  const count = levelThermodynamicsTop(profile) + 1;
  const n = profile.count;
  const lclTemperatureK = profile.spare.subarray(3 * n, 3 * n + count);
  const thetaE = profile.spare.subarray(4 * n, 4 * n + count);
  const thetaW = profile.spare.subarray(5 * n, 5 * n + count);
  for (let k = 0; k < count; k++) {
    const pk = profile.pressureHpa[k] as number;
    const temperature = profile.temperatureK[k] as number;
    const lclT = lclTemperature(temperature, profile.dewpointK[k] as number);
    lclTemperatureK[k] = lclT;
    thetaE[k] = equivalentPotentialTemperatureFromMixingRatio(pk, temperature, profile.mixingRatio[k] as number, lclT);
  }
  // θ_w only on demand (levelThetaW): few levels need it.
  thetaW.fill(NaN);
  profile.thermodynamics = { count, lclTemperatureK, thetaE, thetaW };
  return profile.thermodynamics;
}

/** ln p of the LCL of level k's air, from its LCL temperature (Poisson's equation). */
export function levelLclLogPressure(profile: Profile, k: number, lclTemperatureK: number): number {
  return (profile.logPressure[k] as number) + Math.log(lclTemperatureK / (profile.temperatureK[k] as number)) / KAPPA;
}

/**
 * θ_w of level k (k below {@link LevelThermodynamics.count}), K: from the table, or, when the
 * level's LCL lies outside it, by RK4 from the LCL to 1000 hPa, once, kept for later calls.
 */
export function levelThetaW(profile: Profile, known: LevelThermodynamics, k: number): number {
  let value = levelThetaWInTable(profile, known, k);
  if (Number.isNaN(value)) {
    const lclT = known.lclTemperatureK[k] as number;
    value = moistAdiabatTemperature(Math.exp(levelLclLogPressure(profile, k, lclT)), lclT, 1000, OUTSIDE_TABLE_STEP_HPA);
    known.thetaW[k] = value;
  }
  return value;
}

/**
 * θ_w of level k (k below {@link LevelThermodynamics.count}) from the table, kept for later
 * calls, K; NaN when the level's LCL lies outside the table.
 */
export function levelThetaWInTable(profile: Profile, known: LevelThermodynamics, k: number): number {
  let value = known.thetaW[k] as number;
  if (Number.isNaN(value)) {
    // θ_w is the label of the pseudo-adiabat through the level's LCL (Bolton1980 eq. 15).
    const lclT = known.lclTemperatureK[k] as number;
    value = pseudoAdiabatTable().thetaWInTable(lclT, levelLclLogPressure(profile, k, lclT));
    known.thetaW[k] = value;
  }
  return value;
}

/** Fixed part of the height tolerance, m. */
export const HEIGHT_TOLERANCE_FIXED_M = 50;
/** Relative part of the height tolerance (fraction of the height above ground). */
export const HEIGHT_TOLERANCE_FRACTION = 0.05;

/**
 * How far a reported height above ground may differ from the hypsometric one before the
 * reported heights are replaced: 50 m + 5 % of the height. Our choice (common practice of
 * consistency checks: a wide margin), several times what honest differences reach: using
 * temperature instead of virtual temperature changes a layer thickness by about 0.5 %
 * (WallaceHobbs2006 eq. 3.29 with w ≤ 20 g kg⁻¹), and geopotential versus geometric height
 * by about 0.3 % at 10 km. A file in feet labelled metres is off by 228 %.
 * @param heightAglM - hypsometric height above ground, m
 * @returns tolerance, m
 */
export function heightTolerance(heightAglM: number): number {
  return HEIGHT_TOLERANCE_FIXED_M + HEIGHT_TOLERANCE_FRACTION * Math.abs(heightAglM);
}

/**
 * Sort levels by decreasing pressure without copying when they already are.
 * @param levels - sounding levels in any order
 * @returns the same levels, highest pressure first
 */
export function sortByDecreasingPressure(levels: readonly SoundingLevel[]): readonly SoundingLevel[] {
  for (let i = 1; i < levels.length; i++) {
    if ((levels[i] as SoundingLevel).pressureHpa >= (levels[i - 1] as SoundingLevel).pressureHpa) {
      return [...levels].sort((a, b) => b.pressureHpa - a.pressureHpa);
    }
  }
  return levels;
}

/** Values per level a profile stores (10 arrays, and room for 6 computed on first use). */
export const PROFILE_VALUES_PER_LEVEL = 16;

/**
 * Build the analysis profile from sounding levels.
 *
 * Missing dewpoints are interpolated linearly in ln p where a reported dewpoint lies both
 * below and above them (docs/analysis.md); above the last reported dewpoint the moisture profile
 * ends. A dewpoint above the temperature is capped at the temperature.
 * @param levels - at least two levels with distinct pressures, in any order
 * @param storage - optional room to build it in (at least PROFILE_VALUES_PER_LEVEL × levels
 *   values; reused storage must not be used again while the profile is in use)
 * @returns the profile
 * @throws RangeError for fewer than two levels (validate input first)
 */
export function buildProfile(levels: readonly SoundingLevel[], storage?: Float64Array): Profile {
  if (levels.length < 2) {
    throw new RangeError('A sounding needs at least two levels; validate it with validateSounding first.');
  }
  const sorted = sortByDecreasingPressure(levels);
  const count = sorted.length;
  // One allocation for every per-level array (typed-array allocations dominate small profiles).
  const buffer = storage && storage.length >= PROFILE_VALUES_PER_LEVEL * count ? storage : new Float64Array(PROFILE_VALUES_PER_LEVEL * count);
  const pressureHpa = buffer.subarray(0, count);
  const logPressure = buffer.subarray(count, 2 * count);
  const heightAglM = buffer.subarray(2 * count, 3 * count);
  const temperatureK = buffer.subarray(3 * count, 4 * count);
  const dewpointK = buffer.subarray(4 * count, 5 * count);
  const mixing = buffer.subarray(5 * count, 6 * count);
  const virtualTemperatureK = buffer.subarray(6 * count, 7 * count);
  const uMs = buffer.subarray(7 * count, 8 * count);
  const vMs = buffer.subarray(8 * count, 9 * count);
  const computed = buffer.subarray(9 * count, 10 * count);
  const ground = (sorted[0] as SoundingLevel).heightM;
  let moistureTopIndex = -1;
  for (let i = 0; i < count; i++) {
    const level = sorted[i] as SoundingLevel;
    pressureHpa[i] = level.pressureHpa;
    logPressure[i] = Math.log(level.pressureHpa);
    heightAglM[i] = level.heightM - ground;
    temperatureK[i] = level.temperatureC + ZERO_CELSIUS_K;
    const dewpoint = level.dewpointC;
    dewpointK[i] = dewpoint === null || !Number.isFinite(dewpoint) ? NaN : dewpoint + ZERO_CELSIUS_K;
    if (!Number.isNaN(dewpointK[i] as number)) moistureTopIndex = i;
    const hasWind = level.uMs !== null && level.vMs !== null && Number.isFinite(level.uMs) && Number.isFinite(level.vMs);
    uMs[i] = hasWind ? (level.uMs as number) : NaN;
    vMs[i] = hasWind ? (level.vMs as number) : NaN;
  }
  // Fill bracketed dewpoint gaps (linear in ln p).
  let lastKnown = -1;
  for (let i = 0; i <= moistureTopIndex; i++) {
    if (Number.isNaN(dewpointK[i] as number)) continue;
    if (lastKnown >= 0 && i - lastKnown > 1) {
      const lowerDewpoint = dewpointK[lastKnown] as number;
      const upperDewpoint = dewpointK[i] as number;
      const span = (logPressure[i] as number) - (logPressure[lastKnown] as number);
      for (let k = lastKnown + 1; k < i; k++) {
        const fraction = ((logPressure[k] as number) - (logPressure[lastKnown] as number)) / span;
        dewpointK[k] = lowerDewpoint + fraction * (upperDewpoint - lowerDewpoint);
      }
    }
    lastKnown = i;
  }
  for (let i = 0; i < count; i++) {
    const temperature = temperatureK[i] as number;
    let dewpoint = dewpointK[i] as number;
    if (dewpoint > temperature) {
      dewpoint = temperature;
      dewpointK[i] = dewpoint;
    }
    // w = ε e/(p − e) with e = eₛ(T_d) of Bolton1980 eq. 10, written out (hot path).
    let w = 0;
    if (!Number.isNaN(dewpoint)) {
      const dewpointC = dewpoint - ZERO_CELSIUS_K;
      const vaporPressure = 6.112 * Math.exp((17.67 * dewpointC) / (dewpointC + 243.5));
      w = (EPSILON * vaporPressure) / ((pressureHpa[i] as number) - vaporPressure);
    }
    mixing[i] = w;
    virtualTemperatureK[i] = (temperature * (w + EPSILON)) / (EPSILON * (1 + w));
  }
  // Check the reported heights against the hypsometric equation (WallaceHobbs2006 eq. 3.29,
  // virtual temperature linear in ln p inside a layer), and use the computed ones when any
  // level is off by more than the tolerance.
  computed[0] = 0; // the storage may be reused: every other value is written before it is read
  let largestDifference = 0;
  let largestAt = pressureHpa[0] as number;
  let replace = false;
  for (let i = 1; i < count; i++) {
    const thickness =
      ((RD * 0.5 * ((virtualTemperatureK[i - 1] as number) + (virtualTemperatureK[i] as number))) / GRAVITY) *
      ((logPressure[i - 1] as number) - (logPressure[i] as number));
    computed[i] = (computed[i - 1] as number) + thickness;
    const difference = Math.abs((heightAglM[i] as number) - (computed[i] as number));
    if (difference > largestDifference) {
      largestDifference = difference;
      largestAt = pressureHpa[i] as number;
    }
    if (difference > heightTolerance(computed[i] as number)) replace = true;
  }
  if (replace) heightAglM.set(computed);
  return {
    count,
    pressureHpa,
    logPressure,
    heightAglM,
    temperatureK,
    dewpointK,
    mixingRatio: mixing,
    virtualTemperatureK,
    uMs,
    vMs,
    moistureTopIndex,
    groundElevationM: ground,
    largestHeightDifferenceM: largestDifference,
    heightsReplaced: replace,
    largestHeightDifferencePressureHpa: largestAt,
    thermodynamics: undefined,
    tableCoordinates: undefined,
    exner: undefined,
    spare: buffer.subarray(10 * count, 16 * count),
    storage: buffer,
  };
}

/**
 * Index i such that p[i] ≥ pressure > p[i+1] (the layer holding a pressure), or −1 when the
 * pressure lies outside the profile.
 */
export function layerIndexAtPressure(profile: Profile, pressureHpa: number): number {
  const p = profile.pressureHpa;
  const n = profile.count;
  if (!(pressureHpa <= (p[0] as number) && pressureHpa >= (p[n - 1] as number))) return -1;
  let low = 0;
  let high = n - 1;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if ((p[middle] as number) >= pressureHpa) low = middle;
    else high = middle;
  }
  return low;
}

/**
 * Value of a profile array at a pressure, linear in ln p; NaN outside the profile.
 */
export function valueAtPressure(profile: Profile, values: Float64Array, pressureHpa: number): number {
  const i = layerIndexAtPressure(profile, pressureHpa);
  if (i < 0) return NaN;
  const lnp = Math.log(pressureHpa);
  const lower = profile.logPressure[i] as number;
  const upper = profile.logPressure[i + 1] as number;
  const fraction = upper === lower ? 0 : (lnp - lower) / (upper - lower);
  const a = values[i] as number;
  return a + fraction * ((values[i + 1] as number) - a);
}

/**
 * Value of a profile array at a height above ground, linear in height; NaN outside.
 */
export function valueAtHeight(profile: Profile, values: Float64Array, heightAglM: number): number {
  const z = profile.heightAglM;
  const n = profile.count;
  if (!(heightAglM >= (z[0] as number) && heightAglM <= (z[n - 1] as number))) return NaN;
  let low = 0;
  let high = n - 1;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if ((z[middle] as number) <= heightAglM) low = middle;
    else high = middle;
  }
  const z0 = z[low] as number;
  const z1 = z[high] as number;
  const fraction = z1 === z0 ? 0 : (heightAglM - z0) / (z1 - z0);
  const a = values[low] as number;
  return a + fraction * ((values[high] as number) - a);
}

/** Pressure at a height above ground (ln p linear in height); NaN outside the profile. */
export function pressureAtHeight(profile: Profile, heightAglM: number): number {
  return Math.exp(valueAtHeight(profile, profile.logPressure, heightAglM));
}

/** Height above ground at a pressure (linear in ln p); NaN outside the profile. */
export function heightAtPressure(profile: Profile, pressureHpa: number): number {
  return valueAtPressure(profile, profile.heightAglM, pressureHpa);
}
