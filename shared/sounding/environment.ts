import * as constants from './constants';
import { dewpointFromMixingRatio } from './mixing-ratio';
import { pseudoAdiabatTable } from './moist-adiabat';
import { finiteOrNull, mixedLayerStart } from './parcel';
import { heightAtPressure, valueAtHeight, valueAtPressure, type Profile } from './profile';
import { saturationVaporPressure } from './saturation';
import { equivalentPotentialTemperatureFromMixingRatio } from './thermo';
import { lclTemperature } from './lcl';
import { wetBulbTemperature } from './wet-bulb';

// Constants copied once at load (fast access in hot loops).
const { EPSILON, GRAVITY, ZERO_CELSIUS_K } = constants;

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
  /** Pressure of the downdraft parcel's source (minimum θₑ in the lowest 400 hPa), hPa. */
  downdraftParcelPressure: number | null;
}

/**
 * Precipitable water: depth of liquid water if all the vapour of the column condensed.
 * @param profile - the prepared environment
 * @returns precipitable water, mm, from the surface to the top of the moisture data
 * Notes: PW = (1/(ρ_w g)) ∫ w dp (SCIENCE.md; WallaceHobbs2006 pg. 80 gives the same with
 * specific humidity), trapezoid rule in p, p in Pa; the result in m ×1000 → mm.
 */
export function precipitableWater(profile: Profile): number {
  let sum = 0;
  for (let k = 1; k <= profile.moistureTopIndex; k++) {
    const dpPa = ((profile.pressureHpa[k - 1] as number) - (profile.pressureHpa[k] as number)) * 100;
    sum += 0.5 * ((profile.mixingRatio[k - 1] as number) + (profile.mixingRatio[k] as number)) * dpPa;
  }
  return (sum / (1000 * GRAVITY)) * 1000;
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

/**
 * Downdraft CAPE: the negative buoyancy a saturated downdraft gains sinking to the ground.
 * @param profile - the prepared environment
 * @returns `{dcape, pressure}`: J kg⁻¹ (≥ 0) and the source pressure, hPa
 * Notes: source = level of minimum θₑ (Bolton1980 eq. 39) in the lowest 400 hPa; the parcel
 * starts at that level's wet-bulb temperature and descends along the pseudo-adiabat, kept
 * saturated; DCAPE = ∫ g (Tᵥ,env − Tᵥ,parcel)/Tᵥ,env dz from the ground to the source
 * (GilmoreWicker1998 pg. 945). Net area, floored at 0.
 */
export function downdraftCape(profile: Profile): { dcape: number; pressure: number } | null {
  const limit = (profile.pressureHpa[0] as number) - 400;
  let source = -1;
  let lowest = Infinity;
  for (let k = 0; k <= profile.moistureTopIndex; k++) {
    const pk = profile.pressureHpa[k] as number;
    if (pk < limit) break;
    const temperature = profile.temperatureK[k] as number;
    const dewpoint = profile.dewpointK[k] as number;
    const thetaE = equivalentPotentialTemperatureFromMixingRatio(pk, temperature, profile.mixingRatio[k] as number, lclTemperature(temperature, dewpoint));
    if (thetaE < lowest) {
      lowest = thetaE;
      source = k;
    }
  }
  if (source <= 0) return source === 0 ? { dcape: 0, pressure: profile.pressureHpa[0] as number } : null;
  const table = pseudoAdiabatTable();
  const sourcePressure = profile.pressureHpa[source] as number;
  const wetBulb = wetBulbTemperature(sourcePressure, profile.temperatureK[source] as number, profile.dewpointK[source] as number);
  const thetaW = table.thetaW(wetBulb, profile.logPressure[source] as number);
  const buoyancy = (k: number): number => {
    const pk = profile.pressureHpa[k] as number;
    const temperature = table.temperature(thetaW, profile.logPressure[k] as number);
    const es = saturationVaporPressure(temperature);
    const ws = (EPSILON * es) / (pk - es);
    const parcelVirtual = (temperature * (ws + EPSILON)) / (EPSILON * (1 + ws));
    const envVirtual = profile.virtualTemperatureK[k] as number;
    return (GRAVITY * (envVirtual - parcelVirtual)) / envVirtual;
  };
  let sum = 0;
  let previous = buoyancy(0);
  for (let k = 1; k <= source; k++) {
    const current = buoyancy(k);
    sum += 0.5 * (previous + current) * ((profile.heightAglM[k] as number) - (profile.heightAglM[k - 1] as number));
    previous = current;
  }
  return { dcape: Math.max(0, sum), pressure: sourcePressure };
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
  const wetBulb = new Float64Array(profile.moistureTopIndex + 1);
  let wetBulbZero = NaN;
  for (let k = 0; k <= profile.moistureTopIndex; k++) {
    wetBulb[k] = wetBulbTemperature(profile.pressureHpa[k] as number, profile.temperatureK[k] as number, profile.dewpointK[k] as number);
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
