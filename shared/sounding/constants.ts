/**
 * Physical constants used by the sounding engine, in SI units.
 *
 * The values are the ones docs/analysis.md lists for the project, so every quantity the engine
 * reports is computed with the same numbers. Sources are AuthorYear keys in REFERENCES.md.
 */

/** Standard gravity, m s⁻². Notes: exact by definition (NOAA1976 pg. 2). */
export const GRAVITY = 9.80665;

/** Gas constant of dry air, J kg⁻¹ K⁻¹. Notes: WallaceHobbs2006 pg. 66 (rounded). */
export const RD = 287.04;

/** Gas constant of water vapour, J kg⁻¹ K⁻¹. Notes: WallaceHobbs2006 pg. 66. */
export const RV = 461.5;

/** Specific heat of dry air at constant pressure, J kg⁻¹ K⁻¹. Notes: Bolton1980 pg. 1046. */
export const CP_DRY = 1005.7;

/** Specific heat of liquid water, J kg⁻¹ K⁻¹ (used only by the pseudo-adiabat). Notes: WallaceHobbs2006 pg. 118. */
export const CP_LIQUID = 4190;

/** Ratio of the gas constants Rd/Rv, dimensionless (≈ 0.622). Notes: WallaceHobbs2006 eq. 3.14. */
export const EPSILON = RD / RV;

/** Poisson exponent Rd/cp for dry air, dimensionless (≈ 0.2854). Notes: WallaceHobbs2006 eq. 3.54. */
export const KAPPA = RD / CP_DRY;

/** Latent heat of vaporization at 0 °C, J kg⁻¹. Notes: Bolton1980 eq. 2. */
export const LV_0C = 2.501e6;

/** Rate of change of the latent heat of vaporization with temperature, J kg⁻¹ K⁻¹. Notes: Bolton1980 eq. 2. */
export const LV_SLOPE = -2370;

/** Density of liquid water, kg m⁻³ (for precipitable water depth). Notes: common practice. */
export const WATER_DENSITY = 1000;

/** 0 °C in kelvin. Notes: exact by definition. */
export const ZERO_CELSIUS_K = 273.15;

/** Reference pressure for potential temperature, hPa. Notes: WallaceHobbs2006 eq. 3.54. */
export const REFERENCE_PRESSURE_HPA = 1000;
