import * as constants from './constants';

// Constants copied once at load (fast access in hot loops).
const { KAPPA } = constants;

/**
 * Temperature at the lifted condensation level (LCL).
 *
 * @param temperatureK - parcel temperature at its starting level, K
 * @param dewpointK - parcel dewpoint at its starting level, K (≤ temperature)
 * @returns T_L, K
 * @example lclTemperature(303.15, 293.15) // → 290.8 K
 * Notes: T_L = 1 / (1/(T_d − 56) + ln(T/T_d)/800) + 56. Source: Bolton1980 eq. 15, stated
 * accuracy 0.1 K for −35 °C ≤ T_d ≤ 35 °C. A saturated parcel (T_d = T) gives T_L = T.
 */
export function lclTemperature(temperatureK: number, dewpointK: number): number {
  return 1 / (1 / (dewpointK - 56) + Math.log(temperatureK / dewpointK) / 800) + 56;
}

/**
 * Pressure at the lifted condensation level.
 *
 * @param pressureHpa - parcel pressure at its starting level, hPa
 * @param temperatureK - parcel temperature, K
 * @param dewpointK - parcel dewpoint, K
 * @returns p_L, hPa (≤ pressureHpa)
 * @example lclPressure(1000, 303.15, 293.15) // → 864.6 hPa
 * Notes: p_L = p (T_L/T)^(1/κ): the parcel keeps its potential temperature up to the LCL
 * (Poisson's equation, WallaceHobbs2006 eq. 3.54), with T_L from Bolton1980 eq. 15.
 */
export function lclPressure(pressureHpa: number, temperatureK: number, dewpointK: number): number {
  const temperatureAtLcl = lclTemperature(temperatureK, dewpointK);
  return pressureHpa * Math.exp(Math.log(temperatureAtLcl / temperatureK) / KAPPA);
}
