import { describe, expect, it } from 'vitest';
import { colourFor, colourScales, legendTicks, scalePosition } from './map-colours';

describe('map colours', () => {
  it('when the value is at either end or beyond, returns the end colours', () => {
    const scale = colourScales.mlCape;
    expect(colourFor(0, scale)).toBe('#fbf4e4');
    expect(colourFor(4000, scale)).toBe('#7a1f3d');
    expect(colourFor(9000, scale)).toBe('#7a1f3d');
    expect(colourFor(-50, scale)).toBe('#fbf4e4');
  });

  it('when CIN grows more negative, moves toward the dark end', () => {
    expect(scalePosition(-150, colourScales.mlCin)).toBeCloseTo(0.5, 10);
    expect(colourFor(-300, colourScales.mlCin)).toBe('#2e3a4f');
  });

  it('when the value is missing, returns null so the point is drawn hollow', () => {
    expect(colourFor(null, colourScales.stp)).toBeNull();
    expect(colourFor(Number.NaN, colourScales.stp)).toBeNull();
  });

  it('when asked for five ticks, spaces them evenly from light to dark', () => {
    expect(legendTicks(colourScales.mlCin)).toEqual([0, -75, -150, -225, -300]);
  });
});
