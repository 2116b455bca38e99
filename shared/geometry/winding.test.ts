import { booleanClockwise } from '@turf/turf';
import { describe, expect, it } from 'vitest';
import { withRfc7946Winding } from './winding';

// RFC 7946 §3.1.6: exterior rings counterclockwise, holes clockwise.
describe('RFC 7946 winding', () => {
  it('when the exterior ring is clockwise and the hole counterclockwise, both are turned round', () => {
    const clockwiseOuter: [number, number][] = [[0, 0], [0, 4], [4, 4], [4, 0], [0, 0]];
    const counterclockwiseHole: [number, number][] = [[1, 1], [2, 1], [2, 2], [1, 2], [1, 1]];
    const wound = withRfc7946Winding({ type: 'Polygon', coordinates: [clockwiseOuter, counterclockwiseHole] });
    expect(wound.type).toBe('Polygon');
    const [outer, hole] = wound.type === 'Polygon' ? wound.coordinates : [];
    expect(booleanClockwise(outer ?? [])).toBe(false);
    expect(booleanClockwise(hole ?? [])).toBe(true);
  });

  it('when a multipolygon is already wound the RFC 7946 way, its positions stay as they were', () => {
    const square: [number, number][] = [[0, 0], [4, 0], [4, 4], [0, 4], [0, 0]];
    expect(withRfc7946Winding({ type: 'MultiPolygon', coordinates: [[square]] })).toEqual({ type: 'MultiPolygon', coordinates: [[square]] });
  });
});
