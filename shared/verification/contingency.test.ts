import { describe, expect, it } from 'vitest';
import { scoresOf, tabulate } from './contingency';

describe('tabulate and scoresOf', () => {
  it('counts a hand-built five-cell case and gives the scores worked out by hand (definitions: Wilks 2011, sect. 8.2)', () => {
    // cell:      1    2    3    4    5
    // forecast:  yes  yes  no   no   yes
    // observed:  yes  no   yes  no   no
    // → a (hits) = 1 (cell 1), b (false alarms) = 2 (cells 2, 5), c (misses) = 1 (cell 3), d = 1 (cell 4)
    const table = tabulate([1, 1, 0, 0, 1], [1, 0, 1, 0, 0]);
    expect(table).toEqual({ hits: 1, falseAlarms: 2, misses: 1, correctNegatives: 1 });
    const scores = scoresOf(table);
    expect(scores.pod).toBeCloseTo(1 / 2, 12); // a/(a+c) = 1/2
    expect(scores.successRatio).toBeCloseTo(1 / 3, 12); // a/(a+b) = 1/3, i.e. FAR = 2/3
    expect(scores.csi).toBeCloseTo(1 / 4, 12); // a/(a+b+c) = 1/4
    expect(scores.bias).toBeCloseTo(3 / 2, 12); // (a+b)/(a+c) = 3/2
  });

  it('when nothing was forecast or observed, the ratios are undefined (null), not zero', () => {
    const scores = scoresOf(tabulate([0, 0, 0], [0, 0, 0]));
    expect(scores).toEqual({ pod: null, successRatio: null, csi: null, bias: null });
  });

  it('refuses forecast and observed series of different lengths', () => {
    expect(() => tabulate([1], [1, 0])).toThrow(RangeError);
  });
});
