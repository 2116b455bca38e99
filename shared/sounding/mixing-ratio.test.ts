import psychrolib from 'psychrolib';
import { beforeAll, describe, expect, it } from 'vitest';
import { EPSILON } from './constants';
import { dewpointFromMixingRatio, dewpointFromRelativeHumidity, mixingRatio, saturationMixingRatio, vaporPressureFromMixingRatio } from './mixing-ratio';

beforeAll(() => {
  psychrolib.SetUnitSystem(psychrolib.SI);
});

describe('mixingRatio (WallaceHobbs2006 eq. 3.59)', () => {
  // Cross-check: psychrolib 1.1.1 (npm; ASHRAE Handbook 2017 ch. 1 eq. 20), ε = 0.621945.
  it.each([
    [1000, 20],
    [850, 15],
    [700, 8],
    [500, 2],
    [300, 0.3],
  ])('at %d hPa with e = %d hPa matches psychrolib within 0.01 %%', (pressureHpa, vaporHpa) => {
    const reference = psychrolib.GetHumRatioFromVapPres(vaporHpa * 100, pressureHpa * 100);
    // Tolerance: our ε = Rd/Rv = 0.621967 vs psychrolib's 0.621945 (3.5e-5 relative).
    expect(Math.abs(mixingRatio(vaporHpa, pressureHpa) / reference - 1)).toBeLessThan(1e-4);
  });

  it.each([
    [1013.25, 25],
    [960, 16],
    [890, 13],
    [700, 5],
    [500, 1],
  ])('saturation mixing ratio at %d hPa and %d °C matches psychrolib within 0.15 %%', (pressureHpa, temperatureC) => {
    // Cross-check: psychrolib 1.1.1 GetHumRatioFromTDewPoint (Hyland–Wexler over water above
    // 0.01 °C); our eₛ is Bolton1980 eq. 10, within 0.1 % of it in this range.
    const reference = psychrolib.GetHumRatioFromTDewPoint(temperatureC, pressureHpa * 100);
    expect(Math.abs(saturationMixingRatio(pressureHpa, temperatureC + 273.15) / reference - 1)).toBeLessThan(0.0015);
  });

  it('is inverted by vaporPressureFromMixingRatio', () => {
    expect(vaporPressureFromMixingRatio(mixingRatio(18, 960), 960)).toBeCloseTo(18, 10);
  });

  it('uses ε = Rd/Rv ≈ 0.622 (WallaceHobbs2006 pg. 80; common practice)', () => {
    expect(EPSILON).toBeCloseTo(0.622, 3);
  });
});

describe('moisture across elevation: the same mixing ratio means a higher dewpoint at a higher pressure', () => {
  it('12 g/kg at 960 hPa is a dewpoint near 16 °C (about 61 °F) (common practice; formula: e = wp/(ε+w), Bolton1980 eq. 11)', () => {
    const dewpointC = dewpointFromMixingRatio(0.012, 960) - 273.15;
    expect(dewpointC).toBeGreaterThan(15.5);
    expect(dewpointC).toBeLessThan(16.5);
    // Cross-check: psychrolib 1.1.1 gives 12 g/kg back at that dewpoint within 0.2 %.
    expect(Math.abs(psychrolib.GetHumRatioFromTDewPoint(dewpointC, 96000) / 0.012 - 1)).toBeLessThan(0.002);
  });

  it('a 13 °C dewpoint at 890 hPa is about 10.6 g/kg, not the 12 g/kg a chart reading suggests (ε e/(p − e), e from Bolton1980 eq. 10)', () => {
    const grams = saturationMixingRatio(890, 13 + 273.15) * 1000;
    expect(grams).toBeCloseTo(10.6, 1);
    expect(grams).toBeLessThan(11);
    // Cross-check: psychrolib 1.1.1, same inputs, within 0.1 g/kg.
    expect(Math.abs(psychrolib.GetHumRatioFromTDewPoint(13, 89000) * 1000 - grams)).toBeLessThan(0.1);
  });

  it('the same 12 g/kg gives a lower dewpoint at 850 hPa than at 1000 hPa (formula, WallaceHobbs2006 eq. 3.59)', () => {
    expect(dewpointFromMixingRatio(0.012, 850)).toBeLessThan(dewpointFromMixingRatio(0.012, 1000));
  });
});

describe('dewpointFromRelativeHumidity', () => {
  it('gives the temperature at 100 % and a lower dewpoint at 50 % (definition, WMO2018 Annex 4.B)', () => {
    expect(dewpointFromRelativeHumidity(293.15, 100)).toBeCloseTo(293.15, 9);
    // 20 °C at 50 % has a dewpoint of about 9.3 °C (common practice).
    expect(dewpointFromRelativeHumidity(293.15, 50) - 273.15).toBeCloseTo(9.26, 1);
  });
});
