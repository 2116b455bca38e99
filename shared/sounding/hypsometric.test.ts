import { describe, expect, it } from 'vitest';
import { layerThickness } from './hypsometric';
import { parseSoundingCsv } from './parse-csv';
import { buildCsv } from './testing/csv';

/**
 * U.S. Standard Atmosphere, 1976 (NOAA1976), geopotential height H (m) → pressure (hPa) and
 * temperature (K). Values computed from the standard's defining equations (NOAA1976 eqs.
 * 23 and 33a/33b) with its Table 4 base values: lapse rate −6.5 K/km from 288.15 K and
 * 1013.25 hPa to H = 11 km (226.32 hPa), isothermal 216.65 K to 20 km (54.749 hPa),
 * +1.0 K/km above; g₀ = 9.80665 m s⁻², R* / M₀ = 287.053 J kg⁻¹ K⁻¹.
 * Rows that also appear in the standard's printed tables (from memory): 1000 m → 898.75 hPa,
 * 5000 m → 540.2 hPa, 11000 m → 226.32 hPa.
 */
function standardAtmosphere(heightM: number): { pressureHpa: number; temperatureK: number } {
  const g0 = 9.80665;
  const r = 287.053;
  if (heightM <= 11000) {
    const t = 288.15 - 0.0065 * heightM;
    return { temperatureK: t, pressureHpa: 1013.25 * Math.pow(288.15 / t, -g0 / (r * 0.0065)) };
  }
  if (heightM <= 20000) {
    return { temperatureK: 216.65, pressureHpa: 226.32 * Math.exp((-g0 * (heightM - 11000)) / (r * 216.65)) };
  }
  const t = 216.65 + 0.001 * (heightM - 20000);
  return { temperatureK: t, pressureHpa: 54.749 * Math.pow(216.65 / t, g0 / (r * 0.001)) };
}

describe('heights filled from pressures (hypsometric equation, WallaceHobbs2006 eq. 3.29)', () => {
  it('the standard-atmosphere helper reproduces printed table values (NOAA1976, from memory)', () => {
    expect(standardAtmosphere(1000).pressureHpa).toBeCloseTo(898.75, 1);
    expect(standardAtmosphere(5000).pressureHpa).toBeCloseTo(540.2, 0);
    expect(standardAtmosphere(11000).pressureHpa).toBeCloseTo(226.32, 1);
  });

  it('match the 1976 U.S. Standard Atmosphere within 0.05 % (max 5 m) from the ground to 24 km', () => {
    const heights = Array.from({ length: 25 }, (_, i) => i * 1000);
    const rows = heights.map((h) => {
      const { pressureHpa, temperatureK } = standardAtmosphere(h);
      // Dry air (dewpoint −90 °C) so virtual and air temperature agree to < 0.001 K.
      return `${pressureHpa},,${temperatureK - 273.15},-90,,`;
    });
    const result = parseSoundingCsv(buildCsv({ rows, metadata: { elevation_m: '0' } }), 'standard.csv');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    result.value.levels.forEach((level, i) => {
      const expected = heights[i] as number;
      // Tolerance: Rd = 287.04 here vs 287.053 in the standard (4.5e-5 relative), and the
      // mean-temperature form of the hypsometric equation over 1 km layers.
      expect(Math.abs(level.heightM - expected)).toBeLessThanOrEqual(Math.max(1, expected * 0.0005));
      expect(Math.abs(level.heightM - expected)).toBeLessThan(5);
    });
  });

  it('a 1000–500 hPa thickness of 5400 m means a layer-mean virtual temperature near 266 K (the "540 line", common practice)', () => {
    expect(layerThickness(1000, 500, 266.2, 266.2)).toBeCloseTo(5400, -1);
  });
});
