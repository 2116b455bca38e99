import type { QueryClient } from '@tanstack/react-query';
import { clsx } from 'clsx';
import { Inbox, RefreshCw } from 'lucide-react';
import { Link, useSearchParams } from 'react-router';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { formatTimestampUtc } from '../../../utils/time';
import { mailMessagesQueryOptions, useMailMessages } from '../api/get-mail-messages';
import { MailReader } from '../components/mail-reader';

export const mailLoader = (queryClient: QueryClient) => () => queryClient.prefetchQuery(mailMessagesQueryOptions());

/** The local mail catcher: every e-mail the app sent while no SMTP relay is configured. */
export function MailPage() {
  const messages = useMailMessages();
  const [searchParams] = useSearchParams();
  const selected = searchParams.get('message');

  return (
    <>
      <PageHeader
        title="Mail catcher"
        description="With no SMTP relay configured, Stormdraft keeps every e-mail it sends here instead of delivering it. Newest first."
        actions={
          <Button variant="secondary" size="sm" onClick={() => void messages.refetch()} busy={messages.isFetching}>
            <RefreshCw aria-hidden className="size-3.5" />
            Refresh
          </Button>
        }
      />
      {messages.isPending ? <Loading label="Loading messages…" /> : null}
      {messages.isError ? (
        <Notice tone="error" title="We could not load the caught mail">
          {messages.error.message}
        </Notice>
      ) : null}
      {messages.data && messages.data.messages.length === 0 ? (
        <EmptyState icon={<Inbox aria-hidden className="size-5" />} title="No mail caught yet.">
          Messages appear here as soon as the app sends one — for example, ask for a password reset from the sign-in page.
        </EmptyState>
      ) : null}
      {messages.data && messages.data.messages.length > 0 ? (
        <div className="grid grid-cols-[minmax(0,1fr)] items-start gap-5 xl:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
          <nav aria-label="Caught messages" className="overflow-hidden rounded-lg border border-line bg-panel">
            <ul className="divide-y divide-line">
              {messages.data.messages.map((message) => {
                const isSelected = message.id === selected;
                return (
                  <li key={message.id}>
                    <Link
                      to={`?message=${encodeURIComponent(message.id)}`}
                      aria-current={isSelected ? 'true' : undefined}
                      className={clsx('block px-3 py-2.5 hover:bg-sunken', isSelected && 'bg-accent-soft hover:bg-accent-soft')}
                    >
                      <span className="flex items-baseline justify-between gap-3">
                        <span className="truncate text-sm font-medium text-ink">{message.subject || '(no subject)'}</span>
                        <span className="shrink-0 text-[12px] text-ink-muted">{formatTimestampUtc(message.receivedAt)}</span>
                      </span>
                      <span className="mt-0.5 block truncate text-[12px] text-ink-muted">
                        <span className="sr-only">From </span>
                        {message.from}
                        <span aria-hidden> → </span>
                        <span className="sr-only"> to </span>
                        {message.to}
                      </span>
                    </Link>
                  </li>
                );
              })}
            </ul>
          </nav>
          {selected ? (
            <MailReader messageId={selected} />
          ) : (
            <p className="rounded-lg border border-dashed border-line-strong p-6 text-sm text-ink-muted">Choose a message to read it.</p>
          )}
        </div>
      ) : null}
    </>
  );
}
