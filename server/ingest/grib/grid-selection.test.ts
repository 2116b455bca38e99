import { describe, expect, it } from 'vitest';
import { selectGridPoints } from './grid-selection';

/** A regular grid printed row by row from the north-west corner, longitudes 0..360 as GRIB gives them. */
function grid(ni: number, nj: number, north: number, west360: number, step: number) {
  const latitudes = new Float64Array(ni * nj);
  const longitudes = new Float64Array(ni * nj);
  for (let j = 0; j < nj; j++) {
    for (let i = 0; i < ni; i++) {
      latitudes[j * ni + i] = north - j * step;
      longitudes[j * ni + i] = west360 + i * step;
    }
  }
  return { latitudes, longitudes };
}

const region = { west: -96.5, south: 35.5, east: -87.5, north: 41.5 };

describe('selectGridPoints', () => {
  it('When a grid overlaps the region, then only inside points are kept, numbered row × nx + column of the crop, with longitudes in −180..180', () => {
    // 260 °E = 100 °W; columns at 100..95 °W, rows 42..38 °N.
    const { latitudes, longitudes } = grid(6, 5, 42, 260, 1);
    const chosen = selectGridPoints(latitudes, longitudes, 6, region);
    if (!chosen.ok) throw new Error(chosen.error.reason);
    expect([chosen.value.nx, chosen.value.ny, chosen.value.stride]).toEqual([2, 4, 1]);
    expect(Array.from(chosen.value.pointIndex)).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    expect(Array.from(chosen.value.longitude).slice(0, 2)).toEqual([-96, -95]);
    expect(Array.from(chosen.value.latitude).filter((_, i) => i % 2 === 0)).toEqual([41, 40, 39, 38]);
    // Source point of row 1 (41 °N), column 4 (96 °W) is slot 0.
    expect(chosen.value.slotOfPoint[1 * 6 + 4]).toBe(0);
    expect(chosen.value.slotOfPoint[0]).toBe(-1);
  });

  it('When thinning to 50 km on a 0.1° grid, then the stride follows the shorter (east–west) spacing', () => {
    const { latitudes, longitudes } = grid(40, 40, 40, 265, 0.1);
    const chosen = selectGridPoints(latitudes, longitudes, 40, region, 50);
    if (!chosen.ok) throw new Error(chosen.error.reason);
    // 0.1° of longitude at 38 °N is about 8.8 km, the shorter spacing: round(50 / 8.8) = 6.
    expect(chosen.value.stride).toBe(6);
    expect(chosen.value.latitude[1]).toBeCloseTo(40, 6);
    expect(chosen.value.longitude[1]! - chosen.value.longitude[0]!).toBeCloseTo(0.6, 6);
  });

  it('When no point lies in the region, then the reason names the region', () => {
    const { latitudes, longitudes } = grid(3, 3, 10, 0, 1);
    const chosen = selectGridPoints(latitudes, longitudes, 3, region);
    expect(chosen.ok).toBe(false);
    if (!chosen.ok) expect(chosen.error.reason).toContain('No grid point lies inside the office region');
  });

  it('When the point count is not whole rows, or thinning is out of range, then the reason says which', () => {
    const { latitudes, longitudes } = grid(3, 3, 40, 266, 1);
    expect(selectGridPoints(latitudes, longitudes, 4, region)).toEqual({ ok: false, error: { reason: 'The grid has 9 points, which is not a whole number of rows of 4.' } });
    expect(selectGridPoints(latitudes, longitudes, 3, region, 600)).toEqual({ ok: false, error: { reason: 'thinningKm must be between 0 and 500 km.' } });
  });
});
