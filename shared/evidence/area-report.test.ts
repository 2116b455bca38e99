import { describe, expect, it } from 'vitest';
import { defaultRiskLadder } from '../contracts/office';
import type { AreaGeometry } from '../contracts/risk-areas';
import { emptyKeyFigures } from '../sounding/key-figures';
import { areaReport, evidencePool, soundingJudgements, soundingsInArea } from './area-report';
import { soundingsInside, type EvidenceSounding } from './evidence';
import { defaultSupportGuidance } from './guidance';

const period = { validFrom: '2027-04-18T12:00:00Z', validUntil: '2027-04-19T12:00:00Z' };
const at = (id: string, longitude: number, latitude: number, extra: Partial<EvidenceSounding> = {}): EvidenceSounding => ({
  id,
  stationId: id,
  latitude,
  longitude,
  validTime: '2027-04-18T18:00:00Z',
  source: 'model',
  modified: false,
  figures: { ...emptyKeyFigures(), mlCape: 1200, muCape: 1500 },
  ...extra,
});

/** An irregular outline (a notched pentagon) with a square hole, in degrees. */
const notched: AreaGeometry = {
  type: 'Polygon',
  coordinates: [
    [[-96, 36], [-91, 36.5], [-90, 39], [-93, 38], [-95.5, 40], [-96, 36]],
    [[-94, 37], [-93, 37], [-93, 37.5], [-94, 37.5], [-94, 37]],
  ],
};

describe('soundingsInArea', () => {
  it('When 3000 scattered stations are queried through the longitude index, then exactly the stations the plain point-in-polygon scan finds are inside', () => {
    let seed = 11;
    const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const soundings = Array.from({ length: 3000 }, (_, i) => at(`s${i}`, -98 + random() * 10, 34 + random() * 8));
    const pool = evidencePool(soundings, period);
    const viaIndex = soundingsInArea(pool, notched).map((s) => s.id).sort();
    const viaScan = soundingsInside(notched, soundings).map((s) => s.id).sort();
    expect(viaScan.length).toBeGreaterThan(100);
    expect(viaIndex).toEqual(viaScan);
  });

  it('When stations lie on a corner, in the hole and beside the bounding box, then only the corner one and the inside one count', () => {
    const pool = evidencePool([at('corner', -90, 39), at('hole', -93.5, 37.25), at('inside', -92, 37), at('east', -89.5, 37), at('north', -92, 40.5)], period);
    expect(soundingsInArea(pool, notched).map((s) => s.id).sort()).toEqual(['corner', 'inside']);
  });

  it('When two stations share a longitude, then both are found (the binary search starts at the first)', () => {
    const pool = evidencePool([at('a', -96, 37.5), at('b', -96, 37.2), at('c', -96, 39)], period);
    const square: AreaGeometry = { type: 'Polygon', coordinates: [[[-96, 37], [-95, 37], [-95, 38], [-96, 38], [-96, 37]]] };
    expect(soundingsInArea(pool, square).map((s) => s.id).sort()).toEqual(['a', 'b']);
  });
});

describe('evidencePool', () => {
  it('When candidates are modified, outside the period or of the other source, then they stay out of the pool', () => {
    const candidates = [
      at('kept', -93, 38, { source: 'observed' }),
      at('modified', -93, 38, { source: 'observed', modified: true }),
      at('late', -93, 38, { source: 'observed', validTime: '2027-04-20T00:00:00Z' }),
      at('model', -93, 38),
    ];
    expect(evidencePool(candidates, { ...period, source: 'observed' }).soundings.map((s) => s.id)).toEqual(['kept']);
    expect(evidencePool(candidates, period).soundings.map((s) => s.id).sort()).toEqual(['kept', 'model']);
  });
});

describe('areaReport', () => {
  const area = { id: 'a1', levelKey: 'thunder', hazards: [], geometry: notched };

  it('When no sounding lies inside, then the count is 0 and the support check says no soundings inside', () => {
    const report = areaReport(area, evidencePool([at('far', -80, 30)], period), defaultRiskLadder, defaultSupportGuidance);
    expect(report.evidence.count).toBe(0);
    expect(report.support.result).toBe('none');
  });

  it('When soundings lie inside, then the evidence counts them and summarises their figures', () => {
    const inside = [at('x', -92, 37, { figures: { ...emptyKeyFigures(), mlCape: 1000 } }), at('y', -95, 37, { figures: { ...emptyKeyFigures(), mlCape: 3000 } })];
    const report = areaReport(area, evidencePool([...inside, at('far', -80, 30)], period), defaultRiskLadder, defaultSupportGuidance);
    expect(report.evidence.count).toBe(2);
    expect(report.evidence.soundingIds.sort()).toEqual(['x', 'y']);
    expect(report.evidence.stats.mlCape?.median).toBe(2000);
  });

  it('When the soundings come in two pools (uploaded and a model run), then the answer is the one a single pool gives', () => {
    let seed = 5;
    const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const sounding = (i: number) =>
      at(`s${i}`, -97 + random() * 8, 35 + random() * 6, { figures: { ...emptyKeyFigures(), mlCape: random() * 3000, muCape: random() < 0.2 ? null : random() * 4000, bulkShear0to6kmMs: random() * 30 } });
    const soundings = Array.from({ length: 600 }, (_, i) => sounding(i));
    const level2 = { ...area, levelKey: 'level2', hazards: [{ hazard: 'hail' as const, significant: false }] };
    const single = areaReport(level2, evidencePool(soundings, period), defaultRiskLadder, defaultSupportGuidance);
    const split = areaReport(level2, [evidencePool(soundings.slice(0, 250), period), evidencePool(soundings.slice(250), period)], defaultRiskLadder, defaultSupportGuidance);
    expect(single.evidence.count).toBeGreaterThan(100);
    expect(split.evidence.count).toBe(single.evidence.count);
    expect(split.evidence.stats).toEqual(single.evidence.stats);
    expect(split.support.result).toBe(single.support.result);
    expect(split.support.reasons).toEqual(single.support.reasons);
    expect([...split.support.backing].sort()).toEqual([...single.support.backing].sort());
    expect(split.support.hazards.map((h) => h.reasons)).toEqual(single.support.hazards.map((h) => h.reasons));
  });
});

describe('soundingJudgements', () => {
  it('When the check names backing, failing and lacking soundings, then each inside sounding gets its judgement and the rest stay "inside"', () => {
    const judgements = soundingJudgements({
      evidence: { areaId: 'a', count: 4, flaggedCount: 0, soundingIds: ['b', 'f', 'l', 'u'], stats: {} },
      support: { result: 'thin', reasons: [], backing: ['b'], failing: ['f'], lacking: ['l'], hazards: [] },
    });
    expect(Object.fromEntries(judgements)).toEqual({ b: 'backs', f: 'fails', l: 'lacks', u: 'inside' });
  });
});
