import { describe, expect, it } from 'vitest';
import { defaultRiskLadder } from '../contracts/office';
import { areaTitle, ladderLevel, levelLabel } from './levels';

describe('level labels', () => {
  it('when the level is on the ladder, its label is the office’s own', () => {
    expect(levelLabel(defaultRiskLadder, 'level2')).toBe('Level 2 · Scattered');
  });

  it('when the office removed the level, the area still has a readable name and a neutral colour', () => {
    expect(ladderLevel(defaultRiskLadder, 'level9')).toMatchObject({ label: 'Unknown level (level9)', colour: '#c9d1dc' });
  });

  it('when an area has its own label, it follows the level after a dash; blank labels are left out', () => {
    expect(areaTitle(defaultRiskLadder, { levelKey: 'level1', label: ' Lower valley ' })).toBe('Level 1 · Isolated — Lower valley');
    expect(areaTitle(defaultRiskLadder, { levelKey: 'level1', label: '  ' })).toBe('Level 1 · Isolated');
  });
});
