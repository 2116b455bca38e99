import type { AreaGeometry } from '../../../../shared/contracts/outlooks';
import { areaKm2, areaOutsideKm2, unionOf } from '../../../../shared/geometry/area-checks';

/** An area on either side of the comparison. Ids may differ between sides (an amendment copies areas). */
export interface DiffArea {
  id: string;
  levelKey: string;
  geometry: AreaGeometry;
  label?: string | undefined;
}

export interface LevelChange {
  beforeId: string;
  afterId: string;
  fromLevelKey: string;
  toLevelKey: string;
  label: string;
}

export interface LevelAreaChange {
  levelKey: string;
  beforeKm2: number;
  afterKm2: number;
  /** Ground newly covered by this level. */
  gainedKm2: number;
  /** Ground this level no longer covers. */
  lostKm2: number;
}

export interface OutlookDiff {
  added: DiffArea[];
  removed: DiffArea[];
  levelChanges: LevelChange[];
  perLevel: LevelAreaChange[];
  /** True when nothing changed beyond rounding (under 1 km² per level). */
  unchanged: boolean;
}

/**
 * Two areas are "the same area" when they share an id, or when their overlap is at least this
 * share of their union (intersection over union). Union, not the smaller area: a small core
 * nested inside a large area must not be mistaken for it.
 */
const SAME_AREA_OVERLAP = 0.3;

function overlapShare(a: AreaGeometry, b: AreaGeometry): number {
  const sizeA = areaKm2(a);
  const sizeB = areaKm2(b);
  const overlap = sizeA - areaOutsideKm2(a, b);
  const union = sizeA + sizeB - overlap;
  return union > 0 ? overlap / union : 0;
}

/**
 * Pairs areas across the two sides: first by id, then (for areas an amendment copied under new
 * ids) greedily by the largest overlap (intersection over union, same level first on ties). Unpaired areas were added
 * or removed.
 */
function pairAreas(before: readonly DiffArea[], after: readonly DiffArea[]): { pairs: [DiffArea, DiffArea][]; added: DiffArea[]; removed: DiffArea[] } {
  const pairs: [DiffArea, DiffArea][] = [];
  const afterLeft = new Map(after.map((a) => [a.id, a]));
  const beforeLeft: DiffArea[] = [];
  for (const b of before) {
    const same = afterLeft.get(b.id);
    if (same) {
      pairs.push([b, same]);
      afterLeft.delete(b.id);
    } else beforeLeft.push(b);
  }
  const candidates: { b: DiffArea; a: DiffArea; share: number }[] = [];
  for (const b of beforeLeft)
    for (const a of afterLeft.values()) {
      const share = overlapShare(b.geometry, a.geometry);
      if (share > SAME_AREA_OVERLAP) candidates.push({ b, a, share });
    }
  const sameLevel = (c: { b: DiffArea; a: DiffArea }) => (c.b.levelKey === c.a.levelKey ? 1 : 0);
  candidates.sort((x, y) => y.share - x.share || sameLevel(y) - sameLevel(x));
  const usedBefore = new Set<string>();
  for (const c of candidates) {
    if (usedBefore.has(c.b.id) || !afterLeft.has(c.a.id)) continue;
    pairs.push([c.b, c.a]);
    usedBefore.add(c.b.id);
    afterLeft.delete(c.a.id);
  }
  return { pairs, added: [...afterLeft.values()], removed: beforeLeft.filter((b) => !usedBefore.has(b.id)) };
}

/**
 * What changed between two versions of an outlook's risk areas: areas added and removed, areas
 * whose level changed, and for each level the ground gained and lost (km², from the union of the
 * level's areas on each side, so overlapping areas are not counted twice). Levels follow the
 * ladder order, then any level the ladder does not know.
 */
export function diffOutlookAreas(before: readonly DiffArea[], after: readonly DiffArea[], ladderKeys: readonly string[]): OutlookDiff {
  const { pairs, added, removed } = pairAreas(before, after);
  const levelChanges: LevelChange[] = pairs
    .filter(([b, a]) => b.levelKey !== a.levelKey)
    .map(([b, a]) => ({ beforeId: b.id, afterId: a.id, fromLevelKey: b.levelKey, toLevelKey: a.levelKey, label: a.label || b.label || '' }));

  const keys = [...new Set([...before, ...after].map((a) => a.levelKey))].sort((x, y) => {
    const ix = ladderKeys.indexOf(x);
    const iy = ladderKeys.indexOf(y);
    return (ix === -1 ? Infinity : ix) - (iy === -1 ? Infinity : iy);
  });
  const perLevel = keys.map((levelKey): LevelAreaChange => {
    const beforeUnion = unionOf(before.filter((a) => a.levelKey === levelKey).map((a) => a.geometry));
    const afterUnion = unionOf(after.filter((a) => a.levelKey === levelKey).map((a) => a.geometry));
    return {
      levelKey,
      beforeKm2: beforeUnion ? areaKm2(beforeUnion) : 0,
      afterKm2: afterUnion ? areaKm2(afterUnion) : 0,
      gainedKm2: afterUnion ? areaOutsideKm2(afterUnion, beforeUnion) : 0,
      lostKm2: beforeUnion ? areaOutsideKm2(beforeUnion, afterUnion) : 0,
    };
  });
  const unchanged = added.length === 0 && removed.length === 0 && levelChanges.length === 0 && perLevel.every((l) => l.gainedKm2 < 1 && l.lostKm2 < 1);
  return { added, removed, levelChanges, perLevel, unchanged };
}

/** "12,400 km²" — whole square kilometres, grouped. */
export function formatKm2(value: number): string {
  return `${Math.round(value).toLocaleString('en-US')} km²`;
}
