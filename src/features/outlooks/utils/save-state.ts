/**
 * What the save indicator says. Pure: the autosave hook supplies the facts, this decides the
 * words and tone, so the rules are tested without timers or a server.
 */
export type SavePhase =
  | { kind: 'saved'; at: string | null }
  | { kind: 'unsaved' }
  | { kind: 'saving' }
  | { kind: 'conflict'; message: string }
  | { kind: 'error'; message: string }
  | { kind: 'read-only'; reason: string };

export interface SaveFacts {
  editable: boolean;
  readOnlyReason?: string;
  dirty: boolean;
  saving: boolean;
  conflict: string | null;
  error: string | null;
  lastSavedAt: string | null;
}

/** Conflict beats everything (nothing may be overwritten silently); then saving, error, unsaved, saved. */
export function savePhase(facts: SaveFacts): SavePhase {
  if (!facts.editable) return { kind: 'read-only', reason: facts.readOnlyReason ?? 'This outlook cannot be edited.' };
  if (facts.conflict !== null) return { kind: 'conflict', message: facts.conflict };
  if (facts.saving) return { kind: 'saving' };
  if (facts.error !== null) return { kind: 'error', message: facts.error };
  if (facts.dirty) return { kind: 'unsaved' };
  return { kind: 'saved', at: facts.lastSavedAt };
}

/** "Saved 14:02" in the office's time zone (24-hour clock). */
export function formatSavedAt(iso: string, timeZone: string): string {
  const instant = new Date(iso);
  if (Number.isNaN(instant.getTime())) return 'Saved';
  const time = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(instant);
  return `Saved ${time}`;
}

export function savePhaseText(phase: SavePhase, timeZone: string): string {
  switch (phase.kind) {
    case 'saved':
      return phase.at === null ? 'Saved' : formatSavedAt(phase.at, timeZone);
    case 'unsaved':
      return 'Unsaved changes';
    case 'saving':
      return 'Saving…';
    case 'conflict':
      return 'Changed by someone else';
    case 'error':
      return 'Not saved';
    case 'read-only':
      return 'Read only';
  }
}

/** Whether the autosave timer should be running now. */
export function shouldAutosave(facts: SaveFacts): boolean {
  return facts.editable && facts.dirty && !facts.saving && facts.conflict === null;
}

/** Autosave waits this long after the last change. */
export const AUTOSAVE_DELAY_MS = 2000;
