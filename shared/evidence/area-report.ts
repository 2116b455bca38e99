import { bbox, booleanPointInPolygon } from '@turf/turf';
import type { RiskLadder, SupportGuidance } from '../contracts/office';
import type { AreaGeometry, HazardKind } from '../contracts/risk-areas';
import { evidenceOfSoundings, gatherFigures, pickFigures, type FigureColumns, soundingsInPeriod, type AreaEvidence, type EvidenceSounding } from './evidence';
import { checkSupport, type SupportCheck } from './support-check';

/**
 * The per-area part of the evidence report, shared by the server (the record, in the geometry
 * worker pool) and the browser (the live preview while a vertex moves): one implementation, so
 * the preview and the saved answer can only differ by the soundings they were given.
 *
 * Runs on every animation frame of a drag, so the soundings of an outlook's period are indexed
 * once (`evidencePool`) and each area asks the index for the points in its bounding box before
 * the exact point-in-polygon test.
 */

/** What the report needs of a risk area (a saved area or the one being drawn). */
export interface ReportArea {
  id: string;
  levelKey: string;
  hazards: readonly { hazard: HazardKind; significant: boolean }[];
  geometry: AreaGeometry;
}

/** One area's evidence and support check. */
export interface AreaReport {
  areaId: string;
  levelKey: string;
  evidence: AreaEvidence;
  support: SupportCheck;
}

/**
 * The soundings that count as evidence for one outlook period, sorted by longitude so a
 * bounding-box query is a binary search plus a latitude test (built once per candidate set).
 */
export interface EvidencePool {
  /** Soundings in the period, ordered by longitude (west to east). */
  readonly soundings: readonly EvidenceSounding[];
  readonly longitudes: Float64Array;
  readonly latitudes: Float64Array;
  /** The key figures of `soundings`, gathered once for every area asked of this pool. */
  readonly columns: FigureColumns;
}

export interface PoolFilter {
  validFrom: string;
  validUntil: string;
  /** Only observed or only model soundings; all when absent. */
  source?: 'observed' | 'model' | undefined;
}

/**
 * The evidence pool of a period: the candidates valid in [validFrom, validUntil], optionally of
 * one source, without modified (what-if) soundings, which are neither observations nor forecasts.
 */
export function evidencePool(candidates: readonly EvidenceSounding[], { validFrom, validUntil, source }: PoolFilter): EvidencePool {
  const kept = soundingsInPeriod(
    candidates.filter((s) => !s.modified),
    validFrom,
    validUntil,
    source,
  );
  const unsorted = Float64Array.from(kept, (s) => s.longitude);
  const order = longitudeOrder(unsorted);
  const soundings = Array.from(order, (i) => kept[i] as EvidenceSounding); // i < kept.length
  return {
    soundings,
    longitudes: Float64Array.from(order, (i) => unsorted[i] ?? NaN),
    latitudes: Float64Array.from(soundings, (s) => s.latitude),
    columns: gatherFigures(soundings),
  };
}

const INDEX_BITS = 2 ** 20;

/**
 * The order of positions by longitude. Each key is the longitude in micro-degrees east of
 * 180 °W times 2²⁰ plus the position's index (below 2⁵³, so exact), so one native numeric sort
 * of a typed array orders them, far faster than a sort with a comparator; larger pools fall back
 * to the comparator. Ties closer than a micro-degree (0.1 m) keep their input order.
 */
function longitudeOrder(longitudes: Float64Array): Uint32Array {
  const n = longitudes.length;
  if (n >= INDEX_BITS) return Uint32Array.from(longitudes, (_, i) => i).sort((a, b) => (longitudes[a] ?? 0) - (longitudes[b] ?? 0));
  const keys = new Float64Array(n);
  for (let i = 0; i < n; i++) keys[i] = Math.round(((longitudes[i] ?? 0) + 180) * 1e6) * INDEX_BITS + i;
  keys.sort();
  return Uint32Array.from(keys, (key) => key % INDEX_BITS);
}

/** First index whose longitude is >= `value` (binary search over the sorted longitudes). */
function lowerBound(sorted: Float64Array, value: number): number {
  let low = 0;
  let high = sorted.length;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if ((sorted[middle] ?? Infinity) < value) low = middle + 1;
    else high = middle;
  }
  return low;
}

/**
 * Soundings of the pool whose station lies inside the geometry, in the pool's order. A station
 * exactly on the outline counts as inside; one in a hole does not (Turf point-in-polygon).
 */
export function soundingsInArea(pool: EvidencePool, geometry: AreaGeometry, positions?: number[]): EvidenceSounding[] {
  const [west, south, east, north] = bbox(geometry);
  const inside: EvidenceSounding[] = [];
  const position: [number, number] = [0, 0];
  for (let i = lowerBound(pool.longitudes, west - 1e-6); i < pool.longitudes.length; i++) {
    const longitude = pool.longitudes[i] ?? Infinity;
    if (longitude > east + 1e-6) break; // the order is exact to a micro-degree
    const latitude = pool.latitudes[i] ?? NaN;
    if (latitude < south || latitude > north) continue;
    position[0] = longitude;
    position[1] = latitude;
    const sounding = pool.soundings[i];
    if (sounding && booleanPointInPolygon(position, geometry)) {
      inside.push(sounding);
      positions?.push(i);
    }
  }
  return inside;
}

/**
 * Judges the soundings inside an area against the office guidance for its level (and hazards).
 * The one place the report calls the support check: each sounding inside is judged against
 * every rule of the level and of each hazard flagged on the area.
 */
function judge(area: ReportArea, inside: EvidenceSounding[], columns: FigureColumns, ladder: RiskLadder, guidance: SupportGuidance): SupportCheck {
  return checkSupport({ inside, levelKey: area.levelKey, hazards: [...area.hazards], ladder, guidance, columns });
}

let scratch: Float64Array | undefined;

/** One area's evidence (soundings inside and the statistics of each parameter) and its support check. */
export function areaReport(area: ReportArea, pool: EvidencePool | readonly EvidencePool[], ladder: RiskLadder, guidance: SupportGuidance): AreaReport {
  const pools = Array.isArray(pool) ? (pool as readonly EvidencePool[]) : [pool as EvidencePool];
  const inside: EvidenceSounding[] = [];
  const picks = pools.map((p) => {
    const positions: number[] = [];
    for (const sounding of soundingsInArea(p, area.geometry, positions)) inside.push(sounding);
    return { columns: p.columns, positions };
  });
  // The figures, copied from the pools' columns, are read by both the statistics and the support check.
  const columns = pickFigures(picks, scratch);
  scratch = columns.values; // reused by the next area: the columns do not outlive this call
  // The support check reads the columns in sounding order; the statistics then reorder them.
  const support = judge(area, inside, columns, ladder, guidance);
  const evidence = evidenceOfSoundings(area.id, inside, columns);
  return { areaId: area.id, levelKey: area.levelKey, evidence, support };
}

/** How a sounding inside an area stands against the area's level in its support check. */
export type SoundingJudgement = 'backs' | 'fails' | 'lacks' | 'inside';

/**
 * Each sounding inside the area with how the support check judged it: backing the level, failing
 * a rule, lacking a value a rule uses, or inside but not judged one by one.
 */
export function soundingJudgements(report: Pick<AreaReport, 'evidence' | 'support'>): Map<string, SoundingJudgement> {
  const judgements = new Map<string, SoundingJudgement>();
  for (const id of report.evidence.soundingIds) judgements.set(id, 'inside');
  for (const id of report.support.lacking) judgements.set(id, 'lacks');
  for (const id of report.support.failing) judgements.set(id, 'fails');
  for (const id of report.support.backing) judgements.set(id, 'backs');
  return judgements;
}
