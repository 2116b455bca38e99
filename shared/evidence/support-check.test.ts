import { describe, expect, it } from 'vitest';
import { defaultRiskLadder } from '../contracts/office';
import type { AreaEvidence, ParameterStats } from './evidence';
import { checkSupport, defaultGuidanceThresholds } from './support-check';

const stats = (median: number): ParameterStats => ({ count: 5, min: median, median, p90: median, max: median, histogram: [] });
const evidence = (count: number, medians: Partial<Record<'mlCape' | 'bulkShear0to6kmMs' | 'srh0to1km' | 'stp', number>>): AreaEvidence => ({
  areaId: 'a',
  count,
  flaggedCount: 0,
  soundingIds: [],
  stats: Object.fromEntries(Object.entries(medians).map(([k, v]) => [k, stats(v)])),
});

describe('checkSupport', () => {
  it('When no sounding lies inside, then the result is "no soundings inside"', () => {
    expect(checkSupport(evidence(0, {}), 'level3', defaultRiskLadder, defaultGuidanceThresholds).result).toBe('none');
  });

  it('When median MLCAPE is below the level guidance, then thin support names the numbers in words', () => {
    const check = checkSupport(evidence(6, { mlCape: 450, bulkShear0to6kmMs: 25, srh0to1km: 180 }), 'level3', defaultRiskLadder, defaultGuidanceThresholds);
    expect(check.result).toBe('thin');
    expect(check.reasons).toContain('median MLCAPE 450 J/kg, below the 1,500 J/kg expected for Level 3 · Numerous');
  });

  it('When every median meets the level but not the next, then the level is supported', () => {
    const check = checkSupport(evidence(6, { mlCape: 1700, bulkShear0to6kmMs: 22, srh0to1km: 120, stp: 0.5 }), 'level3', defaultRiskLadder, defaultGuidanceThresholds);
    expect(check.result).toBe('supported');
  });

  it('When the medians meet the next level too, then the environment exceeds the level', () => {
    const check = checkSupport(evidence(6, { mlCape: 2500, bulkShear0to6kmMs: 28, srh0to1km: 250, stp: 2 }), 'level3', defaultRiskLadder, defaultGuidanceThresholds);
    expect(check.result).toBe('exceeds');
    expect(check.reasons.join(' ')).toMatch(/Level 4/);
  });

  it('When fewer than three soundings are inside, then support is thin even with good values', () => {
    const check = checkSupport(evidence(2, { mlCape: 1700, bulkShear0to6kmMs: 22, srh0to1km: 120 }), 'level3', defaultRiskLadder, defaultGuidanceThresholds);
    expect(check.result).toBe('thin');
    expect(check.reasons[0]).toMatch(/only 2 soundings/);
  });
});
