import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeSounding } from './analyze';
import { effectiveInflowLayer } from './kinematics';
import { levelStart, liftParcelWithEffectiveDecision, meetsEffectiveInflowCriteria, mostUnstableLevelIndex, surfaceBasedStart } from './parcel';
import { buildProfile } from './profile';
import { buildSounding, soundingRecipe } from './testing/random-sounding';

// The analysis shares work between its parts (docs/analysis.md, "Cost"): these checks compare
// each shortcut with the long way round, so a shortcut that drifts from it fails here.
describe('work shared inside one analysis', () => {
  it('a full ascent gives the same effective-inflow decision as the early-stopping check', () => {
    fc.assert(
      fc.property(soundingRecipe(5, 60), (recipe) => {
        const profile = buildProfile(buildSounding(recipe));
        const surface = liftParcelWithEffectiveDecision(profile, surfaceBasedStart(profile));
        expect(surface.meetsEffectiveCriteria).toBe(meetsEffectiveInflowCriteria(profile, 0));
        const index = mostUnstableLevelIndex(profile);
        const mostUnstable = liftParcelWithEffectiveDecision(buildProfile(buildSounding(recipe)), levelStart(profile, index));
        expect(mostUnstable.meetsEffectiveCriteria).toBe(meetsEffectiveInflowCriteria(buildProfile(buildSounding(recipe)), index));
      }),
      { numRuns: 150, seed: 11 },
    );
  });

  it('the analysis finds the same effective inflow layer as a search that lifts every candidate', () => {
    fc.assert(
      fc.property(soundingRecipe(5, 60), (recipe) => {
        const levels = buildSounding(recipe);
        expect(analyzeSounding(levels).kinematics.effectiveInflowLayer).toEqual(effectiveInflowLayer(buildProfile(levels)));
      }),
      { numRuns: 150, seed: 12 },
    );
  });

  it('an analysis is not changed by the next one (the reused profile storage is not in any result)', () => {
    const recipes = fc.sample(soundingRecipe(5, 60), { numRuns: 20, seed: 13 });
    const first = analyzeSounding(buildSounding(recipes[0] as (typeof recipes)[number]), { trace: true });
    const before = JSON.stringify(first);
    for (const recipe of recipes.slice(1)) analyzeSounding(buildSounding(recipe), { trace: true });
    expect(JSON.stringify(first)).toBe(before);
  });

  it('the most-unstable parcel taken from the surface parcel is its own copy', () => {
    const recipe = fc.sample(soundingRecipe(5, 60), { numRuns: 1, seed: 14 })[0] as Parameters<typeof buildSounding>[0];
    const levels = buildSounding({ ...recipe, surfaceDewpointDepressionK: 0 });
    const analysis = analyzeSounding(levels, { trace: true });
    // A saturated surface has the highest θₑ here, so the most-unstable level is the surface.
    expect(analysis.mostUnstable.parcelPressure).toBe(analysis.surfaceBased.parcelPressure);
    expect(analysis.mostUnstable).toEqual(analysis.surfaceBased);
    expect(analysis.mostUnstable).not.toBe(analysis.surfaceBased);
    expect(analysis.mostUnstable.trace).not.toBe(analysis.surfaceBased.trace);
  });
});
