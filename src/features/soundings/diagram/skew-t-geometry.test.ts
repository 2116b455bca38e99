import { describe, expect, it } from 'vitest';
import { pathThrough, skewT } from './skew-t-geometry';

// A frame chosen so the transform can be evaluated by hand: 900 px for 90 K (10 px/K),
// 600 px for one decade of pressure (1000 → 100 hPa), skew 1 (45°).
const handFrame = {
  left: 0,
  top: 0,
  width: 900,
  height: 600,
  pressureBottomHpa: 1000,
  pressureTopHpa: 100,
  temperatureLeftC: -40,
  temperatureRightC: 50,
  skew: 1,
};

describe('skewT', () => {
  it('places (316.23 hPa, −20 °C) at (500, 300), derived by hand from the transform definition', () => {
    // y = 600 · (ln 10^2.5 − ln 100)/(ln 1000 − ln 100) = 600 · 0.5 = 300;
    // x = (−20 − (−40)) · 10 + 1 · (600 − 300) = 200 + 300 = 500.
    const point = skewT(handFrame).toPoint(10 ** 2.5, -20);
    expect(point.y).toBeCloseTo(300, 9);
    expect(point.x).toBeCloseTo(500, 9);
  });

  it('puts 1000 hPa on the bottom edge and 100 hPa on the top edge', () => {
    const transform = skewT(handFrame);
    expect(transform.pressureToY(1000)).toBeCloseTo(600, 9);
    expect(transform.pressureToY(100)).toBeCloseTo(0, 9);
  });

  it('puts 1050 hPa and 100 hPa at the ends of the full-diagram axis', () => {
    const transform = skewT({ ...handFrame, top: 16, height: 560, pressureBottomHpa: 1050 });
    expect(transform.pressureToY(1050)).toBeCloseTo(576, 9);
    expect(transform.pressureToY(100)).toBeCloseTo(16, 9);
  });

  it('skews isotherms: 0 °C moves 600 px right from 1000 to 100 hPa with skew 1', () => {
    const transform = skewT(handFrame);
    expect(transform.toPoint(100, 0).x - transform.toPoint(1000, 0).x).toBeCloseTo(600, 9);
  });

  it('round-trips through the inverse', () => {
    const transform = skewT({ ...handFrame, left: 48, top: 12, skew: 0.8 });
    for (const [pressureHpa, temperatureC] of [
      [1013, 25],
      [850, 12.5],
      [500, -17],
      [250, -52],
      [120, -60],
    ] as const) {
      const back = transform.fromPoint(transform.toPoint(pressureHpa, temperatureC));
      expect(back.pressureHpa).toBeCloseTo(pressureHpa, 9);
      expect(back.temperatureC).toBeCloseTo(temperatureC, 9);
    }
  });
});

describe('pathThrough', () => {
  it('breaks the line at null points', () => {
    expect(pathThrough([{ x: 0, y: 0 }, { x: 1, y: 1 }, null, { x: 2, y: 2 }, { x: 3, y: 3 }])).toBe('M0.0,0.0L1.0,1.0M2.0,2.0L3.0,3.0');
  });
});
