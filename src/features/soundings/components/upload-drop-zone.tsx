import { clsx } from 'clsx';
import { FileUp } from 'lucide-react';
import { useId, useRef, useState, type DragEvent } from 'react';
import { soundingLimits } from '../../../../shared/contracts/soundings';

interface UploadDropZoneProps {
  onFiles: (files: File[]) => void;
  busy: boolean;
}

/** Drop exchange-CSV files here, or pick them; both hand over every file chosen at once. */
export function UploadDropZone({ onFiles, busy }: UploadDropZoneProps) {
  const inputId = useId();
  const hintId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [dragging, setDragging] = useState(false);

  function handleDrop(event: DragEvent<HTMLDivElement>) {
    event.preventDefault();
    setDragging(false);
    if (busy) return;
    const files = Array.from(event.dataTransfer.files);
    if (files.length > 0) onFiles(files);
  }

  return (
    <div
      onDragOver={(event) => {
        event.preventDefault();
        if (!busy) setDragging(true);
      }}
      onDragLeave={() => setDragging(false)}
      onDrop={handleDrop}
      className={clsx(
        'flex flex-col items-center justify-center gap-3 rounded-lg border-2 border-dashed px-6 py-10 text-center transition-colors',
        dragging ? 'border-accent bg-accent-soft' : 'border-line-strong bg-panel',
        busy && 'opacity-70',
      )}
    >
      <span className="flex size-11 items-center justify-center rounded-full bg-sunken text-ink-muted">
        <FileUp aria-hidden className="size-5" />
      </span>
      <div>
        <p className="text-sm font-semibold text-ink">{dragging ? 'Drop the files to upload them' : 'Drag sounding files here'}</p>
        <p id={hintId} className="mt-1 text-[13px] text-ink-muted">
          Exchange-CSV files, up to {soundingLimits.maxFileBytes / (1024 * 1024)} MB each. Many at once is fine: they are checked one by one, and a rejected file stores
          nothing.
        </p>
      </div>
      <div>
        <input
          ref={input}
          id={inputId}
          type="file"
          multiple
          accept=".csv,text/csv,text/plain"
          className="sr-only"
          aria-describedby={hintId}
          disabled={busy}
          onChange={(event) => {
            const files = Array.from(event.target.files ?? []);
            // Clear so choosing the same file again still triggers a change.
            event.target.value = '';
            if (files.length > 0) onFiles(files);
          }}
        />
        <label
          htmlFor={inputId}
          className={clsx(
            'inline-flex h-9 cursor-pointer items-center rounded-md bg-accent px-3.5 text-sm font-medium text-white hover:bg-accent-strong',
            busy && 'pointer-events-none opacity-60',
          )}
        >
          {busy ? 'Uploading…' : 'Choose files'}
        </label>
      </div>
    </div>
  );
}
