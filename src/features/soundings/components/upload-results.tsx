import { clsx } from 'clsx';
import { CircleAlert, CircleCheck, TriangleAlert } from 'lucide-react';
import { Link } from 'react-router';
import type { UploadResult } from '../../../../shared/contracts/soundings';
import { issueMessageWithoutPlace, type RefusedFile } from '../utils/upload-checks';

interface UploadResultsProps {
  results: readonly UploadResult[];
  refused: readonly RefusedFile[];
}

const statusText: Record<UploadResult['status'], string> = {
  accepted: 'Accepted',
  'accepted-with-warnings': 'Accepted with warnings',
  duplicate: 'Already in the library (not stored again)',
  rejected: 'Rejected',
};

function StatusIcon({ status }: { status: UploadResult['status'] }) {
  switch (status) {
    case 'accepted':
      return <CircleCheck aria-hidden className="size-4 shrink-0 text-ok" />;
    case 'accepted-with-warnings':
      return <TriangleAlert aria-hidden className="size-4 shrink-0 text-warning" />;
    case 'duplicate':
      return <CircleCheck aria-hidden className="size-4 shrink-0 text-ink-muted" />;
    case 'rejected':
      return <CircleAlert aria-hidden className="size-4 shrink-0 text-danger" />;
  }
}

function where(issue: { line?: number | undefined; column?: string | undefined }): string | null {
  if (issue.line !== undefined && issue.column !== undefined) return `Line ${issue.line}, column “${issue.column}”`;
  if (issue.line !== undefined) return `Line ${issue.line}`;
  if (issue.column !== undefined) return `Column “${issue.column}”`;
  return null;
}

/** One row per file: what happened to it, every problem with its line and column, and a link when stored. */
export function UploadResults({ results, refused }: UploadResultsProps) {
  return (
    <ul aria-label="Upload results" className="divide-y divide-line rounded-lg border border-line bg-panel">
      {refused.map((file) => (
        <li key={`refused-${file.fileName}`} className="px-4 py-3">
          <div className="flex items-center gap-2">
            <CircleAlert aria-hidden className="size-4 shrink-0 text-danger" />
            <span className="min-w-0 truncate font-medium text-ink">{file.fileName}</span>
            <span className="rounded bg-danger-soft px-1.5 py-0.5 text-[12px] font-semibold text-danger">Not sent</span>
          </div>
          <p className="mt-1 pl-6 text-[13px] text-ink-muted">{file.message}</p>
        </li>
      ))}
      {results.map((result, index) => (
        <li key={`${index}-${result.fileName}`} className="px-4 py-3" data-status={result.status}>
          <div className="flex flex-wrap items-center gap-2">
            <StatusIcon status={result.status} />
            <span className="min-w-0 truncate font-medium text-ink">{result.fileName}</span>
            <span
              className={clsx(
                'rounded px-1.5 py-0.5 text-[12px] font-semibold',
                result.status === 'accepted' && 'bg-ok-soft text-ok',
                result.status === 'accepted-with-warnings' && 'bg-warning-soft text-warning',
                result.status === 'rejected' && 'bg-danger-soft text-danger',
              )}
            >
              {statusText[result.status]}
            </span>
            {result.soundingId !== null ? (
              <Link to={`/soundings/${result.soundingId}`} className="ml-auto text-[13px] font-medium text-accent hover:underline">
                Open {result.fileName}
              </Link>
            ) : null}
          </div>
          {result.issues.length > 0 ? (
            <ul className="mt-1.5 space-y-1 pl-6 text-[13px]">
              {result.issues.map((issue, issueIndex) => {
                const place = where(issue);
                return (
                  <li key={issueIndex} className="flex gap-2">
                    <span className={clsx('shrink-0 font-semibold', issue.severity === 'error' ? 'text-danger' : 'text-warning')}>
                      {issue.severity === 'error' ? 'Error' : 'Warning'}
                    </span>
                    <span className="text-ink-muted">
                      {place ? <span className="font-medium text-ink">{place}: </span> : null}
                      {issueMessageWithoutPlace(issue.message, result.fileName)}
                    </span>
                  </li>
                );
              })}
            </ul>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
