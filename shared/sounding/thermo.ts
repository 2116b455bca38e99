import * as constants from './constants';
import { lclTemperature } from './lcl';
import { vaporPressureFromMixingRatio } from './mixing-ratio';

// Constants copied once at load (fast access in hot loops).
const { EPSILON, KAPPA, REFERENCE_PRESSURE_HPA } = constants;

/**
 * Potential temperature: the temperature air would have if brought dry-adiabatically to 1000 hPa.
 *
 * @param pressureHpa - air pressure, hPa
 * @param temperatureK - air temperature, K
 * @returns potential temperature θ, K
 * @example potentialTemperature(800, 273.15) // → 291.11 K
 * Notes: θ = T (1000/p)^κ, κ = Rd/cp = 0.2854. Source: WallaceHobbs2006 eq. 3.54 (Poisson's equation).
 */
export function potentialTemperature(pressureHpa: number, temperatureK: number): number {
  return temperatureK * Math.pow(REFERENCE_PRESSURE_HPA / pressureHpa, KAPPA);
}

/**
 * Temperature on a dry adiabat: the inverse of {@link potentialTemperature}.
 *
 * @param pressureHpa - air pressure, hPa
 * @param potentialTemperatureK - potential temperature θ, K
 * @returns temperature T, K
 * @example dryAdiabatTemperature(800, 291.11) // → 273.15 K
 * Notes: T = θ (p/1000)^κ. Source: WallaceHobbs2006 eq. 3.54.
 */
export function dryAdiabatTemperature(pressureHpa: number, potentialTemperatureK: number): number {
  return potentialTemperatureK * Math.pow(pressureHpa / REFERENCE_PRESSURE_HPA, KAPPA);
}

/**
 * Virtual temperature: the temperature dry air would need to have the density of the moist air.
 *
 * @param temperatureK - air temperature, K
 * @param mixingRatioKgKg - water vapour mixing ratio w, kg kg⁻¹ (no condensate)
 * @returns virtual temperature Tᵥ, K
 * @example virtualTemperature(300, 0.015) // → 302.69 K
 * Notes: Tᵥ = T (w + ε) / (ε (1 + w)). Source: WallaceHobbs2006 eq. 3.59–3.60
 * (≈ T (1 + 0.61 w)).
 */
export function virtualTemperature(temperatureK: number, mixingRatioKgKg: number): number {
  return (temperatureK * (mixingRatioKgKg + EPSILON)) / (EPSILON * (1 + mixingRatioKgKg));
}

/**
 * Equivalent potential temperature (pseudo-adiabatic).
 *
 * @param pressureHpa - air pressure, hPa
 * @param temperatureK - air temperature, K
 * @param dewpointK - dewpoint, K (≤ temperature)
 * @returns θₑ, K: conserved in dry and pseudo-adiabatic ascent
 * @example equivalentPotentialTemperature(850, 293.15, 291.15) // → 353.9 K
 * Notes: θ_DL = T (1000/(p − e))^κ (T/T_L)^(0.28 r) (Bolton1980 eq. 24) and
 * θₑ = θ_DL exp[(3036/T_L − 1.78) r (1 + 0.448 r)] (Bolton1980 eq. 39), with r the mixing
 * ratio in kg kg⁻¹, e the vapour pressure, κ = 0.2854 and T_L the LCL temperature
 * (Bolton1980 eq. 15).
 */
export function equivalentPotentialTemperature(pressureHpa: number, temperatureK: number, dewpointK: number): number {
  const vaporPressure = vaporPressureFromDewpoint(dewpointK);
  const mixing = (EPSILON * vaporPressure) / (pressureHpa - vaporPressure);
  return equivalentPotentialTemperatureFromMixingRatio(pressureHpa, temperatureK, mixing, lclTemperature(temperatureK, dewpointK));
}

/**
 * Equivalent potential temperature from temperature, mixing ratio and the LCL temperature.
 *
 * The fast form of {@link equivalentPotentialTemperature} when T_L is already known.
 * @param pressureHpa - pressure, hPa
 * @param temperatureK - temperature, K
 * @param mixingRatioKgKg - mixing ratio r, kg kg⁻¹
 * @param lclTemperatureK - temperature at the lifted condensation level T_L, K
 * @returns θₑ, K
 * @example equivalentPotentialTemperatureFromMixingRatio(1000, 300, 0.02, 297.3) // → ≈ 359 K
 * Notes: Bolton1980 eqs. 24 and 39 (see {@link equivalentPotentialTemperature}).
 */
export function equivalentPotentialTemperatureFromMixingRatio(
  pressureHpa: number,
  temperatureK: number,
  mixingRatioKgKg: number,
  lclTemperatureK: number,
): number {
  const vaporPressure = vaporPressureFromMixingRatio(mixingRatioKgKg, pressureHpa);
  // θ_DL · exp(…) with both powers written as exponentials, so one exp serves all three
  // factors (Math.pow costs several times an exp; the result differs by rounding only).
  const exponent =
    0.2854 * (LOG_REFERENCE_PRESSURE - Math.log(pressureHpa - vaporPressure)) +
    0.28 * mixingRatioKgKg * Math.log(temperatureK / lclTemperatureK) +
    (3036 / lclTemperatureK - 1.78) * mixingRatioKgKg * (1 + 0.448 * mixingRatioKgKg);
  return temperatureK * Math.exp(exponent);
}

const LOG_REFERENCE_PRESSURE = Math.log(REFERENCE_PRESSURE_HPA);

/** Vapour pressure at a given dewpoint, hPa (eₛ at T_d, Bolton1980 eq. 10). */
function vaporPressureFromDewpoint(dewpointK: number): number {
  const dewpointC = dewpointK - 273.15;
  return 6.112 * Math.exp((17.67 * dewpointC) / (dewpointC + 243.5));
}

/**
 * Saturated equivalent potential temperature: θₑ of saturated air at (p, T).
 *
 * @param pressureHpa - pressure, hPa
 * @param temperatureK - temperature, K
 * @returns θₑ*, K
 * @example saturationEquivalentPotentialTemperature(500, 253.15) // → 313.7 K
 * Notes: {@link equivalentPotentialTemperature} with T_d = T (Bolton1980 eq. 39 with T_L = T).
 */
export function saturationEquivalentPotentialTemperature(pressureHpa: number, temperatureK: number): number {
  return equivalentPotentialTemperature(pressureHpa, temperatureK, temperatureK);
}
