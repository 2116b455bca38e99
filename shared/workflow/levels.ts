import type { RiskLevel } from '../contracts/office';

/** Colour for an area whose level the office has since removed from its ladder. */
export const unknownLevelColour = '#c9d1dc';

/** The ladder step of a level key, or a stand-in when the office removed that level. */
export function ladderLevel(ladder: readonly RiskLevel[], levelKey: string): RiskLevel {
  return ladder.find((l) => l.key === levelKey) ?? { key: levelKey, label: `Unknown level (${levelKey})`, colour: unknownLevelColour, meaning: '' };
}

/** "Level 2 · Scattered": the office's label of a level key. */
export function levelLabel(ladder: readonly RiskLevel[], levelKey: string): string {
  return ladderLevel(ladder, levelKey).label;
}

/** "Level 2 · Scattered — Lower valley": the level, with the area's own label when it has one. */
export function areaTitle(ladder: readonly RiskLevel[], area: { levelKey: string; label?: string | undefined }): string {
  const level = levelLabel(ladder, area.levelKey);
  const own = area.label?.trim() ?? '';
  return own ? `${level} — ${own}` : level;
}
