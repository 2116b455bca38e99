/**
 * Data shapes shared by the parser, the validator and the analysis.
 * Units are in the field names; heights in a parsed sounding are metres above mean sea level,
 * heights in an analysis are metres above ground level (the lowest level of the sounding).
 */

/** One observed or modelled level of a sounding. */
export interface SoundingLevel {
  /** Pressure, hPa. */
  pressureHpa: number;
  /** Geopotential height above mean sea level, m. */
  heightM: number;
  /** Air temperature, °C. */
  temperatureC: number;
  /** Dewpoint, °C; null when not reported. */
  dewpointC: number | null;
  /** Wind component toward the east, m s⁻¹; null when not reported. */
  uMs: number | null;
  /** Wind component toward the north, m s⁻¹; null when not reported. */
  vMs: number | null;
}

/** Where a sounding comes from; "unknown" when the file does not say. */
export type SoundingSource = 'observed' | 'model' | 'unknown';

/** Descriptive data about a sounding (from the `# key: value` lines of the exchange CSV). */
export interface SoundingMetadata {
  /** Station identifier, e.g. "OAX"; empty string when not given. */
  station: string;
  /** Human-readable station name; empty string when not given. */
  name: string;
  /** Latitude, degrees north (−90..90); null when not given. */
  latitude: number | null;
  /** Longitude, degrees east (−180..180); null when not given. */
  longitude: number | null;
  /** Station (ground) elevation above mean sea level, m; null when neither it nor the lowest height is given. */
  elevationM: number | null;
  /** Valid time, ISO 8601 in UTC, e.g. "2014-06-16T19:00:00.000Z"; null when not given. */
  validTime: string | null;
  /** Observed (radiosonde), model forecast, or unknown. */
  source: SoundingSource;
}

/**
 * A sounding that passed validation: metadata, levels sorted by decreasing pressure, and the
 * warnings found on the way (a success may still carry warnings for the forecaster).
 */
export interface ParsedSounding {
  metadata: SoundingMetadata;
  levels: SoundingLevel[];
  warnings: SoundingIssue[];
}

/** One problem found in an input sounding. */
export interface SoundingIssue {
  severity: 'error' | 'warning';
  /** Stable machine-readable code, e.g. "DUPLICATE_PRESSURE" (see issue-codes.ts). */
  code: string;
  /** What is wrong and how to fix it, written for the forecaster. */
  message: string;
  /** 1-based line in the CSV file (parser only). */
  line?: number;
  /** Column header (CSV) or field name (structured input). */
  column?: string;
  /** 0-based index of the level in structured input (validator only). */
  levelIndex?: number;
}
