import { GRAVITY, RD } from './constants';

/**
 * Thickness of a layer between two pressures (hypsometric equation).
 *
 * @param bottomPressureHpa - pressure at the bottom of the layer, hPa
 * @param topPressureHpa - pressure at the top, hPa (< bottom)
 * @param bottomVirtualTemperatureK - virtual temperature at the bottom, K
 * @param topVirtualTemperatureK - virtual temperature at the top, K
 * @returns thickness z_top − z_bottom, m
 * @example layerThickness(1000, 500, 288, 252) // → 5478 m
 * Notes: Δz = (R_d / g) T̄ᵥ ln(p_bottom / p_top), with T̄ᵥ the mean of the two virtual
 * temperatures (exact when Tᵥ is linear in ln p). Source: WallaceHobbs2006 eq. 3.29.
 */
export function layerThickness(
  bottomPressureHpa: number,
  topPressureHpa: number,
  bottomVirtualTemperatureK: number,
  topVirtualTemperatureK: number,
): number {
  const meanVirtual = 0.5 * (bottomVirtualTemperatureK + topVirtualTemperatureK);
  return ((RD * meanVirtual) / GRAVITY) * Math.log(bottomPressureHpa / topPressureHpa);
}
