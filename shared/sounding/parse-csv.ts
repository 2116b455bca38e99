import Papa from 'papaparse';
import { err, type Result } from '../result';
import type { ParsedSounding, SoundingIssue } from './types';
import {
  fahrenheitToCelsius,
  feetToMeters,
  kilometersPerHourToMetersPerSecond,
  knotsToMetersPerSecond,
  milesPerHourToMetersPerSecond,
  pascalToHectopascal,
  windComponents,
} from './units';
import { checkSounding, IssueList, MAX_FILE_BYTES, MAX_WIND_SPEED_MS, type LevelField, type RawLevel, type RawMetadata } from './validate';

type Quantity =
  | 'pressure'
  | 'height'
  | 'temperature'
  | 'dewpoint'
  | 'relativeHumidity'
  | 'windDirection'
  | 'windSpeed'
  | 'u'
  | 'v';

/** Accepted header names: quantity prefix → unit suffix → conversion to engine units. */
const COLUMN_UNITS: Record<string, { quantity: Quantity; units: Record<string, (value: number) => number> }> = {
  pressure: { quantity: 'pressure', units: { hpa: (x) => x, mb: (x) => x, pa: pascalToHectopascal } },
  height: { quantity: 'height', units: { m: (x) => x, ft: feetToMeters } },
  temperature: { quantity: 'temperature', units: { c: (x) => x, k: (x) => x - 273.15, f: fahrenheitToCelsius } },
  dewpoint: { quantity: 'dewpoint', units: { c: (x) => x, k: (x) => x - 273.15, f: fahrenheitToCelsius } },
  rh: { quantity: 'relativeHumidity', units: { pct: (x) => x } },
  wind_direction: { quantity: 'windDirection', units: { deg: (x) => x } },
  wind_speed: {
    quantity: 'windSpeed',
    units: { kt: knotsToMetersPerSecond, ms: (x) => x, kmh: kilometersPerHourToMetersPerSecond, mph: milesPerHourToMetersPerSecond },
  },
  u: { quantity: 'u', units: { ms: (x) => x, kt: knotsToMetersPerSecond } },
  v: { quantity: 'v', units: { ms: (x) => x, kt: knotsToMetersPerSecond } },
};

/** Metadata keys of the exchange format and the field each fills. */
const METADATA_KEYS: Record<string, { field: keyof RawMetadata; convert?: (value: string) => string }> = {
  station: { field: 'station' },
  name: { field: 'name' },
  latitude: { field: 'latitude' },
  longitude: { field: 'longitude' },
  elevation_m: { field: 'elevationM' },
  elevation_ft: { field: 'elevationM', convert: (v) => (v.trim() === '' || Number.isNaN(Number(v)) ? v : String(feetToMeters(Number(v)))) },
  valid: { field: 'validTime' },
  source: { field: 'source' },
};

interface Column {
  header: string;
  index: number;
  convert: (value: number) => number;
}

/**
 * The line break of a text that a plain split can tokenize: no quote character anywhere and
 * a single kind of line break ("\n" or "\r\n"); null when papaparse must do it.
 */
function plainLineBreak(text: string): string | null {
  if (text.includes('"')) return null;
  const cr = text.indexOf('\r');
  if (cr < 0) return '\n';
  // Windows line breaks: every CR followed by LF and every LF preceded by CR.
  const crCount = text.split('\r').length - 1;
  const lfCount = text.split('\n').length - 1;
  const crlfCount = text.split('\r\n').length - 1;
  return crCount === crlfCount && lfCount === crlfCount ? '\r\n' : null;
}

/** True for the exchange format's missing-value markers: empty, NA, −9999. */
function isMissing(cell: string): boolean {
  return cell === '' || cell === 'NA' || cell === 'na' || cell === 'Na' || cell === '-9999' || (cell.startsWith('-9999') && Number(cell) === -9999);
}

/** {@link readCell}, reporting a cell that is not a number as NOT_A_NUMBER (then null). */
function readReported(
  cells: string[],
  columns: Partial<Record<Quantity, Column>>,
  quantity: Quantity,
  line: number,
  fileName: string,
  issues: IssueList,
): number | null {
  const column = columns[quantity];
  const value = readCell(cells, column);
  if (value !== undefined) return value;
  const header = (column as Column).header;
  issues.error('NOT_A_NUMBER', `${fileName}, line ${line}, column ${header}: "${cells[(column as Column).index]}" is not a number (use an empty cell, NA or -9999 for a missing value).`, { line, column: header });
  return null;
}

/**
 * The value of a column in a row in engine units: null when the column is absent or the cell
 * holds a missing marker, undefined when the cell is not a number.
 */
function readCell(cells: string[], column: Column | undefined): number | null | undefined {
  if (!column) return null;
  const cell = cells[column.index] as string;
  if (isMissing(cell)) return null;
  const value = decimalValue(cell);
  return Number.isFinite(value) ? column.convert(value) : undefined;
}

/** A line's cells (comma-separated, each trimmed). */
function splitCells(text: string): string[] {
  const cells = text.split(',');
  for (let c = 0; c < cells.length; c++) cells[c] = (cells[c] as string).trim();
  return cells;
}

/** Exact powers of ten (every one up to 10²² is a double). */
const POWERS_OF_TEN = Array.from({ length: 16 }, (_, k) => 10 ** k);

/**
 * Number(cell), with a fast path for plain decimals ("-12.345"): with at most 15 digits the
 * digits form an exact integer m and 10^k is exact, so the one division m / 10^k is correctly
 * rounded, the same double Number gives (Clinger 1990). Anything else goes to Number.
 */
export function decimalValue(cell: string): number {
  const length = cell.length;
  let i = cell.charCodeAt(0) === 45 ? 1 : 0; // "-"
  const digitsStart = i;
  let mantissa = 0;
  let digits = 0;
  let decimals = -1;
  for (; i < length; i++) {
    const c = cell.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      mantissa = mantissa * 10 + (c - 48);
      digits++;
      if (decimals >= 0) decimals++;
    } else if (c === 46 && decimals < 0 && i > digitsStart) {
      decimals = 0;
    } else {
      return Number(cell);
    }
  }
  if (digits === 0 || digits > 15 || decimals === 0) return Number(cell);
  const value = decimals > 0 ? mantissa / (POWERS_OF_TEN[decimals] as number) : mantissa;
  return digitsStart === 1 ? -value : value;
}

/**
 * Parse a sounding in the exchange CSV format (docs/sounding-format.md).
 *
 * Tokenizes with papaparse (quoted cells may hold commas), reads `# key: value` metadata lines, finds columns by header name in any order, converts
 * units by suffix to hPa, m, °C and m s⁻¹ (winds to u/v), accepts the missing markers
 * (empty, NA, −9999), sorts levels by decreasing pressure and fills missing heights with the
 * hypsometric equation. Every problem is reported with the file, line and column; nothing throws.
 * @param text - the file contents
 * @param fileName - name used in messages (default "sounding.csv")
 * @returns the sounding with its warnings, or every issue found when any is an error
 * @example parseSoundingCsv('# station: MV07\n...', 'mv07.csv')
 */
export function parseSoundingCsv(text: string, fileName = 'sounding.csv'): Result<ParsedSounding, SoundingIssue[]> {
  const issues = new IssueList();
  if (text.length > MAX_FILE_BYTES) {
    issues.error('FILE_TOO_LARGE', `${fileName}: the file is larger than 2 MB. Split it or thin the levels.`);
    return err(issues.issues);
  }
  const body = text.replace(/^\uFEFF/, '');
  const metadata: RawMetadata = {};
  const metadataLines: Partial<Record<keyof RawMetadata, number>> = {};
  const metadataKeys: Partial<Record<keyof RawMetadata, string>> = {};
  let headerLine = -1;
  let headerCells: string[] = [];
  // Rows after the header: their line numbers, and their cells (or, from the plain split, the
  // line's text, split only when read, so no cell array outlives its row).
  const rowLineNumbers: number[] = [];
  const rowContents: (string | string[])[] = [];

  const readMetadataLine = (raw: string, line: number): void => {
    const match = /^#\s*([A-Za-z_]+)\s*:\s*(.*)$/.exec(raw);
    if (!match) return;
    const key = (match[1] as string).toLowerCase();
    const known = METADATA_KEYS[key];
    if (!known) return;
    const value = (match[2] as string).trim();
    metadata[known.field] = known.convert ? known.convert(value) : value;
    metadataLines[known.field] = line;
    metadataKeys[known.field] = key;
  };
  const readRow = (cells: string | string[], line: number): void => {
    if (headerLine < 0) {
      headerLine = line;
      headerCells = typeof cells === 'string' ? splitCells(cells) : cells;
    } else {
      rowLineNumbers.push(line);
      rowContents.push(cells);
    }
  };

  const lineBreaks = plainLineBreak(body);
  if (lineBreaks !== null) {
    // No quotes and one kind of line break: a plain split gives what papaparse would, at a
    // fraction of the cost (the tokenizer dominated parsing dense files).
    const lines = body.split(lineBreaks);
    for (let i = 0; i < lines.length; i++) {
      const text = lines[i] as string;
      const raw = text.trim();
      if (raw === '') continue;
      if (raw.startsWith('#')) {
        readMetadataLine(raw, i + 1);
        continue;
      }
      readRow(text, i + 1);
    }
  } else {
    // Line starts, so each row the tokenizer returns can be named by its 1-based line.
    const lineStarts: number[] = [0];
    for (let i = 0; i < body.length; i++) {
      const c = body.charCodeAt(i);
      if (c === 10 || (c === 13 && body.charCodeAt(i + 1) !== 10)) lineStarts.push(i + 1);
    }
    const lineAt = (offset: number): number => {
      let low = 0;
      let high = lineStarts.length - 1;
      while (low < high) {
        const middle = (low + high + 1) >> 1;
        if ((lineStarts[middle] as number) <= offset) low = middle;
        else high = middle - 1;
      }
      return low + 1;
    };
    // Tokenize with papaparse (quoted fields, embedded commas); keep our own validation.
    let rowStart = 0;
    Papa.parse<string[]>(body, {
      delimiter: ',',
      step: (result) => {
        const start = rowStart;
        rowStart = result.meta.cursor;
        const raw = body.slice(start, result.meta.cursor).trim();
        if (raw === '') return;
        const line = lineAt(start);
        if (raw.startsWith('#')) {
          readMetadataLine(raw, line);
          return;
        }
        const quoteError = result.errors.find((e) => e.type === 'Quotes');
        if (quoteError) {
          issues.error('FIELD_COUNT', `${fileName}, line ${line}: ${quoteError.message.toLowerCase()}; close every quoted cell with a quote.`, { line });
          return;
        }
        readRow(result.data.map((cell) => cell.trim()), line);
      },
    });
  }
  if (issues.hasErrors) return err(issues.issues);
  if (headerLine < 0) {
    issues.error('EMPTY_FILE', `${fileName}: no header row found. The first line that is not a "#" line must name the columns, e.g. pressure_hPa,height_m,temperature_C,dewpoint_C.`);
    return err(issues.issues);
  }

  const columns: Partial<Record<Quantity, Column>> = {};
  headerCells.forEach((header, index) => {
    const lower = header.toLowerCase();
    const split = lower.lastIndexOf('_');
    const prefix = split > 0 ? lower.slice(0, split) : lower;
    const unit = split > 0 ? lower.slice(split + 1) : '';
    const spec = COLUMN_UNITS[prefix];
    const at = { line: headerLine, column: header };
    if (!spec) {
      issues.warning('UNKNOWN_COLUMN', `${fileName}, line ${headerLine}: column "${header}" is not part of the format and is ignored.`, at);
      return;
    }
    const convert = spec.units[unit];
    if (!convert) {
      issues.error('UNSUPPORTED_UNIT', `${fileName}, line ${headerLine}: column "${header}" has unit "${unit}"; accepted: ${Object.keys(spec.units).map((u) => `${prefix}_${u}`).join(', ')}.`, at);
      return;
    }
    if (columns[spec.quantity]) {
      issues.error('DUPLICATE_COLUMN', `${fileName}, line ${headerLine}: columns "${columns[spec.quantity]?.header}" and "${header}" give the same quantity. Keep one.`, at);
      return;
    }
    columns[spec.quantity] = { header, index, convert };
  });
  const headerAt = { line: headerLine };
  if (!columns.pressure) issues.error('MISSING_COLUMN', `${fileName}, line ${headerLine}: no pressure column (pressure_hPa or pressure_Pa).`, headerAt);
  if (!columns.temperature) issues.error('MISSING_COLUMN', `${fileName}, line ${headerLine}: no temperature column (temperature_C, _K or _F).`, headerAt);
  if (!columns.dewpoint && !columns.relativeHumidity) {
    issues.error('MISSING_COLUMN', `${fileName}, line ${headerLine}: no moisture column (dewpoint_C, _K, _F or rh_pct).`, headerAt);
  }
  const hasDirectionSpeed = columns.windDirection !== undefined || columns.windSpeed !== undefined;
  if (hasDirectionSpeed && (!columns.windDirection || !columns.windSpeed)) {
    issues.error('MISSING_COLUMN', `${fileName}, line ${headerLine}: wind needs both wind_direction_deg and a wind_speed_ column.`, headerAt);
  }
  if ((columns.u !== undefined || columns.v !== undefined) && (!columns.u || !columns.v)) {
    issues.error('MISSING_COLUMN', `${fileName}, line ${headerLine}: wind components need both u_ and v_ columns.`, headerAt);
  }
  if (hasDirectionSpeed && (columns.u || columns.v)) {
    issues.error('DUPLICATE_COLUMN', `${fileName}, line ${headerLine}: give wind either as direction and speed or as u and v, not both.`, headerAt);
  }
  if (!hasDirectionSpeed && !columns.u && !columns.v) {
    issues.warning('NO_WIND_COLUMNS', `${fileName}, line ${headerLine}: no wind columns; kinematic results will be null.`, headerAt);
  }
  if (issues.hasErrors) return err(issues.issues);

  const rawLevels: RawLevel[] = [];
  const rowLines: number[] = [];
  for (let r = 0; r < rowContents.length; r++) {
    const content = rowContents[r] as string | string[];
    const cells = typeof content === 'string' ? splitCells(content) : content;
    const line = rowLineNumbers[r] as number;
    if (cells.length !== headerCells.length) {
      issues.error('FIELD_COUNT', `${fileName}, line ${line}: ${cells.length} cells, but the header has ${headerCells.length}.`, { line: line });
      continue;
    }
    const before = issues.issues.length;
    const pressureHpa = readReported(cells, columns, 'pressure', line, fileName, issues);
    const heightM = readReported(cells, columns, 'height', line, fileName, issues);
    const temperatureC = readReported(cells, columns, 'temperature', line, fileName, issues);
    const dewpointC = readReported(cells, columns, 'dewpoint', line, fileName, issues);
    const relativeHumidityPercent = readReported(cells, columns, 'relativeHumidity', line, fileName, issues);
    let uMs: number | null = null;
    let vMs: number | null = null;
    if (hasDirectionSpeed) {
      const direction = readReported(cells, columns, 'windDirection', line, fileName, issues);
      const speed = readReported(cells, columns, 'windSpeed', line, fileName, issues);
      if (direction !== null && speed !== null) {
        if (direction < 0 || direction > 360 || speed < 0 || speed > MAX_WIND_SPEED_MS) {
          const column = direction < 0 || direction > 360 ? columns.windDirection : columns.windSpeed;
          issues.error('WIND_OUT_OF_RANGE', `${fileName}, line ${line}, column ${column?.header}: wind direction must be 0–360° and speed between 0 and ${MAX_WIND_SPEED_MS} m/s (${Math.round(MAX_WIND_SPEED_MS / 0.514444)} kt).`, { line: line, column: column?.header });
        } else {
          const components = windComponents(direction, speed);
          uMs = components.u;
          vMs = components.v;
        }
      } else if (direction !== null || speed !== null) {
        const column = direction === null ? columns.windDirection : columns.windSpeed;
        issues.warning('WIND_INCOMPLETE', `${fileName}, line ${line}, column ${column?.header}: wind ${direction === null ? 'direction' : 'speed'} is missing; the wind of this level is treated as missing.`, { line: line, column: column?.header });
      }
    } else if (columns.u && columns.v) {
      uMs = readReported(cells, columns, 'u', line, fileName, issues);
      vMs = readReported(cells, columns, 'v', line, fileName, issues);
      const componentTooFast = (value: number | null, column: Column): void => {
        if (value !== null && Math.abs(value) > MAX_WIND_SPEED_MS) {
          issues.error('WIND_OUT_OF_RANGE', `${fileName}, line ${line}, column ${column.header}: a wind component must be between −${MAX_WIND_SPEED_MS} and ${MAX_WIND_SPEED_MS} m/s.`, { line: line, column: column.header });
        }
      };
      componentTooFast(uMs, columns.u);
      componentTooFast(vMs, columns.v);
      if ((uMs === null) !== (vMs === null)) {
        issues.warning('WIND_INCOMPLETE', `${fileName}, line ${line}: only one wind component is given; the wind of this level is treated as missing.`, { line: line });
        uMs = null;
        vMs = null;
      }
    }
    if (issues.issues.length > before && issues.hasErrors) continue;
    rawLevels.push({ pressureHpa, heightM, temperatureC, dewpointC, relativeHumidityPercent, uMs, vMs });
    rowLines.push(line);
  }
  if (issues.hasErrors) return err(issues.issues);

  const columnOf = (field: LevelField): string | undefined => {
    switch (field) {
      case 'dewpoint':
        return (columns.dewpoint ?? columns.relativeHumidity)?.header;
      case 'wind':
        return (columns.windDirection ?? columns.u)?.header;
      default:
        return columns[field]?.header;
    }
  };
  return checkSounding(rawLevels, metadata, {
    inputName: fileName,
    level: (index, field) => {
      const line = rowLines[index];
      const column = columnOf(field);
      return { ...(line !== undefined ? { line } : {}), ...(column !== undefined ? { column } : {}) };
    },
    metadata: (key) => {
      const line = metadataLines[key] ?? headerLine;
      const metadataKey = metadataKeys[key] ?? { elevationM: 'elevation_m', validTime: 'valid' }[key as string] ?? key;
      return { ...(line !== undefined ? { line } : {}), column: `# ${metadataKey}` };
    },
  }, issues);
}
