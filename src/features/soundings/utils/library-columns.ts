import { isOptionalLibraryFigureKey, optionalLibraryFigureKeys, type FigureKey } from './sounding-figures';

/** Where the library keeps the person's extra columns in this browser. */
export const LIBRARY_COLUMNS_STORAGE_KEY = 'stormdraft.library.extra-columns';

/**
 * The extra columns saved in this browser: known figure keys only, in the chooser's order, so
 * a stale or hand-edited value never breaks the table.
 * @param saved - what storage held (null when nothing)
 */
export function parseLibraryColumns(saved: string | null): FigureKey[] {
  if (saved === null) return [];
  let parsed: unknown;
  try {
    parsed = JSON.parse(saved);
  } catch {
    return [];
  }
  if (!Array.isArray(parsed)) return [];
  const wanted = new Set(parsed.filter((item): item is string => typeof item === 'string' && isOptionalLibraryFigureKey(item)));
  return optionalLibraryFigureKeys.filter((key) => wanted.has(key));
}

/** The extra columns with one key turned on or off, in the chooser's order. */
export function toggleLibraryColumn(current: readonly FigureKey[], key: FigureKey, on: boolean): FigureKey[] {
  const wanted = new Set(current);
  if (on) wanted.add(key);
  else wanted.delete(key);
  return optionalLibraryFigureKeys.filter((candidate) => wanted.has(candidate));
}
