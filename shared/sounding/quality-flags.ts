import { GRAVITY, CP_DRY, ZERO_CELSIUS_K } from './constants';
import type { KinematicsAnalysis } from './kinematics';
import type { ParcelResult } from './parcel';
import { HEIGHT_TOLERANCE_FIXED_M, HEIGHT_TOLERANCE_FRACTION, type Profile } from './profile';

/**
 * What a quality flag is about. A flagged sounding is still analysed and still counts as
 * evidence; the flag says which numbers deserve caution and why (docs/analysis.md, "Quality flags").
 */
export const QUALITY_FLAG_CODES = {
  HEIGHTS_REPLACED: 'Reported heights disagree with the hypsometric equation; the computed heights are used.',
  SURFACE_IMPLAUSIBLE: 'A surface value lies outside the range observed anywhere on Earth.',
  TOP_BELOW_500_HPA: 'The sounding ends below 500 hPa: the lifted index is missing and CAPE and EL may be cut.',
  CAPE_CLIPPED_AT_TOP: 'A parcel is still buoyant at the top of the data: its CAPE is cut there and its EL is unknown.',
  SUPERADIABATIC_LAYER: 'A layer deeper than 500 m cools faster with height than the dry adiabat.',
  LAPSE_RATE_IMPLAUSIBLE: 'The temperature falls faster than the dry adiabat over several kilometres: check the temperature unit.',
  SURFACE_WIND_MISSING: 'No wind at the lowest level: the lowest reported wind stands in for it.',
} as const;

export type QualityFlagCode = keyof typeof QUALITY_FLAG_CODES;

/** One quality flag of an analysis. */
export interface QualityFlag {
  code: QualityFlagCode;
  /** What was found, with the numbers and the rule, written for the forecaster. */
  message: string;
  /** The parcel it concerns, when it concerns one. */
  parcel?: 'surfaceBased' | 'mixedLayer' | 'mostUnstable';
}

/**
 * Bounds of plausible surface values: just beyond the extremes ever measured at the surface
 * (from memory of the WMO World Weather and Climate Extremes Archive: highest temperature
 * 56.7 °C, lowest −89.2 °C, highest sea-level pressure 1084.8 hPa; highest dewpoint about
 * 35 °C). The lowest surface pressure allows stations up to about 5.5 km.
 */
export const SURFACE_BOUNDS = {
  temperatureC: { min: -90, max: 57 },
  dewpointMaxC: 35,
  pressureHpa: { min: 500, max: 1085 },
} as const;

/** A superadiabatic layer deeper than this is flagged, m. */
export const SUPERADIABATIC_DEPTH_M = 500;
/** Depth over which a mean lapse rate steeper than dry adiabatic means a unit mistake, m. */
export const IMPLAUSIBLE_LAPSE_DEPTH_M = 2000;
/** Dry-adiabatic lapse rate g/c_p, K m⁻¹ (WallaceHobbs2006 eq. 3.53). */
const DRY_ADIABATIC_LAPSE_K_PER_M = GRAVITY / CP_DRY;

const round = (value: number, digits = 0): string => value.toFixed(digits);

/**
 * The quality flags of an analysis.
 * @param profile - the prepared environment (knows whether its heights were replaced)
 * @param parcels - the three parcels
 * @param kinematics - the wind analysis (knows whether the surface wind was substituted)
 * @returns the flags, in a stable order
 */
export function qualityFlags(
  profile: Profile,
  parcels: { surfaceBased: ParcelResult; mixedLayer: ParcelResult; mostUnstable: ParcelResult },
  kinematics: KinematicsAnalysis,
): QualityFlag[] {
  const flags: QualityFlag[] = [];
  if (profile.heightsReplaced) {
    flags.push({
      code: 'HEIGHTS_REPLACED',
      message: `Reported heights differ from the hypsometric equation by up to ${round(profile.largestHeightDifferenceM)} m (at ${round(profile.largestHeightDifferencePressureHpa, 1)} hPa), more than the tolerance of ${HEIGHT_TOLERANCE_FIXED_M} m + ${HEIGHT_TOLERANCE_FRACTION * 100} % of the height (our rule, see docs/analysis.md); the computed heights are used. Heights in feet labelled as metres do this.`,
    });
  }
  const surfaceTemperatureC = (profile.temperatureK[0] as number) - ZERO_CELSIUS_K;
  const surfaceDewpointC = (profile.dewpointK[0] as number) - ZERO_CELSIUS_K;
  const surfacePressure = profile.pressureHpa[0] as number;
  const implausible: string[] = [];
  if (surfaceTemperatureC < SURFACE_BOUNDS.temperatureC.min || surfaceTemperatureC > SURFACE_BOUNDS.temperatureC.max) {
    implausible.push(`temperature ${round(surfaceTemperatureC, 1)} °C (plausible ${SURFACE_BOUNDS.temperatureC.min} to ${SURFACE_BOUNDS.temperatureC.max} °C)`);
  }
  if (surfaceDewpointC > SURFACE_BOUNDS.dewpointMaxC) implausible.push(`dewpoint ${round(surfaceDewpointC, 1)} °C (plausible up to ${SURFACE_BOUNDS.dewpointMaxC} °C)`);
  if (surfacePressure < SURFACE_BOUNDS.pressureHpa.min || surfacePressure > SURFACE_BOUNDS.pressureHpa.max) {
    implausible.push(`pressure ${round(surfacePressure, 1)} hPa (plausible ${SURFACE_BOUNDS.pressureHpa.min} to ${SURFACE_BOUNDS.pressureHpa.max} hPa)`);
  }
  if (implausible.length > 0) {
    flags.push({ code: 'SURFACE_IMPLAUSIBLE', message: `Surface ${implausible.join(', ')}: beyond the extremes measured on Earth. Check the units and the lowest row.` });
  }
  const top = profile.pressureHpa[profile.count - 1] as number;
  if (top > 500) {
    flags.push({ code: 'TOP_BELOW_500_HPA', message: `The sounding ends at ${round(top, 1)} hPa, below 500 hPa: no lifted index, and CAPE and EL may be cut at the top.` });
  }
  for (const key of ['surfaceBased', 'mixedLayer', 'mostUnstable'] as const) {
    if (parcels[key].capeClippedAtTop) {
      flags.push({ code: 'CAPE_CLIPPED_AT_TOP', parcel: key, message: `The ${parcelLabel[key]} parcel is still buoyant at the top of the data (${round(top, 1)} hPa): its CAPE stops there and its EL is unknown.` });
    }
  }
  const superadiabatic = deepestSuperadiabaticLayer(profile);
  if (superadiabatic.depth > SUPERADIABATIC_DEPTH_M) {
    flags.push({
      code: 'SUPERADIABATIC_LAYER',
      message: `The layer from ${round(superadiabatic.bottom)} to ${round(superadiabatic.top)} m above ground (${round(superadiabatic.depth)} m deep) cools faster than the dry adiabat (${round(DRY_ADIABATIC_LAPSE_K_PER_M * 1000, 1)} K/km). Observed superadiabatic layers are shallow: a surface layer over hot ground of a few hundred metres at most, or thin layers from rounded reports (common practice; our threshold is ${SUPERADIABATIC_DEPTH_M} m); check the data.`,
    });
  }
  const lapse = meanLapseRateOverDepth(profile);
  if (lapse !== null && lapse.rate > DRY_ADIABATIC_LAPSE_K_PER_M) {
    flags.push({
      code: 'LAPSE_RATE_IMPLAUSIBLE',
      message: `The temperature falls by ${round(lapse.rate * 1000, 1)} K/km on average over the lowest ${round(lapse.depth / 1000, 1)} km, faster than the dry adiabat (${round(DRY_ADIABATIC_LAPSE_K_PER_M * 1000, 1)} K/km): the profile is implausible for its units. Values in °F under a °C header do this.`,
    });
  }
  if (kinematics.surfaceWindSubstituted) {
    flags.push({ code: 'SURFACE_WIND_MISSING', message: 'The lowest level has no wind: the lowest reported wind is used at the ground for shear, storm motion and helicity.' });
  }
  return flags;
}

const parcelLabel = { surfaceBased: 'surface-based', mixedLayer: 'mixed-layer', mostUnstable: 'most-unstable' } as const;

/** The deepest contiguous layer whose potential temperature falls with height. */
function deepestSuperadiabaticLayer(profile: Profile): { bottom: number; top: number; depth: number } {
  let best = { bottom: 0, top: 0, depth: 0 };
  let start = -1;
  const z = profile.heightAglM;
  for (let k = 1; k < profile.count; k++) {
    const dz = (z[k] as number) - (z[k - 1] as number);
    const dt = (profile.temperatureK[k - 1] as number) - (profile.temperatureK[k] as number);
    const superadiabatic = dz > 0 && dt / dz > DRY_ADIABATIC_LAPSE_K_PER_M;
    if (superadiabatic && start < 0) start = k - 1;
    if ((!superadiabatic || k === profile.count - 1) && start >= 0) {
      const end = superadiabatic ? k : k - 1;
      const depth = (z[end] as number) - (z[start] as number);
      if (depth > best.depth) best = { bottom: z[start] as number, top: z[end] as number, depth };
      start = -1;
    }
  }
  return best;
}

/** Mean lapse rate from the ground to the highest level within 500 hPa–top, when at least 2 km deep; K m⁻¹. */
function meanLapseRateOverDepth(profile: Profile): { rate: number; depth: number } | null {
  let index = -1;
  for (let k = 1; k < profile.count; k++) {
    if ((profile.pressureHpa[k] as number) < 500) break;
    index = k;
  }
  if (index < 0) return null;
  const depth = (profile.heightAglM[index] as number) - (profile.heightAglM[0] as number);
  if (depth < IMPLAUSIBLE_LAPSE_DEPTH_M) return null;
  return { rate: ((profile.temperatureK[0] as number) - (profile.temperatureK[index] as number)) / depth, depth };
}
