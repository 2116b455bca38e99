import { TriangleAlert } from 'lucide-react';
import type { SoundingIssueDto } from '../../../../shared/contracts/soundings';
import { storedIssueMessage } from '../utils/upload-checks';

/** Warnings found when the sounding was checked; it was stored, but the forecaster should know. */
export function SoundingWarnings({ warnings }: { warnings: readonly SoundingIssueDto[] }) {
  if (warnings.length === 0) return null;
  return (
    <section aria-labelledby="sounding-warnings-title" className="mb-4 rounded-md border border-warning-line border-l-4 bg-warning-soft px-3.5 py-2.5 text-sm">
      <h2 id="sounding-warnings-title" className="flex items-center gap-2 font-semibold text-ink">
        <TriangleAlert aria-hidden className="size-4 text-warning" />
        {warnings.length === 1 ? '1 warning from the checks' : `${warnings.length} warnings from the checks`}
      </h2>
      <ul className="mt-1 list-disc space-y-0.5 pl-10 text-[13px] text-ink-muted">
        {warnings.map((warning, index) => (
          <li key={index}>
            {warning.line !== undefined ? <span className="font-medium text-ink">Line {warning.line}: </span> : null}
            {storedIssueMessage(warning.message)}
          </li>
        ))}
      </ul>
    </section>
  );
}
