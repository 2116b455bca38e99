import * as constants from './constants';
import { finiteOrNull, meetsEffectiveInflowCriteria, type ParcelResult } from './parcel';
import type { Profile } from './profile';

// Constants copied once at load (fast access in hot loops).
const { RD } = constants;

/** A wind vector, m s⁻¹ (u toward east, v toward north). */
export interface WindVector {
  u: number;
  v: number;
}

/** The effective inflow layer (Thompson2007): heights above ground, m; pressures, hPa. */
export interface EffectiveInflowLayer {
  bottomPressure: number;
  topPressure: number;
  bottomHeight: number;
  topHeight: number;
}

/** Wind-profile results. Shear and motion m s⁻¹, helicity m² s⁻²; null where winds do not reach. */
export interface KinematicsAnalysis {
  bulkShear0to1km: number | null;
  bulkShear0to3km: number | null;
  bulkShear0to6km: number | null;
  /** 0–6 km non-pressure-weighted mean wind. */
  meanWind0to6km: WindVector | null;
  stormMotionRight: WindVector | null;
  stormMotionLeft: WindVector | null;
  /**
   * Which Bunkers mover is the cyclonic deviant one the helicity uses: the right mover in the
   * Northern Hemisphere, the left mover in the Southern (latitude < 0; Bunkers2000 pg. 62).
   */
  deviantMover: 'right' | 'left';
  /** Motion of the cyclonic deviant mover, m s⁻¹. */
  stormMotionDeviant: WindVector | null;
  /** True when the lowest level had no wind and the lowest reported wind stood in for it. */
  surfaceWindSubstituted: boolean;
  /** Storm-relative helicity for the cyclonic deviant mover (right mover north of the equator), m² s⁻². */
  srh0to1km: number | null;
  srh0to3km: number | null;
  effectiveInflowLayer: EffectiveInflowLayer | null;
  /** SRH of the effective inflow layer (deviant mover), m² s⁻²; 0 when there is no effective layer. */
  effectiveSrh: number | null;
  /** Bulk shear from the effective inflow base to half the MU equilibrium-level height, m s⁻¹. */
  effectiveBulkShear: number | null;
  /** Bulk Richardson number shear (½ΔV², ΔV = 0–6 km minus 0–0.5 km density-weighted mean wind), m² s⁻². */
  brnShear: number | null;
}

/** Winds of the levels that report one, by height above ground (the first `n` entries). */
interface WindProfile {
  n: number;
  /** Heights strictly increasing (then the points inside a layer are one run of indices). */
  sorted: boolean;
  height: Float64Array;
  u: Float64Array;
  v: Float64Array;
  density: Float64Array;
}

/**
 * Reused room for the wind profile: it lives only during one synchronous analyzeKinematics
 * call, so one buffer serves every call (typed-array allocations cost more than the work).
 */
let windScratch = new Float64Array(0);

function windProfile(profile: Profile): WindProfile {
  let reported = 0;
  for (let k = 0; k < profile.count; k++) {
    if (!Number.isNaN(profile.uMs[k] as number) && !Number.isNaN(profile.vMs[k] as number)) reported++;
  }
  // No wind at the lowest level: the lowest reported wind stands in for it (flagged by the
  // analysis), so shear and helicity are computed instead of all turning null.
  const firstReported = (): number => {
    for (let k = 0; k < profile.count; k++) {
      if (!Number.isNaN(profile.uMs[k] as number) && !Number.isNaN(profile.vMs[k] as number)) return k;
    }
    return -1;
  };
  const first = reported > 0 ? firstReported() : -1;
  const substitute = first >= 0 && (profile.heightAglM[first] as number) > 0;
  const n = reported + (substitute ? 1 : 0);
  if (windScratch.length < 4 * n) windScratch = new Float64Array(Math.max(4 * n, 2 * windScratch.length));
  const buffer = windScratch;
  const winds: WindProfile = { n, sorted: false, height: buffer.subarray(0, n), u: buffer.subarray(n, 2 * n), v: buffer.subarray(2 * n, 3 * n), density: buffer.subarray(3 * n, 4 * n) };
  let i = 0;
  if (substitute) {
    winds.height[0] = 0;
    winds.u[0] = profile.uMs[first] as number;
    winds.v[0] = profile.vMs[first] as number;
    winds.density[0] = ((profile.pressureHpa[0] as number) * 100) / (RD * (profile.virtualTemperatureK[0] as number));
    i = 1;
  }
  for (let k = 0; k < profile.count; k++) {
    const u = profile.uMs[k] as number;
    const v = profile.vMs[k] as number;
    if (Number.isNaN(u) || Number.isNaN(v)) continue;
    winds.height[i] = profile.heightAglM[k] as number;
    winds.u[i] = u;
    winds.v[i] = v;
    winds.density[i] = ((profile.pressureHpa[k] as number) * 100) / (RD * (profile.virtualTemperatureK[k] as number));
    i++;
  }
  let sorted = true;
  for (let j = 1; j < n && sorted; j++) sorted = (winds.height[j] as number) > (winds.height[j - 1] as number);
  winds.sorted = sorted;
  return winds;
}

/**
 * Index of the first wind point above `bottom` when the heights are sorted (the points inside
 * a layer then follow in one run, and callers stop at its top); 0 otherwise (callers then
 * skip every point outside the layer).
 */
function pointsInside(winds: WindProfile, bottom: number): number {
  if (!winds.sorted) return 0;
  const h = winds.height;
  let low = 0;
  let high = winds.n;
  while (low < high) {
    const middle = (low + high) >> 1;
    if ((h[middle] as number) > bottom) high = middle;
    else low = middle + 1;
  }
  return low;
}

/** Interpolate a wind-profile array at a height (linear); NaN outside the reported winds. */
function at(winds: WindProfile, values: Float64Array, height: number): number {
  const h = winds.height;
  const n = winds.n;
  if (n === 0 || height < (h[0] as number) || height > (h[n - 1] as number)) return NaN;
  let low = 0;
  let high = n - 1;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if ((h[middle] as number) <= height) low = middle;
    else high = middle;
  }
  const h0 = h[low] as number;
  const h1 = h[high] as number;
  const fraction = h1 === h0 ? 0 : (height - h0) / (h1 - h0);
  return (values[low] as number) + fraction * ((values[high] as number) - (values[low] as number));
}

/**
 * Bulk wind difference (shear magnitude) between two heights.
 * Notes: |V(top) − V(bottom)| (common practice; Thompson2003 "BWD").
 */
function bulkShear(winds: WindProfile, bottom: number, top: number): number {
  const du = at(winds, winds.u, top) - at(winds, winds.u, bottom);
  const dv = at(winds, winds.v, top) - at(winds, winds.v, bottom);
  return Math.hypot(du, dv);
}

/**
 * Mean wind of a layer, height-weighted (or density-weighted), trapezoid rule over the
 * layer's points: its bottom, the reported levels inside it, its top.
 * Notes: Bunkers2000 pg. 66 uses the non-pressure-weighted 0–6 km mean.
 */
function meanWind(winds: WindProfile, bottom: number, top: number, densityWeighted = false): WindVector | null {
  const bottomU = at(winds, winds.u, bottom);
  const topU = at(winds, winds.u, top);
  if (Number.isNaN(bottomU) || Number.isNaN(topU)) return null;
  let su = 0;
  let sv = 0;
  let sw = 0;
  let aHeight = bottom;
  let aU = bottomU;
  let aV = at(winds, winds.v, bottom);
  let aW = densityWeighted ? at(winds, winds.density, bottom) : 1;
  // The points inside the layer, then its top (i = n); written without a closure so the
  // running sums stay unboxed.
  for (let i = pointsInside(winds, bottom); i <= winds.n; i++) {
    let height: number;
    let u: number;
    let v: number;
    let w: number;
    if (i < winds.n) {
      height = winds.height[i] as number;
      if (!(height > bottom && height < top)) {
        // Sorted: past the top, only the top point is left.
        if (winds.sorted && height >= top) i = winds.n - 1;
        continue;
      }
      u = winds.u[i] as number;
      v = winds.v[i] as number;
      w = densityWeighted ? (winds.density[i] as number) : 1;
    } else {
      height = top;
      u = topU;
      v = at(winds, winds.v, top);
      w = densityWeighted ? at(winds, winds.density, top) : 1;
    }
    const dz = height - aHeight;
    su += 0.5 * (aW * aU + w * u) * dz;
    sv += 0.5 * (aW * aV + w * v) * dz;
    sw += 0.5 * (aW + w) * dz;
    aHeight = height;
    aU = u;
    aV = v;
    aW = w;
  }
  return sw > 0 ? { u: su / sw, v: sv / sw } : null;
}

/**
 * Bunkers storm motion: right- and left-moving supercells.
 * Notes: V_right = V_mean + D (S × k̂)/|S| and V_left = V_mean − D (S × k̂)/|S|, with V_mean
 * the 0–6 km non-pressure-weighted mean wind, S the shear vector from the 0–0.5 km mean wind
 * to the 5.5–6 km mean wind, k̂ the upward unit vector and D = 7.5 m s⁻¹. S × k̂ = (S_v, −S_u)
 * points 90° to the right of S, so the right mover deviates to the right of the shear.
 * Source: Bunkers2000 eq. 1 and pg. 66.
 */
function bunkersMotion(winds: WindProfile): { right: WindVector; left: WindVector; mean: WindVector } | null {
  const mean = meanWind(winds, 0, 6000);
  const low = meanWind(winds, 0, 500);
  const high = meanWind(winds, 5500, 6000);
  if (!mean || !low || !high) return null;
  const su = high.u - low.u;
  const sv = high.v - low.v;
  const magnitude = Math.hypot(su, sv);
  // No shear to speak of (below 1 mm/s, e.g. rounding noise): no deviation, and no 7.5/|S| overflow.
  if (!(magnitude > 1e-3)) return { right: mean, left: mean, mean };
  const deviation = 7.5 / magnitude;
  return {
    right: { u: mean.u + deviation * sv, v: mean.v - deviation * su },
    left: { u: mean.u - deviation * sv, v: mean.v + deviation * su },
    mean,
  };
}

/**
 * Storm-relative helicity of a layer.
 * Notes: SRH = Σ [(u_{n+1} − c_x)(v_n − c_y) − (u_n − c_x)(v_{n+1} − c_y)] over the layer's
 * hodograph points: its bottom, the reported levels inside it, its top (DaviesJones1990; the
 * discrete form of −∫ k̂·(V − C) × ∂V/∂z dz). Positive for a hodograph turning clockwise
 * relative to the storm.
 */
function stormRelativeHelicity(winds: WindProfile, bottom: number, top: number, storm: WindVector): number {
  const bottomU = at(winds, winds.u, bottom);
  const topU = at(winds, winds.u, top);
  if (Number.isNaN(bottomU) || Number.isNaN(topU)) return NaN;
  let sum = 0;
  let aU = bottomU;
  let aV = at(winds, winds.v, bottom);
  for (let i = pointsInside(winds, bottom); i < winds.n; i++) {
    const h = winds.height[i] as number;
    if (!(h > bottom && h < top)) {
      if (winds.sorted && h >= top) break;
      continue;
    }
    const bU = winds.u[i] as number;
    const bV = winds.v[i] as number;
    sum += (bU - storm.u) * (aV - storm.v) - (aU - storm.u) * (bV - storm.v);
    aU = bU;
    aV = bV;
  }
  const bV = at(winds, winds.v, top);
  sum += (topU - storm.u) * (aV - storm.v) - (aU - storm.u) * (bV - storm.v);
  return sum;
}

/** Candidate parcels of the effective-layer search are at least this far apart, hPa. */
export const EFFECTIVE_LAYER_CANDIDATE_SPACING_HPA = 5;

/**
 * The effective inflow layer: the lowest contiguous layer of levels whose parcels have
 * CAPE ≥ 100 J kg⁻¹ and CIN ≥ −250 J kg⁻¹ (Thompson2007 pg. 104).
 *
 * The base is searched in the lowest 300 hPa; once found, the layer extends up to the level
 * before the first one that fails. Candidates are levels at least 5 hPa apart, so however
 * dense the sounding, at most about 60 parcels are lifted for the base search and one per
 * 5 hPa of layer depth; at each edge the skipped levels of one 5 hPa window are then checked
 * one by one, so the edges are exactly those of a scan of every level, unless a failing (or
 * passing) level hides inside a window whose both ends pass (or fail).
 * @param profile - the prepared environment
 * @param known - decisions already known for some levels (from parcels lifted anyway)
 * @returns the layer, or null when no candidate meets the criteria
 */
export function effectiveInflowLayer(profile: Profile, known: readonly { index: number; meets: boolean }[] = []): EffectiveInflowLayer | null {
  const limit = (profile.pressureHpa[0] as number) - 300;
  const meets = (k: number): boolean => {
    for (const decision of known) if (decision.index === k) return decision.meets;
    return meetsEffectiveInflowCriteria(profile, k);
  };
  let bottom = -1;
  let lastPassing = -1;
  let lastCandidate = -1;
  for (let k = 0; k <= profile.moistureTopIndex; k++) {
    const pressure = profile.pressureHpa[k] as number;
    if (bottom < 0 && pressure < limit) break;
    const spaced = lastCandidate < 0 || (profile.pressureHpa[lastCandidate] as number) - pressure >= EFFECTIVE_LAYER_CANDIDATE_SPACING_HPA;
    if (!spaced && k !== profile.moistureTopIndex) continue;
    const passes = meets(k);
    if (bottom < 0) {
      if (passes) {
        // Refine within the skipped levels: the base is the lowest passing level.
        bottom = k;
        for (let j = lastCandidate + 1; j < k; j++) {
          if (meets(j)) {
            bottom = j;
            break;
          }
        }
        lastPassing = k;
      }
    } else if (!passes) {
      // Refine within the skipped levels: the top is the level below the first failing one.
      for (let j = lastPassing + 1; j < k; j++) {
        if (!meets(j)) return layerOf(profile, bottom, j - 1);
      }
      return layerOf(profile, bottom, k - 1);
    } else {
      lastPassing = k;
    }
    lastCandidate = k;
  }
  return bottom < 0 ? null : layerOf(profile, bottom, lastPassing);
}

function layerOf(profile: Profile, bottom: number, top: number): EffectiveInflowLayer {
  return {
    bottomPressure: profile.pressureHpa[bottom] as number,
    topPressure: profile.pressureHpa[top] as number,
    bottomHeight: profile.heightAglM[bottom] as number,
    topHeight: profile.heightAglM[top] as number,
  };
}

/** Options of {@link analyzeKinematics}. */
export interface KinematicsOptions {
  /** Latitude of the sounding, degrees north; below 0 the left mover is the deviant one. Default: northern. */
  latitude?: number | null;
  /** Index of the most-unstable level (saves finding it again). */
  mostUnstableIndex?: number;
  /** Effective-criteria decisions already known for some levels (see {@link effectiveInflowLayer}). */
  knownEffective?: readonly { index: number; meets: boolean }[];
}

/**
 * Analyse the wind profile: shear, storm motion, helicity and the effective inflow layer.
 * @param profile - the prepared environment
 * @param mostUnstable - the most-unstable parcel (its EL sets the effective bulk shear depth)
 * @param options - latitude (hemisphere of the deviant mover) and the most-unstable level
 * @returns {@link KinematicsAnalysis}
 */
export function analyzeKinematics(profile: Profile, mostUnstable: ParcelResult, options: KinematicsOptions = {}): KinematicsAnalysis {
  const winds = windProfile(profile);
  const surfaceWindSubstituted = winds.n > 0 && Number.isNaN(profile.uMs[0] as number);
  const motion = bunkersMotion(winds);
  const deviantMover = options.latitude !== undefined && options.latitude !== null && options.latitude < 0 ? 'left' : 'right';
  const deviant = motion ? (deviantMover === 'left' ? motion.left : motion.right) : null;
  const layer = effectiveInflowLayer(profile, options.knownEffective);
  let effectiveSrh: number | null = null;
  let effectiveBulkShear: number | null = null;
  if (deviant) effectiveSrh = layer ? finiteOrNull(stormRelativeHelicity(winds, layer.bottomHeight, layer.topHeight, deviant)) : 0;
  if (layer && mostUnstable.elHeight !== null) {
    const top = layer.bottomHeight + 0.5 * (mostUnstable.elHeight - layer.bottomHeight);
    effectiveBulkShear = finiteOrNull(bulkShear(winds, layer.bottomHeight, top));
  } else if (!layer && winds.n > 0) {
    effectiveBulkShear = 0;
  }
  const deep = meanWind(winds, 0, 6000, true);
  const shallow = meanWind(winds, 0, 500, true);
  const brnShear = deep && shallow ? 0.5 * ((deep.u - shallow.u) ** 2 + (deep.v - shallow.v) ** 2) : null;
  return {
    bulkShear0to1km: finiteOrNull(bulkShear(winds, 0, 1000)),
    bulkShear0to3km: finiteOrNull(bulkShear(winds, 0, 3000)),
    bulkShear0to6km: finiteOrNull(bulkShear(winds, 0, 6000)),
    meanWind0to6km: motion ? motion.mean : null,
    stormMotionRight: motion ? motion.right : null,
    stormMotionLeft: motion ? motion.left : null,
    deviantMover,
    stormMotionDeviant: deviant,
    surfaceWindSubstituted,
    srh0to1km: deviant ? finiteOrNull(stormRelativeHelicity(winds, 0, 1000, deviant)) : null,
    srh0to3km: deviant ? finiteOrNull(stormRelativeHelicity(winds, 0, 3000, deviant)) : null,
    effectiveInflowLayer: layer,
    effectiveSrh,
    effectiveBulkShear,
    brnShear,
  };
}
