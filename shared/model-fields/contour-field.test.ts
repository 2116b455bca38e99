import { booleanPointInPolygon, point } from '@turf/turf';
import { describe, expect, it } from 'vitest';
import { contourField, MAX_FIELD_VERTICES, type GridField } from './contour-field';
import { fieldDefinitions, fieldBands } from './field-bands';

/**
 * A skewed, rotated grid standing in for a Lambert conformal one: neither rows nor columns run
 * along parallels or meridians, and the grid is wider than tall so a transposed mapping shows.
 */
function skewedGrid(nx: number, ny: number, valueAt: (column: number, row: number) => number): GridField & { latitude: Float64Array; longitude: Float64Array } {
  const values = new Float64Array(nx * ny);
  const latitude = new Float64Array(nx * ny);
  const longitude = new Float64Array(nx * ny);
  for (let row = 0; row < ny; row++) {
    for (let column = 0; column < nx; column++) {
      const i = row * nx + column;
      longitude[i] = -100 + 0.1 * column + 0.04 * row;
      latitude[i] = 35 - 0.03 * column + 0.1 * row;
      values[i] = valueAt(column, row);
    }
  }
  return { nx, ny, values, latitude, longitude };
}

const distance = (c: number, r: number, c0: number, r0: number) => Math.hypot(c - c0, r - r0);

describe('contourField', () => {
  it('when the grid is skewed like a Lambert grid, then each grid point lies in the band of its value (a cell away from the edges)', () => {
    // A CAPE dome over column 22, row 8: 3000 J/kg at its centre, falling 250 J/kg per cell.
    const nx = 34;
    const ny = 18;
    const grid = skewedGrid(nx, ny, (c, r) => Math.max(0, 3000 - 250 * distance(c, r, 22, 8)));
    const result = contourField(grid, fieldDefinitions.mlCape);
    const band1000 = result.features.features.find((f) => f.properties.from === 1000);
    if (!band1000) throw new Error('no 1000 J/kg band');
    let checked = 0;
    for (let r = 0; r < ny; r++) {
      for (let c = 0; c < nx; c++) {
        const i = r * nx + c;
        const value = grid.values[i] ?? 0;
        if (Math.abs(value - 1000) < 250) continue; // within one cell of the 1000 J/kg line
        const inside = booleanPointInPolygon(point([grid.longitude[i] ?? 0, grid.latitude[i] ?? 0]), band1000.geometry);
        expect(inside, `point (${c}, ${r}) of ${Math.round(value)} J/kg`).toBe(value > 1000);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(500);
  });

  it('when the field is MLCIN, then bands grow toward stronger (more negative) inhibition', () => {
    const grid = skewedGrid(20, 20, (c) => -20 * c); // 0 at column 0 down to -380 at column 19
    const result = contourField(grid, fieldDefinitions.mlCin);
    const strong = result.features.features.find((f) => f.properties.from === -200);
    if (!strong) throw new Error('no -200 J/kg band');
    const east = 15 + 10 * 20; // column 15 (-300), row 10
    const west = 3 + 10 * 20; // column 3 (-60)
    expect(booleanPointInPolygon(point([grid.longitude[east] ?? 0, grid.latitude[east] ?? 0]), strong.geometry)).toBe(true);
    expect(booleanPointInPolygon(point([grid.longitude[west] ?? 0, grid.latitude[west] ?? 0]), strong.geometry)).toBe(false);
  });

  it('when the grid has no sounding at some points, then those points are never inside a band', () => {
    const grid = skewedGrid(12, 10, (c) => (c < 6 ? NaN : 5000));
    // Cropped corner: positions unknown where there is no sounding.
    for (let r = 0; r < 10; r++) {
      for (let c = 0; c < 6; c++) {
        grid.latitude[r * 12 + c] = NaN;
        grid.longitude[r * 12 + c] = NaN;
      }
    }
    const result = contourField(grid, fieldDefinitions.mlCape);
    const top = result.features.features.at(-1);
    if (!top) throw new Error('no band');
    expect(top.properties.from).toBe(4000);
    // Column 9, row 5 has 5000 J/kg; column 2 (no sounding) would sit at this position.
    expect(booleanPointInPolygon(point([-100 + 0.9 + 0.2, 35 - 0.27 + 0.5]), top.geometry)).toBe(true);
    expect(booleanPointInPolygon(point([-100 + 0.2 + 0.2, 35 - 0.06 + 0.5]), top.geometry)).toBe(false);
  });

  it('when a noisy field would give a huge answer, then the grid is thinned until the vertices fit the limit', () => {
    let seed = 11;
    const random = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const grid = skewedGrid(300, 300, () => random() * 5000);
    const result = contourField(grid, fieldDefinitions.mlCape);
    expect(result.stride).toBeGreaterThan(1);
    expect(result.vertexCount).toBeLessThanOrEqual(MAX_FIELD_VERTICES);
  });

  it('gives each band its lower break, the next break as its upper edge and its colour', () => {
    const bands = fieldBands(fieldDefinitions.precipitableWaterMm);
    expect(bands[0]).toEqual({ index: 0, from: 10, to: 15, colour: fieldDefinitions.precipitableWaterMm.colours[0] });
    expect(bands.at(-1)?.to).toBeNull();
  });
});
