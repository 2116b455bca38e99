import { describe, expect, it } from 'vitest';
import { scoresOf } from './contingency';
import { aggregateByKey, podOnCsiLine, sumTables } from './aggregate';

describe('sumTables and aggregateByKey', () => {
  it('adds the tables cell by cell and scores the sum (two hand-built days)', () => {
    const day1 = { hits: 2, falseAlarms: 6, misses: 2, correctNegatives: 90 };
    const day2 = { hits: 4, falseAlarms: 0, misses: 4, correctNegatives: 92 };
    expect(sumTables([day1, day2])).toEqual({ hits: 6, falseAlarms: 6, misses: 6, correctNegatives: 182 });
    const [level1] = aggregateByKey([
      { key: 'level1', table: day1 },
      { key: 'level1', table: day2 },
    ]);
    // Summed: a = 6, b = 6, c = 6 → POD = 6/12 = 0.5, SR = 0.5, CSI = 6/18 = 1/3, bias = 12/12 = 1 (Wilks 2011, sect. 8.2).
    expect(level1!.scores.pod).toBeCloseTo(0.5, 12);
    expect(level1!.scores.csi).toBeCloseTo(1 / 3, 12);
    expect(level1!.scores.bias).toBeCloseTo(1, 12);
    // Averaging the two days' CSI instead (0.2 and 0.5) would give 0.35: the sum is what we report.
    expect(scoresOf(day1).csi).toBeCloseTo(0.2, 12);
  });
});

describe('podOnCsiLine', () => {
  it('where POD equals SR, CSI = x/(2 − x) (from 1/CSI = 2/x − 1): the 1/3 isoline passes POD = SR = 0.5', () => {
    expect(podOnCsiLine(1 / 3, 0.5)).toBeCloseTo(0.5, 12);
  });
  it('an isoline does not reach success ratios below its own value', () => {
    expect(podOnCsiLine(0.5, 0.4)).toBeNull();
  });
});
