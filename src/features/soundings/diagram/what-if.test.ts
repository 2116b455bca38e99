import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeSounding, parseSoundingCsv, type SoundingLevel } from '../../../../shared/sounding';
import { applySurfaceChange, measureRecomputeMs, parcelStartOptions, recomputeWhatIf, whatIfProblem } from './what-if';

function fixture(name: string): SoundingLevel[] {
  const text = readFileSync(resolve(process.cwd(), 'tests/fixtures/soundings', name), 'utf8');
  const parsed = parseSoundingCsv(text, name);
  if (!parsed.ok) throw new Error(`fixture ${name} did not parse`);
  return parsed.value.levels;
}

const levels = fixture('oax_20140616_19z.csv');

describe('applySurfaceChange', () => {
  it('replaces only the lowest level and leaves the original untouched', () => {
    const changed = applySurfaceChange(levels, { surfaceDewpointC: 25 });
    expect(changed[0]?.dewpointC).toBe(25);
    expect(changed[0]?.temperatureC).toBe(levels[0]?.temperatureC);
    expect(levels[0]?.dewpointC).toBe(23.8); // the fixture's first row
    expect(changed[1]).toBe(levels[1]);
  });

  it('returns the same array when nothing changes', () => {
    expect(applySurfaceChange(levels, {})).toBe(levels);
  });
});

describe('whatIfProblem', () => {
  it('refuses a dewpoint above the temperature', () => {
    expect(whatIfProblem(levels, { surfaceTemperatureC: 25, surfaceDewpointC: 26 })).toMatch(/dewpoint cannot be higher/);
    expect(whatIfProblem(levels, { surfaceTemperatureC: 25, surfaceDewpointC: 25 })).toBeNull();
  });
});

describe('recomputeWhatIf', () => {
  it('agrees with analyzeSounding on the modified levels (the same engine, nothing re-derived)', () => {
    const result = recomputeWhatIf(levels, { surfaceDewpointC: 25.8 });
    const direct = analyzeSounding(applySurfaceChange(levels, { surfaceDewpointC: 25.8 }));
    expect(result.analysis.surfaceBased.cape).toBe(direct.surfaceBased.cape);
    expect(result.analysis.mixedLayer.cape).toBe(direct.mixedLayer.cape);
    expect(result.analysis.surfaceBased.trace?.length).toBeGreaterThan(10);
  });

  it('a moister surface (+2 K dewpoint) raises surface-based CAPE and lowers the LCL', () => {
    const before = recomputeWhatIf(levels, {}).analysis.surfaceBased;
    const after = recomputeWhatIf(levels, { surfaceDewpointC: 25.8 }).analysis.surfaceBased;
    expect(after.cape).toBeGreaterThan(before.cape);
    expect(after.lclHeight ?? Infinity).toBeLessThan(before.lclHeight ?? 0);
  });

  it('lifts a parcel from the chosen level', () => {
    const result = recomputeWhatIf(levels, { parcelStartPressureHpa: 925 });
    expect(result.chosenParcel?.parcelPressure).toBe(925);
    expect(result.chosenParcel?.trace?.[0]?.pressureHpa).toBe(925);
  });
});

describe('parcelStartOptions', () => {
  it('offers levels with a dewpoint within 300 hPa of the surface', () => {
    const options = parcelStartOptions(levels);
    expect(options[0]).toBe(965);
    expect(Math.min(...options)).toBeGreaterThanOrEqual(665);
  });
});

describe('measureRecomputeMs', () => {
  it('returns the median of the measured durations (a fake clock that advances 2 ms per reading pair)', () => {
    let tick = 0;
    const fakeNow = () => {
      tick += 1;
      return tick % 2 === 1 ? 0 : 2;
    };
    expect(measureRecomputeMs(levels.slice(0, 20), { runs: 3, now: fakeNow })).toBe(2);
  });
});
