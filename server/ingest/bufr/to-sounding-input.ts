/**
 * Turns a radiosonde read from BUFR into the structured sounding the soundings service validates
 * (metadata plus levels in hPa, m, °C and wind components in m/s). Pure: no I/O.
 */
import { kelvinToCelsius, pascalToHectopascal, windComponents } from '../../../shared/sounding';
import type { BufrRadiosonde } from './read-radiosondes';

export interface StructuredSoundingInput {
  metadata: { station: string; name: string; latitude: number | null; longitude: number | null; elevationM: number | null; validTime: string | null; source: 'observed' };
  levels: { pressureHpa: number; heightM: number | null; temperatureC: number | null; dewpointC: number | null; uMs: number | null; vMs: number | null }[];
}

/** Rounds away binary noise from unit conversions (0.01 °C, 0.01 hPa and 0.01 m/s are far below what a sonde resolves). */
const tidy = (value: number) => Math.round(value * 1000) / 1000;

/**
 * The structured sounding for one radiosonde. Its valid time is the launch time the message gives;
 * wind direction (where the wind blows from, degrees) and speed become u and v.
 * @example toSoundingInput({ station: '72901', …, levels: [{ pressurePa: 85000, temperatureK: 273.15, windDirectionDeg: 270, windSpeedMs: 10, … }] })
 *   // → levels[0] = { pressureHpa: 850, temperatureC: 0, uMs: 10, vMs: 0, … }
 */
export function toSoundingInput(radiosonde: BufrRadiosonde): StructuredSoundingInput {
  return {
    metadata: {
      station: radiosonde.station,
      name: '',
      latitude: radiosonde.latitude,
      longitude: radiosonde.longitude,
      elevationM: radiosonde.elevationM,
      validTime: radiosonde.launchTime,
      source: 'observed',
    },
    levels: radiosonde.levels.map((level) => {
      const wind = level.windDirectionDeg !== null && level.windSpeedMs !== null ? windComponents(level.windDirectionDeg, level.windSpeedMs) : null;
      return {
        pressureHpa: tidy(pascalToHectopascal(level.pressurePa)),
        heightM: level.geopotentialHeightM,
        temperatureC: level.temperatureK === null ? null : tidy(kelvinToCelsius(level.temperatureK)),
        dewpointC: level.dewpointK === null ? null : tidy(kelvinToCelsius(level.dewpointK)),
        uMs: wind ? tidy(wind.u) : null,
        vMs: wind ? tidy(wind.v) : null,
      };
    }),
  };
}
