import { err, ok, type Result } from '../result';
import { EPSILON, ZERO_CELSIUS_K } from './constants';
import { layerThickness } from './hypsometric';
import type { SoundingIssueCode } from './issue-codes';
import { mixingRatio } from './mixing-ratio';
import { saturationVaporPressure } from './saturation';
import type { ParsedSounding, SoundingIssue, SoundingLevel, SoundingMetadata, SoundingSource } from './types';

/** Upload limits (docs/sounding-format.md). */
export const MAX_FILE_BYTES = 2 * 1024 * 1024;
export const MAX_LEVELS = 5000;
export const MIN_LEVELS = 5;
/** The sounding must reach at least this pressure (its top pressure must be ≤ this), hPa. */
export const REQUIRED_TOP_HPA = 500;
export const MIN_PRESSURE_HPA = 10;
export const MAX_PRESSURE_HPA = 1100;
export const MIN_TEMPERATURE_C = -120;
export const MAX_TEMPERATURE_C = 60;
export const MIN_DEWPOINT_C = -150;
/**
 * Fastest wind accepted, m s⁻¹ (about 290 kt): well above the fastest upper-air winds
 * measured, about 110 m s⁻¹ (from memory; common practice to reject beyond ~150 m s⁻¹).
 */
export const MAX_WIND_SPEED_MS = 150;
/** ln(p_lower / p_upper) above which adjacent levels count as a data gap (≈ 3.3 km; wider than any standard mandatory-level spacing). */
const DATA_GAP_LOG_RATIO = 0.45;

/** A level as read, before checks, in engine units (null: missing). */
export interface RawLevel {
  pressureHpa: number | null;
  heightM: number | null;
  temperatureC: number | null;
  dewpointC: number | null;
  relativeHumidityPercent: number | null;
  uMs: number | null;
  vMs: number | null;
}

/** The quantity of a level an issue is about. */
export type LevelField = 'pressure' | 'height' | 'temperature' | 'dewpoint' | 'relativeHumidity' | 'wind';

/** Metadata as read, before checks. */
export interface RawMetadata {
  station?: unknown;
  name?: unknown;
  latitude?: unknown;
  longitude?: unknown;
  elevationM?: unknown;
  validTime?: unknown;
  source?: unknown;
}

/** Where an issue is: line/column for CSV, levelIndex/field name for structured input. */
export type Location = Pick<SoundingIssue, 'line' | 'column' | 'levelIndex'>;

/** How a caller (parser or validator) names the place of a problem. */
export interface Locator {
  level(index: number, field: LevelField): Location;
  metadata(key: keyof RawMetadata): Location;
  /** Name of the input for messages, e.g. the file name. */
  inputName: string;
}

/** "file.csv, line 12, column temperature_C" or "sounding, levels[3].temperatureC". */
export function describeLocation(inputName: string, location: Location): string {
  if (location.levelIndex !== undefined) {
    return `${inputName}, levels[${location.levelIndex}]${location.column ? `.${location.column}` : ''}`;
  }
  return `${inputName}${location.line !== undefined ? `, line ${location.line}` : ''}${location.column ? `, column ${location.column}` : ''}`;
}

/** Collects issues; knows whether any is an error. */
export class IssueList {
  readonly issues: SoundingIssue[] = [];
  /** When set, prefixes each message with its place ("file.csv, line 12, column temperature_C: "). */
  describe: ((location: Location) => string) | undefined;

  add(severity: SoundingIssue['severity'], code: SoundingIssueCode, message: string, location: Location = {}): void {
    const text = this.describe ? `${this.describe(location)}: ${message}` : message;
    this.issues.push({ severity, code, message: text, ...location });
  }

  error(code: SoundingIssueCode, message: string, location: Location = {}): void {
    this.add('error', code, message, location);
  }

  warning(code: SoundingIssueCode, message: string, location: Location = {}): void {
    this.add('warning', code, message, location);
  }

  get hasErrors(): boolean {
    return this.issues.some((issue) => issue.severity === 'error');
  }

  get warnings(): SoundingIssue[] {
    return this.issues.filter((issue) => issue.severity === 'warning');
  }
}

function toNumber(value: unknown): number | null {
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (typeof value === 'string' && value.trim() !== '') {
    const parsed = Number(value.trim());
    return Number.isFinite(parsed) ? parsed : null;
  }
  return null;
}

/** Days in a month of a (proleptic Gregorian) year. */
function daysInMonth(year: number, month: number): number {
  return [31, year % 4 === 0 && (year % 100 !== 0 || year % 400 === 0) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1] ?? 0;
}

/**
 * An ISO 8601 time with a time zone, checked field by field (30 February is refused rather
 * than rolled over to 2 March), as milliseconds; null when it is not one.
 */
export function parseValidTime(text: string): number | null {
  const match = /^(\d{4})-(\d\d)-(\d\d)T(\d\d):(\d\d)(?::(\d\d)(?:\.\d+)?)?(Z|[+-]\d\d:?\d\d)$/i.exec(text);
  if (!match) return null;
  const [year, month, day, hour, minute, second] = [1, 2, 3, 4, 5, 6].map((i) => Number(match[i] ?? 0)) as [number, number, number, number, number, number];
  if (year < 1900 || year > 9999 || month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month) || hour > 23 || minute > 59 || second > 59) return null;
  const milliseconds = Date.parse(text);
  return Number.isNaN(milliseconds) ? null : milliseconds;
}

function checkMetadata(raw: RawMetadata, locator: Locator, issues: IssueList, lowestHeightM: number | null): SoundingMetadata {
  const station = typeof raw.station === 'string' ? raw.station.trim() : '';
  if (station === '') {
    issues.warning('MISSING_METADATA', `the station identifier is missing. The sounding can be analysed; a library upload keeps it out of evidence until a station is given (add "# station: ABC").`, locator.metadata('station'));
  }
  const name = typeof raw.name === 'string' ? raw.name.trim() : '';

  const readCoordinate = (key: 'latitude' | 'longitude', limit: number): number | null => {
    if (raw[key] === undefined || raw[key] === null || raw[key] === '') {
      issues.warning('MISSING_METADATA', `the ${key} is missing. The sounding can be analysed; a library upload keeps it out of evidence until it is given (add "# ${key}: <degrees>").`, locator.metadata(key));
      return null;
    }
    const value = toNumber(raw[key]);
    if (value === null || Math.abs(value) > limit) {
      issues.error('INVALID_METADATA', `the ${key} "${String(raw[key])}" is not a number between −${limit} and ${limit} degrees.`, locator.metadata(key));
      return null;
    }
    return value;
  };
  const latitude = readCoordinate('latitude', 90);
  const longitude = readCoordinate('longitude', 180);

  let elevationM: number | null = null;
  if (raw.elevationM === undefined || raw.elevationM === null || raw.elevationM === '') {
    if (lowestHeightM !== null) {
      elevationM = lowestHeightM;
      issues.warning('MISSING_METADATA', `the station elevation is missing; the height of the lowest level (${lowestHeightM} m) is used.`, locator.metadata('elevationM'));
    } else {
      issues.warning('MISSING_METADATA', `the station elevation and the lowest height are missing; heights above ground start at 0 m (results above ground do not depend on the elevation).`, locator.metadata('elevationM'));
    }
  } else {
    const value = toNumber(raw.elevationM);
    if (value === null || value < -500 || value > 9000) {
      issues.error('INVALID_METADATA', `the elevation "${String(raw.elevationM)}" is not a height in metres between −500 and 9000.`, locator.metadata('elevationM'));
    } else {
      elevationM = value;
    }
  }

  let validTime: string | null = null;
  if (raw.validTime === undefined || raw.validTime === null || raw.validTime === '') {
    issues.warning('MISSING_METADATA', `the valid time is missing. The sounding can be analysed; a library upload keeps it out of evidence until it is given (add "# valid: 2027-04-18T18:00:00Z").`, locator.metadata('validTime'));
  } else {
    const text = String(raw.validTime).trim();
    const milliseconds = parseValidTime(text);
    if (milliseconds === null) {
      issues.error('INVALID_METADATA', `the valid time "${text}" is not a real date and time with a time zone (ISO 8601, e.g. 2027-04-18T18:00:00Z; months have their own number of days).`, locator.metadata('validTime'));
    } else {
      validTime = new Date(milliseconds).toISOString();
    }
  }

  let source: SoundingSource = 'unknown';
  if (raw.source === undefined || raw.source === null || raw.source === '') {
    issues.warning('MISSING_METADATA', `the source is missing; it is recorded as "unknown". Add "# source: observed" or "# source: model".`, locator.metadata('source'));
  } else {
    const text = String(raw.source).trim().toLowerCase();
    if (text === 'observed' || text === 'model' || text === 'unknown') source = text;
    else issues.error('INVALID_METADATA', `the source "${String(raw.source)}" must be "observed", "model" or "unknown".`, locator.metadata('source'));
  }
  return { station, name, latitude, longitude, elevationM, validTime, source };
}

/**
 * Check raw levels and metadata and build a sounding: the checks shared by the CSV parser
 * and the structured validator, so both report the same codes.
 *
 * Every class of bad input in docs/sounding-format.md gives an error or a warning with its place; no
 * input throws. Heights that are missing are filled with the hypsometric equation using
 * virtual temperature (WallaceHobbs2006 eq. 3.29), starting from the station elevation.
 * @param rawLevels - the levels in input order
 * @param rawMetadata - the metadata values as read
 * @param locator - how to name the place of a problem
 * @param issues - issues found so far (by the caller's own format checks)
 * @returns the sounding with its warnings, or all issues when any is an error
 */
export function checkSounding(
  rawLevels: readonly RawLevel[],
  rawMetadata: RawMetadata,
  locator: Locator,
  issues: IssueList,
): Result<ParsedSounding, SoundingIssue[]> {
  issues.describe = (location) => describeLocation(locator.inputName, location);
  if (rawLevels.length > MAX_LEVELS) {
    issues.error('TOO_MANY_LEVELS', `the sounding has ${rawLevels.length} levels; at most ${MAX_LEVELS} are accepted. Thin it and upload again.`);
    return err(issues.issues);
  }
  interface Candidate {
    index: number;
    pressureHpa: number;
    heightM: number | null;
    temperatureC: number;
    dewpointC: number | null;
    uMs: number | null;
    vMs: number | null;
  }
  const candidates: Candidate[] = [];
  let droppedAbove10 = 0;
  let firstDroppedAbove10: Location | undefined;
  for (let index = 0; index < rawLevels.length; index++) {
    const level = rawLevels[index] as RawLevel;
    const pressure = level.pressureHpa;
    if (pressure === null) {
      issues.error('MISSING_VALUE', `a level has no pressure. Every level needs one.`, locator.level(index, 'pressure'));
      continue;
    }
    if (pressure <= 0 || pressure > MAX_PRESSURE_HPA) {
      issues.error('PRESSURE_OUT_OF_RANGE', `pressure ${pressure} hPa is outside ${MIN_PRESSURE_HPA}–${MAX_PRESSURE_HPA} hPa. Check the unit (hPa or Pa) in the header.`, locator.level(index, 'pressure'));
      continue;
    }
    if (pressure < MIN_PRESSURE_HPA) {
      droppedAbove10++;
      firstDroppedAbove10 ??= locator.level(index, 'pressure');
      continue;
    }
    const temperature = level.temperatureC;
    if (temperature === null) {
      issues.warning('MISSING_TEMPERATURE', `the level at ${pressure} hPa has no temperature and is left out.`, locator.level(index, 'temperature'));
      continue;
    }
    if (temperature < MIN_TEMPERATURE_C || temperature > MAX_TEMPERATURE_C) {
      issues.error('TEMPERATURE_OUT_OF_RANGE', `temperature ${temperature} °C at ${pressure} hPa is outside ${MIN_TEMPERATURE_C} to ${MAX_TEMPERATURE_C} °C. Check the unit (C, K or F) in the header.`, locator.level(index, 'temperature'));
      continue;
    }
    let dewpoint = level.dewpointC;
    if (dewpoint === null && level.relativeHumidityPercent !== null) {
      const rh = level.relativeHumidityPercent;
      if (!(rh > 0 && rh <= 100)) {
        issues.error('RELATIVE_HUMIDITY_OUT_OF_RANGE', `relative humidity ${rh} % at ${pressure} hPa is outside 0–100 %.`, locator.level(index, 'relativeHumidity'));
        continue;
      }
      const vaporPressure = (rh / 100) * saturationVaporPressure(temperature + ZERO_CELSIUS_K);
      const logRatio = Math.log(vaporPressure / 6.112);
      dewpoint = (243.5 * logRatio) / (17.67 - logRatio);
    }
    if (dewpoint !== null) {
      if (dewpoint < MIN_DEWPOINT_C || dewpoint > MAX_TEMPERATURE_C) {
        issues.error('DEWPOINT_OUT_OF_RANGE', `dewpoint ${dewpoint} °C at ${pressure} hPa is outside ${MIN_DEWPOINT_C} to ${MAX_TEMPERATURE_C} °C.`, locator.level(index, 'dewpoint'));
        continue;
      }
      if (dewpoint > temperature) {
        issues.warning('DEWPOINT_ABOVE_TEMPERATURE', `dewpoint ${dewpoint} °C is above the temperature ${temperature} °C at ${pressure} hPa; it is set equal to the temperature${dewpoint - temperature > 0.5 ? ' (check that the columns are not swapped)' : ''}.`, locator.level(index, 'dewpoint'));
        dewpoint = temperature;
      }
    }
    if ((level.uMs !== null && Math.abs(level.uMs) > MAX_WIND_SPEED_MS) || (level.vMs !== null && Math.abs(level.vMs) > MAX_WIND_SPEED_MS)) {
      issues.error('WIND_OUT_OF_RANGE', `the wind at ${pressure} hPa is faster than ${MAX_WIND_SPEED_MS} m/s; check the unit.`, locator.level(index, 'wind'));
      continue;
    }
    candidates.push({ index, pressureHpa: pressure, heightM: level.heightM, temperatureC: temperature, dewpointC: dewpoint, uMs: level.uMs, vMs: level.vMs });
  }
  if (droppedAbove10 > 0) {
    issues.warning('PRESSURE_OUT_OF_RANGE', `${droppedAbove10} level(s) above ${MIN_PRESSURE_HPA} hPa are left out (the engine works between ${MIN_PRESSURE_HPA} and ${MAX_PRESSURE_HPA} hPa).`, firstDroppedAbove10);
  }

  // Order: any order is sorted by decreasing pressure (stable); identical duplicates merge,
  // conflicting ones are refused (which one is right cannot be guessed).
  let outOfOrder = 0;
  for (let i = 1; i < candidates.length; i++) {
    if ((candidates[i] as Candidate).pressureHpa > (candidates[i - 1] as Candidate).pressureHpa) outOfOrder++;
  }
  if (outOfOrder > 0 && outOfOrder < candidates.length - 1) {
    issues.warning('LEVELS_SORTED', `the levels are not in pressure order; they are sorted by decreasing pressure.`);
  }
  candidates.sort((a, b) => b.pressureHpa - a.pressureHpa || a.index - b.index);
  const same = (a: Candidate, b: Candidate): boolean =>
    a.heightM === b.heightM && a.temperatureC === b.temperatureC && a.dewpointC === b.dewpointC && a.uMs === b.uMs && a.vMs === b.vMs;
  for (let i = candidates.length - 1; i > 0; i--) {
    const previous = candidates[i - 1] as Candidate;
    const current = candidates[i] as Candidate;
    if (current.pressureHpa !== previous.pressureHpa) continue;
    const firstLine = describeLocation(locator.inputName, locator.level(previous.index, 'pressure'));
    if (same(previous, current)) {
      issues.warning('DUPLICATE_PRESSURE', `the level at ${current.pressureHpa} hPa appears twice with the same values (also ${firstLine}); it is kept once.`, locator.level(current.index, 'pressure'));
      candidates.splice(i, 1);
    } else {
      issues.error('DUPLICATE_PRESSURE', `two levels have the pressure ${current.pressureHpa} hPa with different values (the other is ${firstLine}). Keep the right one.`, locator.level(current.index, 'pressure'));
    }
  }

  const lowest = candidates[0];
  const metadata = checkMetadata(rawMetadata, locator, issues, lowest?.heightM ?? null);

  if (candidates.length < MIN_LEVELS) {
    issues.error('TOO_FEW_LEVELS', `only ${candidates.length} usable level(s); at least ${MIN_LEVELS} are needed.`);
    return err(issues.issues);
  }
  const top = candidates[candidates.length - 1] as Candidate;
  if (top.pressureHpa > REQUIRED_TOP_HPA) {
    issues.warning('TOP_TOO_LOW', `the sounding ends at ${top.pressureHpa} hPa, below ${REQUIRED_TOP_HPA} hPa: it is analysed and flagged (no lifted index; CAPE and EL may be cut at the top).`, locator.level(top.index, 'pressure'));
  }
  if ((lowest as Candidate).dewpointC === null) {
    issues.error('SURFACE_DEWPOINT_MISSING', `the lowest level (${(lowest as Candidate).pressureHpa} hPa) has no dewpoint; a surface parcel needs one.`, locator.level((lowest as Candidate).index, 'dewpoint'));
  }

  // Heights: fill missing ones hypsometrically from the level below, starting at the station elevation.
  const virtual = (c: Candidate): number => {
    const t = c.temperatureC + ZERO_CELSIUS_K;
    if (c.dewpointC === null) return t;
    const w = mixingRatio(saturationVaporPressure(c.dewpointC + ZERO_CELSIUS_K), c.pressureHpa);
    return (t * (w + EPSILON)) / (EPSILON * (1 + w));
  };
  const base = lowest as Candidate;
  if (base.heightM === null) {
    base.heightM = metadata.elevationM ?? 0;
  } else if (metadata.elevationM !== null && Math.abs(base.heightM - metadata.elevationM) > 50) {
    issues.warning('ELEVATION_MISMATCH', `the lowest level height ${base.heightM} m differs from the station elevation ${metadata.elevationM} m by more than 50 m.`, locator.level(base.index, 'height'));
  }
  // Reported heights that do not increase upward cannot be used: all heights above the lowest
  // level are then computed with the hypsometric equation.
  let heightsDropped = false;
  for (let i = 1; i < candidates.length; i++) {
    const current = candidates[i] as Candidate;
    let below: number | null = null;
    for (let j = i - 1; j >= 0 && below === null; j--) below = (candidates[j] as Candidate).heightM;
    if (current.heightM !== null && below !== null && current.heightM <= below) {
      issues.warning('HEIGHT_NOT_INCREASING', `height ${current.heightM} m at ${current.pressureHpa} hPa is not above the height ${below} m of the level below; the heights above the lowest level are computed with the hypsometric equation instead.`, locator.level(current.index, 'height'));
      heightsDropped = true;
      break;
    }
  }
  if (heightsDropped) for (let i = 1; i < candidates.length; i++) (candidates[i] as Candidate).heightM = null;
  let windMissing = 0;
  for (let i = 0; i < candidates.length; i++) {
    const current = candidates[i] as Candidate;
    if (current.uMs === null || current.vMs === null) windMissing++;
    if (i === 0) continue;
    const previous = candidates[i - 1] as Candidate;
    if (current.heightM === null && previous.heightM !== null) {
      current.heightM = previous.heightM + layerThickness(previous.pressureHpa, current.pressureHpa, virtual(previous), virtual(current));
    }
    if (Math.log(previous.pressureHpa / current.pressureHpa) > DATA_GAP_LOG_RATIO) {
      issues.warning('DATA_GAP', `no data between ${previous.pressureHpa} and ${current.pressureHpa} hPa (about ${Math.round((29.3 * 250 * Math.log(previous.pressureHpa / current.pressureHpa)) / 100) / 10} km); values there are interpolated.`, locator.level(current.index, 'pressure'));
    }
  }
  if (windMissing > 0 && windMissing < candidates.length) {
    issues.warning('WIND_MISSING', `${windMissing} of ${candidates.length} levels have no wind; kinematic values that need them are null.`);
  }
  if (issues.hasErrors) return err(issues.issues);
  const levels: SoundingLevel[] = candidates.map((c) => ({
    pressureHpa: c.pressureHpa,
    heightM: c.heightM as number,
    temperatureC: c.temperatureC,
    dewpointC: c.dewpointC,
    uMs: c.uMs,
    vMs: c.vMs,
  }));
  return ok({ metadata, levels, warnings: issues.warnings });
}

const STRUCTURED_FIELDS: Record<LevelField, string> = {
  pressure: 'pressureHpa',
  height: 'heightM',
  temperature: 'temperatureC',
  dewpoint: 'dewpointC',
  relativeHumidity: 'relativeHumidityPercent',
  wind: 'uMs',
};

/**
 * Validate an already-structured sounding (e.g. the body of a JSON API request) with the
 * same checks and issue codes as the CSV parser; issues carry `levelIndex` and the field name.
 *
 * @param input - `{metadata: {station, name?, latitude, longitude, elevationM?, validTime, source?},
 *   levels: [{pressureHpa, heightM?, temperatureC, dewpointC?, uMs?, vMs?}, …]}`
 * @returns the sounding (levels sorted by decreasing pressure) with warnings, or the issues
 * @example validateSounding({metadata: {...}, levels: [...]}) // → {ok: true, value: {...}}
 */
export function validateSounding(input: unknown): Result<ParsedSounding, SoundingIssue[]> {
  const issues = new IssueList();
  if (typeof input !== 'object' || input === null) {
    issues.error('INVALID_INPUT', 'The sounding must be an object with "metadata" and "levels".');
    return err(issues.issues);
  }
  const record = input as { metadata?: unknown; levels?: unknown };
  if (!Array.isArray(record.levels)) {
    issues.error('INVALID_INPUT', 'The sounding needs a "levels" array.', { column: 'levels' });
    return err(issues.issues);
  }
  const metadata = (typeof record.metadata === 'object' && record.metadata !== null ? record.metadata : {}) as RawMetadata;
  const locator: Locator = {
    inputName: 'sounding',
    level: (index, field) => ({ levelIndex: index, column: STRUCTURED_FIELDS[field] }),
    metadata: (key) => ({ column: `metadata.${key}` }),
  };
  const rawLevels: RawLevel[] = [];
  record.levels.forEach((item: unknown, index: number) => {
    const level = (typeof item === 'object' && item !== null ? item : {}) as Record<string, unknown>;
    const read = (key: string, required: boolean): number | null => {
      const value = level[key];
      if (value === undefined || value === null) {
        return null;
      }
      if (typeof value !== 'number' || !Number.isFinite(value)) {
        issues.error('NOT_A_NUMBER', `sounding: levels[${index}].${key} is ${JSON.stringify(value)}, not a finite number.`, { levelIndex: index, column: key });
        return required ? NaN : null;
      }
      return value;
    };
    const pressureHpa = read('pressureHpa', true);
    const temperatureC = read('temperatureC', true);
    const raw: RawLevel = {
      pressureHpa: Number.isNaN(pressureHpa) ? null : pressureHpa,
      heightM: read('heightM', false),
      temperatureC: Number.isNaN(temperatureC) ? null : temperatureC,
      dewpointC: read('dewpointC', false),
      relativeHumidityPercent: read('relativeHumidityPercent', false),
      uMs: read('uMs', false),
      vMs: read('vMs', false),
    };
    if (Number.isNaN(pressureHpa) || Number.isNaN(temperatureC)) return;
    rawLevels.push(raw);
  });
  if (issues.hasErrors) return err(issues.issues);
  return checkSounding(rawLevels, metadata, locator, issues);
}
