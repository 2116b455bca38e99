import type { Units } from '../../../../shared/contracts/users';
import {
  CELSIUS_ZERO_K,
  METRES_PER_FOOT,
  formatHeight,
  formatNumber,
  formatSpeed,
  formatTemperature,
  heightUnitLabel,
  speedUnitLabel,
  temperatureUnitLabel,
} from '../../../utils/units';

/**
 * Display helpers for the sounding views. Values come from the engine in °C, m, m s⁻¹ and J/kg
 * and leave as strings in the person's units (src/utils/units.ts does the conversions).
 */
export const MISSING = '—';
const NARROW_NO_BREAK_SPACE = '\u202f';

export const temperatureText = (temperatureC: number, units: Units, decimals = 1): string =>
  formatTemperature(temperatureC + CELSIUS_ZERO_K, units.temperature, decimals);
export const heightText = (heightM: number, units: Units, decimals = 0): string => formatHeight(heightM, units.height, decimals);
export const speedText = (speedMs: number, units: Units, decimals = 0): string => formatSpeed(speedMs, units.speed, decimals);
export const withUnit = (value: number, decimals: number, unit: string): string => {
  const text = formatNumber(value, decimals);
  return text === MISSING ? MISSING : `${text}${NARROW_NO_BREAK_SPACE}${unit}`;
};
export const energyText = (energyJPerKg: number): string => withUnit(energyJPerKg, 0, 'J/kg');
export const pressureText = (pressureHpa: number, decimals = 0): string => withUnit(pressureHpa, decimals, 'hPa');

/** Temperature in the display unit (°C or °F) as a number, from °C. */
export function toDisplayTemperature(temperatureC: number, unit: Units['temperature']): number {
  return unit === 'C' ? temperatureC : temperatureC * 1.8 + 32;
}

/** °C from a temperature in the display unit. */
export function fromDisplayTemperature(value: number, unit: Units['temperature']): number {
  return unit === 'C' ? value : (value - 32) / 1.8;
}

/** A height difference in the display unit, from m. */
export function toDisplayHeight(heightM: number, unit: Units['height']): number {
  return unit === 'm' ? heightM : heightM / METRES_PER_FOOT;
}

export { heightUnitLabel, speedUnitLabel, temperatureUnitLabel, formatNumber };
