import { describe, expect, it } from 'vitest';
import type { AreaGeometry } from '../../../../shared/contracts/outlooks';
import { areaKm2 } from '../../../../shared/geometry/area-checks';
import { diffOutlookAreas, formatKm2, type DiffArea } from './outlook-diff';

const ladder = ['thunder', 'level1', 'level2', 'level3'];
const box = (w: number, s: number, e: number, n: number): AreaGeometry => ({
  type: 'Polygon',
  coordinates: [
    [
      [w, s],
      [e, s],
      [e, n],
      [w, n],
      [w, s],
    ],
  ],
});
const area = (id: string, levelKey: string, geometry: AreaGeometry, label = ''): DiffArea => ({ id, levelKey, geometry, label });

describe('diffOutlookAreas', () => {
  it('when both sides are the same, reports no change', () => {
    const areas = [area('a', 'level1', box(-95, 37, -90, 40))];
    const diff = diffOutlookAreas(areas, areas, ladder);
    expect(diff.unchanged).toBe(true);
    expect(diff.added).toEqual([]);
    expect(diff.removed).toEqual([]);
    expect(diff.perLevel[0]?.gainedKm2).toBe(0);
  });

  it('when an area appears and another disappears, lists them as added and removed', () => {
    const before = [area('a', 'level1', box(-95, 37, -93, 39))];
    const after = [area('b', 'level2', box(-90, 37, -89, 38))];
    const diff = diffOutlookAreas(before, after, ladder);
    expect(diff.added.map((a) => a.id)).toEqual(['b']);
    expect(diff.removed.map((a) => a.id)).toEqual(['a']);
    expect(diff.levelChanges).toEqual([]);
  });

  it('when an amendment copies an area under a new id and raises its level, reports a level change, not add and remove', () => {
    const before = [area('old', 'level2', box(-94, 37.5, -91, 39.5), 'Core')];
    const after = [area('new', 'level3', box(-94, 37.5, -91.2, 39.5), 'Core')];
    const diff = diffOutlookAreas(before, after, ladder);
    expect(diff.added).toEqual([]);
    expect(diff.removed).toEqual([]);
    expect(diff.levelChanges).toEqual([{ beforeId: 'old', afterId: 'new', fromLevelKey: 'level2', toLevelKey: 'level3', label: 'Core' }]);
  });

  it('when a level grows on one side, reports the gained ground in km² and nothing lost', () => {
    const small = box(-95, 37, -93, 39);
    const large = box(-95, 37, -91, 39);
    const diff = diffOutlookAreas([area('a', 'level1', small)], [area('a', 'level1', large)], ladder);
    const level1 = diff.perLevel.find((l) => l.levelKey === 'level1');
    // The added strip is the large box minus the small one (Turf spherical areas of both boxes).
    expect(level1?.gainedKm2).toBeCloseTo(areaKm2(large) - areaKm2(small), -1);
    expect(level1?.lostKm2).toBeCloseTo(0, 3);
    expect(diff.unchanged).toBe(false);
  });

  it('when two areas of a level overlap, counts the shared ground once', () => {
    const a = box(-95, 37, -93, 39);
    const b = box(-94, 37, -92, 39);
    const diff = diffOutlookAreas([], [area('a', 'level1', a), area('b', 'level1', b)], ladder);
    const union = box(-95, 37, -92, 39);
    expect(diff.perLevel[0]?.afterKm2).toBeCloseTo(areaKm2(union), -1);
  });

  it('when a small core sits inside a large area, does not pair the core with the large area', () => {
    const before = [area('l1', 'level1', box(-95, 37, -89, 40)), area('l2', 'level2', box(-94, 37.5, -91, 39.5), 'Core')];
    const after = [area('n1', 'level1', box(-95.5, 36.5, -89, 40.5)), area('n3', 'level3', box(-93.5, 38, -91.5, 39.2), 'Core')];
    const diff = diffOutlookAreas(before, after, ladder);
    expect(diff.levelChanges.map((c) => [c.beforeId, c.afterId])).toEqual([['l2', 'n3']]);
    expect(diff.added).toEqual([]);
    expect(diff.removed).toEqual([]);
  });

  it('lists levels in ladder order', () => {
    const diff = diffOutlookAreas([area('a', 'level3', box(-94, 38, -93, 39))], [area('b', 'thunder', box(-96, 36, -88, 41))], ladder);
    expect(diff.perLevel.map((l) => l.levelKey)).toEqual(['thunder', 'level3']);
    expect(diff.perLevel[1]?.lostKm2).toBeGreaterThan(0);
  });

  it('formats km² as whole grouped numbers', () => {
    expect(formatKm2(12_400.4)).toBe('12,400 km²');
  });
});
