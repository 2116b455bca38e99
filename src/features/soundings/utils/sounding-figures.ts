import type { SoundingKeyFigures } from '../../../../shared/contracts/soundings';
import type { UnitFormatters } from '../../../hooks/use-units';
import { CELSIUS_ZERO_K, formatNumber, heightUnitLabel, metresPerSecondToKnots, metresPerSecondToMph, metresToFeet, speedUnitLabel, temperatureUnitLabel } from '../../../utils/units';

/**
 * The key figures a forecaster scans in the library, on the map and in popups: how each is
 * named and shown in the person's units. Values arrive in SI from the server.
 */
export type FigureKey = Extract<
  keyof SoundingKeyFigures,
  'mlCape' | 'muCape' | 'mlCin' | 'mlLclHeightM' | 'precipitableWaterMm' | 'bulkShear0to6kmMs' | 'srh0to1km' | 'stp' | 'surfaceDewpointC'
>;

export interface FigureDefinition {
  key: FigureKey;
  /** Short column heading. */
  label: string;
  /** Full name for screen readers, tooltips and the map's parameter list. */
  name: string;
  /** The value in the person's units, with its unit; a dash when missing. */
  format: (value: number | null, units: UnitFormatters) => string;
  /** The unit alone, for a column heading ('' when dimensionless). */
  unit: (units: UnitFormatters) => string;
  /** The number alone in the person's units, for a table cell under a heading that names the unit. */
  value: (value: number | null, units: UnitFormatters) => string;
}

const speedIn = (speedMps: number, units: UnitFormatters) =>
  units.units.speed === 'kt' ? metresPerSecondToKnots(speedMps) : units.units.speed === 'mph' ? metresPerSecondToMph(speedMps) : speedMps;
const heightIn = (heightM: number, units: UnitFormatters) => (units.units.height === 'ft' ? metresToFeet(heightM) : heightM);
const dewpointIn = (dewpointC: number, units: UnitFormatters) => (units.units.temperature === 'F' ? dewpointC * 1.8 + 32 : dewpointC);
const plain = (value: number | null, decimals: number) => (value === null ? '—' : formatNumber(value, decimals));

const NARROW_NO_BREAK_SPACE = '\u202f';
const MISSING = '—';

const withUnit = (value: number | null, decimals: number, unit: string) =>
  value === null ? MISSING : unit === '' ? formatNumber(value, decimals) : `${formatNumber(value, decimals)}${NARROW_NO_BREAK_SPACE}${unit}`;

export const figureDefinitions: Record<FigureKey, FigureDefinition> = {
  mlCape: { key: 'mlCape', label: 'MLCAPE', name: 'Mixed-layer CAPE', format: (v) => withUnit(v, 0, 'J/kg'), unit: () => 'J/kg', value: (v) => plain(v, 0) },
  muCape: { key: 'muCape', label: 'MUCAPE', name: 'Most-unstable CAPE', format: (v) => withUnit(v, 0, 'J/kg'), unit: () => 'J/kg', value: (v) => plain(v, 0) },
  mlCin: { key: 'mlCin', label: 'MLCIN', name: 'Mixed-layer CIN', format: (v) => withUnit(v, 0, 'J/kg'), unit: () => 'J/kg', value: (v) => plain(v, 0) },
  mlLclHeightM: { key: 'mlLclHeightM', label: 'LCL', name: 'Mixed-layer LCL height (above ground)', format: (v, u) => (v === null ? MISSING : u.height(v)), unit: (u) => heightUnitLabel[u.units.height], value: (v, u) => plain(v === null ? null : heightIn(v, u), 0) },
  precipitableWaterMm: { key: 'precipitableWaterMm', label: 'PW', name: 'Precipitable water', format: (v) => withUnit(v, 1, 'mm'), unit: () => 'mm', value: (v) => plain(v, 1) },
  bulkShear0to6kmMs: { key: 'bulkShear0to6kmMs', label: '0–6 km shear', name: '0–6 km bulk shear', format: (v, u) => (v === null ? MISSING : u.speed(v)), unit: (u) => speedUnitLabel[u.units.speed], value: (v, u) => plain(v === null ? null : speedIn(v, u), 0) },
  srh0to1km: { key: 'srh0to1km', label: '0–1 km SRH', name: '0–1 km storm-relative helicity', format: (v) => withUnit(v, 0, 'm²/s²'), unit: () => 'm²/s²', value: (v) => plain(v, 0) },
  stp: { key: 'stp', label: 'STP', name: 'Significant tornado parameter', format: (v) => withUnit(v, 1, ''), unit: () => '', value: (v) => plain(v, 1) },
  surfaceDewpointC: {
    key: 'surfaceDewpointC',
    label: 'Sfc dewpoint',
    name: 'Surface dewpoint',
    format: (v, u) => (v === null ? MISSING : u.temperature(v + CELSIUS_ZERO_K)),
    unit: (u) => temperatureUnitLabel[u.units.temperature],
    value: (v, u) => plain(v === null ? null : dewpointIn(v, u), 1),
  },
};

/** Library columns, in reading order: instability, cloud base, moisture, kinematics, composite. */
export const libraryFigureKeys = ['mlCape', 'muCape', 'mlCin', 'mlLclHeightM', 'precipitableWaterMm', 'bulkShear0to6kmMs', 'srh0to1km', 'stp'] as const satisfies readonly FigureKey[];

/** Parameters the map can colour its points by. */
export const mapFigureKeys = ['mlCape', 'muCape', 'mlCin', 'precipitableWaterMm', 'bulkShear0to6kmMs', 'srh0to1km', 'stp', 'surfaceDewpointC'] as const satisfies readonly FigureKey[];
export type MapFigureKey = (typeof mapFigureKeys)[number];

export function isMapFigureKey(value: string): value is MapFigureKey {
  return (mapFigureKeys as readonly string[]).includes(value);
}
