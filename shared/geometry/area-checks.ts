import { area, bboxPolygon, difference, featureCollection, intersect, polygon, multiPolygon, union, unkinkPolygon } from '@turf/turf';
import type { Feature, MultiPolygon, Polygon } from 'geojson';
import type { Region } from '../contracts/office';
import type { AreaGeometry } from '../contracts/outlooks';
import { ringsSelfIntersect } from './segment-crossings';

/** Areas smaller than this are probably slivers left by editing (km²). */
export const sliverAreaKm2 = 50;

export type AreaCheckCode = 'SELF_INTERSECTION' | 'OUTSIDE_REGION' | 'SLIVER' | 'NOT_NESTED';

/** One finding on a risk area: what is wrong, in words, and whether a one-click fix exists. */
export interface AreaCheck {
  code: AreaCheckCode;
  severity: 'error' | 'warning';
  message: string;
  fix?: 'unkink' | 'clip-to-region' | 'expand-lower-level';
}

/** GeoJSON positions as [longitude, latitude] pairs (any altitude dropped). */
const toPairs = (ring: number[][]): [number, number][] => ring.map((p) => [p[0] ?? 0, p[1] ?? 0]);

const toFeature = (geometry: AreaGeometry): Feature<Polygon | MultiPolygon> =>
  geometry.type === 'Polygon' ? polygon(geometry.coordinates) : multiPolygon(geometry.coordinates);

/** Area of a geometry in km² (Turf's spherical area). */
export function areaKm2(geometry: AreaGeometry): number {
  return area(toFeature(geometry)) / 1e6;
}

function polygonsOf(geometry: AreaGeometry): Polygon[] {
  return geometry.type === 'Polygon' ? [geometry] : geometry.coordinates.map((coordinates) => ({ type: 'Polygon', coordinates }));
}

/** True when an edge of the outline crosses or touches another edge (spatial index, near-linear). */
export function selfIntersects(geometry: AreaGeometry): boolean {
  return polygonsOf(geometry).some((p) => ringsSelfIntersect(p.coordinates));
}

/** Splits a self-intersecting outline into simple polygons at its crossings (the offered fix). */
export function unkink(geometry: AreaGeometry): AreaGeometry {
  const parts = polygonsOf(geometry).flatMap((p) => unkinkPolygon(polygon(p.coordinates)).features.map((f) => f.geometry.coordinates.map(toPairs)));
  return parts.length === 1 && parts[0] ? { type: 'Polygon', coordinates: parts[0] } : { type: 'MultiPolygon', coordinates: parts };
}

function fromFeature(feature: Feature<Polygon | MultiPolygon> | null): AreaGeometry | null {
  if (!feature) return null;
  const g = feature.geometry;
  return g.type === 'Polygon' ? { type: 'Polygon', coordinates: g.coordinates.map(toPairs) } : { type: 'MultiPolygon', coordinates: g.coordinates.map((rings) => rings.map(toPairs)) };
}

/** The part of the area inside the office region (null when none of it is). */
export function clipToRegion(geometry: AreaGeometry, region: Region): AreaGeometry | null {
  const box = bboxPolygon([region.west, region.south, region.east, region.north]);
  return fromFeature(intersect(featureCollection([toFeature(geometry), box])));
}

/** The union of several areas (null for none). */
export function unionOf(geometries: readonly AreaGeometry[]): AreaGeometry | null {
  if (geometries.length === 0) return null;
  if (geometries.length === 1) return geometries[0] ?? null;
  return fromFeature(union(featureCollection(geometries.map(toFeature))));
}

/** The part of `geometry` outside `container`, in km² (0 when fully inside). */
export function areaOutsideKm2(geometry: AreaGeometry, container: AreaGeometry | null): number {
  if (!container) return areaKm2(geometry);
  const outside = fromFeature(difference(featureCollection([toFeature(geometry), toFeature(container)])));
  return outside ? areaKm2(outside) : 0;
}

const areaKm2OrZero = (geometry: AreaGeometry | null) => (geometry ? areaKm2(geometry) : 0);

/** True when every position of the geometry lies inside the region's box (one linear pass). */
export function withinRegionBox(geometry: AreaGeometry, region: Region): boolean {
  const rings = geometry.type === 'Polygon' ? geometry.coordinates : geometry.coordinates.flat();
  return rings.every((ring) => ring.every(([x = 0, y = 0]) => x >= region.west && x <= region.east && y >= region.south && y <= region.north));
}

export interface CheckedArea {
  id: string;
  levelKey: string;
  geometry: AreaGeometry;
}

/**
 * Geometry checks for every area of an outlook: self-intersection (error, with an unkink fix),
 * outside the office region (warning, clip fix), slivers under 50 km² (warning), and nesting:
 * an area of a level should lie within the union of the areas of the level below (warning,
 * with a fix that expands the lower level to contain it). Levels are ordered by the ladder.
 * Advisory except self-intersection, which makes the area's size and evidence meaningless.
 */
export function checkAreas(areas: readonly CheckedArea[], ladderKeys: readonly string[], region: Region): Record<string, AreaCheck[]> {
  const result: Record<string, AreaCheck[]> = {};
  const simple = new Map<string, boolean>();
  for (const a of areas) {
    const checks: AreaCheck[] = [];
    const kinked = selfIntersects(a.geometry);
    simple.set(a.id, !kinked);
    if (kinked) {
      checks.push({ code: 'SELF_INTERSECTION', severity: 'error', message: 'The outline crosses itself. Split it at the crossing, or redraw the crossing edges.', fix: 'unkink' });
    } else {
      const total = areaKm2(a.geometry);
      // Most areas lie well inside the region: a linear bounding-box test skips the clip.
      const within = withinRegionBox(a.geometry, region) ? total : areaKm2OrZero(clipToRegion(a.geometry, region));
      if (total - within > 1) {
        checks.push({
          code: 'OUTSIDE_REGION',
          severity: 'warning',
          message: `${Math.round(total - within).toLocaleString('en-US')} km² of this area lies outside the office region. Clip it to the region.`,
          fix: 'clip-to-region',
        });
      }
      if (total < sliverAreaKm2) {
        checks.push({ code: 'SLIVER', severity: 'warning', message: `This area is only ${total.toFixed(1)} km²; it may be a sliver left by editing. Delete it or enlarge it.` });
      }
    }
    result[a.id] = checks;
  }
  for (const a of areas) {
    const levelIndex = ladderKeys.indexOf(a.levelKey);
    if (levelIndex <= 0 || !simple.get(a.id)) continue;
    const lowerKey = ladderKeys[levelIndex - 1];
    const lower = areas.filter((b) => b.levelKey === lowerKey && simple.get(b.id)).map((b) => b.geometry);
    const outside = areaOutsideKm2(a.geometry, unionOf(lower));
    if (outside > 1) {
      result[a.id]?.push({
        code: 'NOT_NESTED',
        severity: 'warning',
        message: `${Math.round(outside).toLocaleString('en-US')} km² of this area is not inside the ${lowerKey} areas below it. Expand the lower level to contain it.`,
        fix: 'expand-lower-level',
      });
    }
  }
  return result;
}
