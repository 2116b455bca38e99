import { lclPressure, lclTemperature } from './lcl';
import { moistAdiabatTemperature, OUTSIDE_TABLE_STEP_HPA, pseudoAdiabatTable, type MoistAscentMethod } from './moist-adiabat';

/**
 * Wet-bulb temperature by Normand's rule: lift the air dry-adiabatically to its LCL, then bring
 * it back down the pseudo-adiabat to its own pressure.
 *
 * @param pressureHpa - pressure, hPa
 * @param temperatureK - temperature, K
 * @param dewpointK - dewpoint, K (≤ temperature)
 * @param method - 'table' (fast, default) or 'reference' (RK4 integration)
 * @returns (pseudo-)wet-bulb temperature, K, between the dewpoint and the temperature
 * @example wetBulbTemperature(1000, 303.15, 293.15) // → 296.0 K (22.9 °C)
 * Notes: Normand's rule (WallaceHobbs2006 pg. 85–86), with the LCL of Bolton1980 eq. 15 and
 * the pseudo-adiabat of moist-adiabat.ts (the table; outside it, RK4 from the LCL down to
 * the pressure). This is the adiabatic (pseudo) wet-bulb
 * temperature; it differs from the isobaric wet-bulb by a few tenths of a kelvin at most
 * (WallaceHobbs2006 pg. 85).
 */
export function wetBulbTemperature(
  pressureHpa: number,
  temperatureK: number,
  dewpointK: number,
  method: MoistAscentMethod = 'table',
): number {
  const dewpoint = Math.min(dewpointK, temperatureK);
  const temperatureLcl = lclTemperature(temperatureK, dewpoint);
  const pressureLcl = lclPressure(pressureHpa, temperatureK, dewpoint);
  if (method === 'reference') return moistAdiabatTemperature(pressureLcl, temperatureLcl, pressureHpa, 1);
  const table = pseudoAdiabatTable();
  const thetaW = table.thetaWInTable(temperatureLcl, Math.log(pressureLcl));
  const inTable = Number.isNaN(thetaW) ? NaN : table.temperatureInTable(thetaW, Math.log(pressureHpa));
  // Outside the table: straight down the curve from the LCL (never by way of 1000 hPa).
  return Number.isNaN(inTable) ? moistAdiabatTemperature(pressureLcl, temperatureLcl, pressureHpa, OUTSIDE_TABLE_STEP_HPA) : inTable;
}
