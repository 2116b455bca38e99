import { rewind } from '@turf/turf';
import type { Position } from 'geojson';
import type { AreaGeometry } from '../contracts/outlooks';

const toPair = (position: Position): [number, number] => [position[0] ?? 0, position[1] ?? 0];

/**
 * The geometry with RFC 7946 §3.1.6 winding (exterior rings counterclockwise, holes clockwise),
 * by Turf's `rewind`. Parsers must accept either order; producers should write this one.
 */
export function withRfc7946Winding(geometry: AreaGeometry): AreaGeometry {
  const wound = rewind(geometry);
  switch (wound.type) {
    case 'Polygon':
      return { type: 'Polygon', coordinates: wound.coordinates.map((ring) => ring.map(toPair)) };
    case 'MultiPolygon':
      return { type: 'MultiPolygon', coordinates: wound.coordinates.map((polygon) => polygon.map((ring) => ring.map(toPair))) };
    default:
      throw new Error(`rewind turned a ${geometry.type} into a ${wound.type}`);
  }
}
