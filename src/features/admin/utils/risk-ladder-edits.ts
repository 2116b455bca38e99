import { defaultRiskLadder, type RiskLadder, type RiskLevel } from '../../../../shared/contracts/office';

/**
 * Pure edits of the risk ladder while an admin works on it. Each row carries a `rowId` that
 * survives reordering, so React keeps focus and input state on the right row.
 */
export interface EditableLevel extends RiskLevel {
  rowId: string;
}

export type MakeRowId = () => string;

let rowCounter = 0;
/** Row ids for the editor session; only need to be unique within the page. */
export const makeRowId: MakeRowId = () => `ladder-row-${++rowCounter}`;

export function toEditableLadder(ladder: RiskLadder, makeId: MakeRowId = makeRowId): EditableLevel[] {
  return ladder.map((level) => ({ ...level, rowId: makeId() }));
}

export function toRiskLadder(rows: readonly EditableLevel[]): RiskLadder {
  return rows.map(({ key, label, colour, meaning }) => ({ key, label, colour, meaning }));
}

/** The first `levelN` key not yet used, counting from the ladder's length. */
export function nextFreeKey(rows: readonly EditableLevel[]): string {
  const used = new Set(rows.map((row) => row.key));
  let n = rows.length;
  while (used.has(`level${n}`)) n += 1;
  return `level${n}`;
}

/** Appends a new, highest level. Its colour starts as the darkest default so it reads as "higher". */
export function addLevel(rows: readonly EditableLevel[], makeId: MakeRowId = makeRowId): EditableLevel[] {
  return [...rows, { rowId: makeId(), key: nextFreeKey(rows), label: '', colour: '#24062b', meaning: '' }];
}

export function removeLevel(rows: readonly EditableLevel[], index: number): EditableLevel[] {
  return rows.filter((_, i) => i !== index);
}

/** Swaps a level with its neighbour; moving past either end leaves the ladder unchanged. */
export function moveLevel(rows: readonly EditableLevel[], index: number, direction: -1 | 1): EditableLevel[] {
  const target = index + direction;
  const row = rows[index];
  const neighbour = rows[target];
  if (row === undefined || neighbour === undefined) return [...rows];
  const next = [...rows];
  next[index] = neighbour;
  next[target] = row;
  return next;
}

export function updateLevel(rows: readonly EditableLevel[], index: number, patch: Partial<RiskLevel>): EditableLevel[] {
  return rows.map((row, i) => (i === index ? { ...row, ...patch } : row));
}

export function defaultEditableLadder(makeId: MakeRowId = makeRowId): EditableLevel[] {
  return toEditableLadder(defaultRiskLadder, makeId);
}

export function isHexColour(value: string): boolean {
  return /^#[0-9a-fA-F]{6}$/.test(value);
}
