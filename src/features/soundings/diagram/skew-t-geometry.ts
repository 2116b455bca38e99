/**
 * The skew-T log-p transform: where a (pressure, temperature) pair sits on the diagram, and back.
 *
 * Definition (pixels, SVG y grows downward):
 *   y(p)    = top + height · (ln p − ln p_top) / (ln p_bottom − ln p_top)
 *   x(p, T) = left + (T − T_left) · width / (T_right − T_left) + skew · (top + height − y(p))
 * T_left and T_right are the temperatures at the left and right edges of the bottom axis;
 * `skew` is how many pixels an isotherm moves right per pixel it rises (1 → 45°).
 * Pure: no DOM, no React.
 */
export interface SkewTFrame {
  /** Plot area in SVG pixels. */
  left: number;
  top: number;
  width: number;
  height: number;
  /** Pressure at the bottom edge, hPa (e.g. 1050). */
  pressureBottomHpa: number;
  /** Pressure at the top edge, hPa (e.g. 100). */
  pressureTopHpa: number;
  /** Temperatures at the left and right ends of the bottom edge, °C. */
  temperatureLeftC: number;
  temperatureRightC: number;
  /** Horizontal pixels per vertical pixel of rise along an isotherm. */
  skew: number;
}

export interface Point {
  x: number;
  y: number;
}

export interface SkewT {
  frame: SkewTFrame;
  /** y of a pressure, px. */
  pressureToY: (pressureHpa: number) => number;
  /** Pressure at a y, hPa. */
  yToPressure: (y: number) => number;
  /** Diagram position of a pressure and temperature. */
  toPoint: (pressureHpa: number, temperatureC: number) => Point;
  /** Pressure and temperature at a diagram position (the inverse of toPoint). */
  fromPoint: (point: Point) => { pressureHpa: number; temperatureC: number };
}

/** Build the transform for a frame. */
export function skewT(frame: SkewTFrame): SkewT {
  const logTop = Math.log(frame.pressureTopHpa);
  const logSpan = Math.log(frame.pressureBottomHpa) - logTop;
  const pixelsPerKelvin = frame.width / (frame.temperatureRightC - frame.temperatureLeftC);
  const bottom = frame.top + frame.height;
  const pressureToY = (pressureHpa: number): number => frame.top + (frame.height * (Math.log(pressureHpa) - logTop)) / logSpan;
  const yToPressure = (y: number): number => Math.exp(logTop + ((y - frame.top) / frame.height) * logSpan);
  return {
    frame,
    pressureToY,
    yToPressure,
    toPoint: (pressureHpa, temperatureC) => {
      const y = pressureToY(pressureHpa);
      return { x: frame.left + (temperatureC - frame.temperatureLeftC) * pixelsPerKelvin + frame.skew * (bottom - y), y };
    },
    fromPoint: ({ x, y }) => ({
      pressureHpa: yToPressure(y),
      temperatureC: frame.temperatureLeftC + (x - frame.left - frame.skew * (bottom - y)) / pixelsPerKelvin,
    }),
  };
}

/** SVG path data through points; `null` entries break the line. */
export function pathThrough(points: readonly (Point | null)[]): string {
  let d = '';
  let pen = false;
  for (const point of points) {
    if (!point || !Number.isFinite(point.x) || !Number.isFinite(point.y)) {
      pen = false;
      continue;
    }
    d += `${pen ? 'L' : 'M'}${point.x.toFixed(1)},${point.y.toFixed(1)}`;
    pen = true;
  }
  return d;
}
