import { area, buffer } from '@turf/turf';
import type { Feature, MultiPolygon, Polygon } from 'geojson';

/**
 * An outline drawn just inside an area, for the bold inner outline that marks significant
 * hazards (docs/vocabulary.md: no hatching). The inset scales with the area's size (2–10 km); when the
 * area is too small to shrink, the area's own outline is returned.
 */
export function insetOutline(geometry: Polygon | MultiPolygon): Polygon | MultiPolygon {
  const feature: Feature<Polygon | MultiPolygon> = { type: 'Feature', properties: {}, geometry };
  const sizeKm = Math.sqrt(area(feature) / 1e6);
  const insetKm = Math.min(10, Math.max(2, sizeKm * 0.025));
  try {
    const shrunk = buffer(feature, -insetKm, { units: 'kilometers' });
    const shape = shrunk?.geometry;
    if (shape && (shape.type === 'Polygon' || shape.type === 'MultiPolygon') && shape.coordinates.length > 0) return shape;
  } catch {
    // Turf's buffer can fail on degenerate outlines; the plain outline still shows the flag.
  }
  return geometry;
}

/** The northernmost position of the outer ring(s): where an area's label sits, just inside. */
export function labelAnchor(geometry: Polygon | MultiPolygon): [number, number] | null {
  const rings = geometry.type === 'Polygon' ? [geometry.coordinates[0] ?? []] : geometry.coordinates.map((p) => p[0] ?? []);
  let best: [number, number] | null = null;
  for (const ring of rings) {
    for (const position of ring) {
      const [longitude, latitude] = position;
      if (longitude === undefined || latitude === undefined) continue;
      if (best === null || latitude > best[1]) best = [longitude, latitude];
    }
  }
  return best;
}
