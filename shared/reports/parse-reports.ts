import Papa from 'papaparse';
import type { Feature, FeatureCollection } from 'geojson';
import { err, ok, type Result } from '../result';
import { duplicateRule, reportHazards, reportLimits, reportSources, type ReportHazard, type ReportSource, type StormReport } from './storm-report';

/** One problem in a report file, with the line (CSV, 1-based) or feature index (GeoJSON, 0-based) it is on. */
export interface ReportIssue {
  line?: number;
  feature?: number;
  column?: string;
  message: string;
}

export interface ParsedReports {
  reports: StormReport[];
  /** How many reports were merged into others as duplicates. */
  merged: number;
}

const COLUMNS = ['time_utc', 'latitude', 'longitude', 'hazard', 'hail_cm', 'gust_kmh', 'gust_measured', 'ef_rating', 'source', 'remark'] as const;
const REQUIRED = ['time_utc', 'latitude', 'longitude', 'hazard'] as const;
const METADATA_KEYS = new Set(['source', 'office', 'note']);

const ISO_UTC = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2})(?:\.\d{1,3})?)?Z$/;

/** Parses an ISO 8601 UTC time, refusing impossible dates (30 February) rather than rolling them over. */
export function parseUtcTime(text: string): string | undefined {
  const match = ISO_UTC.exec(text.trim());
  if (!match) return undefined;
  const [, y, mo, d, h, mi, s] = match.map(Number) as [number, number, number, number, number, number, number];
  const seconds = Number.isNaN(s) ? 0 : s;
  if (y < 1900 || y > 9999 || mo < 1 || mo > 12 || d < 1 || h > 23 || mi > 59 || seconds > 59) return undefined;
  const date = new Date(Date.UTC(y, mo - 1, d, h, mi, seconds));
  if (date.getUTCDate() !== d || date.getUTCMonth() !== mo - 1) return undefined;
  return date.toISOString();
}

function parseEf(text: string): number | null | undefined {
  const t = text.trim().toUpperCase();
  if (t === '' || t === 'EFU' || t === 'U') return null;
  const match = /^(?:EF)?([0-5])$/.exec(t);
  return match ? Number(match[1]) : undefined;
}

function parseBool(text: string): boolean | null | undefined {
  const t = text.trim().toLowerCase();
  if (t === '') return null;
  if (['yes', 'true', 'measured', 'm'].includes(t)) return true;
  if (['no', 'false', 'estimated', 'e'].includes(t)) return false;
  return undefined;
}

function optionalNumber(text: string): number | null | undefined {
  if (text.trim() === '') return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : undefined;
}

interface RawReport {
  time?: unknown;
  latitude?: unknown;
  longitude?: unknown;
  hazard?: unknown;
  hailCm?: unknown;
  gustKmh?: unknown;
  gustMeasured?: unknown;
  efRating?: unknown;
  source?: unknown;
  remark?: unknown;
}

/** Checks one report's fields; pushes issues (without location) and returns the report when valid. */
function checkReport(raw: RawReport, defaultSource: ReportSource | undefined, problems: { column: string; message: string }[]): StormReport | undefined {
  const text = (value: unknown) => (value === undefined || value === null ? '' : String(value));
  const time = parseUtcTime(text(raw.time));
  if (!time) problems.push({ column: 'time_utc', message: `"${text(raw.time)}" is not a UTC time like 2027-04-18T21:15Z (a real calendar date, year 1900–9999).` });
  const latitude = typeof raw.latitude === 'number' ? raw.latitude : optionalNumber(text(raw.latitude));
  if (typeof latitude !== 'number' || latitude < -90 || latitude > 90) problems.push({ column: 'latitude', message: 'Latitude must be a number from -90 to 90.' });
  const longitude = typeof raw.longitude === 'number' ? raw.longitude : optionalNumber(text(raw.longitude));
  if (typeof longitude !== 'number' || longitude < -180 || longitude > 180) problems.push({ column: 'longitude', message: 'Longitude must be a number from -180 to 180.' });
  const hazard = text(raw.hazard).trim().toLowerCase();
  if (!(reportHazards as readonly string[]).includes(hazard)) problems.push({ column: 'hazard', message: `Hazard must be one of ${reportHazards.join(', ')}.` });
  const hailCm = typeof raw.hailCm === 'number' ? raw.hailCm : optionalNumber(text(raw.hailCm));
  if (hailCm === undefined || (hailCm !== null && (hailCm < reportLimits.hailCm.min || hailCm > reportLimits.hailCm.max)))
    problems.push({ column: 'hail_cm', message: `Hail diameter must be a number from ${reportLimits.hailCm.min} to ${reportLimits.hailCm.max} cm, or empty.` });
  const gustKmh = typeof raw.gustKmh === 'number' ? raw.gustKmh : optionalNumber(text(raw.gustKmh));
  if (gustKmh === undefined || (gustKmh !== null && (gustKmh < reportLimits.gustKmh.min || gustKmh > reportLimits.gustKmh.max)))
    problems.push({ column: 'gust_kmh', message: `Gust must be a number from ${reportLimits.gustKmh.min} to ${reportLimits.gustKmh.max} km/h, or empty.` });
  const gustMeasured = typeof raw.gustMeasured === 'boolean' ? raw.gustMeasured : parseBool(text(raw.gustMeasured));
  if (gustMeasured === undefined) problems.push({ column: 'gust_measured', message: 'Gust measured must be yes, no or empty.' });
  const efRating = typeof raw.efRating === 'number' && Number.isInteger(raw.efRating) && raw.efRating >= 0 && raw.efRating <= 5 ? raw.efRating : parseEf(text(raw.efRating));
  if (efRating === undefined) problems.push({ column: 'ef_rating', message: 'EF rating must be EF0–EF5, 0–5, EFU or empty.' });
  const sourceText = text(raw.source).trim().toLowerCase().replace(/[\s-]+/g, '_');
  const source = sourceText === '' ? defaultSource : (reportSources as readonly string[]).includes(sourceText) ? (sourceText as ReportSource) : undefined;
  if (!source) problems.push({ column: 'source', message: `Source must be one of ${reportSources.join(', ')} (or set "# source:" for the file).` });
  const remark = text(raw.remark).replace(/\p{Cc}/gu, ' ').trim();
  if (remark.length > reportLimits.maxRemarkChars) problems.push({ column: 'remark', message: `Remark is longer than ${reportLimits.maxRemarkChars} characters.` });
  if (hazard !== 'hail' && hailCm !== null && hailCm !== undefined) problems.push({ column: 'hail_cm', message: 'Hail diameter belongs only to hail reports.' });
  if (hazard !== 'tornado' && efRating !== null && efRating !== undefined) problems.push({ column: 'ef_rating', message: 'EF rating belongs only to tornado reports.' });
  if (problems.length > 0) return undefined;
  return {
    time: time!, // checked above: a problem was pushed when missing
    latitude: latitude as number,
    longitude: longitude as number,
    hazard: hazard as ReportHazard,
    hailCm: hailCm ?? null,
    gustKmh: gustKmh ?? null,
    gustMeasured: gustMeasured ?? null,
    efRating: efRating ?? null,
    source: source!, // checked above
    remark,
  };
}

/**
 * Parses our storm-report CSV: optional `# key: value` lines (`source` sets the default source),
 * then a header row naming the columns (any order; see docs/storm-reports.md), then one report
 * per row. Every problem is returned with its line; nothing is taken from a file with problems.
 */
export function parseReportsCsv(text: string): Result<ParsedReports, ReportIssue[]> {
  if (new TextEncoder().encode(text).length > reportLimits.maxFileBytes) return err([{ message: `The file is larger than ${reportLimits.maxFileBytes / 1024 / 1024} MB.` }]);
  const lines = text.split(/\r?\n/);
  let defaultSource: ReportSource | undefined;
  const issues: ReportIssue[] = [];
  let first = 0;
  while (first < lines.length && ((lines[first] ?? '').trim().startsWith('#') || (lines[first] ?? '').trim() === '')) {
    const match = /^#\s*([a-z_]+)\s*:\s*(.*)$/i.exec((lines[first] ?? '').trim());
    if (match) {
      const key = (match[1] ?? '').toLowerCase();
      const value = (match[2] ?? '').trim().toLowerCase().replace(/[\s-]+/g, '_');
      if (!METADATA_KEYS.has(key)) issues.push({ line: first + 1, message: `Unknown metadata "${key}": use ${[...METADATA_KEYS].join(', ')}.` });
      else if (key === 'source') {
        if ((reportSources as readonly string[]).includes(value)) defaultSource = value as ReportSource;
        else issues.push({ line: first + 1, column: 'source', message: `Source must be one of ${reportSources.join(', ')}.` });
      }
    }
    first++;
  }
  const body = lines.slice(first).join('\n');
  const parsed = Papa.parse<string[]>(body, { skipEmptyLines: false });
  const rows = parsed.data;
  const header = (rows[0] ?? []).map((h) => h.trim().toLowerCase());
  if (header.length === 0 || header.every((h) => h === '')) return err([...issues, { line: first + 1, message: 'The header row is missing.' }]);
  for (const name of header) if (!(COLUMNS as readonly string[]).includes(name)) issues.push({ line: first + 1, column: name, message: `Unknown column "${name}": use ${COLUMNS.join(', ')}.` });
  for (const name of REQUIRED) if (!header.includes(name)) issues.push({ line: first + 1, column: name, message: `The column "${name}" is required.` });
  if (issues.length > 0) return err(issues);
  const column = (row: string[], name: string) => {
    const index = header.indexOf(name);
    return index < 0 ? '' : (row[index] ?? '');
  };
  const reports: StormReport[] = [];
  for (let r = 1; r < rows.length; r++) {
    const row = rows[r] ?? [];
    const line = first + r + 1;
    if (row.length === 1 && (row[0] ?? '').trim() === '') continue;
    if (reports.length >= reportLimits.maxReportsPerFile) return err([{ line, message: `More than ${reportLimits.maxReportsPerFile} reports in one file: split it.` }]);
    if (row.length !== header.length) {
      issues.push({ line, message: `This row has ${row.length} cells; the header has ${header.length}.` });
      continue;
    }
    const problems: { column: string; message: string }[] = [];
    const report = checkReport(
      {
        time: column(row, 'time_utc'),
        latitude: column(row, 'latitude'),
        longitude: column(row, 'longitude'),
        hazard: column(row, 'hazard'),
        hailCm: column(row, 'hail_cm'),
        gustKmh: column(row, 'gust_kmh'),
        gustMeasured: column(row, 'gust_measured'),
        efRating: column(row, 'ef_rating'),
        source: column(row, 'source'),
        remark: column(row, 'remark'),
      },
      defaultSource,
      problems,
    );
    for (const problem of problems) issues.push({ line, ...problem });
    if (report) reports.push(report);
  }
  for (const error of parsed.errors) if (error.code !== 'UndetectableDelimiter') issues.push({ line: first + (error.row ?? 0) + 2, message: `CSV: ${error.message}.` });
  if (issues.length > 0) return err(issues);
  if (reports.length === 0) return err([{ message: 'The file holds no reports.' }]);
  return ok(mergeDuplicates(reports));
}

/** Parses a GeoJSON FeatureCollection of Point features whose properties carry the report fields (camelCase). */
export function parseReportsGeoJson(value: unknown): Result<ParsedReports, ReportIssue[]> {
  const collection = value as Partial<FeatureCollection> | null;
  if (!collection || typeof collection !== 'object' || collection.type !== 'FeatureCollection' || !Array.isArray(collection.features))
    return err([{ message: 'Expected a GeoJSON FeatureCollection of Point features.' }]);
  if (collection.features.length > reportLimits.maxReportsPerFile) return err([{ message: `More than ${reportLimits.maxReportsPerFile} reports in one file: split it.` }]);
  const issues: ReportIssue[] = [];
  const reports: StormReport[] = [];
  collection.features.forEach((feature: Feature, index) => {
    const geometry = feature?.geometry;
    if (!geometry || geometry.type !== 'Point' || !Array.isArray(geometry.coordinates) || geometry.coordinates.length < 2) {
      issues.push({ feature: index, message: 'Each feature must be a Point.' });
      return;
    }
    const properties = (feature.properties ?? {}) as Record<string, unknown>;
    const problems: { column: string; message: string }[] = [];
    const report = checkReport({ ...properties, longitude: geometry.coordinates[0], latitude: geometry.coordinates[1] }, undefined, problems);
    for (const problem of problems) issues.push({ feature: index, ...problem });
    if (report) reports.push(report);
  });
  if (issues.length > 0) return err(issues);
  if (reports.length === 0) return err([{ message: 'The collection holds no reports.' }]);
  return ok(mergeDuplicates(reports));
}

/** Great-circle distance in km (haversine, mean Earth radius 6371 km). */
export function distanceKm(a: { latitude: number; longitude: number }, b: { latitude: number; longitude: number }): number {
  const rad = Math.PI / 180;
  const dLat = (b.latitude - a.latitude) * rad;
  const dLon = (b.longitude - a.longitude) * rad;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.latitude * rad) * Math.cos(b.latitude * rad) * Math.sin(dLon / 2) ** 2;
  return 2 * 6371 * Math.asin(Math.min(1, Math.sqrt(h)));
}

/** True when two reports describe one event under the duplicate rule (same hazard, close in space and time). */
export function isDuplicate(a: StormReport, b: StormReport): boolean {
  return a.hazard === b.hazard && Math.abs(Date.parse(a.time) - Date.parse(b.time)) <= duplicateRule.minutes * 60_000 && distanceKm(a, b) <= duplicateRule.distanceKm;
}

const larger = (a: number | null, b: number | null) => (a === null ? b : b === null ? a : Math.max(a, b));

/** Merges duplicates: the earliest report stays, keeping the largest magnitude and both remarks. */
export function mergeDuplicates(reports: StormReport[]): ParsedReports {
  const sorted = [...reports].sort((a, b) => a.time.localeCompare(b.time));
  const kept: StormReport[] = [];
  let merged = 0;
  for (const report of sorted) {
    const twin = kept.find((k) => isDuplicate(k, report));
    if (!twin) {
      kept.push({ ...report });
      continue;
    }
    merged++;
    twin.hailCm = larger(twin.hailCm, report.hailCm);
    twin.gustKmh = larger(twin.gustKmh, report.gustKmh);
    twin.efRating = larger(twin.efRating, report.efRating);
    if (report.gustMeasured) twin.gustMeasured = true;
    if (report.remark && !twin.remark.includes(report.remark)) twin.remark = [twin.remark, report.remark].filter(Boolean).join(' / ').slice(0, 500);
  }
  return { reports: kept, merged };
}
