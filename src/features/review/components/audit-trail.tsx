import { Notice } from '../../../components/ui/notice';
import { formatTimestampUtc } from '../../../utils/time';
import { useAudit } from '../../../api/outlooks/get-audit';
import { auditActionWords } from '../utils/review-rules';

/** Who did what and when, newest first (append-only on the server). */
export function AuditTrail({ outlookId }: { outlookId: string }) {
  const audit = useAudit(outlookId);
  if (audit.isError) return <Notice tone="error">{audit.error.message}</Notice>;
  if (!audit.data) return null;
  return (
    <ol className="space-y-1.5 text-sm" aria-label="Audit trail">
      {audit.data.events.map((event) => (
        <li key={event.id} className="border-l-2 border-line pl-2.5">
          <p>
            <span className="font-semibold">{auditActionWords(event.action)}</span>
            {event.fromState && event.toState && event.fromState !== event.toState ? (
              <span className="text-ink-muted">
                {' '}
                ({event.fromState.replace('_', ' ')} → {event.toState.replace('_', ' ')})
              </span>
            ) : null}
            {typeof event.details.issuanceNumber === 'string' ? <span className="text-ink-muted"> as issuance {event.details.issuanceNumber}</span> : null}
            {event.details.fourEyesRelaxed === true ? <span className="text-warning"> (four-eyes rule relaxed by office setting)</span> : null}
          </p>
          <p className="text-[12px] text-ink-muted">
            {event.actorName ?? 'System'} · {formatTimestampUtc(event.createdAt)}
          </p>
          {event.comment ? <p className="mt-0.5 whitespace-pre-wrap text-[13px]">“{event.comment}”</p> : null}
        </li>
      ))}
    </ol>
  );
}
