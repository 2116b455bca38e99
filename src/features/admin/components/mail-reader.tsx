import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { formatTimestampUtc } from '../../../utils/time';
import { useMailMessage } from '../api/get-mail-message';

/**
 * One caught message. The HTML renders in an iframe with an empty `sandbox` (no scripts, no
 * forms, no same-origin access), so a message can never act on this page.
 */
export function MailReader({ messageId }: { messageId: string }) {
  const message = useMailMessage(messageId);
  if (message.isPending) return <Loading label="Opening message…" />;
  if (message.isError) {
    return (
      <Notice tone="error" title="We could not open this message">
        {message.error.message}
      </Notice>
    );
  }
  const mail = message.data;
  return (
    <article aria-labelledby="mail-subject" className="rounded-lg border border-line bg-panel">
      <header className="border-b border-line px-4 py-3">
        <h2 id="mail-subject" className="text-base font-semibold">
          {mail.subject || '(no subject)'}
        </h2>
        <dl className="mt-2 grid grid-cols-[4rem_1fr] gap-y-0.5 text-[13px]">
          <dt className="text-ink-muted">From</dt>
          <dd className="break-all">{mail.from}</dd>
          <dt className="text-ink-muted">To</dt>
          <dd className="break-all">{mail.to}</dd>
          <dt className="text-ink-muted">Received</dt>
          <dd>{formatTimestampUtc(mail.receivedAt)}</dd>
        </dl>
      </header>
      <section aria-label="HTML version" className="border-b border-line p-4">
        <h3 className="mb-2 text-[12px] font-semibold tracking-wide text-ink-muted uppercase">HTML</h3>
        {mail.html ? (
          <iframe title={`HTML of “${mail.subject}”`} sandbox="" srcDoc={mail.html} className="h-[28rem] w-full rounded border border-line bg-white" />
        ) : (
          <p className="text-sm text-ink-muted">This message has no HTML part.</p>
        )}
      </section>
      <section aria-label="Plain-text version" className="p-4">
        <h3 className="mb-2 text-[12px] font-semibold tracking-wide text-ink-muted uppercase">Plain text</h3>
        {mail.text ? (
          <pre tabIndex={0} role="region" aria-label="Plain text of the message" className="max-h-80 overflow-auto rounded bg-sunken p-3 font-mono text-[13px] whitespace-pre-wrap">{mail.text}</pre>
        ) : (
          <p className="text-sm text-ink-muted">This message has no plain-text part.</p>
        )}
      </section>
    </article>
  );
}
