import { readFileSync } from 'node:fs';
import { layerThickness, parseSoundingCsv, type SoundingLevel } from '../../shared/sounding';
import { buildSounding, type SoundingRecipe } from '../../shared/sounding/testing/random-sounding';

/**
 * Deterministic synthetic soundings for the benchmark: a warm-season profile (moist boundary
 * layer, conditionally unstable lapse rates, tropopause near 200 hPa) with a veering,
 * strengthening wind, resampled to `levelCount` levels evenly spaced in ln p from the
 * surface to 100 hPa. `variant` shifts the surface temperature and moisture so the JIT does
 * not see one sounding only.
 */
export function syntheticSounding(levelCount: number, variant: number): SoundingLevel[] {
  const surfacePressure = 1000 - (variant % 7) * 10;
  const surfaceTemperature = 24 + (variant % 5) * 2;
  const surfaceDepression = 2 + (variant % 4) * 2;
  const levels: SoundingLevel[] = [];
  const logStep = Math.log(surfacePressure / 100) / (levelCount - 1);
  for (let i = 0; i < levelCount; i++) {
    const pressureHpa = surfacePressure * Math.exp(-logStep * i);
    const previous = levels[i - 1];
    let temperatureC = surfaceTemperature;
    let heightM = 0;
    if (previous) {
      const guess = layerThickness(previous.pressureHpa, pressureHpa, previous.temperatureC + 273.15, previous.temperatureC + 273.15);
      const lapse = previous.heightM < 1500 ? 8.5 : previous.heightM < 12000 ? 7.0 : -1.0;
      temperatureC = previous.temperatureC - (lapse * guess) / 1000;
      heightM = previous.heightM + layerThickness(previous.pressureHpa, pressureHpa, previous.temperatureC + 273.15, temperatureC + 273.15);
    }
    const depression = heightM < 1500 ? surfaceDepression : Math.min(35, surfaceDepression + (heightM - 1500) / 250);
    const speed = 5 + Math.min(heightM, 10000) * 0.004;
    const direction = ((160 + Math.min(heightM, 6000) * 0.015) * Math.PI) / 180;
    levels.push({
      pressureHpa,
      heightM,
      temperatureC,
      dewpointC: temperatureC - depression,
      uMs: -speed * Math.sin(direction),
      vMs: -speed * Math.cos(direction),
    });
  }
  return levels;
}

/** The three observed fixture soundings as CSV text. */
export function fixtureTexts(): { name: string; text: string }[] {
  return ['bna_20021111_00z.csv', 'bna_20140728_00z.csv', 'oax_20140616_19z.csv'].map((name) => ({
    name,
    text: readFileSync(new URL(`../fixtures/soundings/${name}`, import.meta.url), 'utf8'),
  }));
}

/** Check that fixture texts parse (the bench must measure valid work). */
export function assertParses(texts: { name: string; text: string }[]): void {
  for (const { name, text } of texts) {
    const result = parseSoundingCsv(text, name);
    if (!result.ok) throw new Error(`${name} does not parse: ${result.error[0]?.message}`);
  }
}

/** Levels as exchange-CSV text (u/v winds in m/s). */
function toCsv(levels: readonly SoundingLevel[]): string {
  const rows = levels.map((l) => `${l.pressureHpa.toFixed(3)},${l.heightM.toFixed(1)},${l.temperatureC.toFixed(2)},${l.dewpointC === null ? '' : l.dewpointC.toFixed(2)},${(l.uMs ?? 0).toFixed(2)},${(l.vMs ?? 0).toFixed(2)}`);
  return ['# station: ODD', '# latitude: 38', '# longitude: -92', '# valid: 2027-04-18T18:00:00Z', '# source: model', 'pressure_hPa,height_m,temperature_C,dewpoint_C,u_ms,v_ms', ...rows].join('\n');
}

/** A deterministic recipe: `count` levels, lapse rates and depressions from simple rules. */
function recipe(count: number, options: { lapse?: (i: number) => number; depression?: number; top?: number } = {}): SoundingRecipe {
  return {
    surfacePressureHpa: 1000,
    surfaceTemperatureC: 30,
    surfaceDewpointDepressionK: options.depression ?? 8,
    lapseRatesKPerKm: Array.from({ length: count - 1 }, (_, i) => (options.lapse ? options.lapse(i) : i < count * 0.8 ? 7 : -1)),
    dewpointDepressionsK: Array.from({ length: count - 1 }, (_, i) => options.depression ?? Math.min(30, 5 + i * (40 / count))),
    windSpeedsMs: Array.from({ length: count }, (_, i) => 5 + (i * 40) / count),
    topPressureHpa: options.top ?? 100,
  };
}

/** Odd but legal soundings as CSV texts, for the slowest-file figure. */
export function oddSoundingTexts(): { name: string; text: string }[] {
  const cases: [string, SoundingRecipe][] = [
    ['superadiabatic.csv', recipe(60, { lapse: (i) => (i < 4 ? 15 : 7) })],
    ['sparse.csv', recipe(5)],
    ['truncated.csv', recipe(40, { top: 650 })],
    ['dense-5000.csv', recipe(5000)],
    ['isothermal.csv', recipe(80, { lapse: () => 0 })],
    ['saturated.csv', recipe(100, { depression: 0 })],
  ];
  return cases.map(([name, r]) => ({ name, text: toCsv(buildSounding(r)) }));
}
