import { useEffect, useRef } from 'react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import type { SoundingSummary } from '../../../../shared/contracts/soundings';
import { formatValidTimeUtc } from '../utils/valid-time';

interface DeleteSoundingDialogProps {
  sounding: SoundingSummary | null;
  busy: boolean;
  problem: string | null;
  onConfirm: (sounding: SoundingSummary) => void;
  onCancel: () => void;
}

/** A modal confirmation before deleting: names the sounding and says what else goes with it. */
export function DeleteSoundingDialog({ sounding, busy, problem, onConfirm, onCancel }: DeleteSoundingDialogProps) {
  const dialog = useRef<HTMLDialogElement>(null);

  useEffect(() => {
    const element = dialog.current;
    if (!element) return;
    if (sounding && !element.open) element.showModal();
    if (!sounding && element.open) element.close();
  }, [sounding]);

  return (
    <dialog
      ref={dialog}
      aria-labelledby="delete-sounding-title"
      onCancel={(event) => {
        event.preventDefault();
        if (!busy) onCancel();
      }}
      className="m-auto w-full max-w-md rounded-lg border border-line bg-panel p-0 text-ink shadow-xl backdrop:bg-ink/40"
    >
      {sounding ? (
        <div className="space-y-3 p-5">
          <h2 id="delete-sounding-title" className="text-base font-semibold">
            Delete {sounding.stationId} · {formatValidTimeUtc(sounding.validTime)}?
          </h2>
          <p className="text-sm text-ink-muted">
            {sounding.modificationName !== null
              ? `This deletes the modified sounding “${sounding.modificationName}”. The original stays.`
              : 'This deletes the sounding and every modified sounding made from it.'}{' '}
            It cannot be undone.
          </p>
          {problem ? <Notice tone="error">{problem}</Notice> : null}
          <div className="flex justify-end gap-2 pt-1">
            <Button variant="ghost" onClick={onCancel} disabled={busy}>
              Keep it
            </Button>
            <Button variant="danger" busy={busy} onClick={() => onConfirm(sounding)}>
              Delete sounding
            </Button>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}
