import { useMemo } from 'react';
import { defaultUnits, type Units } from '../../shared/contracts/users';
import { formatHeight, formatSpeed, formatTemperature } from '../utils/units';
import { useMe } from './use-me';

export interface UnitFormatters {
  units: Units;
  temperature: (temperatureK: number, decimals?: number) => string;
  height: (heightM: number, decimals?: number) => string;
  speed: (speedMps: number, decimals?: number) => string;
}

/** The signed-in person's display units (defaults for anonymous visitors) with bound formatters. */
export function useUnits(): UnitFormatters {
  const me = useMe();
  const units = me.data?.preferences.units ?? defaultUnits;
  return useMemo(
    () => ({
      units,
      temperature: (temperatureK, decimals) => formatTemperature(temperatureK, units.temperature, decimals),
      height: (heightM, decimals) => formatHeight(heightM, units.height, decimals),
      speed: (speedMps, decimals) => formatSpeed(speedMps, units.speed, decimals),
    }),
    [units],
  );
}
