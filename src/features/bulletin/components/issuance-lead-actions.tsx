import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import { withdrawInputSchema } from '../../../../shared/contracts/workflow';
import { Button } from '../../../components/ui/button';
import { FieldError, inputClasses } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { useAmendIssuance } from '../api/amend-issuance';
import type { Issuance } from '../api/issuance-schema';
import { useWithdrawIssuance } from '../api/withdraw-issuance';

/** For a signed-in lead on a current issuance: start an amendment, or withdraw it with a reason. */
export function IssuanceLeadActions({ issuance }: { issuance: Issuance }) {
  const navigate = useNavigate();
  const amend = useAmendIssuance(issuance.number);
  const withdraw = useWithdrawIssuance(issuance.number);
  const [withdrawing, setWithdrawing] = useState(false);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | null>(null);

  const onAmend = () => amend.mutate(undefined, { onSuccess: (result) => void navigate(`/outlooks/${result.outlookId}`) });

  const onWithdraw = (event: FormEvent) => {
    event.preventDefault();
    const parsed = withdrawInputSchema.safeParse({ reason });
    if (!parsed.success) {
      setReasonError(parsed.error.issues[0]?.message ?? 'Give a reason.');
      return;
    }
    setReasonError(null);
    withdraw.mutate(parsed.data, { onSuccess: () => setWithdrawing(false) });
  };

  return (
    <section aria-labelledby="lead-actions-title" className="space-y-3 rounded-lg border border-line bg-panel p-4">
      <h2 id="lead-actions-title" className="text-sm font-semibold">
        Lead actions
      </h2>
      <p className="text-[13px] text-ink-muted">
        An amendment starts a new draft from this issuance; publishing it supersedes {issuance.number}. Withdrawing removes it from
        the bulletin and shows your reason here.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={onAmend} busy={amend.isPending}>
          Amend this issuance
        </Button>
        {withdrawing ? null : (
          <Button variant="danger" onClick={() => setWithdrawing(true)}>
            Withdraw…
          </Button>
        )}
      </div>
      {amend.isError ? <Notice tone="error">{amend.error.message}</Notice> : null}
      {withdrawing ? (
        <form onSubmit={onWithdraw} className="space-y-2" noValidate>
          <label htmlFor="withdraw-reason" className="block text-[13px] font-medium">
            Reason for the withdrawal (shown to the public)
          </label>
          <textarea
            id="withdraw-reason"
            rows={3}
            className={inputClasses}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            aria-invalid={reasonError ? true : undefined}
            aria-describedby={reasonError ? 'withdraw-reason-error' : undefined}
          />
          {reasonError ? <FieldError id="withdraw-reason-error">{reasonError}</FieldError> : null}
          {withdraw.isError ? <Notice tone="error">{withdraw.error.message}</Notice> : null}
          <div className="flex gap-2">
            <Button type="submit" variant="danger" busy={withdraw.isPending}>
              Withdraw {issuance.number}
            </Button>
            <Button variant="ghost" onClick={() => setWithdrawing(false)}>
              Keep it
            </Button>
          </div>
        </form>
      ) : null}
    </section>
  );
}
