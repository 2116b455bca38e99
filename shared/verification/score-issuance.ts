import { bbox, booleanPointInPolygon, point } from '@turf/turf';
import type { MultiPolygon, Polygon } from 'geojson';
import type { Region } from '../contracts/office';
import { tabulate, scoresOf, type ContingencyTable, type Scores } from './contingency';
import { buildVerificationGrid, cellsWithinRadius } from './grid';
import { practicallyPerfectField } from './smoothing';

export type ReportHazard = 'tornado' | 'hail' | 'wind' | 'flood';

/** A storm report as the scorer needs it. Magnitudes in SI-friendly units: hail diameter cm, gust km/h, tornado EF rating 0–5. */
export interface ScoredReport {
  time: string;
  lat: number;
  lon: number;
  hazard: ReportHazard;
  hailDiameterCm?: number | null;
  gustKmh?: number | null;
  efRating?: number | null;
}

export interface ScoredArea {
  levelKey: string;
  hazards: { hazard: ReportHazard; significant: boolean }[];
  geometry: Polygon | MultiPolygon;
}

/**
 * The method's settings, each with its basis. The 40 km radius is common practice in outlook
 * verification (reports "within 25 miles of a point"). The smoothing length of 120 km is from
 * memory (the value used with practically perfect hindcasts after Brooks et al. 1998; check the
 * paper). The 20 km grid is our choice: fine enough to resolve a county-sized risk area.
 */
export interface VerificationMethod {
  gridSpacingKm: number;
  observedRadiusKm: number;
  smoothingLengthKm: number;
  /** Late reports are taken in and the issuance scored again for this many hours after its period ends. */
  lateReportWindowHours: number;
}

export const verificationMethod: Readonly<VerificationMethod> = {
  gridSpacingKm: 20,
  observedRadiusKm: 40,
  smoothingLengthKm: 120,
  lateReportWindowHours: 72,
};

/** Significant thresholds of the product's vocabulary: tornado EF2+, hail 5 cm+, gusts 120 km/h+. */
export function isSignificantReport(report: ScoredReport): boolean {
  switch (report.hazard) {
    case 'tornado':
      return (report.efRating ?? -1) >= 2;
    case 'hail':
      return (report.hailDiameterCm ?? 0) >= 5;
    case 'wind':
      return (report.gustKmh ?? 0) >= 120;
    case 'flood':
      return false;
  }
}

export interface LevelScore {
  levelKey: string;
  table: ContingencyTable;
  scores: Scores;
}

export interface HazardScore {
  hazard: ReportHazard;
  significant: boolean;
  table: ContingencyTable;
  scores: Scores;
  reports: number;
}

export interface IssuanceVerification {
  method: { gridSpacingKm: number; observedRadiusKm: number; smoothingLengthKm: number };
  window: { from: string; until: string };
  cells: number;
  reportsUsed: number;
  levels: LevelScore[];
  hazards: HazardScore[];
  /** Highest value of the practically perfect hindcast over the region (0–1), and the share of it inside each level's forecast. */
  practicallyPerfect: { max: number; insideShareByLevel: Record<string, number | null> };
}

export interface ScoreInput {
  region: Region;
  /** Ladder keys from lowest to highest; a level's forecast area is every area at this level or above. */
  ladder: readonly string[];
  areas: readonly ScoredArea[];
  reports: readonly ScoredReport[];
  /** The part of the valid period the issuance was in force (amended issuances: until replaced). */
  window: { from: string; until: string };
  method?: Partial<VerificationMethod>;
}

const hazards: ReportHazard[] = ['tornado', 'hail', 'wind', 'flood'];

/**
 * Scores one issuance: every grid cell is "forecast" when it lies inside an area at or above a
 * level (or flagged with a hazard) and "observed" when a report of that kind lies within the
 * observed radius during the window. Pure: no clock, no I/O.
 */
export function scoreIssuance(input: ScoreInput): IssuanceVerification {
  const method = { ...verificationMethod, ...input.method };
  const grid = buildVerificationGrid(input.region, method.gridSpacingKm);
  const from = Date.parse(input.window.from);
  const until = Date.parse(input.window.until);
  const reports = input.reports.filter((report) => {
    const t = Date.parse(report.time);
    return t >= from && t < until && report.lon >= input.region.west && report.lon <= input.region.east && report.lat >= input.region.south && report.lat <= input.region.north;
  });

  // Forecast side: per cell, the highest ladder index of an area containing it, and its hazard flags.
  const levelIndex = new Int16Array(grid.cells.length).fill(-1);
  const flagged = new Map<string, Uint8Array>();
  const flagKey = (hazard: ReportHazard, significant: boolean) => `${hazard}:${significant ? 'sig' : 'any'}`;
  for (const hazard of hazards) for (const significant of [false, true]) flagged.set(flagKey(hazard, significant), new Uint8Array(grid.cells.length));
  for (const area of input.areas) {
    const index = input.ladder.indexOf(area.levelKey);
    const [w, s, e, n] = bbox(area.geometry);
    grid.cells.forEach((cell, i) => {
      if (!cell || cell.lon < w || cell.lon > e || cell.lat < s || cell.lat > n) return;
      if (!booleanPointInPolygon(point([cell.lon, cell.lat]), area.geometry)) return;
      if (index > (levelIndex[i] ?? -1)) levelIndex[i] = index;
      for (const flag of area.hazards) {
        flagged.get(flagKey(flag.hazard, false))![i] = 1; // the map holds every hazard in both forms (filled above)
        if (flag.significant) flagged.get(flagKey(flag.hazard, true))![i] = 1; // the map holds every hazard in both forms
      }
    });
  }

  // Observed side: cells within the radius of a report, for any hazard and per hazard form.
  const observedAny = new Uint8Array(grid.cells.length);
  const observed = new Map<string, Uint8Array>();
  for (const key of flagged.keys()) observed.set(key, new Uint8Array(grid.cells.length));
  const reportCounts = new Map<string, number>();
  const markedForSmoothing = new Uint8Array(grid.cells.length);
  for (const report of reports) {
    const [x, y] = grid.project(report.lon, report.lat);
    const near = cellsWithinRadius(grid, x, y, method.observedRadiusKm);
    const keys = [flagKey(report.hazard, false), ...(isSignificantReport(report) ? [flagKey(report.hazard, true)] : [])];
    for (const key of keys) reportCounts.set(key, (reportCounts.get(key) ?? 0) + 1);
    for (const i of near) {
      observedAny[i] = 1;
      for (const key of keys) observed.get(key)![i] = 1; // every key was created above
    }
    const column = Math.floor((x - grid.originXKm) / grid.spacingKm);
    const row = Math.floor((y - grid.originYKm) / grid.spacingKm);
    if (column >= 0 && column < grid.columns && row >= 0 && row < grid.rows) markedForSmoothing[row * grid.columns + column] = 1;
  }

  // Only cells inside the region count.
  const inside = grid.cells.flatMap((cell, i) => (cell ? [i] : []));
  const pick = (values: ArrayLike<number>) => inside.map((i) => values[i] ?? 0);
  const observedInside = pick(observedAny);

  const pph = practicallyPerfectField(grid, markedForSmoothing, method.smoothingLengthKm);
  let pphMax = 0;
  let pphTotal = 0;
  for (const i of inside) {
    pphMax = Math.max(pphMax, pph[i] ?? 0);
    pphTotal += pph[i] ?? 0;
  }

  const levels: LevelScore[] = input.ladder.map((levelKey, index) => {
    const forecast = inside.map((i) => (levelIndex[i] ?? -1) >= index);
    const table = tabulate(forecast, observedInside);
    return { levelKey, table, scores: scoresOf(table) };
  });
  const insideShareByLevel: Record<string, number | null> = {};
  input.ladder.forEach((levelKey, index) => {
    let sum = 0;
    for (const i of inside) if ((levelIndex[i] ?? -1) >= index) sum += pph[i] ?? 0;
    insideShareByLevel[levelKey] = pphTotal > 0 ? sum / pphTotal : null;
  });

  const hazardScores: HazardScore[] = [];
  for (const hazard of hazards) {
    for (const significant of [false, true]) {
      const key = flagKey(hazard, significant);
      const table = tabulate(pick(flagged.get(key)!), pick(observed.get(key)!)); // created for every key above
      hazardScores.push({ hazard, significant, table, scores: scoresOf(table), reports: reportCounts.get(key) ?? 0 });
    }
  }

  return {
    method: { gridSpacingKm: method.gridSpacingKm, observedRadiusKm: method.observedRadiusKm, smoothingLengthKm: method.smoothingLengthKm },
    window: input.window,
    cells: inside.length,
    reportsUsed: reports.length,
    levels,
    hazards: hazardScores,
    practicallyPerfect: { max: pphMax, insideShareByLevel },
  };
}
