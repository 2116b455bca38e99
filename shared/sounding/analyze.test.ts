import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeSounding } from './analyze';
import { parseSoundingCsv } from './parse-csv';
import type { SoundingLevel } from './types';

function fixtureLevels(name: string): SoundingLevel[] {
  const text = readFileSync(new URL(`../../tests/fixtures/soundings/${name}`, import.meta.url), 'utf8');
  const result = parseSoundingCsv(text, name);
  if (!result.ok) throw new Error(JSON.stringify(result.error));
  return result.value.levels;
}

const CONTRACT_PARCEL_KEYS = ['cape', 'cin', 'lclPressure', 'lclHeight', 'lfcPressure', 'elPressure', 'liftedIndex'];

describe.each(['bna_20021111_00z.csv', 'bna_20140728_00z.csv', 'oax_20140616_19z.csv'])('analysis of the observed fixture %s', (name) => {
  const levels = fixtureLevels(name);
  const analysis = analyzeSounding(levels);

  it('has every contract key of docs/analysis.md, numbers or null, never NaN', () => {
    for (const parcel of [analysis.surfaceBased, analysis.mixedLayer, analysis.mostUnstable]) {
      for (const key of CONTRACT_PARCEL_KEYS) expect(parcel).toHaveProperty(key);
    }
    expect(analysis.mostUnstable).toHaveProperty('parcelPressure');
    for (const key of ['precipitableWater', 'bulkShear0to6km', 'stormMotionRight', 'srh0to1km', 'srh0to3km']) expect(analysis).toHaveProperty(key);
    expect(JSON.stringify(analysis)).not.toMatch(/NaN|Infinity|undefined/);
  });

  it('gives physically sensible values (common practice bounds)', () => {
    expect(analysis.precipitableWater).toBeGreaterThan(10);
    expect(analysis.precipitableWater).toBeLessThan(70);
    expect(analysis.mostUnstable.cape).toBeGreaterThanOrEqual(analysis.surfaceBased.cape);
    expect(analysis.surfaceBased.lclHeight).toBeGreaterThan(0);
    expect(analysis.surfaceBased.lclHeight).toBeLessThan(3000);
    expect(analysis.environment.freezingLevelHeight).toBeGreaterThan(2000);
    expect(analysis.environment.freezingLevelHeight).toBeLessThan(5500);
  });

  it('is the same with levels in reverse order', () => {
    expect(analyzeSounding([...levels].reverse())).toEqual(analysis);
  });
});

describe('case-specific checks on the fixtures', () => {
  it('Omaha 16 June 2014 19 UTC: extreme CAPE (> 4000 J/kg surface-based) with strong low-level helicity', () => {
    const analysis = analyzeSounding(fixtureLevels('oax_20140616_19z.csv'));
    expect(analysis.surfaceBased.cape).toBeGreaterThan(4000);
    expect(analysis.srh0to1km).toBeGreaterThan(150);
  });

  it('Nashville 28 July 2014 00 UTC: the most-unstable parcel is above the surface', () => {
    const levels = fixtureLevels('bna_20140728_00z.csv');
    const analysis = analyzeSounding(levels);
    expect(analysis.mostUnstable.parcelPressure).toBeLessThan(levels[0]?.pressureHpa ?? 0);
  });

  it('Nashville 11 Nov 2002 00 UTC: capped surface parcel, winds end at 491.5 hPa so 0–6 km values are null', () => {
    const analysis = analyzeSounding(fixtureLevels('bna_20021111_00z.csv'));
    expect(analysis.surfaceBased.cin).toBeLessThan(-100);
    expect(analysis.bulkShear0to6km).toBeNull();
    expect(analysis.stormMotionRight).toBeNull();
    expect(analysis.kinematics.bulkShear0to1km).toBeGreaterThan(10);
  });
});
