import fc from 'fast-check';
import { layerThickness } from '../hypsometric';
import type { SoundingLevel } from '../types';

/** Parameters of a synthetic sounding for property tests. */
export interface SoundingRecipe {
  surfacePressureHpa: number;
  surfaceTemperatureC: number;
  surfaceDewpointDepressionK: number;
  /** Lapse rate of each layer, K km⁻¹ (negative: inversion). */
  lapseRatesKPerKm: number[];
  /** Dewpoint depression at each level above the surface, K. */
  dewpointDepressionsK: number[];
  windSpeedsMs: number[];
  /** Pressure of the top level, hPa (default 100). */
  topPressureHpa?: number;
}

/** fast-check arbitrary of physically plausible soundings from the surface to about 100 hPa. */
export const soundingRecipe = (minLevels = 12, maxLevels = 45): fc.Arbitrary<SoundingRecipe> =>
  fc.integer({ min: minLevels, max: maxLevels }).chain((count) =>
    fc.record({
      surfacePressureHpa: fc.double({ min: 850, max: 1050, noNaN: true }),
      surfaceTemperatureC: fc.double({ min: 0, max: 38, noNaN: true }),
      surfaceDewpointDepressionK: fc.double({ min: 0, max: 20, noNaN: true }),
      lapseRatesKPerKm: fc.array(fc.double({ min: -4, max: 9.7, noNaN: true }), { minLength: count - 1, maxLength: count - 1 }),
      dewpointDepressionsK: fc.array(fc.double({ min: 0, max: 30, noNaN: true }), { minLength: count - 1, maxLength: count - 1 }),
      windSpeedsMs: fc.array(fc.double({ min: 0, max: 60, noNaN: true }), { minLength: count, maxLength: count }),
    }),
  );

/**
 * Build the levels of a recipe: pressures evenly spaced in ln p up to 100 hPa, temperature
 * from the layer lapse rates (floored at −90 °C), heights from the hypsometric equation,
 * winds veering with height.
 */
export function buildSounding(recipe: SoundingRecipe): SoundingLevel[] {
  const count = recipe.lapseRatesKPerKm.length + 1;
  const logStep = Math.log(recipe.surfacePressureHpa / (recipe.topPressureHpa ?? 100)) / (count - 1);
  const levels: SoundingLevel[] = [];
  let temperatureC = recipe.surfaceTemperatureC;
  let heightM = 0;
  for (let i = 0; i < count; i++) {
    const pressureHpa = recipe.surfacePressureHpa * Math.exp(-logStep * i);
    if (i > 0) {
      const previous = levels[i - 1] as SoundingLevel;
      // First guess of the layer thickness with the previous temperature, then the lapse rate.
      const guess = layerThickness(previous.pressureHpa, pressureHpa, previous.temperatureC + 273.15, previous.temperatureC + 273.15);
      temperatureC = Math.max(-90, previous.temperatureC - ((recipe.lapseRatesKPerKm[i - 1] as number) * guess) / 1000);
      heightM = previous.heightM + layerThickness(previous.pressureHpa, pressureHpa, previous.temperatureC + 273.15, temperatureC + 273.15);
    }
    const depression = i === 0 ? recipe.surfaceDewpointDepressionK : (recipe.dewpointDepressionsK[i - 1] as number);
    const speed = recipe.windSpeedsMs[i] as number;
    const direction = ((150 + (120 * i) / count) * Math.PI) / 180;
    levels.push({
      pressureHpa,
      heightM,
      temperatureC,
      dewpointC: Math.max(-120, temperatureC - depression),
      uMs: -speed * Math.sin(direction),
      vMs: -speed * Math.cos(direction),
    });
  }
  return levels;
}

/** The kinds of odd soundings the property tests must also survive. */
export type OddKind = 'superadiabatic' | 'sparse' | 'truncated' | 'dense' | 'isothermal' | 'saturated';

/**
 * fast-check arbitrary of odd but legal soundings: a superadiabatic surface layer (12–20 K/km
 * in the lowest layers), sparse (5 levels), truncated (top at 600–700 hPa), very dense
 * (2,000–2,500 levels), isothermal, or saturated throughout.
 */
export const oddSoundingRecipe = (kind: OddKind): fc.Arbitrary<SoundingRecipe> => {
  const count = kind === 'sparse' ? 5 : kind === 'dense' ? 2000 : 30;
  const base = kind === 'dense' ? fc.integer({ min: 2000, max: 2500 }) : fc.constant(count);
  return base.chain((levels) =>
    fc.record({
      surfacePressureHpa: fc.double({ min: 850, max: 1050, noNaN: true }),
      surfaceTemperatureC: fc.double({ min: 0, max: 38, noNaN: true }),
      surfaceDewpointDepressionK: kind === 'saturated' ? fc.constant(0) : fc.double({ min: 0, max: 20, noNaN: true }),
      lapseRatesKPerKm: fc.array(
        kind === 'isothermal' ? fc.constant(0) : fc.double({ min: -4, max: 9.7, noNaN: true }),
        { minLength: levels - 1, maxLength: levels - 1 },
      ).chain((rates) =>
        kind === 'superadiabatic'
          ? fc.double({ min: 12, max: 20, noNaN: true }).map((steep) => rates.map((rate, i) => (i < Math.max(1, Math.floor(levels / 15)) ? steep : rate)))
          : fc.constant(rates),
      ),
      dewpointDepressionsK: fc.array(kind === 'saturated' ? fc.constant(0) : fc.double({ min: 0, max: 30, noNaN: true }), { minLength: levels - 1, maxLength: levels - 1 }),
      windSpeedsMs: fc.array(fc.double({ min: 0, max: 60, noNaN: true }), { minLength: levels, maxLength: levels }),
      topPressureHpa: kind === 'truncated' ? fc.double({ min: 600, max: 700, noNaN: true }) : fc.constant(100),
    }),
  );
};
