import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';

/**
 * Shown when a save was refused because someone else saved first. Nothing is overwritten
 * silently: Reload takes their version (mine is discarded); Keep mine saves mine as a new
 * revision on top of theirs (theirs stays in the revision list).
 */
export function ConflictPrompt({ message, onReload, onKeepMine }: { message: string; onReload: () => Promise<void>; onKeepMine: () => Promise<void> }) {
  const [busy, setBusy] = useState<'reload' | 'keep' | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const run = (which: 'reload' | 'keep', action: () => Promise<void>) => {
    setBusy(which);
    setProblem(null);
    action()
      .catch((error: unknown) => setProblem(error instanceof Error ? error.message : 'That did not work; try again.'))
      .finally(() => setBusy(null));
  };
  return (
    <Notice
      tone="error"
      title="Changed by someone else since you opened it"
      actions={
        <>
          <Button size="sm" variant="secondary" busy={busy === 'reload'} onClick={() => run('reload', onReload)}>
            Reload
          </Button>
          <Button size="sm" busy={busy === 'keep'} onClick={() => run('keep', onKeepMine)}>
            Keep mine
          </Button>
        </>
      }
    >
      <p>{message}</p>
      <p className="mt-1">Reload shows their version and discards your unsaved changes. Keep mine saves your version on top; theirs stays in the revision list.</p>
      {problem ? <p className="mt-1 font-medium text-danger">{problem}</p> : null}
    </Notice>
  );
}
