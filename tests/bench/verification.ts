import { demoOffice } from '../../server/services/seed.service';
import { demoOutlookAreas } from '../../server/seed/demo-outlook';
import { defaultRiskLadder } from '../../shared/contracts/office';
import { scoreIssuance, type ScoredReport } from '../../shared/verification/score-issuance';
import type { BenchFigure } from './figures';

/**
 * Scoring one issuance (the demo outlook's areas) against 1000 reports spread over the demo
 * region, on the 20 km equal-area grid: forecast cells, observed cells, the practically perfect
 * hindcast and every level and hazard table. Median of 11 runs after a warm-up.
 */
export const verifyOneIssuance: BenchFigure = {
  name: 'verify_ms_one_issuance_1000_reports',
  unit: 'ms',
  measure() {
    const { west, south, east, north } = demoOffice.region;
    let seed = 11;
    const random = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    const hazards = ['tornado', 'hail', 'wind', 'flood'] as const;
    const reports: ScoredReport[] = Array.from({ length: 1000 }, (_, i) => ({
      time: new Date(Date.UTC(2027, 3, 18, 18) + random() * 12 * 3_600_000).toISOString(),
      lat: south + random() * (north - south),
      lon: west + random() * (east - west),
      hazard: hazards[i % 4]!, // i % 4 indexes the four hazards
      hailDiameterCm: 3 + random() * 3,
      gustKmh: 100 + random() * 40,
      efRating: i % 3,
    }));
    const areas = demoOutlookAreas.map((a) => ({ levelKey: a.levelKey, hazards: a.hazards, geometry: a.geometry }));
    const run = () =>
      scoreIssuance({ region: demoOffice.region, ladder: defaultRiskLadder.map((l) => l.key), areas, reports, window: { from: '2027-04-18T12:00:00Z', until: '2027-04-19T12:00:00Z' } });
    run();
    const times: number[] = [];
    for (let i = 0; i < 11; i++) {
      const start = performance.now();
      run();
      times.push(performance.now() - start);
    }
    times.sort((a, b) => a - b);
    return Math.round((times[5] ?? 0) * 10) / 10;
  },
};
