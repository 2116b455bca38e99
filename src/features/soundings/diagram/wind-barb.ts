import type { Point } from './skew-t-geometry';

/**
 * WMO wind barbs (common practice, WMO No. 485 plotting convention): speed rounded to the
 * nearest 5 kt; a pennant for each 50 kt, a full barb for each 10 kt, a half barb for 5 kt;
 * the staff points toward the direction the wind blows from; barbs on the right of the staff
 * looking from the station along it (northern hemisphere); calm (< 2.5 kt) is a circle.
 */
export interface BarbParts {
  pennants: number;
  fullBarbs: number;
  halfBarbs: number;
  /** The speed the symbol shows, kt (a multiple of 5). */
  roundedKt: number;
}

/** Split a speed in knots into pennants, full barbs and half barbs. */
export function decomposeBarb(speedKt: number): BarbParts {
  const roundedKt = Math.max(0, Math.round(speedKt / 5) * 5);
  const pennants = Math.floor(roundedKt / 50);
  const fullBarbs = Math.floor((roundedKt % 50) / 10);
  const halfBarbs = roundedKt % 10 === 5 ? 1 : 0;
  return { pennants, fullBarbs, halfBarbs, roundedKt };
}

export interface BarbShape {
  calm: boolean;
  /** Staff and barbs (stroke). */
  linePath: string;
  /** Pennants (fill). */
  pennantPath: string;
}

const f = (n: number): string => n.toFixed(1);

/**
 * SVG geometry of a barb drawn at `origin`.
 * @param directionDeg - direction the wind blows from, degrees clockwise from north
 * @param speedKt - speed, kt
 * @param length - staff length, px
 */
export function barbShape(origin: Point, directionDeg: number, speedKt: number, length = 26): BarbShape {
  const parts = decomposeBarb(speedKt);
  if (parts.roundedKt === 0) return { calm: true, linePath: '', pennantPath: '' };
  const radians = (directionDeg * Math.PI) / 180;
  // Along the staff (toward where the wind comes from), in screen coordinates (y down).
  const along = { x: Math.sin(radians), y: -Math.cos(radians) };
  // The right-hand side looking along the staff.
  const right = { x: -along.y, y: along.x };
  const at = (distance: number): Point => ({ x: origin.x + along.x * distance, y: origin.y + along.y * distance });
  const feather = length * 0.42;
  const spacing = length * 0.15;
  const tip = at(length);
  let linePath = `M${f(origin.x)},${f(origin.y)}L${f(tip.x)},${f(tip.y)}`;
  let pennantPath = '';
  let position = length;
  for (let i = 0; i < parts.pennants; i++) {
    const start = at(position);
    const end = at(position - spacing * 1.6);
    const outer = { x: start.x + right.x * feather, y: start.y + right.y * feather };
    pennantPath += `M${f(start.x)},${f(start.y)}L${f(outer.x)},${f(outer.y)}L${f(end.x)},${f(end.y)}Z`;
    position -= spacing * 1.6 + (i === parts.pennants - 1 ? spacing * 0.6 : 0);
  }
  const drawBarb = (scale: number): void => {
    const base = at(position);
    const endX = base.x + (right.x * feather + along.x * feather * 0.45) * scale;
    const endY = base.y + (right.y * feather + along.y * feather * 0.45) * scale;
    linePath += `M${f(base.x)},${f(base.y)}L${f(endX)},${f(endY)}`;
    position -= spacing;
  };
  for (let i = 0; i < parts.fullBarbs; i++) drawBarb(1);
  if (parts.halfBarbs) {
    // A lone half barb sits a little in from the tip so it is not mistaken for a full one.
    if (parts.pennants === 0 && parts.fullBarbs === 0) position -= spacing;
    drawBarb(0.5);
  }
  return { calm: false, linePath, pennantPath };
}
