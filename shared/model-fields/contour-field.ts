import { contours } from 'd3-contour';
import { rewind } from '@turf/turf';
import type { Feature, FeatureCollection, MultiPolygon, Position } from 'geojson';
import { fieldBands, type FieldBand, type FieldDefinition } from './field-bands';

/** Grid points contoured at full resolution; a larger grid is thinned by 2, 4 … first. */
export const MAX_FIELD_GRID_POINTS = 250_000;
/** Vertices in one answer; above this the grid is contoured again at half the resolution. */
export const MAX_FIELD_VERTICES = 60_000;
/** Decimal places of degrees kept in the answer (about 100 m). */
export const FIELD_COORDINATE_DECIMALS = 3;

/**
 * A gridded field as stored: `nx` × `ny` points, point `row × nx + column`, each with its
 * position (any grid: regular latitude–longitude or Lambert conformal) and a value (NaN when
 * the grid has no sounding there or the figure is missing).
 */
export interface GridField {
  nx: number;
  ny: number;
  values: ArrayLike<number>;
  latitude: ArrayLike<number>;
  longitude: ArrayLike<number>;
}

export interface BandProperties {
  band: number;
  from: number;
  to: number | null;
  colour: string;
}

export interface FieldContours {
  bands: FieldBand[];
  /**
   * One MultiPolygon per band that occurs: the area at or beyond the band's break (≥ for
   * 'above', ≤ for 'below'). Drawn in order, each band over the previous one, they show the
   * filled bands; the last feature drawn on any spot tells its band.
   */
  features: FeatureCollection<MultiPolygon, BandProperties>;
  /** 1 at full resolution; 2, 4 … when the grid was thinned to keep the answer small. */
  stride: number;
  vertexCount: number;
}

/**
 * Filled contour bands of a gridded field. Contours are traced in grid index space with
 * d3-contour's marching squares (so a Lambert conformal grid needs no reprojection), then each
 * vertex is placed on the map by bilinear interpolation between the latitudes and longitudes of
 * the four surrounding grid points. Rings follow RFC 7946 winding; coordinates are rounded.
 */
export function contourField(field: GridField, definition: FieldDefinition): FieldContours {
  const bands = fieldBands(definition);
  let stride = 1;
  while ((field.nx / stride) * (field.ny / stride) > MAX_FIELD_GRID_POINTS) stride *= 2;
  for (;;) {
    const grid = stride === 1 ? field : thin(field, stride);
    const features = contourBands(grid, definition, bands);
    const vertexCount = countVertices(features);
    if (vertexCount <= MAX_FIELD_VERTICES || grid.nx < 4 || grid.ny < 4) return { bands, features: { type: 'FeatureCollection', features }, stride, vertexCount };
    stride *= 2;
  }
}

function contourBands(grid: GridField, definition: FieldDefinition, bands: FieldBand[]): Feature<MultiPolygon, BandProperties>[] {
  const { nx, ny } = grid;
  const flip = definition.sense === 'below' ? -1 : 1;
  const values = new Float64Array(nx * ny);
  for (let i = 0; i < values.length; i++) {
    const v = Number(grid.values[i]);
    values[i] = Number.isFinite(v) ? v * flip : NaN;
  }
  const positions = completePositions(grid);
  const generator = contours()
    .size([nx, ny])
    .thresholds(bands.map((b) => b.from * flip));
  const features: Feature<MultiPolygon, BandProperties>[] = [];
  generator(Array.from(values)).forEach((contour, index) => {
    const band = bands[index];
    if (!band || contour.coordinates.length === 0) return;
    const coordinates = contour.coordinates.flatMap((polygon) => {
      const rings = polygon.map((ring) => placeRing(ring, nx, ny, positions)).filter((ring) => ring.length >= 4);
      const [outer, ...holes] = rings;
      return outer ? [[outer, ...holes]] : [];
    });
    if (coordinates.length === 0) return;
    const geometry = rewind({ type: 'MultiPolygon', coordinates }) as MultiPolygon;
    features.push({ type: 'Feature', geometry, properties: { band: band.index, from: band.from, to: band.to, colour: band.colour } });
  });
  return features;
}

/** Every `stride`-th point in both directions. */
function thin(field: GridField, stride: number): GridField {
  const nx = Math.ceil(field.nx / stride);
  const ny = Math.ceil(field.ny / stride);
  const values = new Float64Array(nx * ny);
  const latitude = new Float64Array(nx * ny);
  const longitude = new Float64Array(nx * ny);
  for (let row = 0; row < ny; row++) {
    for (let column = 0; column < nx; column++) {
      const from = row * stride * field.nx + column * stride;
      const to = row * nx + column;
      values[to] = Number(field.values[from]);
      latitude[to] = Number(field.latitude[from]);
      longitude[to] = Number(field.longitude[from]);
    }
  }
  return { nx, ny, values, latitude, longitude };
}

interface Positions {
  latitude: Float64Array;
  longitude: Float64Array;
}

/**
 * Positions of every grid point. Points the grid has no sounding for (cropped away) get a
 * position extrapolated along their row (or column) from the two nearest known points, so that
 * contour vertices near them still land in the right place.
 */
function completePositions(grid: GridField): Positions {
  const { nx, ny } = grid;
  const latitude = Float64Array.from({ length: nx * ny }, (_, i) => Number(grid.latitude[i]));
  const longitude = Float64Array.from({ length: nx * ny }, (_, i) => Number(grid.longitude[i]));
  const fillLine = (count: number, indexAt: (k: number) => number) => {
    const known: number[] = [];
    for (let k = 0; k < count; k++) if (Number.isFinite(latitude[indexAt(k)]) && Number.isFinite(longitude[indexAt(k)])) known.push(k);
    if (known.length < 2 || known.length === count) return;
    let next = 0;
    for (let k = 0; k < count; k++) {
      const i = indexAt(k);
      if (Number.isFinite(latitude[i])) continue;
      while (next < known.length - 2 && (known[next + 1] ?? 0) < k) next++;
      const a = known[next] ?? 0;
      const b = known[next + 1] ?? 1;
      const t = (k - a) / (b - a);
      latitude[i] = (latitude[indexAt(a)] ?? 0) + t * ((latitude[indexAt(b)] ?? 0) - (latitude[indexAt(a)] ?? 0));
      longitude[i] = (longitude[indexAt(a)] ?? 0) + t * ((longitude[indexAt(b)] ?? 0) - (longitude[indexAt(a)] ?? 0));
    }
  };
  for (let row = 0; row < ny; row++) fillLine(nx, (column) => row * nx + column);
  for (let column = 0; column < nx; column++) fillLine(ny, (row) => row * nx + column);
  return { latitude, longitude };
}

const scale = 10 ** FIELD_COORDINATE_DECIMALS;
const round = (value: number) => Math.round(value * scale) / scale;

/** A ring in grid index space (d3-contour: point (c, r) sits at (c + 0.5, r + 0.5)) placed on the map. */
function placeRing(ring: Position[], nx: number, ny: number, positions: Positions): Position[] {
  const placed: Position[] = [];
  for (const [x = 0, y = 0] of ring) {
    const position = placeVertex(x - 0.5, y - 0.5, nx, ny, positions);
    if (!position) continue;
    const last = placed[placed.length - 1];
    if (last && last[0] === position[0] && last[1] === position[1]) continue;
    placed.push(position);
  }
  const first = placed[0];
  const last = placed[placed.length - 1];
  if (first && last && (first[0] !== last[0] || first[1] !== last[1])) placed.push([first[0] ?? 0, first[1] ?? 0]);
  return placed;
}

/** Bilinear interpolation of the grid points' positions at fractional (column, row); unknown corners are left out. */
export function placeVertex(column: number, row: number, nx: number, ny: number, positions: Positions): [number, number] | null {
  const c = Math.min(Math.max(column, 0), nx - 1);
  const r = Math.min(Math.max(row, 0), ny - 1);
  const c0 = Math.min(Math.floor(c), Math.max(nx - 2, 0));
  const r0 = Math.min(Math.floor(r), Math.max(ny - 2, 0));
  const fc = nx === 1 ? 0 : c - c0;
  const fr = ny === 1 ? 0 : r - r0;
  let weight = 0;
  let lat = 0;
  let lon = 0;
  for (const [dc, dr, w] of [
    [0, 0, (1 - fc) * (1 - fr)],
    [1, 0, fc * (1 - fr)],
    [0, 1, (1 - fc) * fr],
    [1, 1, fc * fr],
  ] as const) {
    if (w === 0 || c0 + dc >= nx || r0 + dr >= ny) continue;
    const i = (r0 + dr) * nx + c0 + dc;
    const pointLat = positions.latitude[i];
    const pointLon = positions.longitude[i];
    if (pointLat === undefined || pointLon === undefined || !Number.isFinite(pointLat) || !Number.isFinite(pointLon)) continue;
    weight += w;
    lat += w * pointLat;
    lon += w * pointLon;
  }
  if (weight === 0) return null;
  return [round(lon / weight), round(lat / weight)];
}

function countVertices(features: Feature<MultiPolygon, BandProperties>[]): number {
  let count = 0;
  for (const feature of features) for (const polygon of feature.geometry.coordinates) for (const ring of polygon) count += ring.length;
  return count;
}
