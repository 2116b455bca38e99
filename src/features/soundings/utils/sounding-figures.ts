import type { SoundingKeyFigures } from '../../../../shared/contracts/soundings';
import type { UnitFormatters } from '../../../hooks/use-units';
import { CELSIUS_ZERO_K, formatNumber, heightUnitLabel, metresPerSecondToKnots, metresPerSecondToMph, metresToFeet, speedUnitLabel, temperatureUnitLabel } from '../../../utils/units';

/**
 * The key figures a forecaster scans in the library, on the map and in popups: how each is
 * named and shown in the person's units. Values arrive in SI from the server.
 */
export type FigureKey = Exclude<keyof SoundingKeyFigures, 'flagCount'>;

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

/** A figure in a fixed unit (energies, helicity, lapse rates, angles, composites). */
function fixed(key: FigureKey, label: string, name: string, unit: string, decimals: number): FigureDefinition {
  return { key, label, name, format: (v) => withUnit(v, decimals, unit), unit: () => unit, value: (v) => plain(v, decimals) };
}

/** A height above ground in the person's height unit. */
function heightFigure(key: FigureKey, label: string, name: string): FigureDefinition {
  return { key, label, name, format: (v, u) => (v === null ? MISSING : u.height(v)), unit: (u) => heightUnitLabel[u.units.height], value: (v, u) => plain(v === null ? null : heightIn(v, u), 0) };
}

/** A wind speed in the person's speed unit. */
function speedFigure(key: FigureKey, label: string, name: string): FigureDefinition {
  return { key, label, name, format: (v, u) => (v === null ? MISSING : u.speed(v)), unit: (u) => speedUnitLabel[u.units.speed], value: (v, u) => plain(v === null ? null : speedIn(v, u), 0) };
}

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
  surfaceMixingRatioGkg: fixed('surfaceMixingRatioGkg', 'Sfc mixing ratio', 'Surface mixing ratio', 'g/kg', 1),
  scp: fixed('scp', 'SCP', 'Supercell composite parameter', '', 1),
  // Hazard ingredients (issue 14; definitions and sources in docs/analysis.md).
  srh0to500m: fixed('srh0to500m', '0–500 m SRH', '0–500 m storm-relative helicity', 'm²/s²', 0),
  criticalAngleDeg: fixed('criticalAngleDeg', 'Critical angle', 'Critical angle (surface inflow vs 0–500 m shear)', '°', 0),
  mlLclLfcGapM: heightFigure('mlLclLfcGapM', 'LCL–LFC gap', 'Mixed-layer LCL to LFC gap'),
  lapseRate0to3kmCKm: fixed('lapseRate0to3kmCKm', '0–3 km lapse', '0–3 km lapse rate', '°C/km', 1),
  lapseRate3to6kmCKm: fixed('lapseRate3to6kmCKm', '3–6 km lapse', '3–6 km lapse rate', '°C/km', 1),
  lapseRate850to500CKm: fixed('lapseRate850to500CKm', '850–500 lapse', '850–500 hPa lapse rate', '°C/km', 1),
  lapseRate700to500CKm: fixed('lapseRate700to500CKm', '700–500 lapse', '700–500 hPa lapse rate', '°C/km', 1),
  muCapeHailZone: fixed('muCapeHailZone', 'Hail-zone CAPE', 'Most-unstable CAPE between −10 and −30 °C', 'J/kg', 0),
  freezingLevelM: heightFigure('freezingLevelM', 'Freezing level', 'Freezing level (above ground)'),
  effectiveBulkShearMs: speedFigure('effectiveBulkShearMs', 'Eff. shear', 'Effective bulk shear'),
  bulkShear0to8kmMs: speedFigure('bulkShear0to8kmMs', '0–8 km shear', '0–8 km bulk shear'),
  dcape: fixed('dcape', 'DCAPE', 'Downdraft CAPE', 'J/kg', 0),
  meanWind0to6kmMs: speedFigure('meanWind0to6kmMs', '0–6 km mean wind', '0–6 km mean wind (pressure-weighted)'),
  corfidiUpwindMs: speedFigure('corfidiUpwindMs', 'Corfidi upwind', 'Corfidi upwind vector speed'),
  corfidiDownwindMs: speedFigure('corfidiDownwindMs', 'Corfidi downwind', 'Corfidi downwind vector speed'),
  warmCloudDepthM: heightFigure('warmCloudDepthM', 'Warm-cloud depth', 'Warm-cloud depth (LCL to freezing level)'),
};

/** Library columns, in reading order: instability, cloud base, moisture, kinematics, composite. */
export const libraryFigureKeys = ['mlCape', 'muCape', 'mlCin', 'mlLclHeightM', 'precipitableWaterMm', 'bulkShear0to6kmMs', 'srh0to1km', 'stp'] as const satisfies readonly FigureKey[];

/**
 * Figures the library can add as columns (the column chooser), grouped as the sounding page
 * groups them: more instability, then the hazard ingredients by hazard.
 */
export const optionalLibraryFigureGroups: readonly { title: string; keys: readonly FigureKey[] }[] = [
  { title: 'Instability', keys: ['lapseRate0to3kmCKm', 'lapseRate3to6kmCKm', 'lapseRate850to500CKm', 'lapseRate700to500CKm', 'scp'] },
  { title: 'Tornado', keys: ['srh0to500m', 'criticalAngleDeg', 'mlLclLfcGapM', 'effectiveBulkShearMs'] },
  { title: 'Hail', keys: ['muCapeHailZone', 'freezingLevelM', 'bulkShear0to8kmMs'] },
  { title: 'Damaging wind', keys: ['dcape', 'meanWind0to6kmMs'] },
  { title: 'Flash flooding', keys: ['corfidiUpwindMs', 'corfidiDownwindMs', 'warmCloudDepthM', 'surfaceMixingRatioGkg'] },
];
export const optionalLibraryFigureKeys: readonly FigureKey[] = optionalLibraryFigureGroups.flatMap((group) => group.keys);

export function isOptionalLibraryFigureKey(value: string): value is FigureKey {
  return (optionalLibraryFigureKeys as readonly string[]).includes(value);
}

/** Parameters the map can colour its points by. */
export const mapFigureKeys = [
  'mlCape', 'muCape', 'mlCin', 'precipitableWaterMm', 'bulkShear0to6kmMs', 'srh0to1km', 'stp', 'surfaceDewpointC',
  'srh0to500m', 'criticalAngleDeg', 'mlLclLfcGapM', 'lapseRate0to3kmCKm', 'lapseRate3to6kmCKm', 'lapseRate850to500CKm', 'lapseRate700to500CKm',
  'muCapeHailZone', 'freezingLevelM', 'effectiveBulkShearMs', 'bulkShear0to8kmMs', 'dcape', 'meanWind0to6kmMs', 'corfidiUpwindMs',
  'corfidiDownwindMs', 'warmCloudDepthM',
] as const satisfies readonly FigureKey[];
export type MapFigureKey = (typeof mapFigureKeys)[number];

export function isMapFigureKey(value: string): value is MapFigureKey {
  return (mapFigureKeys as readonly string[]).includes(value);
}
