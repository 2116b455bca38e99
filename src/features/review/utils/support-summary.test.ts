import { describe, expect, it } from 'vitest';
import { supportSummary } from './support-summary';

describe('supportSummary', () => {
  it('counts results, most worrying first', () => {
    expect(supportSummary(['supported', 'none', 'supported', 'thin'])).toBe('1 no soundings inside · 1 thin support · 2 supported');
  });
  it('when there are no areas, says so', () => {
    expect(supportSummary([])).toBe('No risk areas');
  });
});
