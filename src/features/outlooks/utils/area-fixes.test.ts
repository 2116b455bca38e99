import { describe, expect, it } from 'vitest';
import { checkAreas } from '../../../../shared/geometry/area-checks';
import { applyAreaFix } from './area-fixes';
import type { OutlookDocument } from './outlook-document';

const region = { west: -95, south: 36, east: -86, north: 42 };
const box = (w: number, s: number, e: number, n: number) => ({ type: 'Polygon' as const, coordinates: [[[w, s] as [number, number], [e, s] as [number, number], [e, n] as [number, number], [w, n] as [number, number], [w, s] as [number, number]]] });
const ladder = ['thunder', 'level1', 'level2'];
const doc = (areas: OutlookDocument['areas']): OutlookDocument => ({ headline: '', discussion: '', hazardNotes: {}, validFrom: '2027-04-18T11:00:00.000Z', validUntil: '2027-04-19T11:00:00.000Z', areas });

describe('one-click geometry fixes', () => {
  it('when a level-1 area pokes out of the thunder area, then expanding the lower level removes the nesting finding', () => {
    const document = doc([
      { id: 't', levelKey: 'thunder', hazards: [], geometry: box(-93, 37, -89, 40), label: '' },
      { id: 'a', levelKey: 'level1', hazards: [], geometry: box(-90, 38, -88, 39), label: '' },
    ]);
    expect(checkAreas(document.areas, ladder, region).a?.map((c) => c.code)).toContain('NOT_NESTED');
    const fixed = applyAreaFix(document, 'a', 'expand-lower-level', ladder, region);
    expect(checkAreas(fixed.areas, ladder, region).a?.map((c) => c.code) ?? []).not.toContain('NOT_NESTED');
    expect(fixed.areas.map((a) => a.id)).toEqual(['t', 'a']);
  });

  it('when no area of the lower level exists, then one is added with the same outline', () => {
    const document = doc([{ id: 'a', levelKey: 'level1', hazards: [], geometry: box(-90, 38, -88, 39), label: '' }]);
    const fixed = applyAreaFix(document, 'a', 'expand-lower-level', ladder, region, () => 'new-id');
    expect(fixed.areas.map((a) => [a.id, a.levelKey])).toEqual([
      ['new-id', 'thunder'],
      ['a', 'level1'],
    ]);
  });

  it('when an area crosses the region edge, then clipping keeps only the part inside', () => {
    const document = doc([{ id: 'a', levelKey: 'thunder', hazards: [], geometry: box(-97, 38, -93, 39), label: '' }]);
    const fixed = applyAreaFix(document, 'a', 'clip-to-region', ladder, region);
    expect(checkAreas(fixed.areas, ladder, region).a ?? []).toEqual([]);
  });
});
