import type { QueryClient } from '@tanstack/react-query';
import { clsx } from 'clsx';
import { Send } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { formatTimestampUtc } from '../../../utils/time';
import { outboxQueryOptions, useOutbox, type OutboxMessage } from '../api/get-outbox';
import { useResendOutboxMessage } from '../api/resend-outbox-message';

export const outboxLoader = (queryClient: QueryClient) => () => queryClient.prefetchQuery(outboxQueryOptions());

const badges: Record<OutboxMessage['status'], { label: string; className: string }> = {
  queued: { label: 'Queued', className: 'bg-sunken text-ink' },
  sending: { label: 'Sending', className: 'bg-accent-soft text-ink' },
  sent: { label: 'Sent', className: 'bg-ok-soft text-ink' },
  failed: { label: 'Failed', className: 'bg-danger-soft text-danger' },
};

/** The durable outbox: what is waiting, what went, what failed and why, with resend for failures. */
export function OutboxPage() {
  const outbox = useOutbox();
  const resend = useResendOutboxMessage();
  const messages = outbox.data?.messages ?? [];
  const counts = { queued: 0, sending: 0, sent: 0, failed: 0 };
  for (const m of messages) counts[m.status] += 1;

  return (
    <>
      <PageHeader
        title="Outbox"
        description="Every outlook e-mail passes through here. The worker sends queued messages and retries failures with growing delays; this page refreshes every few seconds."
      />
      {outbox.isPending ? <Loading label="Loading the outbox…" /> : null}
      {outbox.isError ? (
        <Notice tone="error" title="We could not load the outbox">
          {outbox.error.message}
        </Notice>
      ) : null}
      {resend.isError ? (
        <Notice tone="error" title="The message was not resent" className="mb-3">
          {resend.error.message}
        </Notice>
      ) : null}
      {outbox.data && messages.length === 0 ? (
        <EmptyState icon={<Send aria-hidden className="size-5" />} title="The outbox is empty.">
          Messages appear here when a published outlook reaches a subscriber’s area at or above their alert threshold.
        </EmptyState>
      ) : null}
      {messages.length > 0 ? (
        <>
          <p className="mb-2 text-[13px] text-ink-muted" aria-live="polite">
            {counts.queued} queued · {counts.sending} sending · {counts.sent} sent · {counts.failed} failed
          </p>
          <div className="relative overflow-x-auto rounded-lg border border-line bg-panel">
            <table className="w-full text-left text-sm">
              <caption className="sr-only">Outbox messages</caption>
              <thead className="border-b border-line bg-sunken text-[13px] text-ink-muted">
                <tr>
                  <th className="px-3 py-2 font-medium">Status</th>
                  <th className="px-3 py-2 font-medium">To</th>
                  <th className="px-3 py-2 font-medium">Subject</th>
                  <th className="px-3 py-2 text-right font-medium">Attempts</th>
                  <th className="px-3 py-2 font-medium">Last error</th>
                  <th className="px-3 py-2 font-medium">Next attempt / sent</th>
                  <th className="px-3 py-2">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody className="divide-y divide-line">
                {messages.map((m) => (
                  <tr key={m.id} className={clsx(m.status === 'failed' && 'bg-danger-soft/40')}>
                    <td className="px-3 py-2">
                      <span className={clsx('rounded px-1.5 py-0.5 text-[12px] font-semibold', badges[m.status].className)}>{badges[m.status].label}</span>
                    </td>
                    <td className="max-w-56 truncate px-3 py-2 text-[13px]">{m.toAddress}</td>
                    <td className="px-3 py-2 text-[13px]">{m.subject}</td>
                    <td className="px-3 py-2 text-right tabular-nums">{m.attempts}</td>
                    <td className="max-w-72 px-3 py-2 text-[13px] text-danger">{m.lastError ?? <span className="text-ink-muted">—</span>}</td>
                    <td className="px-3 py-2 text-[13px] whitespace-nowrap">
                      {m.status === 'sent' && m.sentAt ? `Sent ${formatTimestampUtc(m.sentAt)}` : m.status === 'failed' ? 'Gave up' : formatTimestampUtc(m.nextAttemptAt)}
                    </td>
                    <td className="px-3 py-2 text-right">
                      {m.status === 'failed' ? (
                        <Button size="sm" variant="secondary" busy={resend.isPending && resend.variables === m.id} onClick={() => resend.mutate(m.id)} aria-label={`Resend to ${m.toAddress}`}>
                          Resend
                        </Button>
                      ) : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      ) : null}
    </>
  );
}
