import { describe, expect, it } from 'vitest';
import type { ParcelResult, SoundingLevel } from '../../../../shared/sounding';
import { buoyancyAreas } from './buoyancy-areas';

// A dry, isothermal-in-Tv environment (no dewpoints, so Tv = T) and a hand-made parcel trace:
// the expected areas follow from the definitions in buoyancy-areas.ts, not from any program.
const levels: SoundingLevel[] = [1000, 900, 800, 700, 600, 500, 400].map((pressureHpa, i) => ({
  pressureHpa,
  heightM: i * 1000,
  temperatureC: 0,
  dewpointC: null,
  uMs: null,
  vMs: null,
}));

function parcel(temperatures: number[], lfcPressure: number | null, elPressure: number | null): ParcelResult {
  return {
    parcelPressure: 1000,
    parcelTemperatureC: 0,
    parcelDewpointC: 0,
    cape: 100,
    cin: -10,
    lclPressure: 900,
    lclHeight: 1000,
    lclTemperature: 0,
    lfcPressure,
    lfcHeight: lfcPressure === null ? null : 2000,
    elPressure,
    elHeight: elPressure === null ? null : 5000,
    liftedIndex: null,
    cape0to3km: 0,
    liftedIndexVirtual: null,
    positiveAreaBelowLfc: 0,
    negativeAreaLfcToEl: 0,
    capeClippedAtTop: false,
    trace: temperatures.map((temperatureC, i) => ({
      pressureHpa: 1000 - i * 100,
      temperatureC,
      virtualTemperatureC: temperatureC,
    })),
  };
}

describe('buoyancyAreas', () => {
  it('shades the negative area below the LFC and the positive area between LFC and EL', () => {
    // Parcel Tv − environment: −2 (1000), −1 (900), +1 (800), +2 (700), +1 (600), −1 (500): zero crossings
    // at about 850 hPa (the LFC) and 550 hPa (the EL), both interpolated linearly in ln p.
    const lfc = Math.exp((Math.log(900) + Math.log(800)) / 2);
    const el = Math.exp((Math.log(600) + Math.log(500)) / 2);
    const areas = buoyancyAreas(levels, parcel([-2, -1, 1, 2, 1, -1, -3], lfc, el));
    expect(areas.map((area) => area.sign)).toEqual(['negative', 'positive']);
    const positive = areas[1]?.outline ?? [];
    const pressures = positive.map((point) => point.pressureHpa);
    expect(Math.max(...pressures)).toBeCloseTo(lfc, 6);
    expect(Math.min(...pressures)).toBeCloseTo(el, 6);
    const negative = areas[0]?.outline ?? [];
    expect(Math.max(...negative.map((point) => point.pressureHpa))).toBe(1000);
  });

  it('shades nothing when the parcel has no LFC (its CAPE and CIN are 0 in the engine)', () => {
    expect(buoyancyAreas(levels, parcel([-2, -2, -2, -2, -2, -2, -2], null, null))).toEqual([]);
  });

  it('does not shade positive area below the LFC', () => {
    // Warm at 900 hPa (below the LCL) but the LFC is at 700 hPa: only negative area below 700.
    const areas = buoyancyAreas(levels, parcel([-1, 1, -1, 1, 2, 1, -1], 700, 450));
    const positiveBelowLfc = areas.filter((a) => a.sign === 'positive' && a.outline.some((point) => point.pressureHpa > 700 + 1e-6));
    expect(positiveBelowLfc).toEqual([]);
  });
});
