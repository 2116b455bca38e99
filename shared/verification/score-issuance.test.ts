import { describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import { buildVerificationGrid } from './grid';
import { scoreIssuance, type ScoredReport } from './score-issuance';

// A small invented region on the equator, 4° × 2°: at 100 km spacing about five columns and two or three rows.
const region = { west: 0, south: 0, east: 4, north: 2 };
const coarse = { gridSpacingKm: 100, observedRadiusKm: 1, smoothingLengthKm: 120 };
const window = { from: '2027-04-18T12:00:00Z', until: '2027-04-19T12:00:00Z' };
const ladder = ['level1', 'level2'];
const westHalf: Polygon = { type: 'Polygon', coordinates: [[[0, 0], [2, 0], [2, 2], [0, 2], [0, 0]]] };

const grid = buildVerificationGrid(region, coarse.gridSpacingKm);
const cells = grid.cells.flatMap((cell) => (cell ? [cell] : []));
const westCells = cells.filter((cell) => cell.lon < 2);
const eastCells = cells.filter((cell) => cell.lon > 2);

function reportAt(cell: { lon: number; lat: number }, hazard: ScoredReport['hazard'] = 'hail', time = '2027-04-18T20:00:00Z'): ScoredReport {
  return { time, lon: cell.lon, lat: cell.lat, hazard };
}

describe('scoreIssuance on a hand-built coarse grid', () => {
  it('has cells on both sides of the west half (the cases below rely on it)', () => {
    expect(westCells.length).toBeGreaterThanOrEqual(2);
    expect(eastCells.length).toBeGreaterThanOrEqual(2);
  });

  it('a Level 1 area over the west half, one report in it and one east: 1 hit, 1 miss, the rest of the west false alarms, the rest of the east correct negatives', () => {
    const result = scoreIssuance({
      region,
      ladder,
      areas: [{ levelKey: 'level1', hazards: [{ hazard: 'hail', significant: false }], geometry: westHalf }],
      reports: [reportAt(westCells[0]!), reportAt(eastCells[0]!)],
      window,
      method: coarse,
    });
    const level1 = result.levels.find((l) => l.levelKey === 'level1')!;
    expect(level1.table).toEqual({ hits: 1, falseAlarms: westCells.length - 1, misses: 1, correctNegatives: eastCells.length - 1 });
    // Level 2 was not forecast anywhere: both reports are misses.
    expect(result.levels.find((l) => l.levelKey === 'level2')!.table).toEqual({ hits: 0, falseAlarms: 0, misses: 2, correctNegatives: cells.length - 2 });
    const hail = result.hazards.find((h) => h.hazard === 'hail' && !h.significant)!;
    expect(hail.table.hits).toBe(1);
    expect(hail.reports).toBe(2);
  });

  it('a single report far from every area gives a miss and no hit', () => {
    const result = scoreIssuance({ region, ladder, areas: [{ levelKey: 'level2', hazards: [], geometry: westHalf }], reports: [reportAt(eastCells.at(-1)!)], window, method: coarse });
    for (const level of result.levels) {
      expect(level.table.hits).toBe(0);
      expect(level.table.misses).toBe(1);
    }
  });

  it('no areas and no reports give correct negatives only', () => {
    const result = scoreIssuance({ region, ladder, areas: [], reports: [], window, method: coarse });
    for (const level of result.levels) expect(level.table).toEqual({ hits: 0, falseAlarms: 0, misses: 0, correctNegatives: cells.length });
    expect(result.practicallyPerfect.max).toBe(0);
  });

  it('reports outside the window (an amended issuance scored only while in force) are not used', () => {
    const result = scoreIssuance({
      region,
      ladder,
      areas: [{ levelKey: 'level1', hazards: [], geometry: westHalf }],
      reports: [reportAt(westCells[0]!, 'wind', '2027-04-19T13:00:00Z'), reportAt(westCells[0]!, 'wind', '2027-04-18T11:59:00Z')],
      window,
      method: coarse,
    });
    expect(result.reportsUsed).toBe(0);
    expect(result.levels[0]!.table.hits).toBe(0);
  });

  it('a significant hazard is observed only by a report at the significant magnitude (hail 5 cm+)', () => {
    const small = { ...reportAt(westCells[0]!), hailDiameterCm: 2.5 };
    const big = { ...reportAt(westCells[1]!), hailDiameterCm: 6 };
    const result = scoreIssuance({ region, ladder, areas: [{ levelKey: 'level1', hazards: [{ hazard: 'hail', significant: true }], geometry: westHalf }], reports: [small, big], window, method: coarse });
    const significant = result.hazards.find((h) => h.hazard === 'hail' && h.significant)!;
    expect(significant.reports).toBe(1);
    expect(significant.table.hits).toBe(1);
    expect(significant.table.falseAlarms).toBe(westCells.length - 1);
  });
});
