import type { WindVector } from './kinematics';
import { pressureAtHeight, type Profile } from './profile';

/**
 * The reported winds of a profile as hodograph points by height above ground, for the hazard
 * ingredients (see ingredients.ts). The same rule as the kinematics: when the lowest level has
 * no wind, the lowest reported wind stands in at the ground (the analysis flags it).
 */
export interface WindPoints {
  /** Height above ground, m, increasing. */
  height: number[];
  /** Pressure, hPa. */
  pressure: number[];
  /** Wind components, m s⁻¹. */
  u: number[];
  v: number[];
}

/**
 * The hodograph points of a profile (levels without a wind are skipped).
 * @param profile - the prepared environment
 * @returns the points, lowest first; empty when no level reports a wind
 */
export function windPoints(profile: Profile): WindPoints {
  const points: WindPoints = { height: [], pressure: [], u: [], v: [] };
  for (let k = 0; k < profile.count; k++) {
    const u = profile.uMs[k] as number;
    const v = profile.vMs[k] as number;
    if (Number.isNaN(u) || Number.isNaN(v)) continue;
    if (points.height.length === 0 && k > 0) {
      // No wind at the ground: the lowest reported wind stands in for it.
      points.height.push(0);
      points.pressure.push(profile.pressureHpa[0] as number);
      points.u.push(u);
      points.v.push(v);
    }
    points.height.push(profile.heightAglM[k] as number);
    points.pressure.push(profile.pressureHpa[k] as number);
    points.u.push(u);
    points.v.push(v);
  }
  return points;
}

/**
 * Index i of the points with height[i] ≤ h ≤ height[i+1], or −1 when h lies outside them.
 */
function bracket(points: WindPoints, heightM: number): number {
  const h = points.height;
  const n = h.length;
  if (n < 2 || !(heightM >= (h[0] as number) && heightM <= (h[n - 1] as number))) return -1;
  let low = 0;
  let high = n - 1;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if ((h[middle] as number) <= heightM) low = middle;
    else high = middle;
  }
  return low;
}

/**
 * The wind at a height above ground, linear in height between the reported winds.
 * @param points - hodograph points
 * @param heightM - height above ground, m
 * @returns the wind, m s⁻¹, or null outside the reported winds
 */
export function windAtHeight(points: WindPoints, heightM: number): WindVector | null {
  const i = bracket(points, heightM);
  if (i < 0) return null;
  const h0 = points.height[i] as number;
  const h1 = points.height[i + 1] as number;
  const f = h1 === h0 ? 0 : (heightM - h0) / (h1 - h0);
  const u0 = points.u[i] as number;
  const v0 = points.v[i] as number;
  return { u: u0 + f * ((points.u[i + 1] as number) - u0), v: v0 + f * ((points.v[i + 1] as number) - v0) };
}

/**
 * The hodograph of a layer: its bottom, the reported winds strictly inside it, its top.
 * @returns heights (m) and winds, or null when the winds do not cover the layer
 */
function layerHodograph(points: WindPoints, bottomM: number, topM: number): { height: number[]; wind: WindVector[]; inside: number[] } | null {
  const bottom = windAtHeight(points, bottomM);
  const top = windAtHeight(points, topM);
  if (!bottom || !top || !(topM > bottomM)) return null;
  const height = [bottomM];
  const wind = [bottom];
  /** Index into `points` of each point strictly inside the layer (−1 for the two ends). */
  const inside = [-1];
  for (let i = 0; i < points.height.length; i++) {
    const h = points.height[i] as number;
    if (h > bottomM && h < topM) {
      height.push(h);
      wind.push({ u: points.u[i] as number, v: points.v[i] as number });
      inside.push(i);
    }
  }
  height.push(topM);
  wind.push(top);
  inside.push(-1);
  return { height, wind, inside };
}

/**
 * Bulk wind difference |V(top) − V(bottom)| of a layer (common practice; Thompson2003 "BWD").
 * @param points - hodograph points
 * @param bottomM - bottom of the layer above ground, m
 * @param topM - top of the layer above ground, m
 * @returns m s⁻¹, or null when the winds do not reach both heights
 * @example bulkWindDifference(points, 0, 8000) // 0–8 km bulk shear
 */
export function bulkWindDifference(points: WindPoints, bottomM: number, topM: number): number | null {
  const bottom = windAtHeight(points, bottomM);
  const top = windAtHeight(points, topM);
  return bottom && top ? Math.hypot(top.u - bottom.u, top.v - bottom.v) : null;
}

/**
 * Storm-relative helicity of a layer.
 * @param points - hodograph points
 * @param bottomM - bottom of the layer above ground, m
 * @param topM - top of the layer above ground, m
 * @param storm - storm motion, m s⁻¹
 * @returns m² s⁻², or null when the winds do not cover the layer
 * Notes: SRH = Σ [(u_{n+1} − c_x)(v_n − c_y) − (u_n − c_x)(v_{n+1} − c_y)] over the layer's
 * hodograph points (DaviesJones1990): minus twice the signed area the storm-relative winds
 * sweep, positive for a hodograph turning clockwise relative to the storm.
 */
export function layerHelicity(points: WindPoints, bottomM: number, topM: number, storm: WindVector): number | null {
  const layer = layerHodograph(points, bottomM, topM);
  if (!layer) return null;
  let sum = 0;
  for (let i = 0; i + 1 < layer.wind.length; i++) {
    const a = layer.wind[i] as WindVector;
    const b = layer.wind[i + 1] as WindVector;
    sum += (b.u - storm.u) * (a.v - storm.v) - (a.u - storm.u) * (b.v - storm.v);
  }
  return sum;
}

/**
 * Pressure-weighted mean wind of a layer: ∫ V dp / ∫ dp, trapezoid rule over the layer's
 * hodograph points (common practice; the mass-weighted mean, since dp = −ρ g dz).
 * @param profile - the prepared environment (pressure of the interpolated end points)
 * @param points - hodograph points
 * @param bottomM - bottom of the layer above ground, m
 * @param topM - top of the layer above ground, m
 * @returns the mean wind, m s⁻¹, or null when the winds do not cover the layer
 */
export function pressureWeightedMeanWind(profile: Profile, points: WindPoints, bottomM: number, topM: number): WindVector | null {
  const layer = layerHodograph(points, bottomM, topM);
  if (!layer) return null;
  // Reported points keep their own pressure; the two ends are interpolated (ln p linear in height).
  const pressures = layer.height.map((h, j) => {
    const index = layer.inside[j] as number;
    return index >= 0 ? (points.pressure[index] as number) : pressureAtHeight(profile, h);
  });
  let su = 0;
  let sv = 0;
  let sp = 0;
  for (let i = 0; i + 1 < layer.wind.length; i++) {
    const a = layer.wind[i] as WindVector;
    const b = layer.wind[i + 1] as WindVector;
    const dp = (pressures[i] as number) - (pressures[i + 1] as number);
    su += 0.5 * (a.u + b.u) * dp;
    sv += 0.5 * (a.v + b.v) * dp;
    sp += dp;
  }
  return sp > 0 && Number.isFinite(su) && Number.isFinite(sv) ? { u: su / sp, v: sv / sp } : null;
}

/**
 * The strongest reported wind from the ground up to a height (the low-level jet of the Corfidi
 * vectors).
 * @param points - hodograph points
 * @param topM - highest height above ground searched, m
 * @returns the wind and its height, or null when no wind is reported in the layer
 */
export function strongestWindBelow(points: WindPoints, topM: number): (WindVector & { heightM: number }) | null {
  let best = -1;
  let bestSpeed = -1;
  for (let i = 0; i < points.height.length; i++) {
    if ((points.height[i] as number) > topM) break;
    const speed = Math.hypot(points.u[i] as number, points.v[i] as number);
    if (speed > bestSpeed) {
      bestSpeed = speed;
      best = i;
    }
  }
  return best < 0 ? null : { u: points.u[best] as number, v: points.v[best] as number, heightM: points.height[best] as number };
}
