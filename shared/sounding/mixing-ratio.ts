import * as constants from './constants';
import { dewpointFromVaporPressure, saturationVaporPressure } from './saturation';

// Constants copied once at load (fast access in hot loops).
const { EPSILON } = constants;

/**
 * Mixing ratio of water vapour from its partial pressure.
 *
 * @param vaporPressureHpa - water vapour partial pressure e, hPa
 * @param pressureHpa - total air pressure p, hPa
 * @returns mixing ratio w, kg kg⁻¹ (mass of vapour per mass of dry air)
 * @example mixingRatio(14.97, 890) // → 0.01064 kg/kg
 * Notes: w = ε e / (p − e), ε = Rd/Rv. Source: WallaceHobbs2006 eq. 3.59.
 */
export function mixingRatio(vaporPressureHpa: number, pressureHpa: number): number {
  return (EPSILON * vaporPressureHpa) / (pressureHpa - vaporPressureHpa);
}

/**
 * Saturation mixing ratio over liquid water.
 *
 * @param pressureHpa - air pressure, hPa
 * @param temperatureK - air temperature, K
 * @returns saturation mixing ratio wₛ, kg kg⁻¹
 * @example saturationMixingRatio(1000, 293.15) // → 0.01488 kg/kg
 * Notes: wₛ = ε eₛ(T) / (p − eₛ(T)) with eₛ from Bolton1980 eq. 10 (WallaceHobbs2006 eq. 3.63).
 */
export function saturationMixingRatio(pressureHpa: number, temperatureK: number): number {
  return mixingRatio(saturationVaporPressure(temperatureK), pressureHpa);
}

/**
 * Vapour pressure from the mixing ratio (the inverse of {@link mixingRatio}).
 *
 * @param mixingRatioKgKg - mixing ratio w, kg kg⁻¹
 * @param pressureHpa - air pressure p, hPa
 * @returns vapour pressure e, hPa
 * @example vaporPressureFromMixingRatio(0.012, 960) // → 18.17 hPa
 * Notes: e = w p / (ε + w). Source: WallaceHobbs2006 eq. 3.59 rearranged.
 */
export function vaporPressureFromMixingRatio(mixingRatioKgKg: number, pressureHpa: number): number {
  return (mixingRatioKgKg * pressureHpa) / (EPSILON + mixingRatioKgKg);
}

/**
 * Dewpoint that air with a given mixing ratio has at a given pressure.
 *
 * Lets moisture at stations of different elevation be compared fairly: the same mixing ratio
 * means a higher dewpoint at a higher pressure.
 *
 * @param mixingRatioKgKg - mixing ratio, kg kg⁻¹ (> 0)
 * @param pressureHpa - pressure at which the dewpoint is wanted, hPa
 * @returns dewpoint, K
 * @example dewpointFromMixingRatio(0.012, 960) // → 289.2 K (16.0 °C)
 * Notes: e = w p / (ε + w), then Bolton1980 eq. 11.
 */
export function dewpointFromMixingRatio(mixingRatioKgKg: number, pressureHpa: number): number {
  return dewpointFromVaporPressure(vaporPressureFromMixingRatio(mixingRatioKgKg, pressureHpa));
}

/**
 * Dewpoint from temperature and relative humidity (over liquid water).
 *
 * @param temperatureK - air temperature, K
 * @param relativeHumidityPercent - relative humidity e/eₛ, % (0 < RH ≤ 100)
 * @returns dewpoint, K
 * @example dewpointFromRelativeHumidity(293.15, 50) // → 282.4 K
 * Notes: e = RH/100 · eₛ(T) (WMO definition via vapour pressure; WMO2018 Annex 4.B),
 * then Bolton1980 eq. 11.
 */
export function dewpointFromRelativeHumidity(temperatureK: number, relativeHumidityPercent: number): number {
  return dewpointFromVaporPressure((relativeHumidityPercent / 100) * saturationVaporPressure(temperatureK));
}
