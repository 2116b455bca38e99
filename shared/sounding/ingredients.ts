import { EPSILON, GRAVITY, KAPPA, ZERO_CELSIUS_K } from './constants';
import type { EnvironmentAnalysis } from './environment';
import { bulkWindDifference, layerHelicity, pressureWeightedMeanWind, strongestWindBelow, windAtHeight, windPoints } from './ingredients-wind';
import type { KinematicsAnalysis, WindVector } from './kinematics';
import { lclTemperature } from './lcl';
import { dewpointFromMixingRatio } from './mixing-ratio';
import { pseudoAdiabatTable } from './moist-adiabat';
import { finiteOrNull, type ParcelResult, type ParcelStart } from './parcel';
import { heightAtPressure, pressureAtHeight, valueAtHeight, valueAtPressure, type Profile } from './profile';
import { saturationVaporPressure } from './saturation';

/**
 * The ingredients behind the hazard rules (tornado, hail, damaging wind, flash flooding) that
 * the rest of the analysis does not already give. SI units as in the names; null where the
 * sounding cannot give the value (winds or data too short, no LFC, no LCL). Methods and
 * sources: docs/analysis.md, "Hazard ingredients".
 */
export interface IngredientsAnalysis {
  /** Storm-relative helicity 0–500 m, cyclonic deviant mover (as srh0to1km), m² s⁻² (Coffer2019). */
  srh0to500m: number | null;
  /** Angle between the surface storm-relative inflow and the 0–500 m shear vector, degrees 0–180 (EsterheldGiuliano2008). */
  criticalAngleDeg: number | null;
  /** Mixed-layer LFC height minus LCL height, m (≥ 0); null without an LFC. */
  mlLclLfcGap: number | null;
  /** Temperature lapse rate 3–6 km above ground, K km⁻¹ (positive when it cools upward). */
  lapseRate3to6km: number | null;
  /** Temperature lapse rate 850–500 hPa, K km⁻¹; null where 850 hPa is below the ground. */
  lapseRate850to500hPa: number | null;
  /** Height above ground of the −10 °C environmental level (lowest crossing), m. */
  minus10CHeight: number | null;
  /** Height above ground of the −30 °C environmental level (lowest crossing above −10 °C), m. */
  minus30CHeight: number | null;
  /** Most-unstable parcel CAPE between the −10 °C and −30 °C levels, J kg⁻¹ (JohnsonSugden2014). */
  muCapeHailZone: number | null;
  /** 0–8 km bulk wind difference, m s⁻¹. */
  bulkShear0to8km: number | null;
  /** 0–6 km pressure-weighted mean wind, m s⁻¹. */
  meanWind0to6km: WindVector | null;
  /** Speed of {@link meanWind0to6km}, m s⁻¹. */
  meanWind0to6kmSpeed: number | null;
  /** Pressure-weighted mean wind of the cloud layer (850–300 hPa, or ground–300 hPa where the ground is above 850 hPa), m s⁻¹. */
  cloudLayerMeanWind: WindVector | null;
  /** Low-level jet: the strongest reported wind from the ground to 1.5 km, m s⁻¹. */
  lowLevelJet: WindVector | null;
  /** Corfidi upwind propagation vector: cloud-layer mean wind minus low-level jet, m s⁻¹ (Corfidi2003). */
  corfidiUpwind: WindVector | null;
  corfidiUpwindSpeed: number | null;
  /** Corfidi downwind propagation vector: cloud-layer mean wind plus the upwind vector, m s⁻¹ (Corfidi2003). */
  corfidiDownwind: WindVector | null;
  corfidiDownwindSpeed: number | null;
  /** Warm-cloud depth: freezing level minus mixed-layer LCL height, m (≥ 0) (DoswellBrooksMaddox1996). */
  warmCloudDepth: number | null;
}

/** Depth of the layer of 0–500 m SRH and of the critical angle's shear, m (Coffer2019; EsterheldGiuliano2008). */
export const LOW_LEVEL_LAYER_M = 500;
/** The hail-growth layer lies between these environmental temperatures, °C (JohnsonSugden2014, from memory). */
export const HAIL_ZONE_WARM_C = -10;
export const HAIL_ZONE_COLD_C = -30;
/** The Corfidi cloud layer, hPa (Corfidi2003, from memory of its 850–300 hPa mean wind). */
export const CLOUD_LAYER_BOTTOM_HPA = 850;
export const CLOUD_LAYER_TOP_HPA = 300;
/** The low-level jet is searched from the ground to this height, m (our choice, stated in docs/analysis.md). */
export const LOW_LEVEL_JET_TOP_M = 1500;

const speed = (vector: WindVector | null): number | null => (vector ? Math.hypot(vector.u, vector.v) : null);

/**
 * Critical angle: the angle between the storm-relative wind at the ground and the 0–500 m
 * shear vector.
 * @param surfaceWind - wind at the ground, m s⁻¹
 * @param wind500m - wind at 500 m above ground, m s⁻¹
 * @param storm - storm motion, m s⁻¹
 * @returns degrees in 0..180 (90: the inflow is purely streamwise), or null when either
 *   vector is shorter than 1 mm s⁻¹ (no direction)
 * @example criticalAngle({u: 0, v: 0}, {u: 5, v: 0}, {u: 0, v: -10}) // → 90
 * Notes: θ = acos(((V₀ − C)·(V₅₀₀ − V₀)) / (|V₀ − C| |V₅₀₀ − V₀|)) (EsterheldGiuliano2008).
 */
export function criticalAngle(surfaceWind: WindVector, wind500m: WindVector, storm: WindVector): number | null {
  const iu = surfaceWind.u - storm.u;
  const iv = surfaceWind.v - storm.v;
  const su = wind500m.u - surfaceWind.u;
  const sv = wind500m.v - surfaceWind.v;
  const inflow = Math.hypot(iu, iv);
  const shear = Math.hypot(su, sv);
  if (!(inflow > 1e-3 && shear > 1e-3)) return null;
  const cosine = Math.min(1, Math.max(-1, (iu * su + iv * sv) / (inflow * shear)));
  return (Math.acos(cosine) * 180) / Math.PI;
}

/**
 * Corfidi propagation vectors of mesoscale convective systems.
 * @param cloudLayerMean - mean wind of the cloud layer, m s⁻¹
 * @param lowLevelJet - low-level jet, m s⁻¹
 * @returns `{upwind, downwind}`, m s⁻¹
 * @example corfidiVectors({u: 20, v: 0}, {u: 0, v: 15}) // → upwind (20, −15), downwind (40, −15)
 * Notes: upwind V_up = V_CL − V_LLJ (the system's propagation against the inflow, added to
 * the cells' advection by the cloud-layer wind); downwind V_down = V_CL + V_up (Corfidi2003).
 */
export function corfidiVectors(cloudLayerMean: WindVector, lowLevelJet: WindVector): { upwind: WindVector; downwind: WindVector } {
  const upwind = { u: cloudLayerMean.u - lowLevelJet.u, v: cloudLayerMean.v - lowLevelJet.v };
  return { upwind, downwind: { u: cloudLayerMean.u + upwind.u, v: cloudLayerMean.v + upwind.v } };
}

/**
 * Warm-cloud depth: the depth of cloud warmer than 0 °C, from cloud base to the freezing level.
 * @param lclHeightM - cloud base (LCL) above ground, m
 * @param freezingLevelM - 0 °C level above ground, m
 * @returns m (0 when the cloud base is at or above the freezing level); null when either is missing
 * @example warmCloudDepth(1000, 4200) // → 3200
 * Notes: the ingredients approach to flash floods (DoswellBrooksMaddox1996): deep warm cloud
 * favours efficient warm-rain growth, hence heavy rain.
 */
export function warmCloudDepth(lclHeightM: number | null, freezingLevelM: number | null): number | null {
  if (lclHeightM === null || freezingLevelM === null) return null;
  return Math.max(0, freezingLevelM - lclHeightM);
}

/**
 * Positive area of a piecewise-linear buoyancy profile: ∫ max(B, 0) dz, trapezoid rule with
 * the zero crossings interpolated.
 * @param heightsM - heights, m (increasing)
 * @param buoyancies - buoyancy at each height, m s⁻²
 * @returns J kg⁻¹ (≥ 0)
 * @example positiveArea([0, 1000], [0.1, 0.1]) // → 100
 */
export function positiveArea(heightsM: readonly number[], buoyancies: readonly number[]): number {
  let sum = 0;
  for (let i = 0; i + 1 < heightsM.length; i++) {
    const za = heightsM[i] as number;
    const zb = heightsM[i + 1] as number;
    const ba = buoyancies[i] as number;
    const bb = buoyancies[i + 1] as number;
    if (ba >= 0 && bb >= 0) sum += 0.5 * (ba + bb) * (zb - za);
    else if (ba > 0 || bb > 0) {
      const zx = za + (ba / (ba - bb)) * (zb - za);
      sum += ba > 0 ? 0.5 * ba * (zx - za) : 0.5 * bb * (zb - zx);
    }
  }
  return sum;
}

/**
 * Lowest height above ground, at or above `fromM`, where the environmental temperature falls to
 * `thresholdK` going up (`fromM` itself when it is already as cold there).
 * @returns m, or NaN when the data never get that cold
 */
function coolingCrossingHeight(profile: Profile, thresholdK: number, fromM: number): number {
  const z = profile.heightAglM;
  const t = profile.temperatureK;
  const start = valueAtHeight(profile, t, fromM);
  if (!Number.isFinite(start)) return NaN;
  if (start <= thresholdK) return fromM;
  let previousZ = fromM;
  let previousT = start;
  for (let k = 0; k < profile.count; k++) {
    const zk = z[k] as number;
    if (zk <= fromM) continue;
    const tk = t[k] as number;
    if (tk <= thresholdK) return previousZ + ((previousT - thresholdK) / (previousT - tk)) * (zk - previousZ);
    previousZ = zk;
    previousT = tk;
  }
  return NaN;
}

/**
 * CAPE of a parcel between two heights: the positive buoyancy it has between them, counted
 * only inside its LFC–EL layer (the layer its CAPE comes from).
 * @param profile - the prepared environment
 * @param start - the parcel's start (pressure, temperature, mixing ratio)
 * @param parcel - the parcel's ascent (its LFC and EL bound the layer)
 * @param bottomM - bottom of the layer above ground, m
 * @param topM - top of the layer above ground, m
 * @returns J kg⁻¹ (≥ 0); 0 without an LFC
 * Notes: the parcel follows the engine's ascent (dry adiabat with conserved mixing ratio to the
 * Bolton1980 eq. 15 LCL, then the pseudo-adiabat table); buoyancy g (Tᵥ,p − Tᵥ,e)/Tᵥ,e with
 * the virtual-temperature correction (DoswellRasmussen1994), at the layer's ends and at every
 * level inside it.
 */
export function parcelCapeInLayer(profile: Profile, start: ParcelStart, parcel: ParcelResult, bottomM: number, topM: number): number {
  if (parcel.lfcHeight === null) return 0;
  const top = Math.min(topM, parcel.elHeight ?? (profile.heightAglM[profile.count - 1] as number));
  const bottom = Math.max(bottomM, parcel.lfcHeight);
  if (!(top > bottom)) return 0;
  const w0 = Math.max(start.mixingRatio, 1e-7);
  const dewpoint = Math.min(dewpointFromMixingRatio(w0, start.pressureHpa), start.temperatureK);
  const lclT = lclTemperature(start.temperatureK, dewpoint);
  const lclLogPressure = Math.log(start.pressureHpa) + Math.log(lclT / start.temperatureK) / KAPPA;
  const theta = start.temperatureK * Math.pow(1000 / start.pressureHpa, KAPPA);
  const table = pseudoAdiabatTable();
  const thetaW = table.thetaW(lclT, lclLogPressure);
  const buoyancyAt = (heightM: number): number => {
    const pressure = pressureAtHeight(profile, heightM);
    const logPressure = Math.log(pressure);
    let parcelVirtual: number;
    if (logPressure >= lclLogPressure) {
      parcelVirtual = ((theta * Math.pow(pressure / 1000, KAPPA)) * (w0 + EPSILON)) / (EPSILON * (1 + w0));
    } else {
      const temperature = table.temperature(thetaW, logPressure);
      const es = saturationVaporPressure(temperature);
      const ws = (EPSILON * es) / (pressure - es);
      parcelVirtual = (temperature * (ws + EPSILON)) / (EPSILON * (1 + ws));
    }
    const environment = valueAtHeight(profile, profile.virtualTemperatureK, heightM);
    return (GRAVITY * (parcelVirtual - environment)) / environment;
  };
  const heights = [bottom];
  for (let k = 0; k < profile.count; k++) {
    const zk = profile.heightAglM[k] as number;
    if (zk > bottom && zk < top) heights.push(zk);
  }
  heights.push(top);
  const area = positiveArea(heights, heights.map(buoyancyAt));
  return Number.isFinite(area) ? area : 0;
}

/** Lapse rate between two points, K km⁻¹ (positive when it cools upward); NaN when a point is missing. */
function lapseRate(lowerT: number, upperT: number, lowerZ: number, upperZ: number): number {
  return upperZ > lowerZ ? ((lowerT - upperT) / (upperZ - lowerZ)) * 1000 : NaN;
}

/** What {@link analyzeIngredients} reads from the rest of the analysis. */
export interface IngredientsInputs {
  mixedLayer: ParcelResult;
  mostUnstable: ParcelResult;
  /** The most-unstable parcel's start (its level's temperature and mixing ratio). */
  mostUnstableStart: ParcelStart;
  environment: EnvironmentAnalysis;
  kinematics: KinematicsAnalysis;
}

/**
 * Compute the hazard ingredients of a sounding.
 * @param profile - the prepared environment
 * @param inputs - parcels, environment and kinematics already computed
 * @returns {@link IngredientsAnalysis}: numbers or null, never NaN
 */
export function analyzeIngredients(profile: Profile, inputs: IngredientsInputs): IngredientsAnalysis {
  const { mixedLayer, mostUnstable, environment, kinematics } = inputs;
  const points = windPoints(profile);
  const storm = kinematics.stormMotionDeviant;

  // Tornado: 0–500 m SRH of the deviant mover (left mover south of the equator) and critical angle.
  const surfaceWind = windAtHeight(points, 0);
  const wind500m = windAtHeight(points, LOW_LEVEL_LAYER_M);
  const srh0to500m = storm ? layerHelicity(points, 0, LOW_LEVEL_LAYER_M, storm) : null;
  const angle = storm && surfaceWind && wind500m ? criticalAngle(surfaceWind, wind500m, storm) : null;
  const gap = mixedLayer.lfcHeight !== null && mixedLayer.lclHeight !== null ? Math.max(0, mixedLayer.lfcHeight - mixedLayer.lclHeight) : null;

  // Lapse rates.
  const t = profile.temperatureK;
  const lapse3to6 = lapseRate(valueAtHeight(profile, t, 3000), valueAtHeight(profile, t, 6000), 3000, 6000);
  const lapse850to500 = lapseRate(valueAtPressure(profile, t, 850), valueAtPressure(profile, t, 500), heightAtPressure(profile, 850), heightAtPressure(profile, 500));

  // Hail: MU CAPE between the −10 °C and −30 °C environmental levels.
  const minus10 = coolingCrossingHeight(profile, ZERO_CELSIUS_K + HAIL_ZONE_WARM_C, 0);
  const minus30 = Number.isFinite(minus10) ? coolingCrossingHeight(profile, ZERO_CELSIUS_K + HAIL_ZONE_COLD_C, minus10) : NaN;
  const hailCape = Number.isFinite(minus10) && Number.isFinite(minus30) ? parcelCapeInLayer(profile, inputs.mostUnstableStart, mostUnstable, minus10, minus30) : NaN;

  // Damaging wind and system motion.
  const meanWind0to6km = pressureWeightedMeanWind(profile, points, 0, 6000);
  const surfacePressure = profile.pressureHpa[0] as number;
  const cloudBottom = surfacePressure > CLOUD_LAYER_BOTTOM_HPA ? heightAtPressure(profile, CLOUD_LAYER_BOTTOM_HPA) : 0;
  const cloudTop = heightAtPressure(profile, CLOUD_LAYER_TOP_HPA);
  const cloudLayerMeanWind = Number.isFinite(cloudBottom) && Number.isFinite(cloudTop) ? pressureWeightedMeanWind(profile, points, cloudBottom, cloudTop) : null;
  const jet = strongestWindBelow(points, LOW_LEVEL_JET_TOP_M);
  const lowLevelJet = jet ? { u: jet.u, v: jet.v } : null;
  const corfidi = cloudLayerMeanWind && lowLevelJet ? corfidiVectors(cloudLayerMeanWind, lowLevelJet) : null;

  return {
    srh0to500m: srh0to500m === null ? null : finiteOrNull(srh0to500m),
    criticalAngleDeg: angle === null ? null : finiteOrNull(angle),
    mlLclLfcGap: gap === null ? null : finiteOrNull(gap),
    lapseRate3to6km: finiteOrNull(lapse3to6),
    lapseRate850to500hPa: finiteOrNull(lapse850to500),
    minus10CHeight: finiteOrNull(minus10),
    minus30CHeight: finiteOrNull(minus30),
    muCapeHailZone: finiteOrNull(hailCape),
    bulkShear0to8km: bulkWindDifference(points, 0, 8000),
    meanWind0to6km,
    meanWind0to6kmSpeed: speed(meanWind0to6km),
    cloudLayerMeanWind,
    lowLevelJet,
    corfidiUpwind: corfidi ? corfidi.upwind : null,
    corfidiUpwindSpeed: speed(corfidi ? corfidi.upwind : null),
    corfidiDownwind: corfidi ? corfidi.downwind : null,
    corfidiDownwindSpeed: speed(corfidi ? corfidi.downwind : null),
    warmCloudDepth: warmCloudDepth(mixedLayer.lclHeight, environment.freezingLevelHeight),
  };
}
