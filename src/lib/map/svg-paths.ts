import type { MultiLineString, Position } from 'geojson';
import type { AreaGeometry } from '../../../shared/contracts/risk-areas';
import type { MapBounds } from './risk-area-types';

/** A projection from longitude/latitude (degrees) to SVG pixels. */
export type Project = (position: Position) => [number, number];

const mercatorY = (latitudeDeg: number) => Math.log(Math.tan(Math.PI / 4 + (latitudeDeg * Math.PI) / 360));
const radians = (deg: number) => (deg * Math.PI) / 180;

/**
 * A spherical Mercator projection (the one web maps use) fitted to `bounds` inside a
 * `width` × `height` box with `padding` pixels around, centred, keeping the aspect.
 */
export function fitMercator(bounds: MapBounds, width: number, height: number, padding = 8): Project {
  const x0 = radians(bounds.west);
  const x1 = radians(bounds.east);
  const y0 = mercatorY(bounds.north);
  const y1 = mercatorY(bounds.south);
  const scale = Math.min((width - 2 * padding) / (x1 - x0), (height - 2 * padding) / (y0 - y1));
  const offsetX = (width - scale * (x1 - x0)) / 2;
  const offsetY = (height - scale * (y0 - y1)) / 2;
  return ([lon = 0, lat = 0]) => [offsetX + scale * (radians(lon) - x0), offsetY + scale * (y0 - mercatorY(lat))];
}

const round = (value: number) => Math.round(value * 10) / 10;
const ringPath = (ring: readonly Position[], project: Project, close: boolean) =>
  ring.map((position, i) => `${i === 0 ? 'M' : 'L'}${project(position).map(round).join(' ')}`).join('') + (close ? 'Z' : '');

/** The SVG path of a polygon or multipolygon (holes fill with even-odd). */
export function areaPath(geometry: AreaGeometry, project: Project): string {
  const polygons = geometry.type === 'Polygon' ? [geometry.coordinates] : geometry.coordinates;
  return polygons.flatMap((rings) => rings.map((ring) => ringPath(ring, project, true))).join('');
}

/** The SVG path of boundary lines, keeping only lines that reach into `bounds` (widened by `marginDeg`). */
export function linesPath(lines: MultiLineString, project: Project, bounds: MapBounds, marginDeg = 1): string {
  const inside = ([lon = 0, lat = 0]: Position) =>
    lon >= bounds.west - marginDeg && lon <= bounds.east + marginDeg && lat >= bounds.south - marginDeg && lat <= bounds.north + marginDeg;
  return lines.coordinates
    .filter((line) => line.some(inside))
    .map((line) => ringPath(line, project, false))
    .join('');
}
