import { describe, expect, it } from 'vitest';
import { COALESCE_MS, HISTORY_LIMIT, canRedo, canUndo, historyReducer, startHistory } from './document-history';

describe('document history (undo/redo)', () => {
  it('when a change is undone and redone, then the present steps back and forward', () => {
    let state = startHistory('a');
    state = historyReducer(state, { type: 'change', document: 'b', at: 0 });
    state = historyReducer(state, { type: 'change', document: 'c', at: 5000 });
    expect(state.present).toBe('c');
    state = historyReducer(state, { type: 'undo' });
    expect(state.present).toBe('b');
    expect(canRedo(state)).toBe(true);
    state = historyReducer(state, { type: 'redo' });
    expect(state.present).toBe('c');
    expect(canRedo(state)).toBe(false);
  });

  it('when a new change follows an undo, then the redo branch is dropped', () => {
    let state = startHistory('a');
    state = historyReducer(state, { type: 'change', document: 'b', at: 0 });
    state = historyReducer(state, { type: 'undo' });
    state = historyReducer(state, { type: 'change', document: 'x', at: 10 });
    expect(state.present).toBe('x');
    expect(canRedo(state)).toBe(false);
    expect(state.past).toEqual(['a']);
  });

  it('when typing in one field quickly, then the keystrokes coalesce into one undo step', () => {
    let state = startHistory('');
    state = historyReducer(state, { type: 'change', document: 'S', group: 'headline', at: 0 });
    state = historyReducer(state, { type: 'change', document: 'St', group: 'headline', at: 200 });
    state = historyReducer(state, { type: 'change', document: 'Sto', group: 'headline', at: 400 });
    expect(state.past).toEqual(['']);
    state = historyReducer(state, { type: 'change', document: 'Stor', group: 'headline', at: 400 + COALESCE_MS + 1 });
    expect(state.past).toEqual(['', 'Sto']);
    state = historyReducer(state, { type: 'change', document: 'Storm', group: 'discussion', at: 400 + COALESCE_MS + 2 });
    expect(state.past).toEqual(['', 'Sto', 'Stor']);
  });

  it('when there is nothing to undo or redo, then the state is returned unchanged', () => {
    const state = startHistory('a');
    expect(historyReducer(state, { type: 'undo' })).toBe(state);
    expect(historyReducer(state, { type: 'redo' })).toBe(state);
    expect(canUndo(state)).toBe(false);
  });

  it('when the document is reset (reload after a conflict), then history starts again', () => {
    let state = startHistory('a');
    state = historyReducer(state, { type: 'change', document: 'b', at: 0 });
    state = historyReducer(state, { type: 'reset', document: 'theirs' });
    expect(state).toEqual(startHistory('theirs'));
  });

  it('when more changes than the limit are made, then only the newest are kept', () => {
    let state = startHistory(0);
    for (let i = 1; i <= HISTORY_LIMIT + 20; i++) state = historyReducer(state, { type: 'change', document: i, at: i * 10_000 });
    expect(state.past).toHaveLength(HISTORY_LIMIT);
    expect(state.past[0]).toBe(20);
  });
});
