/**
 * Unit conversions done once at the edge of the engine (parser, validator, CLI).
 * Inside the engine values are K, hPa, kg/kg, m, m s⁻¹ and J kg⁻¹.
 */
import { ZERO_CELSIUS_K } from './constants';

/** Convert °C to K. Example: `celsiusToKelvin(20)` → 293.15. */
export const celsiusToKelvin = (temperatureC: number): number => temperatureC + ZERO_CELSIUS_K;

/** Convert K to °C. Example: `kelvinToCelsius(273.15)` → 0. */
export const kelvinToCelsius = (temperatureK: number): number => temperatureK - ZERO_CELSIUS_K;

/** Convert °F to °C. Example: `fahrenheitToCelsius(212)` → 100. */
export const fahrenheitToCelsius = (temperatureF: number): number => ((temperatureF - 32) * 5) / 9;

/** Convert °C to °F. Example: `celsiusToFahrenheit(16)` → 60.8. */
export const celsiusToFahrenheit = (temperatureC: number): number => (temperatureC * 9) / 5 + 32;

/** Convert Pa to hPa. Example: `pascalToHectopascal(101325)` → 1013.25. */
export const pascalToHectopascal = (pressurePa: number): number => pressurePa / 100;

/** Convert hPa to Pa. Example: `hectopascalToPascal(1000)` → 100000. */
export const hectopascalToPascal = (pressureHpa: number): number => pressureHpa * 100;

/** Convert feet to metres (international foot, exactly 0.3048 m). Example: `feetToMeters(1000)` → 304.8. */
export const feetToMeters = (lengthFt: number): number => lengthFt * 0.3048;

/** Convert knots to m s⁻¹ (1 kt = 1852 m h⁻¹ exactly). Example: `knotsToMetersPerSecond(1)` → 0.51444. */
export const knotsToMetersPerSecond = (speedKt: number): number => (speedKt * 1852) / 3600;

/** Convert m s⁻¹ to knots. Example: `metersPerSecondToKnots(10)` → 19.438. */
export const metersPerSecondToKnots = (speedMs: number): number => (speedMs * 3600) / 1852;

/** Convert km h⁻¹ to m s⁻¹. Example: `kilometersPerHourToMetersPerSecond(36)` → 10. */
export const kilometersPerHourToMetersPerSecond = (speedKmh: number): number => speedKmh / 3.6;

/** Convert statute miles per hour to m s⁻¹ (1 mi = 1609.344 m). Example: `milesPerHourToMetersPerSecond(10)` → 4.4704. */
export const milesPerHourToMetersPerSecond = (speedMph: number): number => (speedMph * 1609.344) / 3600;

/**
 * Wind components from meteorological direction and speed.
 *
 * @param directionDeg - direction the wind blows FROM, degrees clockwise from north
 * @param speed - wind speed in any unit; the components come back in the same unit
 * @returns `{u, v}`: u toward east, v toward north
 * @example windComponents(270, 10) // → {u: 10, v: ≈0} (a west wind blows toward the east)
 * Notes: u = −s sin(d), v = −s cos(d) (WallaceHobbs2006 pg. 270; common practice).
 */
export function windComponents(directionDeg: number, speed: number): { u: number; v: number } {
  const radians = (directionDeg * Math.PI) / 180;
  return { u: -speed * Math.sin(radians), v: -speed * Math.cos(radians) };
}

/**
 * Meteorological direction (from which the wind blows, degrees) and speed of a wind vector.
 *
 * @example windDirectionAndSpeed(10, 0) // → {directionDeg: 270, speed: 10}
 */
export function windDirectionAndSpeed(u: number, v: number): { directionDeg: number; speed: number } {
  const speed = Math.hypot(u, v);
  if (speed === 0) return { directionDeg: 0, speed: 0 };
  const directionDeg = ((Math.atan2(-u, -v) * 180) / Math.PI + 360) % 360;
  return { directionDeg, speed };
}
