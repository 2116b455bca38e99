import { defaultRiskLadder } from '../../shared/contracts/office';
import type { RiskArea } from '../../shared/contracts/outlooks';
import { emptyKeyFigures } from '../../shared/sounding/key-figures';
import type { EvidenceSounding } from '../../shared/evidence/evidence';
import { defaultSupportGuidance } from '../../shared/evidence/guidance';
import { buildEvidenceReport } from '../../server/workers/evidence-report';
import { demoOutlookAreas } from '../../server/seed/demo-outlook';
import { demoOffice } from '../../server/services/seed.service';
import type { BenchFigure } from './figures';

/**
 * Server-side evidence for an outlook of 6 areas over 2000 already-analysed soundings spread
 * over the demo region: period filter, point-in-polygon, statistics, support check and geometry
 * checks. Median of 21 runs after a warm-up.
 */
export const evidenceSixAreas: BenchFigure = {
  name: 'evidence_ms_6_areas_2000_soundings',
  unit: 'ms',
  measure() {
    const { west, south, east, north } = demoOffice.region;
    let seed = 7;
    const random = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    const validTime = '2027-04-18T18:00:00.000Z';
    const soundings: EvidenceSounding[] = Array.from({ length: 2000 }, (_, i) => ({
      id: `s${i}`,
      stationId: `X${i}`,
      latitude: south + random() * (north - south),
      longitude: west + random() * (east - west),
      validTime,
      source: i % 3 === 0 ? 'observed' : 'model',
      modified: false,
      figures: {
        ...emptyKeyFigures(),
        mlCape: random() * 4000, muCape: random() * 4500, mlCin: -random() * 200, mlLclHeightM: 500 + random() * 1500, precipitableWaterMm: 10 + random() * 40,
        bulkShear0to6kmMs: random() * 35, srh0to1km: random() * 300, stp: random() * 5, scp: random() * 15, surfaceDewpointC: 5 + random() * 18, surfaceMixingRatioGkg: 6 + random() * 12, flagCount: 0,
      },
    }));
    // The demo draft's six areas (thunder to Level 3).
    const areas: RiskArea[] = demoOutlookAreas.slice(0, 6).map((a, i) => ({ ...a, id: `a${i}`, sortOrder: i }));
    if (areas.length !== 6) throw new Error('evidence bench: the demo outlook needs 6 areas');
    const outlook = { areas, validFrom: '2027-04-18T12:00:00.000Z', validUntil: '2027-04-19T11:00:00.000Z' };
    const run = () => buildEvidenceReport({ outlook, candidates: soundings, ladder: defaultRiskLadder, guidance: defaultSupportGuidance, region: demoOffice.region });
    for (let i = 0; i < 3; i++) run();
    const times: number[] = [];
    for (let i = 0; i < 21; i++) {
      const start = performance.now();
      const report = run();
      times.push(performance.now() - start);
      if (report.length !== 6) throw new Error('evidence bench: expected 6 areas');
    }
    times.sort((a, b) => a - b);
    return Math.round((times[10] ?? 0) * 10) / 10;
  },
};
