import { describe, expect, it } from 'vitest';
import { analyzeKinematics, effectiveInflowLayer } from './kinematics';
import { effectiveWork, liftParcelOnProfile, levelStart, mostUnstableLevelIndex } from './parcel';
import { buildProfile } from './profile';
import { buildSounding } from './testing/random-sounding';
import { weismanKlempSounding } from './testing/weisman-klemp';
import type { SoundingLevel } from './types';

/** Weisman–Klemp thermodynamics with a straight-line hodograph: u = 5 m/s per km to 6 km, then constant. */
function straightHodograph(): SoundingLevel[] {
  return weismanKlempSounding(0.014, 250).map((level) => ({ ...level, uMs: Math.min(level.heightM, 6000) * 0.005, vMs: 0 }));
}

function kinematicsOf(levels: SoundingLevel[]) {
  const profile = buildProfile(levels);
  const mostUnstable = liftParcelOnProfile(profile, levelStart(profile, mostUnstableLevelIndex(profile)));
  return analyzeKinematics(profile, mostUnstable);
}

describe('kinematics on a straight-line hodograph (analytic values)', () => {
  const k = kinematicsOf(straightHodograph());

  it('bulk shear is |V(top) − V(0)|: 5, 15 and 30 m/s over 0–1, 0–3, 0–6 km', () => {
    expect(k.bulkShear0to1km).toBeCloseTo(5, 9);
    expect(k.bulkShear0to3km).toBeCloseTo(15, 9);
    expect(k.bulkShear0to6km).toBeCloseTo(30, 9);
  });

  it('Bunkers right mover is the 0–6 km mean wind plus 7.5 m/s to the right of the shear (Bunkers2000 eq. 1)', () => {
    // Mean wind 15 m/s toward east; shear toward east, so "right" is toward south.
    expect(k.meanWind0to6km?.u).toBeCloseTo(15, 9);
    expect(k.stormMotionRight?.u).toBeCloseTo(15, 9);
    expect(k.stormMotionRight?.v).toBeCloseTo(-7.5, 9);
    expect(k.stormMotionLeft?.v).toBeCloseTo(7.5, 9);
  });

  it('SRH is twice the area swept by the storm-relative winds: 37.5 and 112.5 m²/s² (DaviesJones1990)', () => {
    // Triangle with base ΔV and height 7.5 m/s: SRH = 2 · ½ · ΔV · 7.5.
    expect(k.srh0to1km).toBeCloseTo(37.5, 6);
    expect(k.srh0to3km).toBeCloseTo(112.5, 6);
  });

  it('BRN shear is ½ ΔV² of the density-weighted 0–6 km and 0–0.5 km mean winds (WeismanKlemp1982 eq. 3)', () => {
    expect(k.brnShear).toBeGreaterThan(0.5 * (15 - 1.25) ** 2 * 0.5);
    expect(k.brnShear).toBeLessThan(0.5 * (15 - 1.25) ** 2);
  });
});

describe('kinematics with missing winds', () => {
  it('winds that stop below 6 km give null 0–6 km shear, storm motion and SRH, but keep 0–1 km shear', () => {
    const levels = straightHodograph().map((level) => (level.heightM > 5000 ? { ...level, uMs: null, vMs: null } : level));
    const k = kinematicsOf(levels);
    expect(k.bulkShear0to1km).toBeCloseTo(5, 9);
    expect(k.bulkShear0to6km).toBeNull();
    expect(k.stormMotionRight).toBeNull();
    expect(k.srh0to1km).toBeNull();
    expect(k.effectiveSrh).toBeNull();
  });

  it('no winds at all: every wind value is null, never NaN', () => {
    const k = kinematicsOf(straightHodograph().map((level) => ({ ...level, uMs: null, vMs: null })));
    expect(k.bulkShear0to1km).toBeNull();
    expect(k.meanWind0to6km).toBeNull();
    expect(JSON.stringify(k)).not.toMatch(/NaN/);
  });
});

describe('effective inflow layer (Thompson2007)', () => {
  it('starts at the ground for the Weisman–Klemp sounding, whose surface parcel has CAPE ≥ 100 and CIN ≥ −250', () => {
    const k = kinematicsOf(straightHodograph());
    expect(k.effectiveInflowLayer?.bottomHeight).toBe(0);
    expect(k.effectiveInflowLayer?.topHeight).toBeGreaterThan(0);
    expect(k.effectiveSrh).toBeGreaterThan(0);
  });

  it('lifts a bounded number of parcels however dense the sounding (work linear in levels)', () => {
    // The same warm-season profile at 250, 1000 and 4000 levels: a moist, conditionally
    // unstable lower troposphere, so the layer is several candidates deep.
    for (const count of [250, 1000, 4000]) {
      const levels = buildSounding({
        surfacePressureHpa: 1000,
        surfaceTemperatureC: 28,
        surfaceDewpointDepressionK: 3,
        lapseRatesKPerKm: Array.from({ length: count - 1 }, (_, i) => (i < 0.8 * count ? 7.5 : -1)),
        dewpointDepressionsK: Array.from({ length: count - 1 }, (_, i) => Math.min(30, 3 + (i * 40) / count)),
        windSpeedsMs: Array.from({ length: count }, () => 10),
      });
      const profile = buildProfile(levels);
      const before = { ...effectiveWork };
      const layer = effectiveInflowLayer(profile);
      expect(layer?.bottomHeight).toBe(0);
      // A parcel from every level of the lowest 300 hPa would be hundreds of parcels here.
      expect(effectiveWork.parcels - before.parcels).toBeLessThanOrEqual(130);
      // Each parcel stops at its decision: the levels passed stay a small multiple of the count.
      expect(effectiveWork.levels - before.levels).toBeLessThanOrEqual(15 * count);
    }
  });
});

