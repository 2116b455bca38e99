import { clsx } from 'clsx';
import type { IntakeFile } from '../../../../shared/contracts/intake';
import { formatTimestampUtc } from '../../../utils/time';
import { formatBytes, formatDuration, formatLabel, outcomeText, progressText, stateLabel } from '../utils/intake-format';

const badgeClasses: Record<IntakeFile['state'], string> = {
  received: 'bg-sunken text-ink',
  processing: 'bg-accent-soft text-ink',
  done: 'bg-ok-soft text-ink',
  failed: 'bg-danger-soft text-danger',
  duplicate: 'bg-sunken text-ink-muted',
};

/** Every file the intake received: where from, how big, what became of it and why. */
export function IntakeFilesTable({ files }: { files: IntakeFile[] }) {
  return (
    <div className="relative overflow-x-auto rounded-lg border border-line bg-panel" role="region" aria-label="Intake files" tabIndex={0}>
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Files taken in, newest first</caption>
        <thead className="border-b border-line bg-sunken text-[13px] text-ink-muted">
          <tr>
            <th className="px-3 py-2 font-medium">File</th>
            <th className="px-3 py-2 font-medium">Source</th>
            <th className="px-3 py-2 font-medium">Format</th>
            <th className="px-3 py-2 text-right font-medium">Size</th>
            <th className="px-3 py-2 font-medium">State</th>
            <th className="px-3 py-2 font-medium">Soundings made</th>
            <th className="px-3 py-2 text-right font-medium">Time taken</th>
            <th className="px-3 py-2 font-medium">Reason / notes</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {files.map((file) => {
            const progress = progressText(file);
            return (
              <tr key={file.id} className={clsx(file.state === 'failed' && 'bg-danger-soft/40')}>
                <td className="min-w-40 px-3 py-2">
                  <span className="font-mono text-[13px] [overflow-wrap:anywhere]">{file.fileName}</span>
                  <span className="block text-[12px] text-ink-muted">{formatTimestampUtc(file.receivedAt)}</span>
                </td>
                <td className="px-3 py-2 text-[13px]">{file.sourceName}</td>
                <td className="px-3 py-2 text-[13px]">{formatLabel(file.format)}</td>
                <td className="px-3 py-2 text-right text-[13px] tabular-nums">{formatBytes(file.sizeBytes)}</td>
                <td className="px-3 py-2">
                  <span className={clsx('rounded px-1.5 py-0.5 text-[12px] font-semibold', badgeClasses[file.state])}>{stateLabel(file.state)}</span>
                  {progress ? (
                    <span className="mt-1 block text-[12px] text-ink-muted">
                      {file.progressTotal > 0 ? <progress className="mr-1 h-1.5 w-20 align-middle" max={file.progressTotal} value={file.progressDone} aria-label={`Progress of ${file.fileName}`} /> : null}
                      {progress}
                    </span>
                  ) : null}
                </td>
                <td className="px-3 py-2 text-[13px] tabular-nums">{outcomeText(file)}</td>
                <td className="px-3 py-2 text-right text-[13px] tabular-nums">{formatDuration(file.durationMs)}</td>
                <td className="max-w-96 px-3 py-2 text-[13px]">
                  {file.failure ? <span className="text-danger">{file.failure}</span> : null}
                  {file.notes.map((note) => (
                    <span key={note} className="block text-ink-muted">
                      {note}
                    </span>
                  ))}
                  {!file.failure && file.notes.length === 0 ? <span className="text-ink-muted">—</span> : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
