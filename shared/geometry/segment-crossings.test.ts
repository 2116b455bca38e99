import { kinks, polygon } from '@turf/turf';
import { describe, expect, it } from 'vitest';
import { ringsSelfIntersect, segmentsIntersect } from './segment-crossings';

const square = [[0, 0], [4, 0], [4, 4], [0, 4], [0, 0]];

describe('segmentsIntersect', () => {
  it('When two segments cross, touch at an end or overlap, then they intersect; parallel ones do not', () => {
    expect(segmentsIntersect([0, 0], [2, 2], [0, 2], [2, 0])).toBe(true);
    expect(segmentsIntersect([0, 0], [2, 0], [2, 0], [3, 5])).toBe(true);
    expect(segmentsIntersect([0, 0], [3, 0], [1, 0], [5, 0])).toBe(true);
    expect(segmentsIntersect([0, 0], [3, 0], [0, 1], [3, 1])).toBe(false);
    expect(segmentsIntersect([0, 0], [1, 0], [2, 0], [3, 0])).toBe(false);
  });
});

describe('ringsSelfIntersect', () => {
  it('When the outline is a simple square (with a doubled click and a point on a straight edge), then it does not self-intersect', () => {
    expect(ringsSelfIntersect([square])).toBe(false);
    expect(ringsSelfIntersect([[[0, 0], [2, 0], [4, 0], [4, 4], [4, 4], [0, 4], [0, 0]]])).toBe(false);
  });

  it('When the outline is a bow tie, then it self-intersects', () => {
    expect(ringsSelfIntersect([[[0, 0], [2, 2], [2, 0], [0, 2], [0, 0]]])).toBe(true);
  });

  it('When the outline touches itself at a corner (figure of eight), then it self-intersects', () => {
    expect(ringsSelfIntersect([[[0, 0], [2, 2], [4, 0], [4, 4], [2, 2], [0, 4], [0, 0]]])).toBe(true);
  });

  it('When an edge folds straight back along the previous one (a spike), then it self-intersects', () => {
    expect(ringsSelfIntersect([[[0, 0], [4, 0], [4, 4], [4, 2], [0, 4], [0, 0]]])).toBe(true);
  });

  it('When a hole lies inside the outer ring, then nothing crosses; when it sticks out, then the rings cross', () => {
    expect(ringsSelfIntersect([square, [[1, 1], [1, 2], [2, 2], [2, 1], [1, 1]]])).toBe(false);
    expect(ringsSelfIntersect([square, [[1, 1], [1, 2], [6, 2], [6, 1], [1, 1]]])).toBe(true);
  });

  it('When a long wavy outline has one crossing far from its start, then it is found', () => {
    // A 20,000-edge star-shaped ring; then two neighbouring points swapped to make one crossing.
    const n = 20_000;
    const ring: number[][] = [];
    for (let i = 0; i < n; i++) {
      const t = (2 * Math.PI * i) / n;
      const r = 1 + 0.1 * Math.sin(40 * t);
      ring.push([r * Math.cos(t), r * Math.sin(t)]);
    }
    ring.push(ring[0] ?? [1, 0]);
    expect(ringsSelfIntersect([ring])).toBe(false);
    const crossed = ring.map((p) => [...p]);
    const k = 15_000;
    [crossed[k], crossed[k + 1]] = [crossed[k + 1] ?? [], crossed[k] ?? []];
    expect(ringsSelfIntersect([crossed])).toBe(true);
  });

  it('When random small outlines are checked, then the answer agrees with the all-pairs test in Turf (kinks)', () => {
    let seed = 7;
    const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const crossing: number[][][] = [];
    for (let trial = 0; trial < 300; trial++) {
      const ring = Array.from({ length: 4 + Math.floor(random() * 6) }, () => [Math.round(random() * 20), Math.round(random() * 20)]);
      ring.push(ring[0] ?? [0, 0]);
      // Turf reports crossings between edges only; touching at a shared corner is left to our stricter rule.
      if (kinks(polygon([ring])).features.length > 0) crossing.push(ring);
    }
    expect(crossing.filter((ring) => !ringsSelfIntersect([ring]))).toEqual([]);
    const crossings = crossing.length;
    expect(crossings).toBeGreaterThan(50);
  });
});
