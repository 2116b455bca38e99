import { defaultRiskLadder } from '../../shared/contracts/office';
import type { RiskArea } from '../../shared/contracts/outlooks';
import { defaultSupportGuidance } from '../../shared/evidence/guidance';
import { keyFigureKeys, type KeyFigureKey } from '../../shared/sounding/key-figures';
import { demoOutlookAreas } from '../../server/seed/demo-outlook';
import { demoOffice } from '../../server/services/seed.service';
import { buildGridEvidenceReport, packRunFigures, runFiguresFromRows, type RunFigures } from '../../server/workers/grid-evidence-report';
import type { BenchFigure } from './figures';

/**
 * Evidence for an outlook of 6 areas over one 200 × 200 model run (40,000 grid soundings) over
 * the demo region, with the run's figures already in memory (as the per-run cache holds them):
 * spatial-index pick of the points in each area's box, evidence soundings of those, then the
 * evidence report (period filter, point-in-polygon, statistics, support check, geometry checks)
 * and the counts per run. Median of 21 runs after a warm-up, so the worker's per-run store of
 * evidence soundings is warm (the first evidence of a run also makes its 40,000 evidence
 * soundings, some tens of ms more, once per run and worker).
 */
export const gridEvidenceSixAreas: BenchFigure = {
  name: 'evidence_ms_6_areas_40000_soundings',
  unit: 'ms',
  measure() {
    const figures = syntheticRun();
    const run = figures.run;
    // The demo draft's six hand-drawn areas.
    const areas: RiskArea[] = demoOutlookAreas.slice(0, 6).map((a, i) => ({ ...a, id: `a${i}`, sortOrder: i }));
    if (areas.length !== 6) throw new Error('grid evidence bench: the demo outlook should have six areas');
    const outlook = { areas, validFrom: '2027-04-18T12:00:00.000Z', validUntil: '2027-04-19T11:00:00.000Z' };
    const packed = [packRunFigures(figures)];
    const once = () => buildGridEvidenceReport({ outlook, candidates: [], ladder: defaultRiskLadder, guidance: defaultSupportGuidance, region: demoOffice.region, runs: packed }).areas;
    for (let i = 0; i < 3; i++) once();
    const times: number[] = [];
    let inside = 0;
    for (let i = 0; i < 21; i++) {
      const start = performance.now();
      const report = once();
      times.push(performance.now() - start);
      if (report.length !== 6 || !report.every((r) => r.evidence.soundingIds.every((id) => id.startsWith(`${run.id}:`)))) throw new Error('grid evidence bench: expected 6 areas');
      inside = report.reduce((sum, r) => sum + r.evidence.count, 0);
    }
    if (inside < 1000) throw new Error(`grid evidence bench: only ${inside} grid soundings inside the areas`);
    times.sort((a, b) => a - b);
    return Math.round((times[10] ?? 0) * 10) / 10;
  },
};

/** A 200 × 200 run over the demo region with invented figures, as the per-run cache holds it. */
function syntheticRun(): RunFigures {
  const { west, south, east, north } = demoOffice.region;
  const side = 200;
  let seed = 7;
  const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
  const run = { id: '11111111-1111-4111-8111-111111111111', model: 'BENCH', cycleTime: '2027-04-18T12:00:00.000Z', forecastHour: 6, validTime: '2027-04-18T18:00:00.000Z', gridKind: 'lambert', nx: side, ny: side, soundingCount: side * side };
  const rows = Array.from({ length: side * side }, (_, i) => {
    const column = i % side;
    const row = Math.floor(i / side);
    const figures = Object.fromEntries(keyFigureKeys.map((key) => [key, null])) as Record<KeyFigureKey, number | null>;
    Object.assign(figures, { mlCape: random() * 4000, muCape: random() * 4500, mlCin: -random() * 200, mlLclHeightM: 500 + random() * 1500, precipitableWaterMm: 10 + random() * 40, bulkShear0to6kmMs: random() * 35, srh0to1km: random() * 300, stp: random() * 5, scp: random() * 15, surfaceDewpointC: 5 + random() * 18, surfaceMixingRatioGkg: 6 + random() * 12 });
    // A slightly sheared grid, as a Lambert grid looks in latitude and longitude.
    const longitude = west + ((east - west) * column) / (side - 1) + 0.002 * row;
    const latitude = south + ((north - south) * row) / (side - 1) - 0.001 * column;
    return { pointIndex: i, latitude, longitude, flagCount: 0, ...figures };
  });
  return runFiguresFromRows(run, rows);
}
