import type { MapFigureKey } from './sounding-figures';

/**
 * How the map colours soundings: each parameter has a domain in SI units (values outside it take
 * the end colour) and a sequential ramp, light for weak and dark for strong. Our own ramps:
 * instability warm, moisture teal, wind indigo, the cap (CIN) slate.
 */
export interface ColourScale {
  /** Value at the light end and at the dark end (SI); `min > max` for CIN, where stronger is more negative. */
  lightAt: number;
  darkAt: number;
  stops: readonly string[];
}

const warm = ['#fbf4e4', '#f3d08a', '#e8964a', '#cc4a2a', '#7a1f3d'] as const;
const moisture = ['#f2f4e6', '#b8dcc2', '#5fb3a3', '#1f7f86', '#0d4a63'] as const;
const wind = ['#f1f0f7', '#c3c4e6', '#8b8fd0', '#5a57b0', '#33226e'] as const;
const cap = ['#f2f4f7', '#c9d1dc', '#93a1b5', '#5d6e87', '#2e3a4f'] as const;

export const colourScales: Record<MapFigureKey, ColourScale> = {
  mlCape: { lightAt: 0, darkAt: 4000, stops: warm },
  muCape: { lightAt: 0, darkAt: 5000, stops: warm },
  mlCin: { lightAt: 0, darkAt: -300, stops: cap },
  precipitableWaterMm: { lightAt: 10, darkAt: 60, stops: moisture },
  bulkShear0to6kmMs: { lightAt: 0, darkAt: 35, stops: wind },
  srh0to1km: { lightAt: 0, darkAt: 400, stops: wind },
  stp: { lightAt: 0, darkAt: 6, stops: warm },
  surfaceDewpointC: { lightAt: 0, darkAt: 25, stops: moisture },
  // Hazard ingredients: our own ends, where the values usually discussed lie (common practice ranges).
  srh0to500m: { lightAt: 0, darkAt: 300, stops: wind },
  criticalAngleDeg: { lightAt: 0, darkAt: 180, stops: cap },
  mlLclLfcGapM: { lightAt: 0, darkAt: 3000, stops: cap },
  lapseRate0to3kmCKm: { lightAt: 4, darkAt: 9.5, stops: warm },
  lapseRate3to6kmCKm: { lightAt: 4, darkAt: 9, stops: warm },
  lapseRate850to500CKm: { lightAt: 4, darkAt: 9, stops: warm },
  lapseRate700to500CKm: { lightAt: 4, darkAt: 9, stops: warm },
  muCapeHailZone: { lightAt: 0, darkAt: 1500, stops: warm },
  freezingLevelM: { lightAt: 1000, darkAt: 5000, stops: cap },
  effectiveBulkShearMs: { lightAt: 0, darkAt: 35, stops: wind },
  bulkShear0to8kmMs: { lightAt: 0, darkAt: 45, stops: wind },
  dcape: { lightAt: 0, darkAt: 1500, stops: warm },
  meanWind0to6kmMs: { lightAt: 0, darkAt: 30, stops: wind },
  corfidiUpwindMs: { lightAt: 0, darkAt: 30, stops: wind },
  corfidiDownwindMs: { lightAt: 0, darkAt: 40, stops: wind },
  warmCloudDepthM: { lightAt: 1000, darkAt: 4500, stops: moisture },
};

function channels(hex: string): [number, number, number] {
  const value = Number.parseInt(hex.slice(1), 16);
  return [(value >> 16) & 255, (value >> 8) & 255, value & 255];
}

function toHex([r, g, b]: [number, number, number]): string {
  return `#${[r, g, b].map((c) => Math.round(c).toString(16).padStart(2, '0')).join('')}`;
}

/** The fraction 0..1 of the way from the light end to the dark end, clamped. */
export function scalePosition(value: number, scale: ColourScale): number {
  const t = (value - scale.lightAt) / (scale.darkAt - scale.lightAt);
  return Math.min(1, Math.max(0, t));
}

/** Colour for a value, interpolated linearly in RGB between the ramp's stops; null stays null. */
export function colourFor(value: number | null, scale: ColourScale): string | null {
  if (value === null || !Number.isFinite(value)) return null;
  const segments = scale.stops.length - 1;
  const position = scalePosition(value, scale) * segments;
  const index = Math.min(segments - 1, Math.floor(position));
  const from = scale.stops[index];
  const to = scale.stops[index + 1];
  if (from === undefined || to === undefined) return scale.stops[0] ?? null;
  const t = position - index;
  const a = channels(from);
  const b = channels(to);
  return toHex([a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t, a[2] + (b[2] - a[2]) * t]);
}

/** Evenly spaced legend ticks from the light end to the dark end, in SI. */
export function legendTicks(scale: ColourScale, count = 5): number[] {
  return Array.from({ length: count }, (_, i) => scale.lightAt + ((scale.darkAt - scale.lightAt) * i) / (count - 1));
}
