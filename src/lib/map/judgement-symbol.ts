/**
 * How a sounding inside the selected area stands against its support check, drawn as a shape
 * around the sounding's coloured dot: the shape carries the meaning (never colour alone), with
 * the product's ok/danger/ink colours as a second cue. Used by the map and its legend alike.
 */
export type JudgementKind = 'backs' | 'fails' | 'lacks' | 'inside';

export interface JudgementSymbol {
  /** SVG path data in a 22 × 22 box centred on the sounding. */
  path: string;
  colour: string;
  width: number;
  dash?: string;
  legend: string;
}

const ring = 'M11 2.5 A8.5 8.5 0 1 1 10.99 2.5 Z';

export const judgementSymbols: Record<JudgementKind, JudgementSymbol> = {
  backs: { path: ring, colour: '#1c6e47', width: 3, legend: 'backs the level (solid ring)' },
  fails: { path: 'M3 3 L8 8 M19 3 L14 8 M3 19 L8 14 M19 19 L14 14', colour: '#b42318', width: 3, legend: 'fails a rule (cross arms)' },
  lacks: { path: ring, colour: '#172030', width: 2, dash: '3 3', legend: 'lacks a value a rule uses (dashed ring)' },
  inside: { path: 'M11 1.5 L20.5 11 L11 20.5 L1.5 11 Z', colour: '#172030', width: 1.6, legend: 'inside, not judged one by one (diamond)' },
};

/** The symbol as an SVG string (a white casing under the stroke so it reads on every risk fill). */
export function judgementSvg(kind: JudgementKind): string {
  const { path, colour, width, dash } = judgementSymbols[kind];
  const dashAttribute = dash ? ` stroke-dasharray="${dash}"` : '';
  return `<svg xmlns="http://www.w3.org/2000/svg" width="22" height="22" viewBox="0 0 22 22" aria-hidden="true"><path d="${path}" fill="none" stroke="#ffffff" stroke-width="${width + 2}" stroke-linecap="round"${dashAttribute}/><path d="${path}" fill="none" stroke="${colour}" stroke-width="${width}" stroke-linecap="round"${dashAttribute}/></svg>`;
}
