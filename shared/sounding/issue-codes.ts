/**
 * Codes of the problems the parser and validator report, with what each means.
 * Codes are stable: the server maps them to HTTP responses and the client to messages.
 */
export const SOUNDING_ISSUE_CODES = {
  FILE_TOO_LARGE: 'The file is larger than 2 MB.',
  EMPTY_FILE: 'The file holds no header row and no levels.',
  MISSING_COLUMN: 'A required column (pressure, temperature, dewpoint or relative humidity) is absent.',
  UNSUPPORTED_UNIT: 'A column names a known quantity with a unit the format does not accept.',
  DUPLICATE_COLUMN: 'Two columns give the same quantity.',
  UNKNOWN_COLUMN: 'A column the format does not know; it is ignored (warning).',
  NO_WIND_COLUMNS: 'No wind columns: kinematic results will be null (warning).',
  FIELD_COUNT: 'A row has more or fewer cells than the header.',
  NOT_A_NUMBER: 'A cell holds text that is not a number.',
  MISSING_VALUE: 'A required value (pressure) is missing on a level.',
  MISSING_TEMPERATURE: 'A level has no temperature; it is dropped (warning).',
  PRESSURE_OUT_OF_RANGE: 'Pressure outside 10–1100 hPa (levels above 10 hPa are dropped with a warning).',
  TEMPERATURE_OUT_OF_RANGE: 'Temperature outside −120 to 60 °C.',
  DEWPOINT_OUT_OF_RANGE: 'Dewpoint outside −150 to 60 °C.',
  RELATIVE_HUMIDITY_OUT_OF_RANGE: 'Relative humidity outside 0–100 %.',
  DEWPOINT_ABOVE_TEMPERATURE: 'Dewpoint above temperature: set equal to the temperature (warning).',
  WIND_OUT_OF_RANGE: 'Wind direction outside 0–360°, or wind speed negative or above 150 m/s.',
  WIND_INCOMPLETE: 'Wind direction without speed or the reverse; the wind of that level is treated as missing (warning).',
  WIND_MISSING: 'Some levels have no wind (warning).',
  DUPLICATE_PRESSURE: 'Two levels have the same pressure: merged when identical (warning), refused when they differ.',
  LEVELS_SORTED: 'Levels were not in pressure order and were sorted (warning).',
  PRESSURE_NOT_MONOTONIC: 'Levels are neither in increasing nor in decreasing pressure order (no longer reported: levels are sorted).',
  HEIGHT_NOT_INCREASING: 'Height does not increase as pressure decreases: heights are computed instead (warning).',
  MISSING_HEIGHT: 'No height for the lowest level and no elevation: heights above ground start at 0 m (no longer an error).',
  ELEVATION_MISMATCH: 'The lowest level height differs from the station elevation by more than 50 m (warning).',
  TOO_FEW_LEVELS: 'Fewer than 5 usable levels.',
  TOO_MANY_LEVELS: 'More than 5,000 levels.',
  TOP_TOO_LOW: 'The sounding ends below 500 hPa: analysed and flagged (warning).',
  SURFACE_DEWPOINT_MISSING: 'The lowest level has no dewpoint, so no surface parcel can be lifted.',
  DATA_GAP: 'Two adjacent levels are more than about 3.3 km apart (ln p ratio > 0.45; warning).',
  MISSING_METADATA: 'A metadata line is absent (warning): analysis works; a library upload keeps the sounding out of evidence until station, position and valid time are given.',
  INVALID_METADATA: 'A metadata value cannot be read (for example latitude 95, 30 February or a time without time zone).',
  INVALID_INPUT: 'Structured input is not an object of the expected shape.',
} as const;

/** A stable code of a sounding problem. */
export type SoundingIssueCode = keyof typeof SOUNDING_ISSUE_CODES;
