import type { Region } from '../../../shared/contracts/office';
import { err, ok, type Result } from '../../../shared/result';

/** Largest thinning spacing taken, km. */
export const MAX_THINNING_KM = 500;

/**
 * The grid points kept from a field: those inside the office region, optionally thinned to a
 * spacing. Points are numbered in the order ecCodes prints them (row by row, `ni` per row);
 * kept points get consecutive slots, and each slot a `pointIndex` = row × nx + column of the
 * cropped, thinned grid.
 */
export interface GridSelection {
  /** Columns and rows of the cropped, thinned grid. */
  nx: number;
  ny: number;
  /** Every kept step, in source columns/rows (1 = no thinning). */
  stride: number;
  /** Source point → slot (−1: not kept). */
  slotOfPoint: Int32Array;
  /** Per slot: point index in the cropped grid, latitude, longitude (−180..180). */
  pointIndex: Int32Array;
  latitude: Float64Array;
  longitude: Float64Array;
}

const EARTH_RADIUS_KM = 6371.0088;

/** Great-circle distance, km (haversine on a sphere of mean radius). */
function distanceKm(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const rad = Math.PI / 180;
  const dLat = (lat2 - lat1) * rad;
  const dLon = (lon2 - lon1) * rad;
  const a = Math.sin(dLat / 2) ** 2 + Math.cos(lat1 * rad) * Math.cos(lat2 * rad) * Math.sin(dLon / 2) ** 2;
  return 2 * EARTH_RADIUS_KM * Math.asin(Math.min(1, Math.sqrt(a)));
}

const normaliseLongitude = (lon: number) => ((((lon + 180) % 360) + 360) % 360) - 180;

/**
 * Choose the grid points inside `region`, thinned to about `thinningKm` apart.
 * @param latitudes - per source point, degrees north
 * @param longitudes - per source point, degrees east (0..360 or −180..180)
 * @param ni - points per row
 * @param thinningKm - wanted spacing, km (undefined or 0: every point)
 */
export function selectGridPoints(latitudes: Float64Array, longitudes: Float64Array, ni: number, region: Region, thinningKm?: number): Result<GridSelection, { reason: string }> {
  const count = latitudes.length;
  const nj = Math.floor(count / ni);
  if (ni < 1 || nj * ni !== count) return err({ reason: `The grid has ${count} points, which is not a whole number of rows of ${ni}.` });
  if (thinningKm !== undefined && (!(thinningKm >= 0) || thinningKm > MAX_THINNING_KM)) return err({ reason: `thinningKm must be between 0 and ${MAX_THINNING_KM} km.` });
  const inside = new Uint8Array(count);
  let colMin = Infinity, colMax = -Infinity, rowMin = Infinity, rowMax = -Infinity;
  for (let k = 0; k < count; k++) {
    const lat = latitudes[k]!;
    const lon = normaliseLongitude(longitudes[k]!);
    if (lat >= region.south && lat <= region.north && lon >= region.west && lon <= region.east) {
      inside[k] = 1;
      const col = k % ni, row = (k - col) / ni;
      colMin = Math.min(colMin, col); colMax = Math.max(colMax, col);
      rowMin = Math.min(rowMin, row); rowMax = Math.max(rowMax, row);
    }
  }
  if (!Number.isFinite(colMin)) {
    return err({ reason: `No grid point lies inside the office region (${region.south}..${region.north} °N, ${region.west}..${region.east} °E).` });
  }
  let stride = 1;
  if (thinningKm && thinningKm > 0) {
    const col = Math.min(Math.round((colMin + colMax) / 2), ni - 2);
    const row = Math.min(Math.round((rowMin + rowMax) / 2), nj - 2);
    const k = row * ni + Math.max(0, col);
    const across = ni > 1 ? distanceKm(latitudes[k]!, longitudes[k]!, latitudes[k + 1]!, longitudes[k + 1]!) : Infinity;
    const along = nj > 1 ? distanceKm(latitudes[k]!, longitudes[k]!, latitudes[k + ni]!, longitudes[k + ni]!) : Infinity;
    const spacing = Math.min(across, along);
    if (Number.isFinite(spacing) && spacing > 0) stride = Math.max(1, Math.round(thinningKm / spacing));
  }
  const nx = Math.floor((colMax - colMin) / stride) + 1;
  const ny = Math.floor((rowMax - rowMin) / stride) + 1;
  const slotOfPoint = new Int32Array(count).fill(-1);
  const pointIndex: number[] = [];
  const latitude: number[] = [];
  const longitude: number[] = [];
  for (let r = 0; r < ny; r++) {
    for (let c = 0; c < nx; c++) {
      const k = (rowMin + r * stride) * ni + colMin + c * stride;
      if (!inside[k]) continue;
      slotOfPoint[k] = pointIndex.length;
      pointIndex.push(r * nx + c);
      latitude.push(latitudes[k]!);
      longitude.push(normaliseLongitude(longitudes[k]!));
    }
  }
  return ok({ nx, ny, stride, slotOfPoint, pointIndex: Int32Array.from(pointIndex), latitude: Float64Array.from(latitude), longitude: Float64Array.from(longitude) });
}
