import { CP_DRY, EPSILON, GRAVITY, KAPPA, ZERO_CELSIUS_K } from '../constants';
import { dewpointFromMixingRatio, saturationMixingRatio } from '../mixing-ratio';
import type { SoundingLevel } from '../types';

/**
 * The analytic sounding of Weisman and Klemp (1982), for tests.
 *
 * θ(z) = θ₀ + (θ_tr − θ₀)(z/z_tr)^(5/4) below the tropopause, θ_tr exp(g(z − z_tr)/(c_p T_tr))
 * above; RH(z) = 1 − ¾(z/z_tr)^(5/4) below, 0.25 above; mixing ratio capped at q_v0.
 * θ₀ = 300 K, θ_tr = 343 K, T_tr = 213 K, z_tr = 12 km, p_sfc = 1000 hPa
 * (WeismanKlemp1982 eqs. 1–2 and pg. 506). Pressure comes from hydrostatic balance in the
 * Exner function, dπ/dz = −g/(c_p θᵥ), integrated upward in `stepM` steps.
 * @param surfaceMixingRatio - q_v0, kg kg⁻¹ (the paper uses 11–16 g kg⁻¹)
 */
export function weismanKlempSounding(surfaceMixingRatio: number, stepM = 50, topM = 16000): SoundingLevel[] {
  const thetaAt = (z: number): number =>
    z <= 12000 ? 300 + 43 * Math.pow(z / 12000, 1.25) : 343 * Math.exp((GRAVITY * (z - 12000)) / (CP_DRY * 213));
  const rhAt = (z: number): number => (z <= 12000 ? 1 - 0.75 * Math.pow(z / 12000, 1.25) : 0.25);
  const levels: SoundingLevel[] = [];
  let exner = 1; // (p/1000)^κ
  let previousExner = 1;
  let previousThetaV = NaN;
  for (let z = 0; z <= topM; z += stepM) {
    const theta = thetaAt(z);
    let w = 0;
    let thetaV = theta;
    // Iterate: mixing ratio depends on pressure (through exner), θᵥ on mixing ratio.
    for (let iteration = 0; iteration < 4; iteration++) {
      const pressure = 1000 * Math.pow(exner, 1 / KAPPA);
      const temperature = theta * exner;
      w = Math.min(surfaceMixingRatio, rhAt(z) * saturationMixingRatio(pressure, temperature));
      thetaV = (theta * (w + EPSILON)) / (EPSILON * (1 + w));
      if (z === 0) break;
      exner = previousExner - (GRAVITY * stepM) / (CP_DRY * 0.5 * (previousThetaV + thetaV));
    }
    const pressure = 1000 * Math.pow(exner, 1 / KAPPA);
    const temperature = theta * exner;
    levels.push({
      pressureHpa: pressure,
      heightM: z,
      temperatureC: temperature - ZERO_CELSIUS_K,
      dewpointC: dewpointFromMixingRatio(w, pressure) - ZERO_CELSIUS_K,
      uMs: null,
      vMs: null,
    });
    previousThetaV = thetaV;
    previousExner = exner;
  }
  return levels;
}
