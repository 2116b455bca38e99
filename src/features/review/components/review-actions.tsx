import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import type { Outlook } from '../../../../shared/contracts/outlooks';
import type { WorkflowAction } from '../../../../shared/contracts/workflow';
import { Button } from '../../../components/ui/button';
import { FieldError, inputClasses } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import type { TransitionResult } from '../../../../shared/contracts/workflow';
import { useTransitionOutlook } from '../../../api/outlooks/transition-outlook';
import { actionProblem, type ActionProblem } from '../utils/review-rules';

interface ReviewActionsProps {
  outlook: Outlook;
  /** The actions open to the person now (shared/workflow/transitions.ts, as the server enforces them). */
  actions: readonly WorkflowAction[];
  /** Why approval is refused under the four-eyes rule, when it is. */
  fourEyesNote: string | null;
}

const successWords: Record<WorkflowAction, string> = {
  submit: 'Submitted for review. A lead will look at it next.',
  return: 'Returned to the author with your comment.',
  approve: 'Approved. Publish it when it should go out.',
  publish: 'Published.',
};

/** Submit, approve, return with a comment, publish — each sent with the version on screen. */
export function ReviewActions({ outlook, actions, fourEyesNote }: ReviewActionsProps) {
  const transition = useTransitionOutlook(outlook.id);
  const [returning, setReturning] = useState(false);
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState<string | null>(null);
  const [problem, setProblem] = useState<ActionProblem | null>(null);
  const [done, setDone] = useState<{ action: WorkflowAction; result: TransitionResult } | null>(null);

  const run = (action: WorkflowAction, text?: string) => {
    setProblem(null);
    setDone(null);
    transition.mutate(
      { action, input: { version: outlook.version, ...(text ? { comment: text } : {}) } },
      {
        onSuccess: (result) => {
          setDone({ action, result });
          setReturning(false);
          setComment('');
        },
        onError: (error) => {
          if (!isApiError(error)) return setProblem({ title: 'That did not work', message: 'Try again.', reload: false });
          const commentIssue = error.issues.find((i) => i.path === 'comment');
          if (commentIssue) return setCommentError(commentIssue.message);
          setProblem(actionProblem(action, error.status, error.message));
        },
      },
    );
  };

  const onReturn = (event: FormEvent) => {
    event.preventDefault();
    if (comment.trim() === '') {
      setCommentError('Say what needs changing: a comment is required to return an outlook.');
      return;
    }
    setCommentError(null);
    run('return', comment.trim());
  };

  const busy = transition.isPending;

  return (
    <div className="space-y-3">
      {done ? (
        <Notice tone="success" title={successWords[done.action]}>
          {done.result.issuanceNumber ? (
            <>
              Issuance{' '}
              <Link to={`/issuances/${done.result.issuanceNumber}`} className="font-semibold text-accent hover:underline">
                {done.result.issuanceNumber}
              </Link>{' '}
              is on the public bulletin.
            </>
          ) : null}
        </Notice>
      ) : null}
      {problem ? (
        <Notice tone={problem.reload ? 'warning' : 'error'} title={problem.title}>
          {problem.message}
        </Notice>
      ) : null}
      {fourEyesNote ? (
        <Notice tone="info" title="Another lead approves this version">
          {fourEyesNote}
        </Notice>
      ) : null}
      {actions.length === 0 ? <p className="text-sm text-ink-muted">No action is open to you in this state.</p> : null}
      <div className="flex flex-wrap gap-2">
        {actions.includes('submit') ? (
          <Button onClick={() => run('submit')} busy={busy}>
            Submit for review
          </Button>
        ) : null}
        {actions.includes('approve') ? (
          <Button onClick={() => run('approve')} busy={busy}>
            Approve
          </Button>
        ) : null}
        {actions.includes('publish') ? (
          <Button onClick={() => run('publish')} busy={busy}>
            Publish
          </Button>
        ) : null}
        {actions.includes('return') && !returning ? (
          <Button variant="secondary" onClick={() => setReturning(true)} disabled={busy}>
            Return with comment…
          </Button>
        ) : null}
      </div>
      {returning ? (
        <form onSubmit={onReturn} className="space-y-2" noValidate>
          <label htmlFor="return-comment" className="block text-[13px] font-medium">
            What needs changing (the author sees this)
          </label>
          <textarea
            id="return-comment"
            rows={3}
            className={inputClasses}
            value={comment}
            onChange={(e) => setComment(e.target.value)}
            aria-invalid={commentError ? true : undefined}
            aria-describedby={commentError ? 'return-comment-error' : undefined}
          />
          {commentError ? <FieldError id="return-comment-error">{commentError}</FieldError> : null}
          <div className="flex gap-2">
            <Button type="submit" busy={busy}>
              Return to author
            </Button>
            <Button variant="ghost" onClick={() => setReturning(false)}>
              Cancel
            </Button>
          </div>
        </form>
      ) : null}
    </div>
  );
}
