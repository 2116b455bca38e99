import type { KinematicsAnalysis } from './kinematics';
import type { ParcelResult } from './parcel';

/** Composite parameters (dimensionless); null when an ingredient is missing. */
export interface CompositesAnalysis {
  /** Supercell composite parameter, effective-layer form (Thompson2007). */
  supercellComposite: number | null;
  /** Supercell composite parameter, fixed-layer form with BRN shear (Thompson2003). */
  supercellCompositeFixedLayer: number | null;
  /** Significant tornado parameter, effective-layer form (Thompson2012). */
  significantTornado: number | null;
  /** Significant tornado parameter, fixed-layer form (Thompson2012). */
  significantTornadoFixedLayer: number | null;
}

const clamp = (value: number, low: number, high: number): number => Math.min(high, Math.max(low, value));

/**
 * Supercell composite parameter, effective-layer form.
 * @param muCape - most-unstable CAPE, J kg⁻¹
 * @param effectiveSrh - effective storm-relative helicity, m² s⁻²
 * @param effectiveBulkShear - effective bulk wind difference, m s⁻¹
 * @returns SCP (dimensionless)
 * @example supercellComposite(2000, 150, 25) // → 6
 * Notes: SCP = (muCAPE/1000) (ESRH/50) (EBWD/20), the EBWD term 0 below 10 m s⁻¹ and 1
 * above 20 m s⁻¹. Source: Thompson2007 pg. 110 (the 2004 preprint form, published there).
 */
export function supercellComposite(muCape: number, effectiveSrh: number, effectiveBulkShear: number): number {
  const shearTerm = effectiveBulkShear < 10 ? 0 : Math.min(1, effectiveBulkShear / 20);
  return (muCape / 1000) * (effectiveSrh / 50) * shearTerm;
}

/**
 * Supercell composite parameter, fixed-layer form.
 * @param muCape - most-unstable CAPE, J kg⁻¹
 * @param srh0to3km - 0–3 km storm-relative helicity, m² s⁻²
 * @param brnShear - bulk Richardson number shear, m² s⁻²
 * @returns SCP (dimensionless)
 * @example supercellCompositeFixedLayer(2000, 200, 40) // → 4
 * Notes: SCP = (MUCAPE/1000)(SRH₀₋₃/100)(BRN shear/40). Source: Thompson2003 eq. 1.
 */
export function supercellCompositeFixedLayer(muCape: number, srh0to3km: number, brnShear: number): number {
  return (muCape / 1000) * (srh0to3km / 100) * (brnShear / 40);
}

/**
 * Significant tornado parameter, fixed-layer form.
 * @param sbCape - surface-based CAPE, J kg⁻¹
 * @param sbLclHeight - surface-based LCL height above ground, m
 * @param srh0to1km - 0–1 km storm-relative helicity, m² s⁻²
 * @param bulkShear0to6km - 0–6 km bulk wind difference, m s⁻¹
 * @returns STP (dimensionless)
 * @example significantTornadoFixedLayer(1500, 1000, 150, 20) // → 1
 * Notes: STP = (sbCAPE/1500)((2000 − sbLCL)/1000)(SRH₁/150)(BWD₆/20); the LCL term is 1
 * below 1000 m and 0 above 2000 m; the BWD₆ term is 0 below 12.5 m s⁻¹ and capped at 1.5
 * above 30 m s⁻¹. Source: Thompson2012 pg. 1139 (fixed-layer STP).
 */
export function significantTornadoFixedLayer(sbCape: number, sbLclHeight: number, srh0to1km: number, bulkShear0to6km: number): number {
  const lclTerm = clamp((2000 - sbLclHeight) / 1000, 0, 1);
  const shearTerm = bulkShear0to6km < 12.5 ? 0 : Math.min(1.5, bulkShear0to6km / 20);
  return (sbCape / 1500) * lclTerm * (srh0to1km / 150) * shearTerm;
}

/**
 * Significant tornado parameter, effective-layer form.
 * @param mlCape - mixed-layer CAPE, J kg⁻¹
 * @param mlLclHeight - mixed-layer LCL height above ground, m
 * @param effectiveSrh - effective storm-relative helicity, m² s⁻²
 * @param effectiveBulkShear - effective bulk wind difference, m s⁻¹
 * @param mlCin - mixed-layer CIN, J kg⁻¹ (≤ 0)
 * @returns STP (dimensionless)
 * @example significantTornado(1500, 1000, 150, 20, 0) // → 1
 * Notes: STP = (mlCAPE/1500)(ESRH/150)(EBWD/20)((2000 − mlLCL)/1000)((200 + mlCIN)/150);
 * the EBWD term is 0 below 12.5 m s⁻¹ and capped at 1.5 above 30 m s⁻¹; the LCL term is 1
 * below 1000 m and 0 above 2000 m; the CIN term is 1 above −50 J kg⁻¹ and 0 below
 * −200 J kg⁻¹. Source: Thompson2012 pg. 1139 (effective-layer STP).
 */
export function significantTornado(mlCape: number, mlLclHeight: number, effectiveSrh: number, effectiveBulkShear: number, mlCin: number): number {
  const shearTerm = effectiveBulkShear < 12.5 ? 0 : Math.min(1.5, effectiveBulkShear / 20);
  const lclTerm = clamp((2000 - mlLclHeight) / 1000, 0, 1);
  const cinTerm = clamp((200 + mlCin) / 150, 0, 1);
  return (mlCape / 1500) * (effectiveSrh / 150) * shearTerm * lclTerm * cinTerm;
}

/**
 * All composite parameters of an analysis.
 * @returns {@link CompositesAnalysis}; a value is null when an ingredient is null
 */
export function analyzeComposites(
  parcels: { surfaceBased: ParcelResult; mixedLayer: ParcelResult; mostUnstable: ParcelResult },
  kinematics: KinematicsAnalysis,
): CompositesAnalysis {
  const { surfaceBased, mixedLayer, mostUnstable } = parcels;
  // South of the equator the cyclonic (left) mover has negative helicity; the composites take
  // the helicity of the cyclonic mover with its sign turned so supportive values stay positive
  // in both hemispheres (docs/analysis.md).
  const sign = kinematics.deviantMover === 'left' ? -1 : 1;
  const k = {
    ...kinematics,
    effectiveSrh: kinematics.effectiveSrh === null ? null : sign * kinematics.effectiveSrh,
    srh0to3km: kinematics.srh0to3km === null ? null : sign * kinematics.srh0to3km,
    srh0to1km: kinematics.srh0to1km === null ? null : sign * kinematics.srh0to1km,
  };
  return {
    supercellComposite:
      k.effectiveSrh !== null && k.effectiveBulkShear !== null ? supercellComposite(mostUnstable.cape, k.effectiveSrh, k.effectiveBulkShear) : null,
    supercellCompositeFixedLayer:
      k.srh0to3km !== null && k.brnShear !== null ? supercellCompositeFixedLayer(mostUnstable.cape, k.srh0to3km, k.brnShear) : null,
    significantTornado:
      k.effectiveSrh !== null && k.effectiveBulkShear !== null && mixedLayer.lclHeight !== null
        ? significantTornado(mixedLayer.cape, mixedLayer.lclHeight, k.effectiveSrh, k.effectiveBulkShear, mixedLayer.cin)
        : null,
    significantTornadoFixedLayer:
      k.srh0to1km !== null && k.bulkShear0to6km !== null && surfaceBased.lclHeight !== null
        ? significantTornadoFixedLayer(surfaceBased.cape, surfaceBased.lclHeight, k.srh0to1km, k.bulkShear0to6km)
        : null,
  };
}
