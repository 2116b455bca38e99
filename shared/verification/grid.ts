import { geoAzimuthalEqualArea, type GeoProjection } from 'd3-geo';
import type { Region } from '../contracts/office';

/** Mean radius of the Earth in kilometres (IUGG mean radius R1 = 6371.0088 km; common practice to round to 6371). */
export const EARTH_RADIUS_KM = 6371;

/** One cell of the verification grid: its centre in the plane (km) and on the globe (degrees). */
export interface GridCell {
  xKm: number;
  yKm: number;
  lon: number;
  lat: number;
}

/**
 * A regular grid of square cells on a Lambert azimuthal equal-area projection centred on the
 * office region, so every cell covers the same area on the ground. Cells whose centre lies outside
 * the region's longitude/latitude box are left out.
 */
export interface VerificationGrid {
  spacingKm: number;
  columns: number;
  rows: number;
  /** Column-major is never used: index = row * columns + column; `null` where the centre is outside the region. */
  cells: (GridCell | null)[];
  /** Plane coordinates (km) of a point. */
  project(lon: number, lat: number): [number, number];
  originXKm: number;
  originYKm: number;
}

function projectionFor(region: Region): GeoProjection {
  const lon0 = (region.west + region.east) / 2;
  const lat0 = (region.south + region.north) / 2;
  // d3's unit-sphere projections scaled by the Earth radius give kilometres.
  return geoAzimuthalEqualArea().rotate([-lon0, -lat0]).scale(EARTH_RADIUS_KM).translate([0, 0]).precision(0);
}

/**
 * Builds the equal-area grid over `region` with square cells `spacingKm` wide.
 * The plane box is found by projecting points along the region's edges.
 */
export function buildVerificationGrid(region: Region, spacingKm: number): VerificationGrid {
  if (!(spacingKm > 0)) throw new RangeError('spacingKm must be positive');
  const projection = projectionFor(region);
  const project = (lon: number, lat: number): [number, number] => {
    const xy = projection([lon, lat]);
    if (!xy) throw new RangeError(`point ${lon},${lat} cannot be projected`);
    return [xy[0], xy[1]];
  };
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  const steps = 32;
  for (let i = 0; i <= steps; i++) {
    const lon = region.west + ((region.east - region.west) * i) / steps;
    const lat = region.south + ((region.north - region.south) * i) / steps;
    for (const [x, y] of [project(lon, region.south), project(lon, region.north), project(region.west, lat), project(region.east, lat)]) {
      minX = Math.min(minX, x);
      maxX = Math.max(maxX, x);
      minY = Math.min(minY, y);
      maxY = Math.max(maxY, y);
    }
  }
  const columns = Math.max(1, Math.ceil((maxX - minX) / spacingKm));
  const rows = Math.max(1, Math.ceil((maxY - minY) / spacingKm));
  const cells: (GridCell | null)[] = new Array<GridCell | null>(columns * rows).fill(null);
  for (let row = 0; row < rows; row++) {
    for (let column = 0; column < columns; column++) {
      const xKm = minX + (column + 0.5) * spacingKm;
      const yKm = minY + (row + 0.5) * spacingKm;
      const lonLat = projection.invert?.([xKm, yKm]);
      if (!lonLat) continue;
      const [lon, lat] = lonLat;
      if (lon < region.west || lon > region.east || lat < region.south || lat > region.north) continue;
      cells[row * columns + column] = { xKm, yKm, lon, lat };
    }
  }
  return { spacingKm, columns, rows, cells, project, originXKm: minX, originYKm: minY };
}

/** Indices of the grid cells whose centre lies within `radiusKm` of the plane point (x, y). */
export function cellsWithinRadius(grid: VerificationGrid, xKm: number, yKm: number, radiusKm: number): number[] {
  const found: number[] = [];
  const c0 = Math.max(0, Math.floor((xKm - radiusKm - grid.originXKm) / grid.spacingKm));
  const c1 = Math.min(grid.columns - 1, Math.floor((xKm + radiusKm - grid.originXKm) / grid.spacingKm));
  const r0 = Math.max(0, Math.floor((yKm - radiusKm - grid.originYKm) / grid.spacingKm));
  const r1 = Math.min(grid.rows - 1, Math.floor((yKm + radiusKm - grid.originYKm) / grid.spacingKm));
  const r2 = radiusKm * radiusKm;
  for (let row = r0; row <= r1; row++) {
    for (let column = c0; column <= c1; column++) {
      const index = row * grid.columns + column;
      const cell = grid.cells[index];
      if (!cell) continue;
      const dx = cell.xKm - xKm;
      const dy = cell.yKm - yKm;
      if (dx * dx + dy * dy <= r2) found.push(index);
    }
  }
  return found;
}
