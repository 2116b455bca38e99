import { describe, expect, it } from 'vitest';
import { dewpointFromVaporPressure, saturationVaporPressure, saturationVaporPressureSlope } from './saturation';

/**
 * Saturation vapour pressure over plane liquid water, hPa: Goff–Gratch values as printed in the
 * Smithsonian Meteorological Tables (List 1951, Table 94) — values from memory, each
 * cross-checked below against the independent published formula of Murphy and Koop (2005, eq. 10).
 */
const SMITHSONIAN_TABLE_94: [temperatureC: number, pressureHpa: number][] = [
  [-40, 0.1891],
  [-30, 0.5088],
  [-20, 1.254],
  [-10, 2.8627],
  [0, 6.1078],
  [10, 12.272],
  [20, 23.373],
  [30, 42.43],
  [40, 73.777],
];

/** Murphy and Koop (2005) eq. 10, liquid water, 123 K < T < 332 K; returns hPa. */
function murphyKoopLiquid(temperatureK: number): number {
  const t = temperatureK;
  const lnPa =
    54.842763 -
    6763.22 / t -
    4.21 * Math.log(t) +
    0.000367 * t +
    Math.tanh(0.0415 * (t - 218.8)) * (53.878 - 1331.22 / t - 9.44523 * Math.log(t) + 0.014025 * t);
  return Math.exp(lnPa) / 100;
}

describe('saturationVaporPressure (Bolton1980 eq. 10)', () => {
  it.each(SMITHSONIAN_TABLE_94)('at %d °C matches the Smithsonian table within 0.4 %%', (temperatureC, tableHpa) => {
    // Tolerance: Bolton states 0.1 % for −30..35 °C against Wexler's formula; against the
    // Goff–Gratch table the fit differs by up to 0.3 % at the ends (−40, −30, +40 °C).
    const value = saturationVaporPressure(temperatureC + 273.15);
    expect(Math.abs(value / tableHpa - 1)).toBeLessThan(0.004);
  });

  it.each(SMITHSONIAN_TABLE_94)('the table value at %d °C agrees with Murphy and Koop (2005) within 0.15 %%', (temperatureC, tableHpa) => {
    // Guards the recalled table: two independent published sources must agree.
    expect(Math.abs(murphyKoopLiquid(temperatureC + 273.15) / tableHpa - 1)).toBeLessThan(0.0015);
  });

  it('returns 6.112 hPa at 0 °C, the constant of Bolton1980 eq. 10', () => {
    expect(saturationVaporPressure(273.15)).toBeCloseTo(6.112, 10);
  });

  it('has a slope equal to the numerical derivative (analytic derivative of eq. 10)', () => {
    const t = 290;
    const numeric = (saturationVaporPressure(t + 1e-4) - saturationVaporPressure(t - 1e-4)) / 2e-4;
    expect(saturationVaporPressureSlope(t)).toBeCloseTo(numeric, 6);
  });

  it('is inverted by dewpointFromVaporPressure (Bolton1980 eq. 11) to 1e-9 K', () => {
    for (const t of [233.15, 263.15, 283.15, 303.15, 313.15]) {
      expect(dewpointFromVaporPressure(saturationVaporPressure(t))).toBeCloseTo(t, 9);
    }
  });
});
