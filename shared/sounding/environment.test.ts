import { describe, expect, it } from 'vitest';
import { analyzeEnvironment, precipitableWater } from './environment';
import { dewpointFromMixingRatio } from './mixing-ratio';
import { rk4Work } from './moist-adiabat';
import { buildProfile } from './profile';
import { buildSounding } from './testing/random-sounding';
import { wetBulbTemperature } from './wet-bulb';
import type { SoundingLevel } from './types';

/** Levels every 50 hPa from 1000 to 500 hPa with T and w given as functions of pressure. */
function levelsOf(temperatureC: (p: number) => number, mixing: (p: number) => number, topHpa = 300): SoundingLevel[] {
  const levels: SoundingLevel[] = [];
  let height = 0;
  for (let p = 1000; p >= topHpa; p -= 50) {
    if (levels.length > 0) {
      const below = levels[levels.length - 1] as SoundingLevel;
      height += ((287.04 * (0.5 * (below.temperatureC + temperatureC(p)) + 273.15)) / 9.80665) * Math.log(below.pressureHpa / p);
    }
    const t = temperatureC(p);
    levels.push({ pressureHpa: p, heightM: height, temperatureC: t, dewpointC: Math.min(t, dewpointFromMixingRatio(mixing(p), p) - 273.15), uMs: null, vMs: null });
  }
  return levels;
}

describe('precipitableWater ((1/ρw g) ∫ q dp with specific humidity, WallaceHobbs2006 pg. 80)', () => {
  // Hand calculation: w = 1 g/kg → q = w/(1 + w) = 0.001/1.001 = 0.000999; over 50000 Pa
  // with ρw = 1000 kg m⁻³: PW = 0.000999 · 50000 / (1000 · 9.80665) m = 5.0935 mm.
  it('is q·Δp/(ρw g) for a constant mixing ratio: 0.000999 · 50000 Pa / 9.80665 = 5.09 mm', () => {
    const profile = buildProfile(levelsOf((p) => 20 - (1000 - p) * 0.08, () => 0.001, 500));
    expect(precipitableWater(profile)).toBeCloseTo(5.0935, 2);
  });

  it('stops at the top of the moisture data', () => {
    const levels = levelsOf((p) => 20 - (1000 - p) * 0.08, () => 0.001, 500).map((level) => (level.pressureHpa < 600 ? { ...level, dewpointC: null } : level));
    expect(precipitableWater(buildProfile(levels))).toBeCloseTo(4.0748, 2) // 0.000999 · 40000 / 9.80665 = 4.0748 mm (hand calculation);
  });
});

describe('analyzeEnvironment', () => {
  const levels = levelsOf((p) => 25 - (1000 - p) * 0.08, (p) => 0.012 * (p / 1000) ** 3);
  const environment = analyzeEnvironment(buildProfile(levels));

  it('reports the surface mixing ratio and its dewpoint at 1000 hPa (same pressure, so the same dewpoint)', () => {
    expect(environment.surfaceMixingRatio).toBeCloseTo(12, 6);
    expect(environment.surfaceDewpointAt1000hPaC).toBeCloseTo(environment.surfaceDewpointC, 6);
  });

  it('finds the freezing level where the temperature crosses 0 °C (linear interpolation)', () => {
    // T = 25 − 0.08 (1000 − p): 0 °C at 687.5 hPa.
    const z650 = levels.find((l) => l.pressureHpa === 650)?.heightM ?? 0;
    const z700 = levels.find((l) => l.pressureHpa === 700)?.heightM ?? 0;
    expect(environment.freezingLevelHeight).toBeGreaterThan(z700);
    expect(environment.freezingLevelHeight).toBeLessThan(z650);
  });

  it('puts the wet-bulb zero below the freezing level in unsaturated air (wet bulb ≤ temperature)', () => {
    expect(environment.wetBulbZeroHeight).toBeLessThan(environment.freezingLevelHeight ?? 0);
  });

  it('gives lapse rates in K/km and a non-negative downdraft CAPE (GilmoreWicker1998)', () => {
    expect(environment.lapseRate0to3km).toBeGreaterThan(3);
    expect(environment.lapseRate0to3km).toBeLessThan(9.8);
    expect(environment.lapseRate700to500hPa).toBeGreaterThan(3);
    expect(environment.downdraftCape).toBeGreaterThanOrEqual(0);
  });
});

describe('work outside the pseudo-adiabat table stays bounded (issue 10)', () => {
  // An isothermal 30 °C column up to 100 hPa: the air aloft has θ_w far above the table's
  // +50 °C, so its wet-bulb and downdraft curves are integrated instead of looked up.
  const count = 800;
  const levels = buildSounding({
    surfacePressureHpa: 1000,
    surfaceTemperatureC: 30,
    surfaceDewpointDepressionK: 8,
    lapseRatesKPerKm: Array.from({ length: count - 1 }, () => 0),
    dewpointDepressionsK: Array.from({ length: count - 1 }, (_, i) => Math.min(30, 5 + (i * 40) / count)),
    windSpeedsMs: Array.from({ length: count }, () => 10),
  });

  it('takes at most 3 RK4 steps per level, never a new integration from 1000 hPa per lookup', () => {
    const before = rk4Work.steps;
    const environment = analyzeEnvironment(buildProfile(levels));
    const steps = rk4Work.steps - before;
    expect(environment.downdraftCape).toBeGreaterThanOrEqual(0);
    // Going by way of 1000 hPa would take hundreds of 5 hPa steps per level aloft.
    expect(steps).toBeLessThanOrEqual(3 * count);
  });

  it('the wet-bulb temperature outside the table matches the reference (RK4, 1 hPa) within 0.001 K', () => {
    // 30 °C with a 0 °C dewpoint at 150 hPa: its curve lies far outside the table.
    const table = wetBulbTemperature(150, 303.15, 273.15);
    const reference = wetBulbTemperature(150, 303.15, 273.15, 'reference');
    expect(Math.abs(table - reference)).toBeLessThan(0.001);
  });
});
