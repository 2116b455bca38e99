import type { ParcelTracePoint, SoundingLevel } from '../../../../shared/sounding';
import type { SkewTFrame } from './skew-t-geometry';

/** Size of the diagram's SVG coordinate system, px. */
export const DIAGRAM_VIEW = { width: 720, height: 620 } as const;
const PLOT = { left: 46, top: 12, width: 584, height: 572 } as const;

/** The full diagram: 1050 → 100 hPa, −40 … 50 °C along the bottom, isotherms at 45°. */
export const FULL_FRAME: SkewTFrame = {
  ...PLOT,
  pressureBottomHpa: 1050,
  pressureTopHpa: 100,
  temperatureLeftC: -40,
  temperatureRightC: 50,
  skew: 1,
};

/** How far an isotherm leans across the zoomed frame, K from bottom to top. */
const ZOOM_LEAN_K = 22;

/**
 * The zoomed diagram: the lowest 300 hPa above the surface, with a temperature range fitted to
 * the data in that layer (temperature, dewpoint and parcel traces) plus a margin.
 */
export function zoomedFrame(levels: readonly SoundingLevel[], traces: readonly (readonly ParcelTracePoint[])[]): SkewTFrame {
  const surface = levels[0]?.pressureHpa ?? 1000;
  const bottom = Math.min(1050, surface + 12);
  const top = surface - 300;
  const logSpan = Math.log(bottom) - Math.log(top);
  // Temperature shifted back along the isotherm lean to the bottom edge.
  const atBottom = (pressureHpa: number, temperatureC: number): number =>
    temperatureC - ZOOM_LEAN_K * ((Math.log(bottom) - Math.log(pressureHpa)) / logSpan);
  const xs: number[] = [];
  for (const level of levels) {
    if (level.pressureHpa < top) break;
    xs.push(atBottom(level.pressureHpa, level.temperatureC));
    if (level.dewpointC !== null) xs.push(atBottom(level.pressureHpa, level.dewpointC));
  }
  for (const trace of traces) {
    for (const point of trace) if (point.pressureHpa >= top) xs.push(atBottom(point.pressureHpa, point.virtualTemperatureC));
  }
  const low = xs.length ? Math.min(...xs) : -10;
  const high = xs.length ? Math.max(...xs) : 30;
  const temperatureLeftC = Math.floor(low - 3);
  const temperatureRightC = Math.max(Math.ceil(high + 4), temperatureLeftC + 15);
  const pixelsPerKelvin = PLOT.width / (temperatureRightC - temperatureLeftC);
  return {
    ...PLOT,
    pressureBottomHpa: bottom,
    pressureTopHpa: top,
    temperatureLeftC,
    temperatureRightC,
    skew: (ZOOM_LEAN_K * pixelsPerKelvin) / PLOT.height,
  };
}

/** Isobars to draw and label inside a frame. */
export function isobarsFor(frame: SkewTFrame): number[] {
  const candidates =
    frame.pressureBottomHpa - frame.pressureTopHpa > 400
      ? [1050, 1000, 925, 850, 700, 600, 500, 400, 300, 250, 200, 150, 100]
      : Array.from({ length: 23 }, (_, i) => 1050 - i * 25);
  return candidates.filter((p) => p <= frame.pressureBottomHpa && p >= frame.pressureTopHpa);
}
