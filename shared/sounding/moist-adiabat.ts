import * as constants from './constants';

// Constants copied once at load (fast access in hot loops).
const { CP_DRY, CP_LIQUID, EPSILON, LV_0C, LV_SLOPE, RD, ZERO_CELSIUS_K } = constants;

/**
 * Pseudo-adiabatic lapse rate in pressure coordinates: how fast saturated air cools as it rises
 * when its condensate falls out at once.
 *
 * @param pressureHpa - pressure, hPa
 * @param temperatureK - temperature of the saturated air, K
 * @returns dT/dp, K hPa⁻¹ (positive: temperature falls as pressure falls)
 * @example pseudoAdiabaticLapseRate(1000, 293.15) // → 0.0369 K hPa⁻¹
 * Notes: from the pseudo-adiabatic entropy equation (Emanuel1994 §4.7)
 * (c_pd + rₛ c_l) d ln T − R_d d ln p_d + d(L_v rₛ / T) = 0, with p_d = p − eₛ,
 * rₛ = ε eₛ/p_d, eₛ from Bolton1980 eq. 10 and L_v(T) = 2.501×10⁶ − 2370 (T − 273.15)
 * (Bolton1980 eq. 2). Solved for dT/dp exactly (no small-rₛ approximation). With these
 * choices θₑ of Bolton1980 eq. 39 stays constant along the integrated curve to about 0.03 K
 * (checked in moist-adiabat.test.ts), the accuracy Bolton reports for his formula.
 */
export function pseudoAdiabaticLapseRate(pressureHpa: number, temperatureK: number): number {
  // eₛ and deₛ/dT of Bolton1980 eq. 10, written out so eₛ is evaluated once (hot path).
  const temperatureC = temperatureK - ZERO_CELSIUS_K;
  const denominator = temperatureC + 243.5;
  const saturationPressure = 6.112 * Math.exp((17.67 * temperatureC) / denominator);
  const saturationSlope = (saturationPressure * 17.67 * 243.5) / (denominator * denominator);
  const dryPressure = pressureHpa - saturationPressure;
  const mixing = (EPSILON * saturationPressure) / dryPressure;
  const latentHeat = LV_0C + LV_SLOPE * temperatureC;
  const mixingSlopeT = ((EPSILON * pressureHpa) / (dryPressure * dryPressure)) * saturationSlope;
  const mixingSlopeP = -mixing / dryPressure;
  const coefficientT =
    (CP_DRY + mixing * CP_LIQUID) / temperatureK +
    (RD * saturationSlope) / dryPressure +
    (mixing / temperatureK) * LV_SLOPE +
    (latentHeat / temperatureK) * mixingSlopeT -
    (latentHeat * mixing) / (temperatureK * temperatureK);
  const coefficientP = -RD / dryPressure + (latentHeat / temperatureK) * mixingSlopeP;
  return -coefficientP / coefficientT;
}

/**
 * RK4 steps taken by {@link moistAdiabatTemperature} since the process started: lets tests
 * check that work outside the table stays bounded (read the difference across a call).
 */
export const rk4Work = { steps: 0 };

/**
 * Temperature after following the pseudo-adiabat from one pressure to another: the reference
 * integration (fourth-order Runge–Kutta).
 *
 * @param startPressureHpa - pressure where the saturated parcel starts, hPa
 * @param startTemperatureK - its temperature, K
 * @param endPressureHpa - pressure to follow the curve to (above or below), hPa
 * @param maxStepHpa - largest RK4 step, hPa (default 1 hPa)
 * @returns temperature at endPressureHpa, K
 * @example moistAdiabatTemperature(1000, 293.15, 500) // → 264.4 K
 * Notes: integrates {@link pseudoAdiabaticLapseRate} with the classic RK4 scheme
 * (PressEtAl2007 eq. 17.1.3). Slow but exact to ≪ 0.01 K; the fast path is
 * {@link PseudoAdiabatTable}.
 */
export function moistAdiabatTemperature(
  startPressureHpa: number,
  startTemperatureK: number,
  endPressureHpa: number,
  maxStepHpa = 1,
): number {
  const span = endPressureHpa - startPressureHpa;
  const steps = Math.max(1, Math.ceil(Math.abs(span) / maxStepHpa));
  rk4Work.steps += steps;
  const step = span / steps;
  let pressure = startPressureHpa;
  let temperature = startTemperatureK;
  for (let i = 0; i < steps; i++) {
    const k1 = pseudoAdiabaticLapseRate(pressure, temperature);
    const k2 = pseudoAdiabaticLapseRate(pressure + step / 2, temperature + (step / 2) * k1);
    const k3 = pseudoAdiabaticLapseRate(pressure + step / 2, temperature + (step / 2) * k2);
    const k4 = pseudoAdiabaticLapseRate(pressure + step, temperature + step * k3);
    temperature += (step / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
    pressure += step;
  }
  return temperature;
}

/**
 * Virtual temperature of saturated air (no condensate).
 * @param temperatureK - temperature, K
 * @param pressureHpa - pressure, hPa
 * @returns Tᵥ, K
 * Notes: wₛ = ε eₛ/(p − eₛ) with eₛ of Bolton1980 eq. 10 (WallaceHobbs2006 eq. 3.63), then
 * Tᵥ = T (wₛ + ε)/(ε (1 + wₛ)) (WallaceHobbs2006 eq. 3.60); written out (hot loops).
 */
export function saturatedVirtualTemperature(temperatureK: number, pressureHpa: number): number {
  const temperatureC = temperatureK - ZERO_CELSIUS_K;
  const es = 6.112 * Math.exp((17.67 * temperatureC) / (temperatureC + 243.5));
  const ws = (EPSILON * es) / (pressureHpa - es);
  return (temperatureK * (ws + EPSILON)) / (EPSILON * (1 + ws));
}

/**
 * Largest RK4 step where the table method leaves its table, hPa. SCIENCE-style bound of
 * 5 hPa; moist-adiabat.test.ts checks that it stays within 0.001 K of the 1 hPa reference.
 */
export const OUTSIDE_TABLE_STEP_HPA = 5;

const TABLE_BOTTOM_HPA = 1100;
const TABLE_LOG_STEP = 0.01;
const TABLE_PRESSURE_NODES = 472; // 1100 hPa up to 1100·e^(−4.71) ≈ 9.9 hPa
const TABLE_THETA_W_MIN_K = ZERO_CELSIUS_K - 70;
const TABLE_THETA_W_STEP_K = 0.5;
const TABLE_THETA_W_NODES = 241; // −70 °C to +50 °C
const LOG_TABLE_BOTTOM = Math.log(TABLE_BOTTOM_HPA);
const LOG_1000 = Math.log(1000);

/** One RK4 step of dT/d(ln p) = p · dT/dp (PressEtAl2007 eq. 17.1.3). */
function rk4LogPressureStep(logPressure: number, temperatureK: number, step: number): number {
  const slope = (lnp: number, t: number): number => {
    const p = Math.exp(lnp);
    return p * pseudoAdiabaticLapseRate(p, t);
  };
  const k1 = slope(logPressure, temperatureK);
  const k2 = slope(logPressure + step / 2, temperatureK + (step / 2) * k1);
  const k3 = slope(logPressure + step / 2, temperatureK + (step / 2) * k2);
  const k4 = slope(logPressure + step, temperatureK + step * k3);
  return temperatureK + (step / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
}

/**
 * A precomputed family of pseudo-adiabats for fast moist ascent.
 *
 * Each curve is labelled by its wet-bulb potential temperature θ_w (its temperature at
 * 1000 hPa), from −70 °C to +50 °C every 0.5 K, and tabulated every 0.01 in ln p from
 * 1100 hPa to 9.9 hPa by RK4 integration of {@link pseudoAdiabaticLapseRate}. Lookups
 * interpolate bilinearly in (θ_w, ln p). The test `moist-adiabat.test.ts` keeps table
 * temperatures within 0.02 K, and parcel.test.ts keeps CAPE within 1 % of the
 * reference integration. Outside the table the RK4 integration is used, with steps of at most
 * {@link OUTSIDE_TABLE_STEP_HPA}.
 */
export class PseudoAdiabatTable {
  /** Temperatures, K: curve i (θ_w) at pressure node j is entry i·472 + j. */
  readonly temperatures: Float64Array;
  /**
   * Virtual temperatures of the saturated air at the same nodes, K (wₛ from eₛ of Bolton1980
   * eq. 10, Tᵥ = T (wₛ + ε)/(ε (1 + wₛ)), WallaceHobbs2006 eq. 3.60): the parcel's buoyancy
   * interpolates these instead of evaluating eₛ at every level of every ascent.
   */
  readonly virtualTemperatures: Float64Array;

  constructor() {
    this.temperatures = new Float64Array(TABLE_THETA_W_NODES * TABLE_PRESSURE_NODES);
    this.virtualTemperatures = new Float64Array(TABLE_THETA_W_NODES * TABLE_PRESSURE_NODES);
    const node1000 = (LOG_TABLE_BOTTOM - LOG_1000) / TABLE_LOG_STEP; // 9.53: between nodes 9 and 10
    const firstAbove = Math.ceil(node1000);
    for (let i = 0; i < TABLE_THETA_W_NODES; i++) {
      const thetaW = TABLE_THETA_W_MIN_K + i * TABLE_THETA_W_STEP_K;
      const row = i * TABLE_PRESSURE_NODES;
      // Upward from 1000 hPa to the first node above it, then one RK4 step in ln p per node.
      const start = Math.exp(LOG_TABLE_BOTTOM - firstAbove * TABLE_LOG_STEP);
      let temperature = moistAdiabatTemperature(1000, thetaW, start, 2);
      this.temperatures[row + firstAbove] = temperature;
      for (let j = firstAbove + 1; j < TABLE_PRESSURE_NODES; j++) {
        temperature = rk4LogPressureStep(LOG_TABLE_BOTTOM - (j - 1) * TABLE_LOG_STEP, temperature, -TABLE_LOG_STEP);
        this.temperatures[row + j] = temperature;
      }
      // Downward from 1000 hPa to the nodes below it.
      const below = Math.exp(LOG_TABLE_BOTTOM - (firstAbove - 1) * TABLE_LOG_STEP);
      temperature = moistAdiabatTemperature(1000, thetaW, below, 2);
      this.temperatures[row + firstAbove - 1] = temperature;
      for (let j = firstAbove - 2; j >= 0; j--) {
        temperature = rk4LogPressureStep(LOG_TABLE_BOTTOM - (j + 1) * TABLE_LOG_STEP, temperature, TABLE_LOG_STEP);
        this.temperatures[row + j] = temperature;
      }
      for (let j = 0; j < TABLE_PRESSURE_NODES; j++) {
        const pressure = Math.exp(LOG_TABLE_BOTTOM - j * TABLE_LOG_STEP);
        this.virtualTemperatures[row + j] = saturatedVirtualTemperature(this.temperatures[row + j] as number, pressure);
      }
    }
  }

  /**
   * Temperature on the pseudo-adiabat labelled θ_w at a pressure.
   * @param thetaWK - wet-bulb potential temperature of the curve, K
   * @param logPressure - natural logarithm of the pressure in hPa
   * @returns temperature, K
   */
  temperature(thetaWK: number, logPressure: number): number {
    const inside = this.temperatureInTable(thetaWK, logPressure);
    return Number.isNaN(inside) ? moistAdiabatTemperature(1000, thetaWK, Math.exp(logPressure), OUTSIDE_TABLE_STEP_HPA) : inside;
  }

  /**
   * Temperature on the pseudo-adiabat labelled θ_w at a pressure, from the table only.
   * @param thetaWK - wet-bulb potential temperature of the curve, K
   * @param logPressure - natural logarithm of the pressure in hPa
   * @returns temperature, K; NaN outside the table (see {@link PseudoAdiabatPath})
   */
  temperatureInTable(thetaWK: number, logPressure: number): number {
    const x = (LOG_TABLE_BOTTOM - logPressure) / TABLE_LOG_STEP;
    const y = (thetaWK - TABLE_THETA_W_MIN_K) / TABLE_THETA_W_STEP_K;
    if (!(x >= 0 && x <= TABLE_PRESSURE_NODES - 1 && y >= 0 && y <= TABLE_THETA_W_NODES - 1)) return NaN;
    const j = Math.min(Math.floor(x), TABLE_PRESSURE_NODES - 2);
    const i = Math.min(Math.floor(y), TABLE_THETA_W_NODES - 2);
    const fx = x - j;
    const fy = y - i;
    const t = this.temperatures;
    const a = i * TABLE_PRESSURE_NODES + j;
    const b = a + TABLE_PRESSURE_NODES;
    const lower = (t[a] as number) + fx * ((t[a + 1] as number) - (t[a] as number));
    const upper = (t[b] as number) + fx * ((t[b + 1] as number) - (t[b] as number));
    return lower + fy * (upper - lower);
  }

  /** Temperature of curve i between pressure nodes j and j+1 (fraction fx). */
  private atNode(i: number, j: number, fx: number): number {
    const t = this.temperatures;
    const a = i * TABLE_PRESSURE_NODES + j;
    return (t[a] as number) + fx * ((t[a + 1] as number) - (t[a] as number));
  }

  /**
   * Label θ_w of the pseudo-adiabat through a saturated point (the inverse lookup).
   * @param temperatureK - temperature of saturated air, K
   * @param logPressure - natural logarithm of its pressure in hPa
   * @returns wet-bulb potential temperature θ_w, K
   */
  thetaW(temperatureK: number, logPressure: number): number {
    const inside = this.thetaWInTable(temperatureK, logPressure);
    return Number.isNaN(inside) ? moistAdiabatTemperature(Math.exp(logPressure), temperatureK, 1000, OUTSIDE_TABLE_STEP_HPA) : inside;
  }

  /**
   * Label θ_w of the pseudo-adiabat through a saturated point, from the table only.
   * @param temperatureK - temperature of saturated air, K
   * @param logPressure - natural logarithm of its pressure in hPa
   * @returns wet-bulb potential temperature θ_w, K; NaN when the point lies outside the table
   */
  thetaWInTable(temperatureK: number, logPressure: number): number {
    const x = (LOG_TABLE_BOTTOM - logPressure) / TABLE_LOG_STEP;
    if (!(x >= 0 && x <= TABLE_PRESSURE_NODES - 1)) return NaN;
    const j = Math.min(Math.floor(x), TABLE_PRESSURE_NODES - 2);
    const fx = x - j;
    let low = 0;
    let high = TABLE_THETA_W_NODES - 1;
    const lowTemperature = this.atNode(low, j, fx);
    const highTemperature = this.atNode(high, j, fx);
    if (!(temperatureK >= lowTemperature && temperatureK <= highTemperature)) return NaN;
    while (high - low > 1) {
      const middle = (low + high) >> 1;
      if (this.atNode(middle, j, fx) <= temperatureK) low = middle;
      else high = middle;
    }
    const tLow = this.atNode(low, j, fx);
    const tHigh = this.atNode(high, j, fx);
    const fraction = tHigh > tLow ? (temperatureK - tLow) / (tHigh - tLow) : 0;
    return TABLE_THETA_W_MIN_K + (low + fraction) * TABLE_THETA_W_STEP_K;
  }
}

/**
 * One parcel's walk along a pseudo-adiabat, level after level, in either direction.
 *
 * Inside the table it interpolates; outside it (θ_w beyond −70..+50 °C or pressure beyond
 * 1100..9.9 hPa) it continues the RK4 integration from the previous point of the walk, so
 * the work over a whole ascent is bounded by the pressure span (one step per level, or per
 * 5 hPa where levels lie further apart),
 * never a new integration from 1000 hPa at each level.
 */
export class PseudoAdiabatPath {
  private lastPressure = NaN;
  private lastTemperature = NaN;
  /** Table coordinates of the last point when it came from the table (node −1: it did not). */
  private lastNode = -1;
  private lastFraction = 0;
  /** Wet-bulb potential temperature of the curve, K. */
  thetaWK = NaN;
  /** Offset of the curve's lower table row (−1 when θ_w lies outside the table). */
  private row = -1;
  /** Fraction of the way from the lower row to the next one. */
  private rowFraction = 0;

  /**
   * @param table - the shared table
   * @param startPressureHpa - a saturated point of the curve: pressure, hPa
   * @param startTemperatureK - and its temperature, K
   * @param thetaWK - θ_w of the curve when already known, K (default: looked up)
   */
  constructor(
    readonly table: PseudoAdiabatTable,
    startPressureHpa: number,
    startTemperatureK: number,
    thetaWK?: number,
  ) {
    this.reset(startPressureHpa, startTemperatureK, thetaWK);
  }

  /**
   * Start the walk again from another saturated point (lets one path object serve many
   * parcels in a row).
   * @param startPressureHpa - pressure, hPa
   * @param startTemperatureK - temperature, K
   * @param thetaWK - θ_w of the curve through that point when already known, K
   */
  reset(startPressureHpa: number, startTemperatureK: number, thetaWK = this.table.thetaW(startTemperatureK, Math.log(startPressureHpa))): void {
    this.lastPressure = startPressureHpa;
    this.lastTemperature = startTemperatureK;
    this.lastNode = -1;
    this.lastFraction = 0;
    this.thetaWK = thetaWK;
    // The row part of temperatureInTable's bilinear interpolation, fixed along the curve.
    const y = (thetaWK - TABLE_THETA_W_MIN_K) / TABLE_THETA_W_STEP_K;
    if (y >= 0 && y <= TABLE_THETA_W_NODES - 1) {
      const i = Math.min(Math.floor(y), TABLE_THETA_W_NODES - 2);
      this.row = i * TABLE_PRESSURE_NODES;
      this.rowFraction = y - i;
    } else {
      this.row = -1;
      this.rowFraction = 0;
    }
  }

  /**
   * Temperature of the curve at the next pressure of the walk, from the pressure's table
   * coordinates (see {@link tablePressureCoordinates}); the same value as
   * {@link temperatureAt}, without recomputing the coordinates at every parcel.
   * @param pressureHpa - pressure, hPa
   * @param logPressure - its natural logarithm
   * @param node - its pressure node (−1: outside the table)
   * @param fraction - its fraction between that node and the next
   * @returns temperature, K
   */
  temperatureAtNode(pressureHpa: number, logPressure: number, node: number, fraction: number): number {
    if (node < 0 || this.row < 0) return this.temperatureAt(pressureHpa, logPressure);
    const temperature = this.interpolate(this.table.temperatures, node, fraction);
    this.lastPressure = pressureHpa;
    this.lastTemperature = temperature;
    this.lastNode = -1;
    return temperature;
  }

  /**
   * Virtual temperature of the saturated parcel at the next pressure of the walk: inside the
   * table interpolated from its virtual temperatures (see
   * {@link PseudoAdiabatTable.virtualTemperatures}), outside it from the continued
   * integration's temperature.
   * @param pressureHpa - pressure, hPa
   * @param logPressure - its natural logarithm
   * @param node - its pressure node (−1: outside the table)
   * @param fraction - its fraction between that node and the next
   * @returns virtual temperature, K
   */
  virtualTemperatureAtNode(pressureHpa: number, logPressure: number, node: number, fraction: number): number {
    if (node < 0 || this.row < 0) return saturatedVirtualTemperature(this.temperatureAt(pressureHpa, logPressure), pressureHpa);
    // The temperature of this point is computed only if the walk needs it later.
    this.lastPressure = pressureHpa;
    this.lastNode = node;
    this.lastFraction = fraction;
    return this.interpolate(this.table.virtualTemperatures, node, fraction);
  }

  /**
   * Virtual temperature of the saturated parcel at the next pressure of the walk, for a
   * pressure whose table coordinates are not at hand.
   * @param pressureHpa - pressure, hPa
   * @param logPressure - its natural logarithm
   * @returns virtual temperature, K
   */
  virtualTemperatureAt(pressureHpa: number, logPressure: number): number {
    const x = (LOG_TABLE_BOTTOM - logPressure) / TABLE_LOG_STEP;
    if (!(x >= 0 && x <= TABLE_PRESSURE_NODES - 1)) return this.virtualTemperatureAtNode(pressureHpa, logPressure, -1, 0);
    const j = Math.min(Math.floor(x), TABLE_PRESSURE_NODES - 2);
    return this.virtualTemperatureAtNode(pressureHpa, logPressure, j, x - j);
  }

  /** Temperature at the last point of the walk, K. */
  lastPointTemperature(): number {
    if (this.lastNode >= 0) {
      this.lastTemperature = this.interpolate(this.table.temperatures, this.lastNode, this.lastFraction);
      this.lastNode = -1;
    }
    return this.lastTemperature;
  }

  private interpolate(values: Float64Array, node: number, fraction: number): number {
    const a = this.row + node;
    const b = a + TABLE_PRESSURE_NODES;
    const lower = (values[a] as number) + fraction * ((values[a + 1] as number) - (values[a] as number));
    const upper = (values[b] as number) + fraction * ((values[b + 1] as number) - (values[b] as number));
    return lower + this.rowFraction * (upper - lower);
  }

  /**
   * Temperature of the curve at the next pressure of the walk.
   * @param pressureHpa - pressure, hPa
   * @param logPressure - its natural logarithm (given to save a logarithm in hot loops)
   * @returns temperature, K
   */
  temperatureAt(pressureHpa: number, logPressure: number): number {
    let temperature = this.table.temperatureInTable(this.thetaWK, logPressure);
    if (Number.isNaN(temperature)) temperature = moistAdiabatTemperature(this.lastPressure, this.lastPointTemperature(), pressureHpa, OUTSIDE_TABLE_STEP_HPA);
    this.lastPressure = pressureHpa;
    this.lastTemperature = temperature;
    this.lastNode = -1;
    return temperature;
  }
}

/**
 * Table coordinates of pressures, as {@link PseudoAdiabatTable.temperatureInTable} computes
 * them: the node below each pressure (−1 outside the table) and the fraction to the next.
 * @param logPressure - natural logarithms of the pressures in hPa
 * @param node - where to write the nodes (default: a new array)
 * @param fraction - where to write the fractions (default: a new array)
 * @returns `{node, fraction}`, one entry per pressure
 */
export function tablePressureCoordinates(
  logPressure: Float64Array,
  node: Int32Array = new Int32Array(logPressure.length),
  fraction: Float64Array = new Float64Array(logPressure.length),
): { node: Int32Array; fraction: Float64Array } {
  const count = logPressure.length;
  for (let k = 0; k < count; k++) {
    const x = (LOG_TABLE_BOTTOM - (logPressure[k] as number)) / TABLE_LOG_STEP;
    if (!(x >= 0 && x <= TABLE_PRESSURE_NODES - 1)) {
      node[k] = -1;
      fraction[k] = 0;
      continue;
    }
    const j = Math.min(Math.floor(x), TABLE_PRESSURE_NODES - 2);
    node[k] = j;
    fraction[k] = x - j;
  }
  return { node, fraction };
}

let sharedTable: PseudoAdiabatTable | undefined;

/**
 * The engine's shared pseudo-adiabat table, built on first use (0.1–0.4 s) and reused.
 * Building it is deterministic; it holds no state that changes afterwards.
 */
export function pseudoAdiabatTable(): PseudoAdiabatTable {
  sharedTable ??= new PseudoAdiabatTable();
  return sharedTable;
}

/** How the moist (saturated) part of an ascent is computed. */
export type MoistAscentMethod = 'table' | 'reference';

/**
 * Wet-bulb potential temperature of saturated air: the temperature at 1000 hPa of the
 * pseudo-adiabat through (p, T).
 *
 * @param pressureHpa - pressure, hPa
 * @param temperatureK - temperature of the saturated air, K
 * @param method - 'table' (fast, default) or 'reference' (RK4, 1 hPa steps)
 * @returns θ_w, K
 * @example wetBulbPotentialTemperature(500, 253.15) // → 286.6 K
 * Notes: definition in WallaceHobbs2006 pg. 85; computed along the pseudo-adiabat
 * ({@link pseudoAdiabaticLapseRate}).
 */
export function wetBulbPotentialTemperature(
  pressureHpa: number,
  temperatureK: number,
  method: MoistAscentMethod = 'table',
): number {
  if (method === 'reference') return moistAdiabatTemperature(pressureHpa, temperatureK, 1000);
  return pseudoAdiabatTable().thetaW(temperatureK, Math.log(pressureHpa));
}
