import { defaultRiskLadder } from '../../shared/contracts/office';
import type { AreaGeometry } from '../../shared/contracts/risk-areas';
import { areaReport, evidencePool, soundingJudgements, type ReportArea } from '../../shared/evidence/area-report';
import { evidenceSoundingsFromCandidates, toEvidenceCandidate } from '../../shared/evidence/evidence-candidates';
import type { EvidenceSounding } from '../../shared/evidence/evidence';
import { defaultSupportGuidance } from '../../shared/evidence/guidance';
import { emptyKeyFigures } from '../../shared/sounding/key-figures';
import { demoOffice } from '../../server/services/seed.service';
import type { BenchFigure } from './figures';

/** An irregular closed outline of `vertices` points around a centre (a lobed blob, as hand-drawn areas are), degrees. */
function blob(centreLongitude: number, centreLatitude: number, radius: number, vertices: number, phase: number): AreaGeometry {
  const ring: [number, number][] = [];
  for (let i = 0; i < vertices; i++) {
    const angle = (2 * Math.PI * i) / vertices;
    const r = radius * (1 + 0.25 * Math.sin(3 * angle + phase) + 0.1 * Math.cos(7 * angle));
    ring.push([centreLongitude + r * 1.3 * Math.cos(angle), centreLatitude + r * Math.sin(angle)]);
  }
  const first = ring[0];
  if (first) ring.push([first[0], first[1]]);
  return { type: 'Polygon', coordinates: [ring] };
}

/**
 * The workspace's live preview, run in Node: per edit (a vertex moved), the evidence, support
 * check and per-sounding judgements of all 6 areas of an outlook over 2,000 soundings, from a
 * pool built once from the evidence-candidates payload. Nested irregular areas of 40 vertices
 * over the demo region. Median of 41 edits after a warm-up, in ms (issue 14 target: <= 16 ms).
 */
export const liveEvidenceSixAreas: BenchFigure = {
  name: 'live_evidence_ms_6_areas_2000_soundings',
  unit: 'ms',
  measure() {
    const { west, south, east, north } = demoOffice.region;
    let seed = 19;
    const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const validTime = '2027-04-18T18:00:00.000Z';
    const soundings: EvidenceSounding[] = Array.from({ length: 2000 }, (_, i) => ({
      id: `s${i}`,
      stationId: `X${i}`,
      latitude: south + random() * (north - south),
      longitude: west + random() * (east - west),
      validTime,
      source: i % 3 === 0 ? 'observed' : 'model',
      modified: false,
      runId: null,
      figures: {
        ...emptyKeyFigures(),
        mlCape: random() * 4000, muCape: random() * 4500, mlCin: -random() * 200, mlLclHeightM: 500 + random() * 1500, precipitableWaterMm: 10 + random() * 40,
        bulkShear0to6kmMs: random() * 35, srh0to1km: random() * 300, stp: random() * 5, scp: random() * 15, surfaceDewpointC: 5 + random() * 18, surfaceMixingRatioGkg: 6 + random() * 12, flagCount: 0,
      },
    }));
    // What the browser holds: the decoded payload, indexed once per candidate set.
    const payload = { figureKeys: [...Object.keys(emptyKeyFigures()).filter((k) => k !== 'flagCount')], soundings: soundings.map(toEvidenceCandidate) };
    const pool = evidencePool(evidenceSoundingsFromCandidates(payload), { validFrom: '2027-04-18T12:00:00.000Z', validUntil: '2027-04-19T11:00:00.000Z' });
    const centreLongitude = (west + east) / 2;
    const centreLatitude = (south + north) / 2;
    const span = Math.min(east - west, north - south);
    const levels = ['thunder', 'level1', 'level2', 'level3', 'level4', 'level5'];
    const areasAt = (edit: number): ReportArea[] =>
      levels.map((levelKey, i) => ({
        id: `a${i}`,
        levelKey,
        hazards: [],
        // Each edit moves the outlines a little, so nothing can be reused between edits.
        geometry: blob(centreLongitude + edit * 0.001, centreLatitude, span * (0.45 - i * 0.07), 40, i + edit * 0.01),
      }));
    const edit = (n: number) => {
      let inside = 0;
      for (const area of areasAt(n)) {
        const report = areaReport(area, pool, defaultRiskLadder, defaultSupportGuidance);
        inside += soundingJudgements(report).size;
      }
      return inside;
    };
    for (let i = 0; i < 5; i++) edit(i);
    const times: number[] = [];
    for (let i = 0; i < 41; i++) {
      const start = performance.now();
      const inside = edit(i);
      times.push(performance.now() - start);
      if (inside < 500) throw new Error('live evidence bench: the areas hold too few soundings to be a fair test');
    }
    times.sort((a, b) => a - b);
    return Math.round((times[20] ?? 0) * 10) / 10;
  },
};
