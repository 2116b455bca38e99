import * as constants from './constants';

// Constants copied once at load (fast access in hot loops).
const { ZERO_CELSIUS_K } = constants;

/**
 * Saturation vapour pressure over liquid water.
 *
 * @param temperatureK - air temperature, K (liquid water, also below 0 °C: supercooled)
 * @returns saturation vapour pressure, hPa
 * @example saturationVaporPressure(293.15) // → 23.37 hPa
 * Notes: eₛ = 6.112 exp(17.67 T / (T + 243.5)), T in °C. Source: Bolton1980 eq. 10.
 * Bolton states an accuracy of 0.1 % for −30 °C ≤ T ≤ 35 °C (Bolton1980 pg. 1047).
 * Valid range: about −40 to +50 °C; outside it the error grows (≈0.3 % at −40 °C).
 */
export function saturationVaporPressure(temperatureK: number): number {
  const temperatureC = temperatureK - ZERO_CELSIUS_K;
  return 6.112 * Math.exp((17.67 * temperatureC) / (temperatureC + 243.5));
}

/**
 * Derivative of the saturation vapour pressure with temperature.
 *
 * @param temperatureK - air temperature, K
 * @returns deₛ/dT, hPa K⁻¹
 * @example saturationVaporPressureSlope(293.15) // → 1.448 hPa K⁻¹
 * Notes: analytic derivative of Bolton1980 eq. 10:
 * deₛ/dT = eₛ · 17.67 · 243.5 / (T + 243.5)², T in °C.
 */
export function saturationVaporPressureSlope(temperatureK: number): number {
  const temperatureC = temperatureK - ZERO_CELSIUS_K;
  const denominator = temperatureC + 243.5;
  return (saturationVaporPressure(temperatureK) * 17.67 * 243.5) / (denominator * denominator);
}

/**
 * Dewpoint from the vapour pressure: the temperature at which `vaporPressureHpa` saturates.
 *
 * @param vaporPressureHpa - water vapour partial pressure, hPa (> 0)
 * @returns dewpoint, K
 * @example dewpointFromVaporPressure(23.37) // → 293.15 K
 * Notes: T_d = 243.5 ln(e/6.112) / (17.67 − ln(e/6.112)) in °C. Source: Bolton1980 eq. 11
 * (the exact inverse of eq. 10).
 */
export function dewpointFromVaporPressure(vaporPressureHpa: number): number {
  const logRatio = Math.log(vaporPressureHpa / 6.112);
  return (243.5 * logRatio) / (17.67 - logRatio) + ZERO_CELSIUS_K;
}
