import { EPSILON, GRAVITY, KAPPA, ZERO_CELSIUS_K } from './constants';
import { lclTemperature } from './lcl';
import { dewpointFromMixingRatio, mixingRatio } from './mixing-ratio';
import { moistAdiabatTemperature, pseudoAdiabatTable, type MoistAscentMethod } from './moist-adiabat';
import { buildProfile, layerIndexAtPressure, valueAtPressure, type Profile } from './profile';
import { saturationVaporPressure } from './saturation';
import { equivalentPotentialTemperatureFromMixingRatio } from './thermo';
import type { SoundingLevel } from './types';

/** One point of a parcel's path, for plotting on a thermodynamic diagram. */
export interface ParcelTracePoint {
  pressureHpa: number;
  temperatureC: number;
  virtualTemperatureC: number;
}

/**
 * What lifting one parcel through the environment gives. Heights are metres above ground
 * level; pressures hPa; energies J kg⁻¹; `null` where a level does not exist.
 */
export interface ParcelResult {
  /** Pressure the parcel starts from, hPa. */
  parcelPressure: number;
  /** Parcel temperature at its start, °C. */
  parcelTemperatureC: number;
  /** Parcel dewpoint at its start, °C. */
  parcelDewpointC: number;
  /** Convective available potential energy: positive area from LFC to EL, J kg⁻¹ (≥ 0). */
  cape: number;
  /** Convective inhibition: negative area from the start to the LFC, J kg⁻¹ (≤ 0). */
  cin: number;
  /** Lifted condensation level pressure, hPa. */
  lclPressure: number;
  /** LCL height above ground, m; null when the LCL is above the top of the data. */
  lclHeight: number | null;
  /** Temperature at the LCL, °C. */
  lclTemperature: number;
  /** Level of free convection, hPa; null when the parcel never becomes buoyant. */
  lfcPressure: number | null;
  lfcHeight: number | null;
  /** Equilibrium level, hPa; null without LFC or when still buoyant at the top of the data. */
  elPressure: number | null;
  elHeight: number | null;
  /** Environment minus parcel temperature at 500 hPa, K (positive: stable); null if not computable. */
  liftedIndex: number | null;
  /** CAPE below 3 km above ground, J kg⁻¹. */
  cape0to3km: number;
  /** The parcel path, only when asked for with `{trace: true}`. */
  trace?: ParcelTracePoint[];
}

/** Options for lifting a parcel. */
export interface ParcelOptions {
  /** Return the parcel path (default false: the analysis hot path does not build it). */
  trace?: boolean;
  /** 'table' (fast, default) or 'reference' (RK4 integration with ≤ 1 hPa steps). */
  moistAscent?: MoistAscentMethod;
}

/** A parcel's starting state in engine units. */
export interface ParcelStart {
  pressureHpa: number;
  temperatureK: number;
  /** Water vapour mixing ratio, kg kg⁻¹ (conserved below the LCL). */
  mixingRatio: number;
}

// Module-level copies of the constants used in the hot loop (read once, not per level).
const EPS = EPSILON;
const G = GRAVITY;
const K = KAPPA;
const ZERO_C = ZERO_CELSIUS_K;
const LOG_1000 = Math.log(1000);
const LOG_500 = Math.log(500);
const THREE_KM = 3000;
/** The smallest mixing ratio used for a parcel, kg kg⁻¹ (keeps the dewpoint finite for bone-dry air). */
const MIN_MIXING_RATIO = 1e-7;

interface AscentOutcome extends ParcelResult {
  /** For the effective-layer check: whether the parcel met CAPE ≥ 100 and CIN ≥ −250. */
  meetsEffectiveCriteria: boolean;
}

/** Effective inflow criteria, J kg⁻¹ (Thompson2007 pg. 104). */
export const EFFECTIVE_CAPE_MIN = 100;
export const EFFECTIVE_CIN_MIN = -250;

/**
 * Lift a parcel through a prepared profile: the core of every parcel in the engine.
 *
 * Method (Doswell and Rasmussen 1994; conventions of SCIENCE.md): the parcel keeps its
 * potential temperature and mixing ratio up to the LCL (Bolton1980 eq. 15), then follows the
 * pseudo-adiabat, saturated, with no condensate loading. Buoyancy
 * B = g (Tᵥ,parcel − Tᵥ,env) / Tᵥ,env is integrated in height with the trapezoid rule, the
 * LCL inserted as a point and zero crossings found by linear interpolation. CAPE is the
 * positive area above the LCL between the lowest LFC and the highest EL; CIN the negative
 * area from the start to the LFC; negative layers between positive areas count in neither.
 * When `effectiveCheck` is set, it stops as soon as the Thompson2007 criteria are decided.
 */
function ascend(profile: Profile, start: ParcelStart, options: ParcelOptions, effectiveCheck: boolean): AscentOutcome {
  const table = (options.moistAscent ?? 'table') === 'table' ? pseudoAdiabatTable() : undefined;
  const trace: ParcelTracePoint[] | undefined = options.trace ? [] : undefined;
  const p = profile.pressureHpa;
  const lnps = profile.logPressure;
  const z = profile.heightAglM;
  const tve = profile.virtualTemperatureK;
  const count = profile.count;

  const startPressure = start.pressureHpa;
  const startLogPressure = Math.log(startPressure);
  const startTemperature = start.temperatureK;
  const w0 = Math.max(start.mixingRatio, MIN_MIXING_RATIO);
  const theta = startTemperature * Math.exp(K * (LOG_1000 - startLogPressure));
  const vaporFactor = (w0 + EPS) / (EPS * (1 + w0));
  const startDewpoint = Math.min(dewpointFromMixingRatio(w0, startPressure), startTemperature);
  const temperatureLcl = lclTemperature(startTemperature, startDewpoint);
  const logPressureLcl = startLogPressure + Math.log(temperatureLcl / startTemperature) / K;
  const pressureLcl = Math.exp(logPressureLcl);
  const thetaW = table ? table.thetaW(temperatureLcl, logPressureLcl) : NaN;
  let referencePressure = pressureLcl;
  let referenceTemperature = temperatureLcl;

  // Environment at the start (linear in ln p between the levels around it).
  const layer = layerIndexAtPressure(profile, startPressure);
  if (layer < 0) throw new RangeError(`Parcel start pressure ${startPressure} hPa is outside the sounding.`);
  const lowerLog = lnps[layer] as number;
  const upperLog = lnps[layer + 1] as number;
  const startFraction = upperLog === lowerLog ? 0 : (startLogPressure - lowerLog) / (upperLog - lowerLog);
  const startHeight = (z[layer] as number) + startFraction * ((z[layer + 1] as number) - (z[layer] as number));
  const startEnvVirtual = (tve[layer] as number) + startFraction * ((tve[layer + 1] as number) - (tve[layer] as number));

  const areas = new BuoyancyAreas(effectiveCheck);
  const startBuoyancy = (G * (startTemperature * vaporFactor - startEnvVirtual)) / startEnvVirtual;
  const startsSaturated = logPressureLcl >= startLogPressure;
  areas.begin(startHeight, startLogPressure, startBuoyancy, startsSaturated);
  let lclHeight = startsSaturated ? startHeight : NaN;
  let prevEnvVirtual = startEnvVirtual;
  if (trace) trace.push(tracePoint(startPressure, startTemperature, startTemperature * vaporFactor));

  for (let k = layer + 1; k < count && !areas.decided; k++) {
    const pk = p[k] as number;
    if (pk >= startPressure) continue;
    const lnpk = lnps[k] as number;
    const zk = z[k] as number;
    const envVirtual = tve[k] as number;
    if (!areas.aboveLcl && lnpk < logPressureLcl) {
      // Insert the LCL as a point of the path.
      const fraction = (logPressureLcl - areas.prevLog) / (lnpk - areas.prevLog);
      const zl = areas.prevZ + fraction * (zk - areas.prevZ);
      const envAtLcl = prevEnvVirtual + fraction * (envVirtual - prevEnvVirtual);
      const parcelVirtual = temperatureLcl * vaporFactor;
      areas.reachLcl(zl, logPressureLcl, (G * (parcelVirtual - envAtLcl)) / envAtLcl);
      lclHeight = zl;
      if (trace) trace.push(tracePoint(pressureLcl, temperatureLcl, parcelVirtual));
      if (areas.decided) break;
    }
    let parcelTemperature: number;
    let parcelVirtual: number;
    if (areas.aboveLcl) {
      if (table) {
        parcelTemperature = table.temperature(thetaW, lnpk);
      } else {
        referenceTemperature = moistAdiabatTemperature(referencePressure, referenceTemperature, pk, 1);
        referencePressure = pk;
        parcelTemperature = referenceTemperature;
      }
      // Saturated: wₛ from eₛ of Bolton1980 eq. 10 (written out: hot loop).
      const temperatureC = parcelTemperature - ZERO_C;
      const es = 6.112 * Math.exp((17.67 * temperatureC) / (temperatureC + 243.5));
      const ws = (EPS * es) / (pk - es);
      parcelVirtual = (parcelTemperature * (ws + EPS)) / (EPS * (1 + ws));
    } else {
      parcelTemperature = theta * Math.exp(K * (lnpk - LOG_1000));
      parcelVirtual = parcelTemperature * vaporFactor;
    }
    areas.add(zk, lnpk, (G * (parcelVirtual - envVirtual)) / envVirtual);
    prevEnvVirtual = envVirtual;
    if (trace) trace.push(tracePoint(pk, parcelTemperature, parcelVirtual));
  }

  // Lifted index at 500 hPa (Galway1956), from temperatures (no virtual correction).
  let liftedIndex = NaN;
  const top = p[count - 1] as number;
  if (!effectiveCheck && startPressure >= 500 && top <= 500) {
    const environment500 = valueAtPressure(profile, profile.temperatureK, 500);
    let parcel500: number;
    if (pressureLcl <= 500) parcel500 = theta * Math.exp(K * (LOG_500 - LOG_1000));
    else if (table) parcel500 = table.temperature(thetaW, LOG_500);
    else parcel500 = moistAdiabatTemperature(pressureLcl, temperatureLcl, 500, 1);
    liftedIndex = environment500 - parcel500;
  }

  const found = areas.lfcFound;
  const hasEl = found && Number.isFinite(areas.elHeight);
  return {
    parcelPressure: startPressure,
    parcelTemperatureC: startTemperature - ZERO_C,
    parcelDewpointC: startDewpoint - ZERO_C,
    cape: found ? areas.cape : 0,
    cin: found ? Math.min(0, areas.cin) : 0,
    lclPressure: pressureLcl,
    lclHeight: finiteOrNull(lclHeight),
    lclTemperature: temperatureLcl - ZERO_C,
    lfcPressure: found ? Math.exp(areas.lfcLogPressure) : null,
    lfcHeight: found ? areas.lfcHeight : null,
    elPressure: hasEl ? Math.exp(areas.elLogPressure) : null,
    elHeight: hasEl ? areas.elHeight : null,
    liftedIndex: finiteOrNull(liftedIndex),
    cape0to3km: found ? areas.cape0to3km : 0,
    ...(trace ? { trace } : {}),
    meetsEffectiveCriteria: effectiveCheck
      ? areas.meetsEffectiveCriteria
      : found && areas.cape >= EFFECTIVE_CAPE_MIN && areas.cin >= EFFECTIVE_CIN_MIN,
  };
}

/**
 * Accumulates the areas of a piecewise-linear buoyancy profile B(z) point by point, with the
 * conventions of SCIENCE.md: CAPE = positive area above the LCL (between the lowest LFC and
 * the highest EL), CIN = negative area from the start to the LFC, negative layers between
 * positive areas in neither, positive area below the LCL in neither.
 */
class BuoyancyAreas {
  cape = 0;
  cin = 0;
  cape0to3km = 0;
  lfcFound = false;
  lfcHeight = NaN;
  lfcLogPressure = NaN;
  elHeight = NaN;
  elLogPressure = NaN;
  prevZ = 0;
  prevLog = 0;
  prevB = 0;
  aboveLcl = false;
  decided = false;
  meetsEffectiveCriteria = false;

  constructor(private readonly effectiveCheck: boolean) {}

  /** The starting point; `atLcl` when the parcel starts saturated. */
  begin(z: number, logPressure: number, buoyancy: number, atLcl: boolean): void {
    this.prevZ = z;
    this.prevLog = logPressure;
    this.prevB = buoyancy;
    if (atLcl) this.markLcl(z, logPressure, buoyancy);
  }

  /** The LCL point: the segment below it counts for CIN only. */
  reachLcl(z: number, logPressure: number, buoyancy: number): void {
    this.add(z, logPressure, buoyancy);
    this.markLcl(z, logPressure, buoyancy);
  }

  private markLcl(z: number, logPressure: number, buoyancy: number): void {
    this.aboveLcl = true;
    if (buoyancy > 0 && !this.lfcFound) {
      this.lfcFound = true;
      this.lfcHeight = z;
      this.lfcLogPressure = logPressure;
    }
  }

  /** The segment from the previous point to (z, ln p, B). */
  add(z: number, logPressure: number, buoyancy: number): void {
    const za = this.prevZ;
    const ba = this.prevB;
    if (!this.aboveLcl) {
      this.cin += negativeArea(za, ba, z, buoyancy);
    } else if (!this.lfcFound) {
      if (buoyancy > 0) {
        const fraction = ba / (ba - buoyancy);
        const zx = za + fraction * (z - za);
        this.cin += negativeArea(za, ba, zx, 0);
        this.lfcFound = true;
        this.lfcHeight = zx;
        this.lfcLogPressure = this.prevLog + fraction * (logPressure - this.prevLog);
        this.addPositive(zx, 0, z, buoyancy);
      } else {
        this.cin += negativeArea(za, ba, z, buoyancy);
      }
    } else {
      this.addPositive(za, ba, z, buoyancy);
      if (buoyancy > 0) {
        this.elHeight = NaN;
        this.elLogPressure = NaN;
      } else if (ba > 0) {
        const fraction = ba / (ba - buoyancy);
        this.elHeight = za + fraction * (z - za);
        this.elLogPressure = this.prevLog + fraction * (logPressure - this.prevLog);
      }
    }
    this.prevZ = z;
    this.prevLog = logPressure;
    this.prevB = buoyancy;
    if (this.effectiveCheck && !this.decided) {
      if (!this.lfcFound && this.cin < EFFECTIVE_CIN_MIN) {
        this.decided = true;
      } else if (this.lfcFound && this.cape >= EFFECTIVE_CAPE_MIN) {
        this.decided = true;
        this.meetsEffectiveCriteria = this.cin >= EFFECTIVE_CIN_MIN;
      }
    }
  }

  private addPositive(za: number, ba: number, zb: number, bb: number): void {
    this.cape += positiveArea(za, ba, zb, bb);
    if (za < THREE_KM) {
      if (zb <= THREE_KM) this.cape0to3km += positiveArea(za, ba, zb, bb);
      else this.cape0to3km += positiveArea(za, ba, THREE_KM, ba + ((THREE_KM - za) / (zb - za)) * (bb - ba));
    }
  }
}

function tracePoint(pressureHpa: number, temperatureK: number, virtualTemperatureK: number): ParcelTracePoint {
  return {
    pressureHpa,
    temperatureC: temperatureK - ZERO_CELSIUS_K,
    virtualTemperatureC: virtualTemperatureK - ZERO_CELSIUS_K,
  };
}

/** A finite number, or null (the engine never returns NaN). */
export function finiteOrNull(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

/** Area of the positive part of a linear segment of buoyancy, J kg⁻¹. */
function positiveArea(za: number, ba: number, zb: number, bb: number): number {
  if (ba >= 0 && bb >= 0) return 0.5 * (ba + bb) * (zb - za);
  if (ba <= 0 && bb <= 0) return 0;
  const zx = za + (ba / (ba - bb)) * (zb - za);
  return ba > 0 ? 0.5 * ba * (zx - za) : 0.5 * bb * (zb - zx);
}

/** Area of the negative part of a linear segment of buoyancy (≤ 0), J kg⁻¹. */
function negativeArea(za: number, ba: number, zb: number, bb: number): number {
  return 0.5 * (ba + bb) * (zb - za) - positiveArea(za, ba, zb, bb);
}

/** Strip the internal field from an ascent outcome. */
function toResult(outcome: AscentOutcome): ParcelResult {
  const { meetsEffectiveCriteria: _unused, ...result } = outcome;
  return result;
}

/**
 * Lift a parcel from a given starting state through a prepared profile.
 * @param profile - the environment (see buildProfile)
 * @param start - starting pressure (hPa), temperature (K) and mixing ratio (kg kg⁻¹)
 * @param options - trace and moist-ascent method
 * @returns the parcel result (see {@link ParcelResult})
 */
export function liftParcelOnProfile(profile: Profile, start: ParcelStart, options: ParcelOptions = {}): ParcelResult {
  return toResult(ascend(profile, start, options, false));
}

/**
 * Whether a parcel lifted from a level meets the effective inflow criteria
 * (CAPE ≥ 100 J kg⁻¹ and CIN ≥ −250 J kg⁻¹; Thompson2007 pg. 104). Stops lifting as soon
 * as the answer is known.
 */
export function meetsEffectiveInflowCriteria(profile: Profile, levelIndex: number): boolean {
  const dewpoint = profile.dewpointK[levelIndex] as number;
  if (Number.isNaN(dewpoint)) return false;
  const pressure = profile.pressureHpa[levelIndex] as number;
  return ascend(
    profile,
    {
      pressureHpa: pressure,
      temperatureK: profile.temperatureK[levelIndex] as number,
      mixingRatio: profile.mixingRatio[levelIndex] as number,
    },
    {},
    true,
  ).meetsEffectiveCriteria;
}

/** The surface-based parcel's start: the lowest level's temperature and mixing ratio. */
export function surfaceBasedStart(profile: Profile): ParcelStart {
  if (Number.isNaN(profile.dewpointK[0] as number)) {
    throw new RangeError('The lowest level has no dewpoint; validate the sounding first.');
  }
  return {
    pressureHpa: profile.pressureHpa[0] as number,
    temperatureK: profile.temperatureK[0] as number,
    mixingRatio: profile.mixingRatio[0] as number,
  };
}

/**
 * The mixed-layer parcel's start: pressure-weighted mean potential temperature and mixing
 * ratio of the lowest `depthHpa` (default 100 hPa), placed at the surface pressure.
 *
 * Notes: means are ∫ x dp / ∫ dp with the trapezoid rule, the layer top interpolated in ln p
 * (common practice, SCIENCE.md). Above the top of the moisture data w counts as 0.
 */
export function mixedLayerStart(profile: Profile, depthHpa = 100): ParcelStart {
  const p = profile.pressureHpa;
  const surface = p[0] as number;
  const topPressure = Math.max(surface - depthHpa, p[profile.count - 1] as number);
  const thetaAt = (i: number): number =>
    (profile.temperatureK[i] as number) * Math.exp(KAPPA * (LOG_1000 - (profile.logPressure[i] as number)));
  let thetaSum = 0;
  let mixingSum = 0;
  let prevP = surface;
  let prevTheta = thetaAt(0);
  let prevW = profile.mixingRatio[0] as number;
  for (let k = 1; k < profile.count; k++) {
    let pk = p[k] as number;
    let thetaK = thetaAt(k);
    let wk = profile.mixingRatio[k] as number;
    if (pk < topPressure) {
      const fraction = (Math.log(topPressure) - Math.log(prevP)) / ((profile.logPressure[k] as number) - Math.log(prevP));
      thetaK = prevTheta + fraction * (thetaK - prevTheta);
      wk = prevW + fraction * (wk - prevW);
      pk = topPressure;
    }
    const dp = prevP - pk;
    thetaSum += 0.5 * (prevTheta + thetaK) * dp;
    mixingSum += 0.5 * (prevW + wk) * dp;
    prevP = pk;
    prevTheta = thetaK;
    prevW = wk;
    if (pk <= topPressure) break;
  }
  const depth = surface - topPressure;
  const meanTheta = thetaSum / depth;
  return {
    pressureHpa: surface,
    temperatureK: meanTheta * Math.exp(KAPPA * (Math.log(surface) - LOG_1000)),
    mixingRatio: mixingSum / depth,
  };
}

/**
 * Index of the most-unstable level: the level with the highest θₑ (Bolton1980 eq. 39) within
 * `depthHpa` (default 300 hPa) of the surface, among levels with a dewpoint.
 */
export function mostUnstableLevelIndex(profile: Profile, depthHpa = 300): number {
  const limit = (profile.pressureHpa[0] as number) - depthHpa;
  let best = 0;
  let bestThetaE = -Infinity;
  for (let k = 0; k < profile.count; k++) {
    const pk = profile.pressureHpa[k] as number;
    if (pk < limit) break;
    const dewpoint = profile.dewpointK[k] as number;
    if (Number.isNaN(dewpoint)) continue;
    const temperature = profile.temperatureK[k] as number;
    const thetaE = equivalentPotentialTemperatureFromMixingRatio(
      pk,
      temperature,
      profile.mixingRatio[k] as number,
      lclTemperature(temperature, dewpoint),
    );
    if (thetaE > bestThetaE) {
      bestThetaE = thetaE;
      best = k;
    }
  }
  return best;
}

/** The start of a parcel at a level of the profile (its temperature and mixing ratio). */
export function levelStart(profile: Profile, levelIndex: number): ParcelStart {
  return {
    pressureHpa: profile.pressureHpa[levelIndex] as number,
    temperatureK: profile.temperatureK[levelIndex] as number,
    mixingRatio: profile.mixingRatio[levelIndex] as number,
  };
}

/** A parcel's starting state as forecasters give it: pressure, temperature and dewpoint. */
export interface ParcelStartObserved {
  /** Starting pressure, hPa (within the sounding). */
  pressureHpa: number;
  /** Starting temperature, °C. */
  temperatureC: number;
  /** Starting dewpoint, °C (≤ temperature). */
  dewpointC: number;
}

/**
 * Lift a parcel from any starting state through a sounding (for the what-if editor).
 *
 * @param levels - the sounding levels (any order)
 * @param start - starting pressure (hPa), temperature (°C) and dewpoint (°C)
 * @param options - `{trace: true}` to get the parcel path; moist-ascent method
 * @returns the parcel result with its trace when asked for
 * @example liftParcel(levels, {pressureHpa: 850, temperatureC: 18, dewpointC: 14}, {trace: true})
 * Notes: see {@link ParcelResult}; methods in README.md (Doswell and Rasmussen 1994).
 */
export function liftParcel(
  levels: readonly SoundingLevel[],
  start: ParcelStartObserved,
  options: ParcelOptions = {},
): ParcelResult {
  const profile = buildProfile(levels);
  const dewpointK = Math.min(start.dewpointC, start.temperatureC) + ZERO_CELSIUS_K;
  return liftParcelOnProfile(
    profile,
    {
      pressureHpa: start.pressureHpa,
      temperatureK: start.temperatureC + ZERO_CELSIUS_K,
      mixingRatio: mixingRatio(saturationVaporPressure(dewpointK), start.pressureHpa),
    },
    options,
  );
}

/**
 * Lift a parcel from one level of the sounding, with that level's temperature and dewpoint.
 * @param levels - the sounding levels (any order)
 * @param pressureHpa - pressure of the level to lift from (must be a level's pressure or
 *   lie within the sounding; the environment is interpolated in ln p)
 * @param options - trace and moist-ascent method
 */
export function liftParcelFromLevel(
  levels: readonly SoundingLevel[],
  pressureHpa: number,
  options: ParcelOptions = {},
): ParcelResult {
  const profile = buildProfile(levels);
  const temperatureK = valueAtPressure(profile, profile.temperatureK, pressureHpa);
  const dewpointK = valueAtPressure(profile, profile.dewpointK, pressureHpa);
  if (!Number.isFinite(temperatureK) || !Number.isFinite(dewpointK)) {
    throw new RangeError(`No temperature and dewpoint at ${pressureHpa} hPa in this sounding.`);
  }
  return liftParcelOnProfile(
    profile,
    { pressureHpa, temperatureK, mixingRatio: mixingRatio(saturationVaporPressure(dewpointK), pressureHpa) },
    options,
  );
}

/**
 * Lift a surface parcel with a modified surface temperature and/or dewpoint (what-if).
 *
 * The sounding itself is not changed: only the parcel starts from the new values (the lowest
 * level's environment temperature stays as observed).
 * @param levels - the sounding levels (any order)
 * @param surface - new surface temperature and/or dewpoint, °C; an omitted value keeps the observed one
 * @param options - trace and moist-ascent method
 * @example liftModifiedSurfaceParcel(levels, {temperatureC: 31}, {trace: true})
 */
export function liftModifiedSurfaceParcel(
  levels: readonly SoundingLevel[],
  surface: { temperatureC?: number; dewpointC?: number },
  options: ParcelOptions = {},
): ParcelResult {
  const profile = buildProfile(levels);
  const observed = surfaceBasedStart(profile);
  const temperatureC = surface.temperatureC ?? observed.temperatureK - ZERO_CELSIUS_K;
  const dewpointC = surface.dewpointC ?? (profile.dewpointK[0] as number) - ZERO_CELSIUS_K;
  return liftParcelOnProfile(
    profile,
    {
      pressureHpa: observed.pressureHpa,
      temperatureK: temperatureC + ZERO_CELSIUS_K,
      mixingRatio: mixingRatio(saturationVaporPressure(Math.min(dewpointC, temperatureC) + ZERO_CELSIUS_K), observed.pressureHpa),
    },
    options,
  );
}
