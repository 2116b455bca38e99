import {
  ZERO_CELSIUS_K,
  dewpointFromMixingRatio,
  dryAdiabatTemperature,
  pseudoAdiabatTable,
} from '../../../../shared/sounding';

/**
 * The background lines of the skew-T log-p diagram, as (pressure, temperature) curves. Every
 * curve is computed with the engine's own functions, so the drawing agrees with the numbers:
 * dry adiabats with Poisson's equation (dryAdiabatTemperature), pseudo-adiabats from the
 * engine's pseudo-adiabat table (the one its parcels follow), mixing-ratio lines with
 * dewpointFromMixingRatio. Pure: no DOM.
 */
export interface ThermoPoint {
  pressureHpa: number;
  temperatureC: number;
}

export interface ThermoCurve {
  /** What the curve is labelled with (θ in °C, θw in °C, or w in g/kg). */
  value: number;
  points: ThermoPoint[];
}

/** Pressures from bottom to top, evenly spaced in ln p (about `steps` points). */
export function logPressureSamples(bottomHpa: number, topHpa: number, steps = 40): number[] {
  const low = Math.log(bottomHpa);
  const high = Math.log(topHpa);
  return Array.from({ length: steps + 1 }, (_, i) => Math.exp(low + ((high - low) * i) / steps));
}

/** Dry adiabats labelled by potential temperature θ (°C). */
export function dryAdiabats(potentialTemperaturesC: readonly number[], bottomHpa: number, topHpa: number): ThermoCurve[] {
  const pressures = logPressureSamples(bottomHpa, topHpa);
  return potentialTemperaturesC.map((thetaC) => ({
    value: thetaC,
    points: pressures.map((pressureHpa) => ({
      pressureHpa,
      temperatureC: dryAdiabatTemperature(pressureHpa, thetaC + ZERO_CELSIUS_K) - ZERO_CELSIUS_K,
    })),
  }));
}

/** Pseudo-adiabats labelled by wet-bulb potential temperature θw (°C, the temperature at 1000 hPa). */
export function pseudoAdiabats(wetBulbPotentialTemperaturesC: readonly number[], bottomHpa: number, topHpa: number): ThermoCurve[] {
  const table = pseudoAdiabatTable();
  const pressures = logPressureSamples(bottomHpa, topHpa);
  return wetBulbPotentialTemperaturesC.map((thetaWC) => ({
    value: thetaWC,
    points: pressures.map((pressureHpa) => ({
      pressureHpa,
      temperatureC: table.temperature(thetaWC + ZERO_CELSIUS_K, Math.log(pressureHpa)) - ZERO_CELSIUS_K,
    })),
  }));
}

/** Lines of constant saturation mixing ratio labelled in g/kg: the dewpoint air with that w has at each pressure. */
export function mixingRatioLines(mixingRatiosGPerKg: readonly number[], bottomHpa: number, topHpa: number): ThermoCurve[] {
  const pressures = logPressureSamples(bottomHpa, topHpa, 12);
  return mixingRatiosGPerKg.map((grams) => ({
    value: grams,
    points: pressures.map((pressureHpa) => ({
      pressureHpa,
      temperatureC: dewpointFromMixingRatio(grams / 1000, pressureHpa) - ZERO_CELSIUS_K,
    })),
  }));
}

/** Default label sets of the diagram. */
export const DRY_ADIABAT_THETAS_C = Array.from({ length: 25 }, (_, i) => -40 + i * 10);
export const PSEUDO_ADIABAT_THETA_WS_C = Array.from({ length: 11 }, (_, i) => -8 + i * 4);
export const MIXING_RATIOS_G_PER_KG = [1, 2, 4, 7, 10, 14, 20, 28];
