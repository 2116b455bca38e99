import { describe, expect, it } from 'vitest';
import { bulkWindDifference, layerHelicity, pressureWeightedMeanWind, strongestWindBelow, windAtHeight, windPoints } from './ingredients-wind';
import { buildProfile } from './profile';
import { weismanKlempSounding } from './testing/weisman-klemp';
import type { SoundingLevel } from './types';

/** Weisman–Klemp thermodynamics (levels every 50 m) with winds chosen per level. */
function withWinds(wind: (level: SoundingLevel) => { u: number; v: number } | null): SoundingLevel[] {
  return weismanKlempSounding(0.014, 50).map((level) => {
    const w = wind(level);
    return { ...level, uMs: w ? w.u : null, vMs: w ? w.v : null };
  });
}

describe('hodograph helpers', () => {
  // u grows 4 m/s per km up to 10 km, v = 0 (a straight hodograph).
  const straight = buildProfile(withWinds((level) => ({ u: 0.004 * Math.min(level.heightM, 10000), v: 0 })));
  const points = windPoints(straight);

  it('0–8 km bulk shear of a straight hodograph is 4 m/s per km × 8 km = 32 m/s (hand calculation)', () => {
    expect(bulkWindDifference(points, 0, 8000)).toBeCloseTo(32, 9);
  });

  it('0–500 m SRH is twice the triangle the storm-relative winds sweep: 2 · ½ · 2 m/s · 7.5 m/s = 15 m²/s² (DaviesJones1990, hand calculation)', () => {
    // Storm 7.5 m/s to the right (south) of the hodograph: the storm-relative winds from the
    // ground (0 − cx, 7.5) to 500 m (2 − cx, 7.5) sweep a triangle of base 2 m/s and height 7.5 m/s.
    expect(layerHelicity(points, 0, 500, { u: 10, v: -7.5 })).toBeCloseTo(15, 9);
    // The mirror image (storm to the left) gives the opposite sign.
    expect(layerHelicity(points, 0, 500, { u: 10, v: 7.5 })).toBeCloseTo(-15, 9);
  });

  it('winds that stop below the top of a layer give null, never NaN', () => {
    const short = windPoints(buildProfile(withWinds((level) => (level.heightM <= 5000 ? { u: 1, v: 2 } : null))));
    expect(bulkWindDifference(short, 0, 8000)).toBeNull();
    expect(layerHelicity(short, 0, 8000, { u: 0, v: 0 })).toBeNull();
    expect(windAtHeight(short, 5000)).toEqual({ u: 1, v: 2 });
    expect(windAtHeight(short, 5001)).toBeNull();
  });

  it('the pressure-weighted mean of a wind linear in pressure is its value at the mid-layer pressure (hand calculation)', () => {
    // u = 0.1 m/s per hPa of (1000 − p): ∫u dp / ∫dp over [p₆, 1000] = 0.1 (1000 − p₆)/2, exact for
    // the trapezoid rule because u is linear in p. The Weisman–Klemp levels are 50 m apart, so 6 km is a level.
    const levels = withWinds((level) => ({ u: 0.1 * (1000 - level.pressureHpa), v: 3 }));
    const at6km = levels.find((level) => level.heightM === 6000);
    if (!at6km) throw new Error('the test sounding has a level at 6 km');
    const mean = pressureWeightedMeanWind(buildProfile(levels), windPoints(buildProfile(levels)), 0, 6000);
    expect(mean?.u).toBeCloseTo((0.1 * (1000 - at6km.pressureHpa)) / 2, 6);
    expect(mean?.v).toBeCloseTo(3, 9);
  });

  it('the low-level jet is the strongest reported wind up to the given height', () => {
    const jet = windPoints(buildProfile(withWinds((level) => (level.heightM === 600 ? { u: 0, v: 25 } : { u: 20, v: 0 }))));
    expect(strongestWindBelow(jet, 1500)).toEqual({ u: 0, v: 25, heightM: 600 });
    expect(strongestWindBelow(jet, 500)).toEqual({ u: 20, v: 0, heightM: 0 });
  });

  it('when the lowest level has no wind, the lowest reported wind stands in at the ground (as in the kinematics)', () => {
    const profile = buildProfile(withWinds((level) => (level.heightM < 200 ? null : { u: 7, v: -1 })));
    const stand = windPoints(profile);
    expect(stand.height[0]).toBe(0);
    expect(windAtHeight(stand, 0)).toEqual({ u: 7, v: -1 });
  });
});
