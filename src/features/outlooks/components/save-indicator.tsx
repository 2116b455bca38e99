import { clsx } from 'clsx';
import { CircleAlert, CircleCheck, CloudUpload, Lock, PencilLine } from 'lucide-react';
import { savePhaseText, type SavePhase } from '../utils/save-state';

const tones: Record<SavePhase['kind'], string> = {
  saved: 'text-ok',
  unsaved: 'text-warning',
  saving: 'text-ink-muted',
  conflict: 'text-danger',
  error: 'text-danger',
  'read-only': 'text-ink-muted',
};

function Icon({ kind }: { kind: SavePhase['kind'] }) {
  const className = 'size-4';
  switch (kind) {
    case 'saved':
      return <CircleCheck aria-hidden className={className} />;
    case 'unsaved':
      return <PencilLine aria-hidden className={className} />;
    case 'saving':
      return <CloudUpload aria-hidden className={className} />;
    case 'conflict':
    case 'error':
      return <CircleAlert aria-hidden className={className} />;
    case 'read-only':
      return <Lock aria-hidden className={className} />;
  }
}

/** "Saved 14:02", "Saving…", "Unsaved changes": always visible beside the toolbar. */
export function SaveIndicator({ phase, timeZone }: { phase: SavePhase; timeZone: string }) {
  return (
    <p role="status" aria-live="polite" aria-label="Save state" data-phase={phase.kind} className={clsx('flex items-center gap-1.5 text-[13px] font-medium whitespace-nowrap', tones[phase.kind])}>
      <Icon kind={phase.kind} />
      {savePhaseText(phase, timeZone)}
    </p>
  );
}
