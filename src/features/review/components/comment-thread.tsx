import { useState, type FormEvent } from 'react';
import { commentInputSchema } from '../../../../shared/contracts/workflow';
import type { OfficeSettings } from '../../../../shared/contracts/office';
import type { Outlook } from '../../../../shared/contracts/outlooks';
import { Button } from '../../../components/ui/button';
import { FieldError, SelectField, inputClasses } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { formatTimestampUtc } from '../../../utils/time';
import { useAddComment } from '../../../api/outlooks/add-comment';
import { useComments } from '../../../api/outlooks/get-comments';
import { areaTitle } from '../../../../shared/workflow/levels';

/** The review conversation: general comments and comments pinned to one area. */
export function CommentThread({ outlookId, areas, ladder, canComment }: { outlookId: string; areas: Outlook['areas']; ladder: OfficeSettings['riskLadder']; canComment: boolean }) {
  const comments = useComments(outlookId);
  const add = useAddComment(outlookId);
  const [body, setBody] = useState('');
  const [areaId, setAreaId] = useState('');
  const [error, setError] = useState<string | null>(null);

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = commentInputSchema.safeParse({ body, riskAreaId: areaId || undefined });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? 'Write a comment first.');
      return;
    }
    setError(null);
    add.mutate(parsed.data, { onSuccess: () => setBody('') });
  };

  const pinName = (riskAreaId: string | null) => {
    if (!riskAreaId) return null;
    const area = areas.find((a) => a.id === riskAreaId);
    return area ? areaTitle(ladder, area) : 'an area no longer in the draft';
  };

  return (
    <div className="space-y-3">
      {comments.isError ? <Notice tone="error">{comments.error.message}</Notice> : null}
      {comments.data && comments.data.comments.length === 0 ? <p className="text-sm text-ink-muted">No comments yet.</p> : null}
      <ol className="space-y-2.5" aria-label="Comments">
        {comments.data?.comments.map((comment) => (
          <li key={comment.id} className="rounded-md border border-line bg-canvas px-3 py-2 text-sm">
            <p className="text-[12px] text-ink-muted">
              <span className="font-semibold text-ink">{comment.authorName ?? 'Someone'}</span> · {formatTimestampUtc(comment.createdAt)}
              {comment.revisionNumber !== null ? ` · version ${comment.revisionNumber}` : ''}
              {comment.riskAreaId ? <span className="ml-1 rounded bg-accent-soft px-1 text-accent-strong">on {pinName(comment.riskAreaId)}</span> : null}
            </p>
            <p className="mt-0.5 whitespace-pre-wrap">{comment.body}</p>
          </li>
        ))}
      </ol>
      {canComment ? (
        <form onSubmit={onSubmit} className="space-y-2" noValidate>
          <label htmlFor="comment-body" className="block text-[13px] font-medium">
            Add a comment
          </label>
          <textarea
            id="comment-body"
            rows={3}
            className={inputClasses}
            value={body}
            onChange={(e) => setBody(e.target.value)}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? 'comment-body-error' : undefined}
          />
          {error ? <FieldError id="comment-body-error">{error}</FieldError> : null}
          <div className="flex flex-wrap items-end gap-2">
            <SelectField
              label="About"
              value={areaId}
              onChange={(e) => setAreaId(e.target.value)}
              options={[{ value: '', label: 'The whole outlook' }, ...areas.map((a) => ({ value: a.id, label: areaTitle(ladder, a) }))]}
              className="min-w-48 flex-1"
            />
            <Button type="submit" variant="secondary" busy={add.isPending}>
              Post comment
            </Button>
          </div>
          {add.isError ? <Notice tone="error">{add.error.message}</Notice> : null}
        </form>
      ) : null}
    </div>
  );
}
