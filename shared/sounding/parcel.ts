import { EPSILON, GRAVITY, KAPPA, ZERO_CELSIUS_K } from './constants';
import { lclTemperature } from './lcl';
import { dewpointFromMixingRatio, mixingRatio } from './mixing-ratio';
import { moistAdiabatTemperature, PseudoAdiabatPath, pseudoAdiabatTable, saturatedVirtualTemperature, type MoistAscentMethod } from './moist-adiabat';
import { buildProfile, exnerAt, layerIndexAtPressure, levelExner, levelTableCoordinates, levelThermodynamics, valueAtPressure, type Profile } from './profile';
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
  /** Convective inhibition: all negative area from the start to the LFC, J kg⁻¹ (≤ 0). */
  cin: number;
  /** Lifted condensation level pressure, hPa. */
  lclPressure: number;
  /** LCL height above ground, m; null when the LCL is above the top of the data. */
  lclHeight: number | null;
  /** Temperature at the LCL, °C. */
  lclTemperature: number;
  /** Level of free convection: base of the positive area holding the most energy, hPa; null when the parcel never becomes buoyant. */
  lfcPressure: number | null;
  lfcHeight: number | null;
  /** Equilibrium level: the highest crossing above the LFC, hPa; null without LFC or when still buoyant at the top of the data. */
  elPressure: number | null;
  elHeight: number | null;
  /** Environment minus parcel temperature at 500 hPa, K (positive: stable); null if not computable. */
  liftedIndex: number | null;
  /** Lifted index from virtual temperatures at 500 hPa (Tᵥ,env − Tᵥ,parcel), K; null if not computable. */
  liftedIndexVirtual: number | null;
  /** CAPE below 3 km above ground, J kg⁻¹. */
  cape0to3km: number;
  /** Positive area between the start and the LFC (counted in neither CAPE nor CIN), J kg⁻¹ (≥ 0). */
  positiveAreaBelowLfc: number;
  /** Negative area between the LFC and the EL (counted in neither CAPE nor CIN), J kg⁻¹ (≤ 0). */
  negativeAreaLfcToEl: number;
  /** True when the parcel is still buoyant at the top of the data: CAPE is cut there and EL is null. */
  capeClippedAtTop: boolean;
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

/**
 * The effective-inflow decision of the last {@link ascend} (set before it returns; the engine
 * is synchronous, so the caller reads it at once): whether the parcel met CAPE ≥ 100 and
 * CIN ≥ −250 J kg⁻¹ on its first LFC (Thompson2007).
 */
let lastEffectiveDecision = false;

/** Effective inflow criteria, J kg⁻¹ (Thompson2007 pg. 104). */
export const EFFECTIVE_CAPE_MIN = 100;
export const EFFECTIVE_CIN_MIN = -250;

/**
 * Lift a parcel through a prepared profile: the core of every parcel in the engine.
 *
 * Method (DoswellRasmussen1994; conventions in docs/analysis.md): the parcel keeps its
 * potential temperature and mixing ratio up to the LCL (Bolton1980 eq. 15), then follows the
 * pseudo-adiabat, saturated, with no condensate loading. Buoyancy
 * B = g (Tᵥ,parcel − Tᵥ,env) / Tᵥ,env is integrated in height with the trapezoid rule, the
 * LCL inserted as a point and zero crossings found by linear interpolation. The LFC is the
 * base of the positive area (above the LCL) that holds the most energy; the EL the highest
 * crossing above it; CAPE the positive area between them; CIN all negative area from the
 * start to the LFC. Above the LCL the table's saturated virtual temperatures give the parcel's
 * Tᵥ directly (see PseudoAdiabatTable.virtualTemperatures).
 */
function ascend(profile: Profile, start: ParcelStart, options: ParcelOptions): ParcelResult {
  const table = (options.moistAscent ?? 'table') === 'table' ? pseudoAdiabatTable() : undefined;
  const trace: ParcelTracePoint[] | undefined = options.trace ? [] : undefined;
  const p = profile.pressureHpa;
  const lnps = profile.logPressure;
  const z = profile.heightAglM;
  const tve = profile.virtualTemperatureK;
  const count = profile.count;
  const { node, fraction: nodeFraction } = levelTableCoordinates(profile);
  const exner = levelExner(profile);

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
  const path = table ? new PseudoAdiabatPath(table, pressureLcl, temperatureLcl, table.thetaW(temperatureLcl, logPressureLcl)) : undefined;
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

  const areas = new BuoyancyAreas();
  const startBuoyancy = (G * (startTemperature * vaporFactor - startEnvVirtual)) / startEnvVirtual;
  const startsSaturated = logPressureLcl >= startLogPressure;
  areas.begin(startHeight, startLogPressure, startBuoyancy, startsSaturated);
  let lclHeight = startsSaturated ? startHeight : NaN;
  let prevEnvVirtual = startEnvVirtual;
  if (trace) trace.push(tracePoint(startPressure, startTemperature, startTemperature * vaporFactor));

  for (let k = layer + 1; k < count; k++) {
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
    }
    let parcelTemperature: number;
    let parcelVirtual: number;
    if (areas.aboveLcl) {
      if (path) {
        parcelVirtual = path.virtualTemperatureAtNode(pk, lnpk, node[k] as number, nodeFraction[k] as number);
        parcelTemperature = trace ? path.lastPointTemperature() : NaN;
      } else {
        referenceTemperature = moistAdiabatTemperature(referencePressure, referenceTemperature, pk, 1);
        referencePressure = pk;
        parcelTemperature = referenceTemperature;
        parcelVirtual = saturatedVirtualTemperature(parcelTemperature, pk);
      }
    } else {
      parcelTemperature = theta * exnerAt(exner, lnps, k);
      parcelVirtual = parcelTemperature * vaporFactor;
    }
    areas.add(zk, lnpk, (G * (parcelVirtual - envVirtual)) / envVirtual);
    prevEnvVirtual = envVirtual;
    if (trace) trace.push(tracePoint(pk, parcelTemperature, parcelVirtual));
  }

  // Lifted index at 500 hPa (Galway1956), from temperatures, and its virtual-temperature form.
  let liftedIndex = NaN;
  let liftedIndexVirtual = NaN;
  const top = p[count - 1] as number;
  if (startPressure >= 500 && top <= 500) {
    const environment500 = valueAtPressure(profile, profile.temperatureK, 500);
    const environmentVirtual500 = valueAtPressure(profile, profile.virtualTemperatureK, 500);
    let parcel500: number;
    let parcelVirtual500: number;
    if (pressureLcl <= 500) {
      parcel500 = theta * Math.exp(K * (LOG_500 - LOG_1000));
      parcelVirtual500 = parcel500 * vaporFactor;
    } else {
      // On the ascent's own curve (the same θ_w a new walk from the LCL would find); outside
      // the table, integrated from the LCL as such a walk would.
      const inTable = path ? path.table.temperatureInTable(path.thetaWK, LOG_500) : NaN;
      parcel500 = Number.isNaN(inTable) ? moistAdiabatTemperature(pressureLcl, temperatureLcl, 500, 1) : inTable;
      parcelVirtual500 = saturatedVirtualTemperature(parcel500, 500);
    }
    liftedIndex = environment500 - parcel500;
    liftedIndexVirtual = environmentVirtual500 - parcelVirtual500;
  }

  const summary = areas.summary();
  const found = summary.lfcFound;
  const result: ParcelResult = {
    parcelPressure: startPressure,
    parcelTemperatureC: startTemperature - ZERO_C,
    parcelDewpointC: startDewpoint - ZERO_C,
    cape: summary.cape,
    cin: Math.min(0, summary.cin),
    lclPressure: pressureLcl,
    lclHeight: finiteOrNull(lclHeight),
    lclTemperature: temperatureLcl - ZERO_C,
    lfcPressure: found ? Math.exp(summary.lfcLogPressure) : null,
    lfcHeight: found ? summary.lfcHeight : null,
    elPressure: found && summary.elFound ? Math.exp(summary.elLogPressure) : null,
    elHeight: found && summary.elFound ? summary.elHeight : null,
    liftedIndex: finiteOrNull(liftedIndex),
    liftedIndexVirtual: finiteOrNull(liftedIndexVirtual),
    cape0to3km: summary.cape0to3km,
    positiveAreaBelowLfc: summary.positiveBelowLfc,
    negativeAreaLfcToEl: Math.min(0, summary.negativeLfcToEl),
    capeClippedAtTop: found && !summary.elFound,
    ...(trace ? { trace } : {}),
  };
  lastEffectiveDecision = areas.firstLfcDecision();
  return result;
}

/** One positive area of buoyancy above the LCL. */
interface PositiveArea {
  baseZ: number;
  baseLog: number;
  /** All negative area from the start to the base, J kg⁻¹ (≤ 0). */
  negativeBefore: number;
  /** All positive area from the start to the base (including below the LCL), J kg⁻¹. */
  positiveBefore: number;
  area: number;
  area0to3km: number;
  /** Where the parcel stops being buoyant; NaN while still buoyant (at the top of the data). */
  topZ: number;
  topLog: number;
}

/** The areas of a finished ascent under the convention of docs/analysis.md. */
interface AreasSummary {
  lfcFound: boolean;
  elFound: boolean;
  cape: number;
  cin: number;
  cape0to3km: number;
  lfcHeight: number;
  lfcLogPressure: number;
  elHeight: number;
  elLogPressure: number;
  positiveBelowLfc: number;
  negativeLfcToEl: number;
}

/**
 * Accumulates the areas of a piecewise-linear buoyancy profile B(z) point by point and keeps
 * every positive area above the LCL, so the convention can pick the one holding the most
 * energy at the end (docs/analysis.md, "Parcel levels and areas").
 */
class BuoyancyAreas {
  private negative = 0;
  private positive = 0;
  private readonly positiveAreas: PositiveArea[] = [];
  private current: PositiveArea | undefined;
  prevZ = 0;
  prevLog = 0;
  prevB = 0;
  aboveLcl = false;

  /** The starting point; `atLcl` when the parcel starts saturated. */
  begin(z: number, logPressure: number, buoyancy: number, atLcl: boolean): void {
    this.prevZ = z;
    this.prevLog = logPressure;
    this.prevB = buoyancy;
    if (atLcl) this.markLcl(z, logPressure, buoyancy);
  }

  /** The LCL point: the segment below it is never CAPE. */
  reachLcl(z: number, logPressure: number, buoyancy: number): void {
    this.add(z, logPressure, buoyancy);
    this.markLcl(z, logPressure, buoyancy);
  }

  private markLcl(z: number, logPressure: number, buoyancy: number): void {
    this.aboveLcl = true;
    if (buoyancy > 0) this.open(z, logPressure);
  }

  private open(z: number, logPressure: number): void {
    this.current = { baseZ: z, baseLog: logPressure, negativeBefore: this.negative, positiveBefore: this.positive, area: 0, area0to3km: 0, topZ: NaN, topLog: NaN };
    this.positiveAreas.push(this.current);
  }

  /** The segment from the previous point to (z, ln p, B). */
  add(z: number, logPressure: number, buoyancy: number): void {
    const za = this.prevZ;
    const ba = this.prevB;
    if (!this.aboveLcl) {
      const positivePart = positiveArea(za, ba, z, buoyancy);
      this.negative += 0.5 * (ba + buoyancy) * (z - za) - positivePart;
      this.positive += positivePart;
    } else if (ba > 0 && buoyancy > 0) {
      this.addPositive(za, ba, z, buoyancy);
    } else if (ba <= 0 && buoyancy <= 0) {
      this.negative += 0.5 * (ba + buoyancy) * (z - za);
    } else {
      const fraction = ba / (ba - buoyancy);
      const zx = za + fraction * (z - za);
      const logx = this.prevLog + fraction * (logPressure - this.prevLog);
      if (buoyancy > 0) {
        this.negative += 0.5 * ba * (zx - za);
        this.open(zx, logx);
        this.addPositive(zx, 0, z, buoyancy);
      } else {
        this.addPositive(za, ba, zx, 0);
        if (this.current) {
          this.current.topZ = zx;
          this.current.topLog = logx;
          this.current = undefined;
        }
        this.negative += 0.5 * buoyancy * (z - zx);
      }
    }
    this.prevZ = z;
    this.prevLog = logPressure;
    this.prevB = buoyancy;
  }

  /**
   * After a full ascent: the decision the effective-layer check ({@link effectiveDecision})
   * makes on the first LFC (its areas only grow, so the end state decides as its early stop
   * does).
   */
  firstLfcDecision(): boolean {
    const first = this.positiveAreas[0];
    return first !== undefined && first.negativeBefore >= EFFECTIVE_CIN_MIN && this.positive - first.positiveBefore >= EFFECTIVE_CAPE_MIN;
  }

  private addPositive(za: number, ba: number, zb: number, bb: number): void {
    const area = 0.5 * (ba + bb) * (zb - za);
    this.positive += area;
    const current = this.current;
    if (!current) return;
    current.area += area;
    if (za < THREE_KM) {
      if (zb <= THREE_KM) current.area0to3km += area;
      else current.area0to3km += 0.5 * (ba + ba + ((THREE_KM - za) / (zb - za)) * (bb - ba)) * (THREE_KM - za);
    }
  }

  /** CAPE, CIN, LFC, EL and the side areas under the convention. */
  summary(): AreasSummary {
    const areas = this.positiveAreas;
    let chosen = -1;
    // Areas below 1e-6 J/kg are rounding noise (a parcel starting exactly at its environment).
    let largest = 1e-6;
    for (let i = 0; i < areas.length; i++) {
      const area = (areas[i] as PositiveArea).area;
      if (area > largest) {
        largest = area;
        chosen = i;
      }
    }
    if (chosen < 0) {
      return { lfcFound: false, elFound: false, cape: 0, cin: 0, cape0to3km: 0, lfcHeight: NaN, lfcLogPressure: NaN, elHeight: NaN, elLogPressure: NaN, positiveBelowLfc: 0, negativeLfcToEl: 0 };
    }
    const lfc = areas[chosen] as PositiveArea;
    const last = areas[areas.length - 1] as PositiveArea;
    let cape = 0;
    let cape0to3km = 0;
    for (let i = chosen; i < areas.length; i++) {
      cape += (areas[i] as PositiveArea).area;
      cape0to3km += (areas[i] as PositiveArea).area0to3km;
    }
    const elFound = Number.isFinite(last.topZ);
    return {
      lfcFound: true,
      elFound,
      cape,
      cin: lfc.negativeBefore,
      cape0to3km,
      lfcHeight: lfc.baseZ,
      lfcLogPressure: lfc.baseLog,
      elHeight: last.topZ,
      elLogPressure: last.topLog,
      positiveBelowLfc: lfc.positiveBefore,
      negativeLfcToEl: last.negativeBefore - lfc.negativeBefore,
    };
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

/** Area of the positive part of a linear segment of buoyancy, J kg⁻¹ (its negative part is the whole trapezoid minus this). */
function positiveArea(za: number, ba: number, zb: number, bb: number): number {
  if (ba >= 0 && bb >= 0) return 0.5 * (ba + bb) * (zb - za);
  if (ba <= 0 && bb <= 0) return 0;
  const zx = za + (ba / (ba - bb)) * (zb - za);
  return ba > 0 ? 0.5 * ba * (zx - za) : 0.5 * bb * (zb - zx);
}



/**
 * Lift a parcel from a given starting state through a prepared profile.
 * @param profile - the environment (see buildProfile)
 * @param start - starting pressure (hPa), temperature (K) and mixing ratio (kg kg⁻¹)
 * @param options - trace and moist-ascent method
 * @returns the parcel result (see {@link ParcelResult})
 */
export function liftParcelOnProfile(profile: Profile, start: ParcelStart, options: ParcelOptions = {}): ParcelResult {
  return ascend(profile, start, options);
}

/**
 * Lift a parcel and also tell whether it meets the effective inflow criteria, as
 * {@link meetsEffectiveInflowCriteria} would for the same start (so the analysis need not
 * lift the surface and most-unstable levels again for the effective layer).
 * @returns the result, and the decision (null with the reference moist ascent, whose
 *   numbers may differ from the table's the effective check uses)
 */
export function liftParcelWithEffectiveDecision(
  profile: Profile,
  start: ParcelStart,
  options: ParcelOptions = {},
): { result: ParcelResult; meetsEffectiveCriteria: boolean | null } {
  const result = ascend(profile, start, options);
  return { result, meetsEffectiveCriteria: (options.moistAscent ?? 'table') === 'table' ? lastEffectiveDecision : null };
}

/**
 * Whether a parcel lifted from a level meets the effective inflow criteria
 * (CAPE ≥ 100 J kg⁻¹ and CIN ≥ −250 J kg⁻¹; Thompson2007 pg. 104). Stops lifting as soon
 * as the answer is known.
 */
export function meetsEffectiveInflowCriteria(profile: Profile, levelIndex: number): boolean {
  const dewpoint = profile.dewpointK[levelIndex] as number;
  if (Number.isNaN(dewpoint)) return false;
  return effectiveDecision(profile, levelIndex);
}

/**
 * Work of the effective-layer checks since the process started: parcels lifted and levels
 * they passed (lets tests check that the search stays linear in the number of levels).
 */
export const effectiveWork = { parcels: 0, levels: 0 };

/** The path object every effective-layer check reuses (the engine is synchronous). */
let effectivePath: PseudoAdiabatPath | undefined;

/**
 * The effective-inflow decision of a parcel lifted from a level: the same ascent as
 * {@link ascend} (same formulas, same order of operations) with only the running areas kept
 * in plain numbers, stopping as soon as the decision is known (Thompson2007 pg. 104: CAPE on
 * the first LFC ≥ 100 J kg⁻¹, CIN before it ≥ −250 J kg⁻¹). shared-work.test.ts checks it
 * against the full ascent's decision.
 */
function effectiveDecision(profile: Profile, levelIndex: number): boolean {
  effectiveWork.parcels++;
  const table = pseudoAdiabatTable();
  const p = profile.pressureHpa;
  const lnps = profile.logPressure;
  const z = profile.heightAglM;
  const tve = profile.virtualTemperatureK;
  const count = profile.count;
  const { node, fraction: nodeFraction } = levelTableCoordinates(profile);
  const exner = levelExner(profile);

  const startPressure = p[levelIndex] as number;
  const startLogPressure = lnps[levelIndex] as number;
  const startTemperature = profile.temperatureK[levelIndex] as number;
  const w0 = Math.max(profile.mixingRatio[levelIndex] as number, MIN_MIXING_RATIO);
  const theta = startTemperature * Math.exp(K * (LOG_1000 - startLogPressure));
  const vaporFactor = (w0 + EPS) / (EPS * (1 + w0));
  const startDewpoint = Math.min(dewpointFromMixingRatio(w0, startPressure), startTemperature);
  const temperatureLcl = lclTemperature(startTemperature, startDewpoint);
  const logPressureLcl = startLogPressure + Math.log(temperatureLcl / startTemperature) / K;
  const pressureLcl = Math.exp(logPressureLcl);
  const thetaW = table.thetaW(temperatureLcl, logPressureLcl);
  if (effectivePath && effectivePath.table === table) effectivePath.reset(pressureLcl, temperatureLcl, thetaW);
  else effectivePath = new PseudoAdiabatPath(table, pressureLcl, temperatureLcl, thetaW);
  const path = effectivePath;

  // The layer holding the start (what layerIndexAtPressure finds for a level's own pressure).
  const layer = levelIndex < count - 1 ? levelIndex : count - 2;
  if (layer < 0) return false;
  const lowerLog = lnps[layer] as number;
  const upperLog = lnps[layer + 1] as number;
  const startFraction = upperLog === lowerLog ? 0 : (startLogPressure - lowerLog) / (upperLog - lowerLog);
  const startHeight = (z[layer] as number) + startFraction * ((z[layer + 1] as number) - (z[layer] as number));
  const startEnvVirtual = (tve[layer] as number) + startFraction * ((tve[layer + 1] as number) - (tve[layer] as number));

  // The running state of BuoyancyAreas, reduced to what the decision needs.
  let negative = 0;
  let positive = 0;
  let hasFirst = false;
  let firstNegative = 0;
  let firstPositive = 0;
  let prevZ = startHeight;
  let prevLog = startLogPressure;
  let prevB = (G * (startTemperature * vaporFactor - startEnvVirtual)) / startEnvVirtual;
  let aboveLcl = logPressureLcl >= startLogPressure;
  if (aboveLcl && prevB > 0) {
    hasFirst = true;
    firstNegative = negative;
    firstPositive = positive;
  }
  let prevEnvVirtual = startEnvVirtual;
  // Each point of the path: the LCL when the parcel passes it, then the level.
  for (let k = layer + 1; k < count; k++) {
    const pk = p[k] as number;
    if (pk >= startPressure) continue;
    const lnpk = lnps[k] as number;
    const zk = z[k] as number;
    const envVirtual = tve[k] as number;
    effectiveWork.levels++;
    for (let point = aboveLcl ? 1 : 0; point < 2; point++) {
      let zPoint: number;
      let logPoint: number;
      let b: number;
      let atLcl = false;
      if (point === 0) {
        if (lnpk >= logPressureLcl) {
          zPoint = zk;
          logPoint = lnpk;
          b = (G * (theta * exnerAt(exner, lnps, k) * vaporFactor - envVirtual)) / envVirtual;
          point = 1; // a level below the LCL: one point only
        } else {
          const fraction = (logPressureLcl - prevLog) / (lnpk - prevLog);
          zPoint = prevZ + fraction * (zk - prevZ);
          logPoint = logPressureLcl;
          const envAtLcl = prevEnvVirtual + fraction * (envVirtual - prevEnvVirtual);
          b = (G * (temperatureLcl * vaporFactor - envAtLcl)) / envAtLcl;
          atLcl = true;
        }
      } else {
        zPoint = zk;
        logPoint = lnpk;
        b = (G * (path.virtualTemperatureAtNode(pk, lnpk, node[k] as number, nodeFraction[k] as number) - envVirtual)) / envVirtual;
      }
      // The segment from the previous point (BuoyancyAreas.add).
      const za = prevZ;
      const ba = prevB;
      if (!aboveLcl) {
        const positivePart = positiveArea(za, ba, zPoint, b);
        negative += 0.5 * (ba + b) * (zPoint - za) - positivePart;
        positive += positivePart;
      } else if (ba > 0 && b > 0) {
        positive += 0.5 * (ba + b) * (zPoint - za);
      } else if (ba <= 0 && b <= 0) {
        negative += 0.5 * (ba + b) * (zPoint - za);
      } else {
        const crossing = ba / (ba - b);
        const zx = za + crossing * (zPoint - za);
        if (b > 0) {
          negative += 0.5 * ba * (zx - za);
          if (!hasFirst) {
            hasFirst = true;
            firstNegative = negative;
            firstPositive = positive;
          }
          positive += 0.5 * (0 + b) * (zPoint - zx);
        } else {
          positive += 0.5 * (ba + 0) * (zx - za);
          negative += 0.5 * b * (zPoint - zx);
        }
      }
      prevZ = zPoint;
      prevLog = logPoint;
      prevB = b;
      if (!hasFirst) {
        if (negative < EFFECTIVE_CIN_MIN) return false;
      } else if (firstNegative < EFFECTIVE_CIN_MIN) {
        return false;
      } else if (positive - firstPositive >= EFFECTIVE_CAPE_MIN) {
        return true;
      }
      if (atLcl) {
        aboveLcl = true;
        if (b > 0 && !hasFirst) {
          hasFirst = true;
          firstNegative = negative;
          firstPositive = positive;
        }
      }
    }
    prevEnvVirtual = envVirtual;
  }
  return false;
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
 * (common practice; docs/analysis.md). Above the top of the moisture data w counts as 0.
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
  const known = levelThermodynamics(profile);
  let best = 0;
  let bestThetaE = -Infinity;
  for (let k = 0; k < profile.count; k++) {
    const pk = profile.pressureHpa[k] as number;
    if (pk < limit) break;
    const dewpoint = profile.dewpointK[k] as number;
    if (Number.isNaN(dewpoint)) continue;
    const temperature = profile.temperatureK[k] as number;
    const thetaE =
      k < known.count
        ? (known.thetaE[k] as number)
        : equivalentPotentialTemperatureFromMixingRatio(pk, temperature, profile.mixingRatio[k] as number, lclTemperature(temperature, dewpoint));
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
