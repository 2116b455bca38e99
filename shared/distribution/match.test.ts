import { describe, expect, it } from 'vitest';
import type { AreaGeometry } from '../contracts/outlooks';
import { decideNotice, matchAreas } from './match';

const box = (w: number, s: number, e: number, n: number): AreaGeometry => ({ type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] });
const ladder = ['thunder', 'level1', 'level2', 'level3'];
const risk = [
  { levelKey: 'thunder', hazards: [], geometry: box(-96, 36, -88, 41) },
  { levelKey: 'level1', hazards: [{ hazard: 'wind' as const, significant: false }], geometry: box(-95, 37, -90, 40) },
  { levelKey: 'level3', hazards: [{ hazard: 'tornado' as const, significant: true }], geometry: box(-94, 38, -92, 39) },
];

describe('matchAreas', () => {
  it('When a county overlaps the Level 3 core, then the highest level is level3 with its hazards', () => {
    expect(matchAreas([box(-93.5, 38.5, -93, 39.5)], risk, ladder)).toEqual({ highestLevelKey: 'level3', hazards: ['tornado'] });
  });
  it('When the area of interest only touches the thunder area, then the level is thunder', () => {
    expect(matchAreas([box(-89.5, 40.5, -88.5, 40.9)], risk, ladder).highestLevelKey).toBe('thunder');
  });
  // Our convention: touching counts. A county whose edge runs along the Level 3 area's edge is
  // alerted at Level 3 (a storm on the line threatens both sides).
  it('When the area only touches the Level 3 edge, then it is matched at Level 3', () => {
    expect(matchAreas([box(-92, 38.2, -91.5, 38.8)], risk, ladder).highestLevelKey).toBe('level3');
  });
  it('When the area lies outside every risk area, then there is no level', () => {
    expect(matchAreas([box(-80, 30, -79, 31)], risk, ladder).highestLevelKey).toBeNull();
  });
  it('When the subscriber follows only wind, then the tornado core does not count', () => {
    expect(matchAreas([box(-93.5, 38.5, -93, 39.5)], risk, ladder, ['wind'])).toEqual({ highestLevelKey: 'level1', hazards: ['wind'] });
  });
});

describe('decideNotice', () => {
  it('When the level reaches the threshold for the first time, then an alert', () => {
    expect(decideNotice(ladder, 'level1', 'level2', null)).toBe('alert');
  });
  it('When the level stays below the threshold and nobody was alerted, then nothing', () => {
    expect(decideNotice(ladder, 'level2', 'level1', null)).toBeNull();
  });
  it('When an amendment lowers an alerted area below the threshold, then "lowered"; when it removes the risk, then "cleared"', () => {
    expect(decideNotice(ladder, 'level2', 'level1', 'level3')).toBe('lowered');
    expect(decideNotice(ladder, 'level2', null, 'level3')).toBe('cleared');
  });
  it('When an amendment keeps the same alerted level, then no second message; when it raises it, then a new alert', () => {
    expect(decideNotice(ladder, 'level1', 'level3', 'level3')).toBeNull();
    expect(decideNotice(ladder, 'level1', 'level3', 'level2')).toBe('alert');
  });
});
