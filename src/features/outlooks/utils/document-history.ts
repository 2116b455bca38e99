/**
 * Undo and redo for the outlook document: a past stack, the present and a future stack. Typing
 * in one field is coalesced into a single step (same `group` within `coalesceMs`), so undo goes
 * back a word burst, not a letter.
 */
export interface DocumentHistory<T> {
  past: T[];
  present: T;
  future: T[];
  /** Group and time of the last change, for coalescing. */
  lastGroup: string | null;
  lastAt: number;
}

export type HistoryAction<T> =
  | { type: 'change'; document: T; group?: string; at: number }
  | { type: 'undo' }
  | { type: 'redo' }
  /** Replace everything (load, reload after a conflict): history starts again. */
  | { type: 'reset'; document: T };

export const HISTORY_LIMIT = 100;
export const COALESCE_MS = 1000;

export function startHistory<T>(document: T): DocumentHistory<T> {
  return { past: [], present: document, future: [], lastGroup: null, lastAt: 0 };
}

export function historyReducer<T>(state: DocumentHistory<T>, action: HistoryAction<T>): DocumentHistory<T> {
  switch (action.type) {
    case 'change': {
      if (action.document === state.present) return state;
      const coalesce = action.group !== undefined && action.group === state.lastGroup && action.at - state.lastAt < COALESCE_MS && state.past.length > 0;
      const past = coalesce ? state.past : [...state.past, state.present].slice(-HISTORY_LIMIT);
      return { past, present: action.document, future: [], lastGroup: action.group ?? null, lastAt: action.at };
    }
    case 'undo': {
      const previous = state.past[state.past.length - 1];
      if (previous === undefined) return state;
      return { past: state.past.slice(0, -1), present: previous, future: [state.present, ...state.future], lastGroup: null, lastAt: 0 };
    }
    case 'redo': {
      const [next, ...rest] = state.future;
      if (next === undefined) return state;
      return { past: [...state.past, state.present], present: next, future: rest, lastGroup: null, lastAt: 0 };
    }
    case 'reset':
      return startHistory(action.document);
  }
}

export const canUndo = <T>(state: DocumentHistory<T>) => state.past.length > 0;
export const canRedo = <T>(state: DocumentHistory<T>) => state.future.length > 0;
