import { describe, expect, it } from 'vitest';
import type { SoundingKeyFigures } from '../contracts/soundings';
import type { AreaGeometry } from '../contracts/outlooks';
import { emptyKeyFigures } from '../sounding/key-figures';
import { areaEvidence, histogram, quantile, soundingsInPeriod, soundingsInside, summarise, type EvidenceSounding } from './evidence';

const noFigures: SoundingKeyFigures = emptyKeyFigures();
const at = (id: string, longitude: number, latitude: number, mlCape: number | null, validTime = '2027-04-18T18:00:00Z'): EvidenceSounding => ({
  id, stationId: id, latitude, longitude, validTime, source: 'model', modified: false, figures: { ...noFigures, mlCape },
});
const square: AreaGeometry = { type: 'Polygon', coordinates: [[[-94, 37], [-92, 37], [-92, 39], [-94, 39], [-94, 37]]] };

describe('quantile', () => {
  // Hyndman and Fan (1996) definition 7: for 1..10, the median is 5.5 and the 90th percentile 9.1.
  it('When values are 1..10, then the median is 5.5 and the 90th percentile 9.1 (Hyndman and Fan 1996, def. 7)', () => {
    const values = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    expect(quantile(values, 0.5)).toBeCloseTo(5.5, 10);
    expect(quantile(values, 0.9)).toBeCloseTo(9.1, 10);
  });
  it('When there is one value, then every quantile is that value', () => {
    expect(quantile([42], 0.9)).toBe(42);
  });
});

describe('histogram', () => {
  it('When values span 0..8 in 8 bins, then every value is counted once and the maximum falls in the last bin', () => {
    const bins = histogram([0, 1, 2, 3, 4, 5, 6, 7, 8]);
    expect(bins.reduce((n, b) => n + b.count, 0)).toBe(9);
    expect(bins[7]?.count).toBe(2);
  });
});

describe('soundingsInside', () => {
  it('When stations lie inside, outside and in the hole of nothing, then only the inside ones are returned', () => {
    const inside = soundingsInside(square, [at('a', -93, 38, 1), at('b', -95, 38, 1), at('c', -93, 40, 1)]);
    expect(inside.map((s) => s.id)).toEqual(['a']);
  });
  // Our convention (stated here and in evidence.ts): a station exactly on the outline counts as
  // inside, so a sounding on a shared edge is evidence for both areas.
  it('When a station lies exactly on an edge or a corner, then it counts as inside', () => {
    const onEdge = soundingsInside(square, [at('edge', -94, 38, 1), at('corner', -92, 39, 1)]);
    expect(onEdge.map((s) => s.id)).toEqual(['edge', 'corner']);
  });

  it('When the polygon has a hole, then a station in the hole is outside', () => {
    const holed: AreaGeometry = { type: 'Polygon', coordinates: [square.coordinates[0] as [number, number][], [[-93.5, 37.5], [-92.5, 37.5], [-92.5, 38.5], [-93.5, 38.5], [-93.5, 37.5]]] };
    expect(soundingsInside(holed, [at('hole', -93, 38, 1), at('rim', -93.8, 38.8, 1)]).map((s) => s.id)).toEqual(['rim']);
  });
});

describe('areaEvidence', () => {
  it('When three soundings are inside, then count, min, median and max come from their values and missing values are skipped', () => {
    const evidence = areaEvidence('x', square, [at('a', -93, 38, 500), at('b', -93.5, 37.5, 1500), at('c', -92.5, 38.5, 1000), at('d', -93.2, 38.2, null), at('out', -90, 38, 9999)]);
    expect(evidence.count).toBe(4);
    expect(evidence.stats.mlCape).toMatchObject({ count: 3, min: 500, median: 1000, max: 1500 });
    expect(evidence.stats.stp).toBeUndefined();
  });
});

describe('soundingsInPeriod', () => {
  it('When soundings fall before, inside and after the period, then only those inside are kept', () => {
    const list = [at('early', 0, 0, 1, '2027-04-18T05:00:00Z'), at('in', 0, 0, 1, '2027-04-18T18:00:00Z'), at('late', 0, 0, 1, '2027-04-19T12:00:01Z')];
    expect(soundingsInPeriod(list, '2027-04-18T06:00:00Z', '2027-04-19T12:00:00Z').map((s) => s.id)).toEqual(['in']);
  });
});

describe('areaEvidence: flagged soundings (issue 10)', () => {
  it('When two of three soundings inside carry quality flags, then they still count and flaggedCount is 2', () => {
    const flagged = (s: EvidenceSounding, flagCount: number): EvidenceSounding => ({ ...s, figures: { ...s.figures, flagCount } });
    const evidence = areaEvidence('a', square, [flagged(at('x', -93, 38, 1000), 2), flagged(at('y', -93.5, 38.5, 1500), 1), at('z', -92.5, 37.5, 500), flagged(at('out', -80, 30, 100), 3)]);
    expect(evidence.count).toBe(3);
    expect(evidence.flaggedCount).toBe(2);
    expect(evidence.stats.mlCape?.count).toBe(3);
  });
});

describe('summarise over grid-sized sets', () => {
  it('when values come in any order with ties, then min, median, p90, max and bins equal those of the sorted values', () => {
    let seed = 3;
    const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    for (const size of [1, 2, 3, 10, 101, 5000]) {
      const values = Array.from({ length: size }, () => Math.round(random() * 40) * 25);
      const sorted = [...values].sort((a, b) => a - b);
      const summary = summarise(values);
      expect(summary).toEqual({ count: size, min: sorted[0], median: quantile(sorted, 0.5), p90: quantile(sorted, 0.9), max: sorted[size - 1], histogram: histogram(sorted) });
    }
  });
});
