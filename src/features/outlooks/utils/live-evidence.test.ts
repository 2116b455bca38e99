import { describe, expect, it } from 'vitest';
import type { AreaReport } from '../../../../shared/evidence/area-report';
import { evidenceView, judgementCounts } from './live-evidence';

const live: AreaReport = {
  areaId: 'a',
  levelKey: 'level1',
  evidence: { areaId: 'a', count: 2, flaggedCount: 0, soundingIds: ['x', 'y'], stats: {} },
  support: { result: 'thin', reasons: [], backing: [], failing: [], lacking: [], hazards: [] },
};
const record = { name: 'server answer' };

describe('evidenceView', () => {
  it('When the draft is saved and the server answered, then the record is shown even if a preview exists', () => {
    expect(evidenceView({ record, live, pending: false })).toEqual({ kind: 'record', report: record });
  });
  it('When a vertex moves or a change is unsaved, then the live preview stands in for the record', () => {
    expect(evidenceView({ record, live, pending: true })).toEqual({ kind: 'preview', report: live });
  });
  it('When the draft is ahead but no preview can be computed, then the last record is shown as stale', () => {
    expect(evidenceView({ record, live: undefined, pending: true })).toEqual({ kind: 'stale', report: record });
  });
  it('When a new area has no record yet, then the preview is shown; with neither, nothing', () => {
    expect(evidenceView({ record: undefined, live, pending: true }).kind).toBe('preview');
    expect(evidenceView({ record: undefined, live: undefined, pending: true }).kind).toBe('none');
  });
});

describe('judgementCounts', () => {
  it('When soundings carry judgements, then each kind is counted', () => {
    expect(judgementCounts(new Map([['a', 'backs'], ['b', 'backs'], ['c', 'lacks']] as const))).toEqual({ backs: 2, fails: 0, lacks: 1, inside: 0 });
  });
});
