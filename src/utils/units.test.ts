import { describe, expect, it } from 'vitest';
import {
  formatHeight,
  formatNumber,
  formatSpeed,
  formatTemperature,
  kelvinToCelsius,
  kelvinToFahrenheit,
  metresPerSecondToKnots,
  metresPerSecondToMph,
  metresToFeet,
} from './units';

// Check values are exact by definition: 0 °C = 273.15 K and 0 °C = 32 °F (SI Brochure, 9th ed.);
// 1 ft = 0.3048 m and 1 mi = 1609.344 m (International Yard and Pound Agreement, 1959);
// 1 kt = 1852 m per hour (international nautical mile). Tolerance: 12 decimal places (float rounding only).
describe('unit conversions', () => {
  it('converts the ice point, 273.15 K, to 0 °C and 32 °F', () => {
    expect(kelvinToCelsius(273.15)).toBeCloseTo(0, 12);
    expect(kelvinToFahrenheit(273.15)).toBeCloseTo(32, 12);
  });

  it('converts the steam point, 373.15 K, to 212 °F', () => {
    expect(kelvinToFahrenheit(373.15)).toBeCloseTo(212, 12);
  });

  it('converts −40 °C to −40 °F, where the scales cross', () => {
    expect(kelvinToFahrenheit(233.15)).toBeCloseTo(-40, 12);
  });

  it('converts 0.3048 m to exactly 1 ft', () => {
    expect(metresToFeet(0.3048)).toBeCloseTo(1, 12);
    expect(metresToFeet(1000)).toBeCloseTo(3280.839895013123, 9);
  });

  it('converts 1852/3600 m/s to 1 kt and 1609.344/3600 m/s to 1 mph', () => {
    expect(metresPerSecondToKnots(1852 / 3600)).toBeCloseTo(1, 12);
    expect(metresPerSecondToMph(1609.344 / 3600)).toBeCloseTo(1, 12);
    expect(metresPerSecondToKnots(10)).toBeCloseTo(19.43844492440605, 9);
  });
});

describe('display formatting', () => {
  it('formats temperatures in the chosen unit with a true minus sign', () => {
    expect(formatTemperature(293.15, 'C')).toBe('20.0\u202f°C');
    expect(formatTemperature(293.15, 'F')).toBe('68.0\u202f°F');
    expect(formatTemperature(263.15, 'C', 0)).toBe('\u221210\u202f°C');
  });

  it('never shows "−0" for a value that rounds to zero', () => {
    expect(formatNumber(-0.04, 1)).toBe('0.0');
  });

  it('formats heights and speeds, and shows a dash for missing values', () => {
    expect(formatHeight(1000, 'ft')).toBe('3281\u202fft');
    expect(formatSpeed(25, 'kt')).toBe('49\u202fkt');
    expect(formatSpeed(25, 'mph')).toBe('56\u202fmph');
    expect(formatSpeed(25, 'ms')).toBe('25\u202fm s⁻¹');
    expect(formatHeight(Number.NaN, 'm')).toBe('—');
  });
});
