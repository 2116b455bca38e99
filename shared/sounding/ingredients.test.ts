import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeSounding } from './analyze';
import { GRAVITY, RD, ZERO_CELSIUS_K } from './constants';
import { corfidiVectors, criticalAngle, parcelCapeInLayer, positiveArea, warmCloudDepth } from './ingredients';
import { levelStart, liftParcelOnProfile, mostUnstableLevelIndex } from './parcel';
import { buildProfile } from './profile';
import { buildSounding, oddSoundingRecipe, soundingRecipe } from './testing/random-sounding';
import { weismanKlempSounding } from './testing/weisman-klemp';
import type { SoundingLevel } from './types';

/**
 * A sounding with temperature piecewise linear in height (levels every 250 m to 16 km), so
 * lapse rates and crossing heights can be worked out by hand. Pressure from the hypsometric
 * equation with the layer-mean temperature (WallaceHobbs2006 eq. 3.29).
 */
function lapseSounding(options: { surfaceC: number; surfaceHpa?: number; lapse: (heightM: number) => number; depression?: (heightM: number) => number }): SoundingLevel[] {
  const levels: SoundingLevel[] = [];
  let pressure = options.surfaceHpa ?? 1000;
  let temperature = options.surfaceC;
  for (let z = 0; z <= 16000; z += 250) {
    if (z > 0) {
      const next = Math.max(-70, temperature - (options.lapse(z - 125) * 250) / 1000);
      pressure *= Math.exp((-GRAVITY * 250) / (RD * (0.5 * (temperature + next) + ZERO_CELSIUS_K)));
      temperature = next;
    }
    const depression = options.depression ? options.depression(z) : 10 + z / 1000;
    levels.push({ pressureHpa: pressure, heightM: z, temperatureC: temperature, dewpointC: temperature - depression, uMs: 5, vMs: 5 });
  }
  return levels;
}

/** Weisman–Klemp thermodynamics (levels every `step` m) with winds chosen by height. */
function wkWithWinds(step: number, wind: (heightM: number) => { u: number; v: number } | null): SoundingLevel[] {
  return weismanKlempSounding(0.014, step).map((level) => {
    const w = wind(level.heightM);
    return { ...level, uMs: w ? w.u : null, vMs: w ? w.v : null };
  });
}

describe('critical angle (EsterheldGiuliano2008), worked by hand', () => {
  const ground = { u: 0, v: 0 };
  const shear = { u: 5, v: 0 }; // 0–500 m shear toward east

  it('storm 10 m/s south of the ground wind: inflow toward north, 90° to the shear (purely streamwise)', () => {
    expect(criticalAngle(ground, shear, { u: 0, v: -10 })).toBeCloseTo(90, 9);
  });

  it('inflow along the shear gives 0°, against it 180°, and (10, 10) against (5, 0) gives 45°', () => {
    expect(criticalAngle(ground, shear, { u: -10, v: 0 })).toBeCloseTo(0, 6);
    expect(criticalAngle(ground, shear, { u: 10, v: 0 })).toBeCloseTo(180, 6);
    expect(criticalAngle(ground, shear, { u: -10, v: -10 })).toBeCloseTo(45, 9);
  });

  it('no shear or no storm-relative inflow: no direction, null', () => {
    expect(criticalAngle(ground, ground, { u: 0, v: -10 })).toBeNull();
    expect(criticalAngle(ground, shear, ground)).toBeNull();
  });
});

describe('Corfidi vectors (Corfidi2003), worked by hand', () => {
  it('cloud-layer wind (20, 0) and low-level jet (0, 25): upwind (20, −25) at √1025 = 32.02 m/s, downwind (40, −25) at √2225 = 47.17 m/s', () => {
    const { upwind, downwind } = corfidiVectors({ u: 20, v: 0 }, { u: 0, v: 25 });
    expect(upwind).toEqual({ u: 20, v: -25 });
    expect(downwind).toEqual({ u: 40, v: -25 });
  });

  it('in the analysis: a westerly 20 m/s above 900 m over a 25 m/s southerly jet at 300–900 m gives those vectors', () => {
    // 850 hPa lies near 1.4 km in this sounding, so every wind of the 850–300 hPa layer is (20, 0).
    const levels = wkWithWinds(50, (z) => (z < 300 ? { u: 0, v: 5 } : z <= 900 ? { u: 0, v: 25 } : { u: 20, v: 0 }));
    const ingredients = analyzeSounding(levels).ingredients;
    expect(ingredients.cloudLayerMeanWind?.u).toBeCloseTo(20, 9);
    expect(ingredients.cloudLayerMeanWind?.v).toBeCloseTo(0, 9);
    expect(ingredients.lowLevelJet).toEqual({ u: 0, v: 25 });
    expect(ingredients.corfidiUpwindSpeed).toBeCloseTo(32.0156, 4);
    expect(ingredients.corfidiDownwindSpeed).toBeCloseTo(47.1699, 4);
    expect(ingredients.corfidiDownwind?.u).toBeCloseTo(40, 9);
  });

  it('winds that stop below 300 hPa give no Corfidi vectors (null, never NaN)', () => {
    const levels = wkWithWinds(250, (z) => (z <= 6000 ? { u: 10, v: 10 } : null));
    const ingredients = analyzeSounding(levels).ingredients;
    expect(ingredients.cloudLayerMeanWind).toBeNull();
    expect(ingredients.corfidiUpwind).toBeNull();
    expect(ingredients.corfidiDownwindSpeed).toBeNull();
    expect(ingredients.meanWind0to6kmSpeed).toBeCloseTo(Math.hypot(10, 10), 9);
  });
});

describe('0–500 m SRH (Coffer2019) and critical angle on a straight hodograph', () => {
  // u = 5 m/s per km to 6 km, then constant; v = 0. The 0–6 km mean wind is (15, 0) and the
  // shear points east, so the Bunkers right mover is (15, −7.5) and the left mover (15, 7.5)
  // (Bunkers2000 eq. 1; hand calculation as in kinematics.test.ts).
  const levels = wkWithWinds(250, (z) => ({ u: 0.005 * Math.min(z, 6000), v: 0 }));

  it('north of the equator: SRH = 2 · ½ · 2.5 m/s · 7.5 m/s = 18.75 m²/s² (the triangle the storm-relative winds sweep)', () => {
    expect(analyzeSounding(levels, { latitude: 40 }).ingredients.srh0to500m).toBeCloseTo(18.75, 6);
  });

  it('south of the equator: the left mover, so −18.75 m²/s² (the sign of srh0to1km there)', () => {
    const south = analyzeSounding(levels, { latitude: -35 });
    expect(south.ingredients.srh0to500m).toBeCloseTo(-18.75, 6);
    expect(Math.sign(south.srh0to1km ?? 0)).toBe(-1);
  });

  it('critical angle: inflow (0 − 15, 0 + 7.5) against shear (2.5, 0) is 180° − atan(7.5/15) = 153.43° in both hemispheres', () => {
    expect(analyzeSounding(levels, { latitude: 40 }).ingredients.criticalAngleDeg).toBeCloseTo(153.435, 3);
    expect(analyzeSounding(levels, { latitude: -35 }).ingredients.criticalAngleDeg).toBeCloseTo(153.435, 3);
  });

  it('0–8 km bulk shear is 30 m/s: the wind stops growing at 6 km (hand calculation)', () => {
    expect(analyzeSounding(levels).ingredients.bulkShear0to8km).toBeCloseTo(30, 9);
  });
});

describe('lapse rates and the hail-zone levels on a sounding worked by hand', () => {
  // 9 K/km below 3 km, 6 K/km above: surface 30 °C, 3 km at 3 °C, 6 km at −15 °C.
  const levels = lapseSounding({ surfaceC: 30, lapse: (z) => (z < 3000 ? 9 : 6) });
  const analysis = analyzeSounding(levels);

  it('3–6 km lapse rate is 6 K/km and 0–3 km is 9 K/km (as built)', () => {
    expect(analysis.ingredients.lapseRate3to6km).toBeCloseTo(6, 9);
    expect(analysis.environment.lapseRate0to3km).toBeCloseTo(9, 9);
  });

  it('850–500 hPa lapse rate lies between 9 and 6 K/km (850 hPa near 1.5 km is in the 9 K/km layer, 500 hPa above 3 km)', () => {
    const z850 = levels.findIndex((level) => level.pressureHpa < 850) * 250;
    const z500 = levels.findIndex((level) => level.pressureHpa < 500) * 250;
    // By hand: (9 (3000 − z850) + 6 (z500 − 3000)) / (z500 − z850), the levels bracketing each
    // pressure interpolated; 250 m levels make that within 0.1 K/km of the value at the levels above.
    const expected = (9 * (3000 - z850) + 6 * (z500 - 3000)) / (z500 - z850);
    expect(Math.abs((analysis.ingredients.lapseRate850to500hPa ?? NaN) - expected)).toBeLessThan(0.15);
  });

  it('−10 °C at 3000 + 13/6 km = 5166.7 m and −30 °C at 3000 + 33/6 km = 8500 m (hand calculation)', () => {
    expect(analysis.ingredients.minus10CHeight).toBeCloseTo(5166.667, 2);
    expect(analysis.ingredients.minus30CHeight).toBeCloseTo(8500, 2);
  });

  it('a station above 850 hPa has no 850–500 hPa lapse rate (null)', () => {
    const high = analyzeSounding(lapseSounding({ surfaceC: 25, surfaceHpa: 820, lapse: () => 7 }));
    expect(high.ingredients.lapseRate850to500hPa).toBeNull();
    expect(high.ingredients.lapseRate3to6km).toBeCloseTo(7, 9);
  });
});

describe('CAPE between the −10 °C and −30 °C levels (JohnsonSugden2014, from memory)', () => {
  it('positive area by hand: constant 0.1 m/s² over 1 km is 100 J/kg; −0.05 → 0.15 m/s² over 1 km crosses zero at 250 m and gives ½ · 0.15 · 750 = 56.25 J/kg', () => {
    expect(positiveArea([0, 1000], [0.1, 0.1])).toBeCloseTo(100, 12);
    expect(positiveArea([0, 1000], [-0.05, 0.15])).toBeCloseTo(56.25, 12);
    expect(positiveArea([0, 500, 1000], [0.1, -0.1, 0.1])).toBeCloseTo(2 * 0.5 * 0.1 * 250, 12);
  });

  it('the layers below −10 °C, between −10 and −30 °C and above −30 °C add up to the engine’s own MUCAPE (within 1 %)', () => {
    for (const levels of [weismanKlempSounding(0.014, 100), lapseSounding({ surfaceC: 30, lapse: () => 8, depression: (z) => 3 + z / 1000 })]) {
      const analysis = analyzeSounding(levels);
      const { minus10CHeight, minus30CHeight, muCapeHailZone } = analysis.ingredients;
      if (minus10CHeight === null || minus30CHeight === null || muCapeHailZone === null) throw new Error('both levels exist in these soundings');
      const profile = buildProfile(levels);
      const start = levelStart(profile, mostUnstableLevelIndex(profile));
      const parcel = liftParcelOnProfile(profile, start);
      const below = parcelCapeInLayer(profile, start, parcel, 0, minus10CHeight);
      const above = parcelCapeInLayer(profile, start, parcel, minus30CHeight, 20000);
      expect(analysis.mostUnstable.cape).toBeGreaterThan(500);
      expect(muCapeHailZone).toBeGreaterThan(0);
      expect(Math.abs(below + muCapeHailZone + above - analysis.mostUnstable.cape)).toBeLessThan(0.01 * analysis.mostUnstable.cape);
    }
  });

  it('a parcel with no LFC has 0 J/kg in the hail zone; a sounding that never reaches −30 °C has none (null)', () => {
    const stable = analyzeSounding(lapseSounding({ surfaceC: 20, lapse: () => 4, depression: () => 25 }));
    expect(stable.mostUnstable.lfcHeight).toBeNull();
    expect(stable.ingredients.muCapeHailZone).toBe(0);
    const warm = analyzeSounding(lapseSounding({ surfaceC: 30, lapse: () => 2 }));
    expect(warm.ingredients.minus30CHeight).toBeNull();
    expect(warm.ingredients.muCapeHailZone).toBeNull();
  });
});

describe('LCL–LFC gap of the mixed-layer parcel', () => {
  it('0 m when the parcel is buoyant as soon as it saturates (reasoned by hand)', () => {
    // Dry-adiabatic (9.8 K/km, θ constant) below 3 km, drier upward: the mixed-layer parcel has
    // the environment's θ, so at its LCL its temperature equals the environment's while it holds
    // more vapour (the 100 hPa mean against the drier air there): Tᵥ,parcel > Tᵥ,env, buoyant at the
    // LCL; above it the parcel cools at the moist rate, slower than 9.8 K/km, so it stays buoyant.
    const levels = lapseSounding({ surfaceC: 30, lapse: (z) => (z < 3000 ? 9.8 : 7), depression: (z) => 8 + z / 500 });
    const analysis = analyzeSounding(levels);
    expect(analysis.mixedLayer.lfcHeight).not.toBeNull();
    expect(analysis.ingredients.mlLclLfcGap).toBeCloseTo(0, 6);
  });

  it('null when the mixed-layer parcel never becomes buoyant (no LFC)', () => {
    const stable = analyzeSounding(lapseSounding({ surfaceC: 20, lapse: () => 4, depression: () => 25 }));
    expect(stable.mixedLayer.lfcHeight).toBeNull();
    expect(stable.ingredients.mlLclLfcGap).toBeNull();
  });
});

describe('warm-cloud depth (DoswellBrooksMaddox1996), worked by hand', () => {
  it('cloud base 1000 m under a freezing level at 4200 m: 3200 m of warm cloud', () => {
    expect(warmCloudDepth(1000, 4200)).toBe(3200);
  });

  it('cloud base above the freezing level: no warm cloud (0 m); a missing level: null', () => {
    expect(warmCloudDepth(3000, 2500)).toBe(0);
    expect(warmCloudDepth(null, 2500)).toBeNull();
    expect(warmCloudDepth(1000, null)).toBeNull();
  });
});

describe('ingredients on random and odd soundings (properties)', () => {
  const check = (levels: SoundingLevel[]) => {
    const analysis = analyzeSounding(levels);
    const i = analysis.ingredients;
    expect(JSON.stringify(i)).not.toMatch(/NaN|Infinity/);
    const numbers = Object.values(i).filter((value): value is number => typeof value === 'number');
    expect(numbers.every(Number.isFinite)).toBe(true);
    const within = (value: number | null, low: number, high: number) => value === null || (value >= low && value <= high);
    expect(within(i.criticalAngleDeg, 0, 180), `critical angle ${i.criticalAngleDeg}`).toBe(true);
    expect(within(i.muCapeHailZone, 0, analysis.mostUnstable.cape * 1.02 + 1), `hail-zone CAPE ${i.muCapeHailZone} of ${analysis.mostUnstable.cape}`).toBe(true);
    // The gap exists exactly when the mixed-layer parcel has an LFC.
    expect(i.mlLclLfcGap === null).toBe(analysis.mixedLayer.lfcHeight === null || analysis.mixedLayer.lclHeight === null);
    for (const value of [i.mlLclLfcGap, i.warmCloudDepth, i.bulkShear0to8km, i.meanWind0to6kmSpeed, i.corfidiUpwindSpeed, i.corfidiDownwindSpeed]) {
      expect(within(value, 0, Infinity)).toBe(true);
    }
    // Speeds and vectors are null together.
    expect(i.corfidiUpwind === null).toBe(i.corfidiUpwindSpeed === null);
    expect(i.meanWind0to6km === null).toBe(i.meanWind0to6kmSpeed === null);
  };

  it('random soundings: finite or null, in range', () => {
    fc.assert(fc.property(soundingRecipe(), (recipe) => check(buildSounding(recipe))), { numRuns: 80 });
  });

  it.each(['superadiabatic', 'sparse', 'truncated', 'isothermal', 'saturated'] as const)('odd soundings (%s): finite or null, in range', (kind) => {
    fc.assert(fc.property(oddSoundingRecipe(kind), (recipe) => check(buildSounding(recipe))), { numRuns: 25 });
  });

  it('truncated soundings (top 600–700 hPa) have no 3–6 km or 850–500 hPa lapse rate, no 0–8 km shear and no Corfidi vectors', () => {
    fc.assert(
      fc.property(oddSoundingRecipe('truncated'), (recipe) => {
        const i = analyzeSounding(buildSounding(recipe)).ingredients;
        expect(i.lapseRate850to500hPa).toBeNull();
        expect(i.lapseRate3to6km).toBeNull();
        expect(i.bulkShear0to8km).toBeNull();
        expect(i.corfidiUpwind).toBeNull();
      }),
      { numRuns: 25 },
    );
  });

  it('random soundings without winds: every wind ingredient is null', () => {
    fc.assert(
      fc.property(soundingRecipe(), (recipe) => {
        const levels = buildSounding(recipe).map((level) => ({ ...level, uMs: null, vMs: null }));
        const i = analyzeSounding(levels).ingredients;
        expect([i.srh0to500m, i.criticalAngleDeg, i.bulkShear0to8km, i.meanWind0to6km, i.cloudLayerMeanWind, i.lowLevelJet, i.corfidiUpwind, i.corfidiDownwind]).toEqual([null, null, null, null, null, null, null, null]);
      }),
      { numRuns: 30 },
    );
  });

  it('are the same with levels in reverse order', () => {
    fc.assert(
      fc.property(soundingRecipe(), (recipe) => {
        const levels = buildSounding(recipe);
        expect(analyzeSounding([...levels].reverse()).ingredients).toEqual(analyzeSounding(levels).ingredients);
      }),
      { numRuns: 20 },
    );
  });
});
