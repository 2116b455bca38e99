import type { Units } from '../../shared/contracts/users';

/**
 * Display conversions. Values arrive in SI (K, m, m/s) as everywhere inside Stormdraft and leave
 * as display strings in the unit the person picked. Render them inside an element with tabular
 * figures (`tabular-nums`, the default in our stylesheet) so columns line up.
 */

/** 0 °C = 273.15 K by definition of the Celsius scale (SI Brochure, 9th ed., 2.3.4). */
export const CELSIUS_ZERO_K = 273.15;
/** 1 ft = 0.3048 m exactly (International Yard and Pound Agreement, 1959). */
export const METRES_PER_FOOT = 0.3048;
/** 1 kt = 1 international nautical mile (1852 m) per hour. */
export const METRES_PER_SECOND_PER_KNOT = 1852 / 3600;
/** 1 mph = 1 international mile (1609.344 m) per hour. */
export const METRES_PER_SECOND_PER_MPH = 1609.344 / 3600;

export const kelvinToCelsius = (temperatureK: number) => temperatureK - CELSIUS_ZERO_K;
export const kelvinToFahrenheit = (temperatureK: number) => (temperatureK - CELSIUS_ZERO_K) * 1.8 + 32;
export const metresToFeet = (heightM: number) => heightM / METRES_PER_FOOT;
export const metresPerSecondToKnots = (speedMps: number) => speedMps / METRES_PER_SECOND_PER_KNOT;
export const metresPerSecondToMph = (speedMps: number) => speedMps / METRES_PER_SECOND_PER_MPH;

export const temperatureUnitLabel: Record<Units['temperature'], string> = { C: '°C', F: '°F' };
export const heightUnitLabel: Record<Units['height'], string> = { m: 'm', ft: 'ft' };
export const speedUnitLabel: Record<Units['speed'], string> = { kt: 'kt', ms: 'm s⁻¹', mph: 'mph' };

const MINUS_SIGN = '\u2212';
const NARROW_NO_BREAK_SPACE = '\u202f';
const MISSING = '—';

/** Fixed decimals, a true minus sign, no "-0". Non-finite values show as a dash. */
export function formatNumber(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return MISSING;
  const text = Math.abs(value).toFixed(decimals);
  const isZero = Number(text) === 0;
  return value < 0 && !isZero ? `${MINUS_SIGN}${text}` : text;
}

function withUnit(value: number, decimals: number, unit: string): string {
  const number = formatNumber(value, decimals);
  return number === MISSING ? MISSING : `${number}${NARROW_NO_BREAK_SPACE}${unit}`;
}

export function formatTemperature(temperatureK: number, unit: Units['temperature'], decimals = 1): string {
  const value = unit === 'C' ? kelvinToCelsius(temperatureK) : kelvinToFahrenheit(temperatureK);
  return withUnit(value, decimals, temperatureUnitLabel[unit]);
}

export function formatHeight(heightM: number, unit: Units['height'], decimals = 0): string {
  const value = unit === 'm' ? heightM : metresToFeet(heightM);
  return withUnit(value, decimals, heightUnitLabel[unit]);
}

export function formatSpeed(speedMps: number, unit: Units['speed'], decimals = 0): string {
  let value: number;
  switch (unit) {
    case 'kt':
      value = metresPerSecondToKnots(speedMps);
      break;
    case 'ms':
      value = speedMps;
      break;
    case 'mph':
      value = metresPerSecondToMph(speedMps);
      break;
  }
  return withUnit(value, decimals, speedUnitLabel[unit]);
}
