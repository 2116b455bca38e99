import type { SoundingLevel, WindVector } from '../../../../shared/sounding';
import { HODOGRAPH_BANDS } from './palette';

/** A point of the hodograph: wind components (m s⁻¹) at a height above ground (m). */
export interface HodographPoint {
  heightM: number;
  u: number;
  v: number;
}

/**
 * The hodograph's segments, one per height band (0–1, 1–3, 3–6, 6–10 km AGL), with the wind
 * interpolated linearly in height at each band edge so the segments join. Pure.
 */
export function hodographSegments(levels: readonly SoundingLevel[]): { band: (typeof HODOGRAPH_BANDS)[number]; points: HodographPoint[] }[] {
  const ground = levels[0]?.heightM ?? 0;
  const winds: HodographPoint[] = levels.flatMap((level) =>
    level.uMs === null || level.vMs === null ? [] : [{ heightM: level.heightM - ground, u: level.uMs, v: level.vMs }],
  );
  const at = (heightM: number): HodographPoint | null => {
    for (let i = 1; i < winds.length; i++) {
      const a = winds[i - 1] as HodographPoint;
      const b = winds[i] as HodographPoint;
      if (a.heightM <= heightM && b.heightM >= heightM) {
        const f = b.heightM === a.heightM ? 0 : (heightM - a.heightM) / (b.heightM - a.heightM);
        return { heightM, u: a.u + f * (b.u - a.u), v: a.v + f * (b.v - a.v) };
      }
    }
    return null;
  };
  return HODOGRAPH_BANDS.map((band) => {
    const inside = winds.filter((w) => w.heightM > band.fromM && w.heightM < band.toM);
    const start = band.fromM === 0 ? (winds[0] ?? null) : at(band.fromM);
    const end = at(band.toM);
    const points = [...(start ? [start] : []), ...inside, ...(end ? [end] : [])];
    return { band, points };
  }).filter((segment) => segment.points.length >= 2);
}

/** Ring spacing and count for a largest speed, in the display unit. */
export function hodographRings(maxSpeedDisplay: number): { step: number; count: number } {
  const step = maxSpeedDisplay > 80 ? 20 : maxSpeedDisplay > 30 ? 10 : 5;
  return { step, count: Math.max(2, Math.ceil(maxSpeedDisplay / step)) };
}

export type { WindVector };
