import Flatbush from 'flatbush';

type Position = readonly number[];

/** Sign of the turn a → b → c: positive counterclockwise, negative clockwise, 0 collinear. */
function orientation(a: Position, b: Position, c: Position): number {
  const value = ((b[0] ?? 0) - (a[0] ?? 0)) * ((c[1] ?? 0) - (a[1] ?? 0)) - ((b[1] ?? 0) - (a[1] ?? 0)) * ((c[0] ?? 0) - (a[0] ?? 0));
  return value > 0 ? 1 : value < 0 ? -1 : 0;
}

/** True when c, known to be collinear with a–b, lies within the segment's bounding box. */
function onSegment(a: Position, b: Position, c: Position): boolean {
  const [ax = 0, ay = 0] = a;
  const [bx = 0, by = 0] = b;
  const [cx = 0, cy = 0] = c;
  return Math.min(ax, bx) <= cx && cx <= Math.max(ax, bx) && Math.min(ay, by) <= cy && cy <= Math.max(ay, by);
}

/** True when segments p1–p2 and q1–q2 share at least one point (crossing, touching or overlapping). */
export function segmentsIntersect(p1: Position, p2: Position, q1: Position, q2: Position): boolean {
  const o1 = orientation(p1, p2, q1);
  const o2 = orientation(p1, p2, q2);
  const o3 = orientation(q1, q2, p1);
  const o4 = orientation(q1, q2, p2);
  if (o1 !== o2 && o3 !== o4) return true;
  return (o1 === 0 && onSegment(p1, p2, q1)) || (o2 === 0 && onSegment(p1, p2, q2)) || (o3 === 0 && onSegment(q1, q2, p1)) || (o4 === 0 && onSegment(q1, q2, p2));
}

const samePoint = (a: Position, b: Position) => a[0] === b[0] && a[1] === b[1];

/** The ring without repeated consecutive positions (a doubled click is not an edge). */
function withoutRepeats(ring: readonly Position[]): Position[] {
  const out: Position[] = [];
  for (const p of ring) {
    const last = out[out.length - 1];
    if (!last || last[0] !== p[0] || last[1] !== p[1]) out.push(p);
  }
  return out;
}

/**
 * True when any two edges of a polygon's rings meet anywhere other than the shared corner of
 * neighbouring edges of one ring: an outline that crosses or touches itself, or a hole that
 * touches or crosses another ring.
 *
 * Near-linear: every edge's bounding box goes into a packed Hilbert R-tree (Flatbush) and each
 * edge is tested only against the edges whose boxes overlap its own, so the work grows with
 * n log n plus the number of nearby edge pairs, not with n² as an all-pairs test does.
 */
export function ringsSelfIntersect(rings: readonly (readonly Position[])[]): boolean {
  const starts: Position[] = [];
  const ends: Position[] = [];
  const ringOf: number[] = [];
  const indexInRing: number[] = [];
  const ringLengths: number[] = [];
  rings.forEach((raw, r) => {
    const ring = withoutRepeats(raw);
    ringLengths.push(ring.length - 1);
    for (let i = 0; i < ring.length - 1; i++) {
      const a = ring[i];
      const b = ring[i + 1];
      if (!a || !b) continue;
      starts.push(a);
      ends.push(b);
      ringOf.push(r);
      indexInRing.push(i);
    }
  });
  const n = starts.length;
  if (n < 3) return false;
  const index = new Flatbush(n);
  for (let i = 0; i < n; i++) {
    const [ax = 0, ay = 0] = starts[i] ?? [];
    const [bx = 0, by = 0] = ends[i] ?? [];
    index.add(Math.min(ax, bx), Math.min(ay, by), Math.max(ax, bx), Math.max(ay, by));
  }
  index.finish();
  const neighbours = (i: number, j: number): boolean => {
    if (ringOf[i] !== ringOf[j]) return false;
    const edges = ringLengths[ringOf[i] ?? 0] ?? 0;
    const a = indexInRing[i] ?? 0;
    const b = indexInRing[j] ?? 0;
    const gap = Math.abs(a - b);
    return gap === 1 || gap === edges - 1;
  };
  for (let i = 0; i < n; i++) {
    const p1 = starts[i] ?? [];
    const p2 = ends[i] ?? [];
    const [ax = 0, ay = 0] = p1;
    const [bx = 0, by = 0] = p2;
    let found = false;
    index.search(Math.min(ax, bx), Math.min(ay, by), Math.max(ax, bx), Math.max(ay, by), (j) => {
      if (found || j <= i) return false;
      const q1 = starts[j] ?? [];
      const q2 = ends[j] ?? [];
      if (neighbours(i, j)) {
        // Neighbours share one corner; they only meet elsewhere when one folds back along the other.
        const shared = samePoint(p2, q1) || samePoint(p2, q2) ? p2 : p1;
        const a = shared === p2 ? p1 : p2;
        const b = samePoint(q1, shared) ? q2 : q1;
        if (orientation(shared, a, b) === 0 && (onSegment(shared, a, b) || onSegment(shared, b, a))) found = true;
        return found;
      }
      if (segmentsIntersect(p1, p2, q1, q2)) found = true;
      return found;
    });
    if (found) return true;
  }
  return false;
}
