import type { AreaGeometry } from '../contracts/outlooks';

type Ring = [number, number][];

/** Twice the signed planar area of a ring in degree space; positive when counterclockwise (shoelace formula). */
export function signedRingArea(ring: readonly (readonly number[])[]): number {
  let sum = 0;
  for (let i = 0; i < ring.length - 1; i++) {
    const a = ring[i] ?? [0, 0];
    const b = ring[i + 1] ?? [0, 0];
    sum += (a[0] ?? 0) * (b[1] ?? 0) - (b[0] ?? 0) * (a[1] ?? 0);
  }
  return sum;
}

const oriented = (ring: Ring, counterclockwise: boolean): Ring => ((signedRingArea(ring) > 0) === counterclockwise ? ring : [...ring].reverse());

/**
 * The geometry with RFC 7946 §3.1.6 winding: exterior rings counterclockwise, holes clockwise.
 * Parsers must accept either order; producers should write this one.
 */
export function withRfc7946Winding(geometry: AreaGeometry): AreaGeometry {
  const fix = (rings: Ring[]) => rings.map((ring, i) => oriented(ring, i === 0));
  return geometry.type === 'Polygon' ? { type: 'Polygon', coordinates: fix(geometry.coordinates) } : { type: 'MultiPolygon', coordinates: geometry.coordinates.map(fix) };
}
