import { describe, expect, it } from 'vitest';
import type { AreaGeometry } from '../contracts/outlooks';
import { areaKm2, checkAreas, selfIntersects, unionOf, unkink } from './area-checks';

const region = { west: -96.5, south: 35.5, east: -87.5, north: 41.5 };
const box = (w: number, s: number, e: number, n: number): AreaGeometry => ({ type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] });
const keys = ['thunder', 'level1', 'level2'];

describe('areaKm2', () => {
  // One degree of latitude is about 111.2 km on a sphere of radius 6371 km (common practice); a
  // 1° × 1° cell at the equator is therefore about 12,364 km² (111.19² — Turf uses 6371008.8 m).
  it('When the area is a 1° square at the equator, then it is about 12,364 km² (spherical geometry, common practice)', () => {
    expect(areaKm2(box(0, 0, 1, 1))).toBeGreaterThan(12_300);
    expect(areaKm2(box(0, 0, 1, 1))).toBeLessThan(12_400);
  });
});

describe('self-intersection', () => {
  const bowtie: AreaGeometry = { type: 'Polygon', coordinates: [[[-94, 37], [-92, 39], [-92, 37], [-94, 39], [-94, 37]]] };
  it('When the outline is a bow tie, then it self-intersects and unkinking gives two simple parts', () => {
    expect(selfIntersects(bowtie)).toBe(true);
    const fixed = unkink(bowtie);
    expect(fixed.type).toBe('MultiPolygon');
    expect(selfIntersects(fixed)).toBe(false);
  });
});

describe('checkAreas', () => {
  it('When areas are nested, inside the region and large, then there are no findings', () => {
    const found = checkAreas([{ id: 't', levelKey: 'thunder', geometry: box(-96, 36, -88, 41) }, { id: 'l1', levelKey: 'level1', geometry: box(-94, 37, -91, 40) }], keys, region);
    expect(found).toEqual({ t: [], l1: [] });
  });

  it('When a level-2 area pokes out of the level-1 area, then a nesting warning offers to expand the lower level', () => {
    const found = checkAreas([{ id: 'l1', levelKey: 'level1', geometry: box(-94, 37, -92, 39) }, { id: 'l2', levelKey: 'level2', geometry: box(-93, 38, -91, 39) }], keys, region);
    expect(found.l2?.map((c) => c.code)).toEqual(['NOT_NESTED']);
    expect(found.l2?.[0]?.fix).toBe('expand-lower-level');
    // The fix: the union of both contains the level-2 area, so the warning goes away.
    const expanded = unionOf([box(-94, 37, -92, 39), box(-93, 38, -91, 39)]);
    if (!expanded) throw new Error('union is empty');
    const again = checkAreas([{ id: 'l1', levelKey: 'level1', geometry: expanded }, { id: 'l2', levelKey: 'level2', geometry: box(-93, 38, -91, 39) }], keys, region);
    expect(again.l2).toEqual([]);
  });

  it('When an area crosses the region edge or is tiny, then it is warned about', () => {
    const found = checkAreas([{ id: 'edge', levelKey: 'thunder', geometry: box(-98, 37, -95, 39) }, { id: 'tiny', levelKey: 'thunder', geometry: box(-93, 38, -92.95, 38.05) }], keys, region);
    expect(found.edge?.map((c) => c.code)).toContain('OUTSIDE_REGION');
    expect(found.tiny?.map((c) => c.code)).toContain('SLIVER');
  });
});
