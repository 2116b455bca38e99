import * as constants from './constants';
import { dewpointFromMixingRatio } from './mixing-ratio';
import { moistAdiabatTemperature, OUTSIDE_TABLE_STEP_HPA, PseudoAdiabatPath, pseudoAdiabatTable } from './moist-adiabat';
import { finiteOrNull, mixedLayerStart } from './parcel';
import {
  heightAtPressure,
  layerIndexAtPressure,
  LEVEL_THERMODYNAMICS_DEPTH_HPA,
  levelLclLogPressure,
  levelTableCoordinates,
  levelThermodynamics,
  levelThetaW,
  levelThetaWInTable,
  valueAtHeight,
  valueAtPressure,
  type LevelThermodynamics,
  type Profile,
} from './profile';
import { wetBulbTemperature } from './wet-bulb';

// Constants copied once at load (fast access in hot loops).
const { GRAVITY, ZERO_CELSIUS_K } = constants;

/** Moisture and temperature structure of the environment. Units in the names and docs. */
export interface EnvironmentAnalysis {
  /** Precipitable water from the surface to the top of the moisture data, mm. */
  precipitableWater: number;
  /** Pressure of the top of the moisture data, hPa. */
  moistureTopPressure: number | null;
  /** Surface (lowest level) temperature, °C. */
  surfaceTemperatureC: number;
  /** Surface dewpoint, °C. */
  surfaceDewpointC: number;
  /** Surface mixing ratio, g kg⁻¹. */
  surfaceMixingRatio: number;
  /** Pressure-weighted mean mixing ratio of the lowest 100 hPa, g kg⁻¹. */
  meanMixingRatio0to100hPa: number;
  /** Dewpoint the surface mixing ratio would have at 1000 hPa, °C (compares stations at different elevations). */
  surfaceDewpointAt1000hPaC: number;
  /** Temperature lapse rate from the surface to 3 km above ground, K km⁻¹. */
  lapseRate0to3km: number | null;
  /** Temperature lapse rate between 700 and 500 hPa, K km⁻¹. */
  lapseRate700to500hPa: number | null;
  /** Lowest height above ground where the temperature falls to 0 °C, m (0 when the surface is at or below 0 °C). */
  freezingLevelHeight: number | null;
  /** Lowest height above ground where the wet-bulb temperature falls to 0 °C, m. */
  wetBulbZeroHeight: number | null;
  /** Downdraft CAPE, J kg⁻¹ (≥ 0). */
  downdraftCape: number | null;
  /** Pressure of the downdraft parcel's source (centre of the 100 hPa layer of lowest mean θₑ in the lowest 400 hPa), hPa. */
  downdraftParcelPressure: number | null;
}

/**
 * Precipitable water: depth of liquid water if all the vapour of the column condensed.
 * @param profile - the prepared environment
 * @returns precipitable water, mm, from the surface to the top of the moisture data
 * Notes: PW = (1/(ρ_w g)) ∫ q dp with the specific humidity q = w/(1 + w) (the mass of
 * vapour per mass of moist air; WallaceHobbs2006 pg. 80 and eq. 3.57), trapezoid rule in p,
 * p in Pa; the result in m ×1000 → mm. Using w instead of q would overstate PW by about w
 * (2 % at 20 g kg⁻¹).
 */
export function precipitableWater(profile: Profile): number {
  let sum = 0;
  const q = (k: number): number => {
    const w = profile.mixingRatio[k] as number;
    return w / (1 + w);
  };
  for (let k = 1; k <= profile.moistureTopIndex; k++) {
    const dpPa = ((profile.pressureHpa[k - 1] as number) - (profile.pressureHpa[k] as number)) * 100;
    sum += 0.5 * (q(k - 1) + q(k)) * dpPa;
  }
  return (sum / (1000 * GRAVITY)) * 1000;
}

/**
 * Reused room for arrays that live only during one synchronous call (the wet-bulb scan, then
 * the downdraft integrals; never both at once): typed-array allocations cost more than the work.
 */
let scratchBuffer = new Float64Array(0);
function scratch(length: number): Float64Array {
  if (scratchBuffer.length < length) scratchBuffer = new Float64Array(Math.max(length, 2 * scratchBuffer.length));
  return scratchBuffer;
}

/**
 * Wet-bulb temperature of level k by Normand's rule, as {@link wetBulbTemperature} finds it,
 * from the level's θ_w already known (outside the table: RK4 from its LCL down to it), K.
 */
function levelWetBulb(profile: Profile, known: LevelThermodynamics, k: number): number {
  const thetaW = levelThetaWInTable(profile, known, k);
  const logPressure = profile.logPressure[k] as number;
  const inTable = Number.isNaN(thetaW) ? NaN : pseudoAdiabatTable().temperatureInTable(thetaW, logPressure);
  if (!Number.isNaN(inTable)) return inTable;
  const lclT = known.lclTemperatureK[k] as number;
  return moistAdiabatTemperature(Math.exp(levelLclLogPressure(profile, k, lclT)), lclT, profile.pressureHpa[k] as number, OUTSIDE_TABLE_STEP_HPA);
}

/** Lowest height above ground where `values` (K) falls to 0 °C going up; 0 if already ≤ 0 °C at the ground. */
function zeroCrossingHeight(profile: Profile, values: Float64Array, lastIndex: number): number {
  const first = (values[0] as number) - ZERO_CELSIUS_K;
  if (first <= 0) return 0;
  for (let k = 1; k <= lastIndex; k++) {
    const lower = (values[k - 1] as number) - ZERO_CELSIUS_K;
    const upper = (values[k] as number) - ZERO_CELSIUS_K;
    if (upper <= 0 && lower > 0) {
      const z0 = profile.heightAglM[k - 1] as number;
      const z1 = profile.heightAglM[k] as number;
      return z0 + (lower / (lower - upper)) * (z1 - z0);
    }
  }
  return NaN;
}

/** Depth of the layer whose mean θₑ picks the downdraft source, hPa. */
export const DOWNDRAFT_LAYER_DEPTH_HPA = 100;
/** How deep above the ground the downdraft source is searched, hPa (GilmoreWicker1998 pg. 945). */
export const DOWNDRAFT_SEARCH_DEPTH_HPA = 400;
if (LEVEL_THERMODYNAMICS_DEPTH_HPA < DOWNDRAFT_SEARCH_DEPTH_HPA + DOWNDRAFT_LAYER_DEPTH_HPA) {
  throw new Error('The per-level thermodynamics must reach as high as the downdraft search.');
}

/**
 * Downdraft CAPE: the negative buoyancy a saturated downdraft gains sinking to the ground.
 * @param profile - the prepared environment
 * @returns `{dcape, pressure}`: J kg⁻¹ (≥ 0) and the source pressure (centre of the layer), hPa
 * Notes: the source is the 100 hPa deep layer with the lowest pressure-weighted mean θₑ
 * (Bolton1980 eq. 39) whose centre lies in the lowest 400 hPa (GilmoreWicker1998 pg. 945
 * take the minimum θₑ in the lowest 400 hPa; averaging over 100 hPa, common practice, keeps a
 * single dry level from deciding it). The parcel starts at the layer centre, saturated, on
 * the pseudo-adiabat of the layer's mean wet-bulb potential temperature, and descends to the
 * ground; DCAPE = ∫ g (Tᵥ,env − Tᵥ,parcel)/Tᵥ,env dz from the ground to the source. Net
 * area, floored at 0.
 */
export function downdraftCape(profile: Profile): { dcape: number; pressure: number } | null {
  // Only the levels the search can reach: the lowest 400 hPa plus half a layer above
  // (θₑ of these levels is computed once per profile).
  const known = levelThermodynamics(profile);
  const top = known.count - 1;
  if (top < 1) return null;
  const count = top + 1;
  const thetaE = known.thetaE;
  // Cumulative pressure-weighted integral of θₑ (trapezoid) for O(1) layer means.
  const cumulativeE = scratch(count);
  cumulativeE[0] = 0;
  for (let k = 1; k < count; k++) {
    const dp = (profile.pressureHpa[k - 1] as number) - (profile.pressureHpa[k] as number);
    cumulativeE[k] = (cumulativeE[k - 1] as number) + 0.5 * ((thetaE[k - 1] as number) + (thetaE[k] as number)) * dp;
  }
  const surface = profile.pressureHpa[0] as number;
  const half = DOWNDRAFT_LAYER_DEPTH_HPA / 2;
  // The layer holding a pressure, as layerIndexAtPressure finds it, by a cursor: the search
  // asks for ever lower pressures, so each cursor only moves up.
  const n = profile.count;
  const lowestPressure = profile.pressureHpa[n - 1] as number;
  const cursors = [0, 0];
  const integralAt = (pressure: number, cursor: 0 | 1): number => {
    if (!(pressure <= surface && pressure >= lowestPressure)) return NaN;
    let i = cursors[cursor] as number;
    while (i < top && i + 1 <= n - 2 && (profile.pressureHpa[i + 1] as number) >= pressure) i++;
    cursors[cursor] = i;
    if (i >= top) return NaN;
    const p0 = profile.pressureHpa[i] as number;
    const p1 = profile.pressureHpa[i + 1] as number;
    const fraction = (p0 - pressure) / (p0 - p1);
    const v0 = thetaE[i] as number;
    const vx = v0 + fraction * ((thetaE[i + 1] as number) - v0);
    return (cumulativeE[i] as number) + 0.5 * (v0 + vx) * (p0 - pressure);
  };
  let lowest = Infinity;
  let bestBottom = NaN;
  for (let k = 0; k < count; k++) {
    const centre = profile.pressureHpa[k] as number;
    if (centre < surface - DOWNDRAFT_SEARCH_DEPTH_HPA) break;
    const bottom = Math.min(surface, centre + half);
    const meanE = (integralAt(bottom - DOWNDRAFT_LAYER_DEPTH_HPA, 1) - integralAt(bottom, 0)) / DOWNDRAFT_LAYER_DEPTH_HPA;
    if (!Number.isFinite(meanE)) break;
    if (meanE < lowest) {
      lowest = meanE;
      bestBottom = bottom;
    }
  }
  if (Number.isNaN(bestBottom)) return null;
  const bestThetaW = layerMeanThetaW(profile, known, bestBottom, bestBottom - DOWNDRAFT_LAYER_DEPTH_HPA);
  const sourcePressure = bestBottom - half;
  const sourceHeight = heightAtPressure(profile, sourcePressure);
  // The parcel's curve, walked from the ground up to the source: table virtual temperatures
  // inside the table, a continued RK4 integration outside it (never again from 1000 hPa).
  const path = new PseudoAdiabatPath(pseudoAdiabatTable(), 1000, bestThetaW, bestThetaW);
  const { node, fraction } = levelTableCoordinates(profile);
  const buoyancy = (parcelVirtual: number, envVirtual: number): number => (GRAVITY * (envVirtual - parcelVirtual)) / envVirtual;
  let sum = 0;
  let previous = buoyancy(path.virtualTemperatureAtNode(profile.pressureHpa[0] as number, profile.logPressure[0] as number, node[0] as number, fraction[0] as number), profile.virtualTemperatureK[0] as number);
  for (let k = 1; k < profile.count; k++) {
    const pk = profile.pressureHpa[k] as number;
    const zk = profile.heightAglM[k] as number;
    const z0 = profile.heightAglM[k - 1] as number;
    if (pk <= sourcePressure) {
      const envAtSource = valueAtPressure(profile, profile.virtualTemperatureK, sourcePressure);
      const current = buoyancy(path.virtualTemperatureAt(sourcePressure, Math.log(sourcePressure)), envAtSource);
      sum += 0.5 * (previous + current) * (sourceHeight - z0);
      break;
    }
    const current = buoyancy(path.virtualTemperatureAtNode(pk, profile.logPressure[k] as number, node[k] as number, fraction[k] as number), profile.virtualTemperatureK[k] as number);
    sum += 0.5 * (previous + current) * (zk - z0);
    previous = current;
  }
  return { dcape: Math.max(0, sum), pressure: sourcePressure };
}

/**
 * Pressure-weighted mean θ_w of the layer from `bottom` up to `upper` (trapezoid rule, the
 * edges interpolated linearly in p), K; θ_w outside the table is integrated only for the
 * levels of this layer.
 */
function layerMeanThetaW(profile: Profile, known: LevelThermodynamics, bottom: number, upper: number): number {
  const p = profile.pressureHpa;
  const i = layerIndexAtPressure(profile, bottom);
  const j = layerIndexAtPressure(profile, upper);
  const at = (layer: number, pressure: number): number => {
    const p0 = p[layer] as number;
    const v0 = levelThetaW(profile, known, layer);
    return v0 + ((p0 - pressure) / (p0 - (p[layer + 1] as number))) * (levelThetaW(profile, known, layer + 1) - v0);
  };
  let sum = 0;
  let previousP = bottom;
  let previousW = at(i, bottom);
  for (let k = i + 1; k <= j; k++) {
    const w = levelThetaW(profile, known, k);
    sum += 0.5 * (previousW + w) * (previousP - (p[k] as number));
    previousP = p[k] as number;
    previousW = w;
  }
  sum += 0.5 * (previousW + at(j, upper)) * (previousP - upper);
  return sum / (bottom - upper);
}

/**
 * Analyse the environment's moisture and temperature structure.
 * @param profile - the prepared environment (see buildProfile)
 * @returns {@link EnvironmentAnalysis}
 */
export function analyzeEnvironment(profile: Profile): EnvironmentAnalysis {
  const surfaceMixing = profile.mixingRatio[0] as number;
  const surfaceTemperature = profile.temperatureK[0] as number;
  const mixedLayer = mixedLayerStart(profile, 100);
  const top3km = valueAtHeight(profile, profile.temperatureK, 3000);
  const t700 = valueAtPressure(profile, profile.temperatureK, 700);
  const t500 = valueAtPressure(profile, profile.temperatureK, 500);
  const z700 = heightAtPressure(profile, 700);
  const z500 = heightAtPressure(profile, 500);
  const wetBulb = scratch(profile.moistureTopIndex + 1);
  const known = levelThermodynamics(profile);
  let wetBulbZero = NaN;
  for (let k = 0; k <= profile.moistureTopIndex; k++) {
    wetBulb[k] = k < known.count ? levelWetBulb(profile, known, k) : wetBulbTemperature(profile.pressureHpa[k] as number, profile.temperatureK[k] as number, profile.dewpointK[k] as number);
    if ((wetBulb[k] as number) <= ZERO_CELSIUS_K) {
      wetBulbZero = zeroCrossingHeight(profile, wetBulb, k);
      break;
    }
  }
  const downdraft = downdraftCape(profile);
  return {
    precipitableWater: precipitableWater(profile),
    moistureTopPressure: profile.moistureTopIndex >= 0 ? (profile.pressureHpa[profile.moistureTopIndex] as number) : null,
    surfaceTemperatureC: surfaceTemperature - ZERO_CELSIUS_K,
    surfaceDewpointC: (profile.dewpointK[0] as number) - ZERO_CELSIUS_K,
    surfaceMixingRatio: surfaceMixing * 1000,
    meanMixingRatio0to100hPa: mixedLayer.mixingRatio * 1000,
    surfaceDewpointAt1000hPaC: dewpointFromMixingRatio(surfaceMixing, 1000) - ZERO_CELSIUS_K,
    lapseRate0to3km: finiteOrNull(((surfaceTemperature - top3km) / 3000) * 1000),
    lapseRate700to500hPa: finiteOrNull(((t700 - t500) / (z500 - z700)) * 1000),
    freezingLevelHeight: finiteOrNull(zeroCrossingHeight(profile, profile.temperatureK, profile.count - 1)),
    wetBulbZeroHeight: finiteOrNull(wetBulbZero),
    downdraftCape: downdraft ? downdraft.dcape : null,
    downdraftParcelPressure: downdraft ? downdraft.pressure : null,
  };
}
