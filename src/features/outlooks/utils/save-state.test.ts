import { describe, expect, it } from 'vitest';
import { savePhase, savePhaseText, shouldAutosave, type SaveFacts } from './save-state';

const base: SaveFacts = { editable: true, dirty: false, saving: false, conflict: null, error: null, lastSavedAt: '2027-04-18T19:02:30Z' };

describe('save state', () => {
  it('when nothing changed since the last save, then it says "Saved" with the office time', () => {
    expect(savePhaseText(savePhase(base), 'America/Chicago')).toBe('Saved 14:02');
    expect(savePhaseText(savePhase(base), 'UTC')).toBe('Saved 19:02');
  });

  it('when there are changes, then it says "Unsaved changes" and the autosave timer runs', () => {
    const facts = { ...base, dirty: true };
    expect(savePhaseText(savePhase(facts), 'UTC')).toBe('Unsaved changes');
    expect(shouldAutosave(facts)).toBe(true);
  });

  it('when a save is in flight, then it says "Saving…" and no second save starts', () => {
    const facts = { ...base, dirty: true, saving: true };
    expect(savePhaseText(savePhase(facts), 'UTC')).toBe('Saving…');
    expect(shouldAutosave(facts)).toBe(false);
  });

  it('when a save met a conflict, then the conflict wins over everything and autosave stops', () => {
    const facts = { ...base, dirty: true, saving: true, error: 'x', conflict: 'changed by someone else since you opened it' };
    expect(savePhase(facts)).toEqual({ kind: 'conflict', message: 'changed by someone else since you opened it' });
    expect(shouldAutosave(facts)).toBe(false);
  });

  it('when the outlook is not editable, then it is read only and never autosaves', () => {
    const facts = { ...base, editable: false, dirty: true, readOnlyReason: 'Only drafts are edited here.' };
    expect(savePhase(facts)).toEqual({ kind: 'read-only', reason: 'Only drafts are edited here.' });
    expect(shouldAutosave(facts)).toBe(false);
  });
});
