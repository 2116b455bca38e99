import { Link } from 'react-router';
import { formatTimestampUtc } from '../../../utils/time';
import { useRevisions } from '../../../api/outlooks/get-revisions';

/** Every save is a revision (who, when); each opens read-only. */
export function RevisionList({ outlookId }: { outlookId: string }) {
  const revisions = useRevisions(outlookId);
  if (revisions.isPending) return <p className="text-[13px] text-ink-muted">Loading revisions…</p>;
  if (revisions.isError) return <p className="text-[13px] text-danger">{revisions.error.message}</p>;
  const list = [...revisions.data.revisions].sort((a, b) => b.revisionNumber - a.revisionNumber);
  if (list.length === 0) return <p className="text-[13px] text-ink-muted">No saved revisions yet; the first autosave makes one.</p>;
  return (
    <ol aria-label="Revisions" className="divide-y divide-line text-[13px]">
      {list.map((revision) => (
        <li key={revision.id} className="flex items-baseline justify-between gap-2 py-1.5">
          <Link to={`/outlooks/${outlookId}/revisions/${revision.id}`} className="font-medium text-accent hover:underline">
            Revision {revision.revisionNumber}
          </Link>
          <span className="text-right text-[12px] text-ink-muted">
            {revision.authorName ?? 'Unknown author'} · {formatTimestampUtc(revision.createdAt)}
          </span>
        </li>
      ))}
    </ol>
  );
}
