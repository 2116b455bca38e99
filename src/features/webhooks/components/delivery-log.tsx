import { clsx } from 'clsx';
import type { WebhookDelivery } from '../../../../shared/contracts/webhooks';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { formatTimestampUtc } from '../../../utils/time';
import { Button } from '../../../components/ui/button';
import { useWebhookDeliveries } from '../api/get-webhook-deliveries';
import { useRetryWebhookDelivery } from '../api/retry-webhook-delivery';

const badges: Record<WebhookDelivery['status'], { label: string; className: string }> = {
  queued: { label: 'Queued', className: 'bg-sunken text-ink' },
  delivering: { label: 'Delivering', className: 'bg-accent-soft text-ink' },
  delivered: { label: 'Delivered', className: 'bg-ok-soft text-ink' },
  failed: { label: 'Failed', className: 'bg-danger-soft text-danger' },
};

/** The delivery log of one endpoint: each event, its attempts, the last answer and when it went. */
export function DeliveryLog({ endpointId }: { endpointId: string }) {
  const log = useWebhookDeliveries(endpointId);
  const retry = useRetryWebhookDelivery();
  if (log.isPending) return <Loading label="Loading the delivery log…" />;
  if (log.isError)
    return (
      <Notice tone="error" title="We could not load the delivery log">
        {log.error.message}
      </Notice>
    );
  if (!log.data.deliveries.length) return <p className="text-[13px] text-ink-muted">No events yet. One is sent when an outlook is published, amended or withdrawn.</p>;
  return (
    <>
      {retry.isError ? (
        <Notice tone="error" title="The delivery was not retried" className="mb-2">
          {retry.error.message}
        </Notice>
      ) : null}
      <div className="overflow-x-auto rounded-md border border-line">
        <table className="w-full text-left text-[13px]">
          <caption className="sr-only">Delivery log</caption>
          <thead className="border-b border-line bg-sunken text-ink-muted">
            <tr>
              <th className="px-2 py-1.5 font-medium">Status</th>
              <th className="px-2 py-1.5 font-medium">Event</th>
              <th className="px-2 py-1.5 font-medium">Issuance</th>
              <th className="px-2 py-1.5 text-right font-medium">Attempts</th>
              <th className="px-2 py-1.5 font-medium">Last answer</th>
              <th className="px-2 py-1.5 font-medium">Delivered / next attempt</th>
              <th className="px-2 py-1.5 font-medium">webhook-id</th>
              <th className="px-2 py-1.5">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-line">
            {log.data.deliveries.map((d) => (
              <tr key={d.id}>
                <td className="px-2 py-1.5">
                  <span className={clsx('rounded px-1.5 py-0.5 text-[12px] font-semibold', badges[d.status].className)}>{badges[d.status].label}</span>
                </td>
                <td className="px-2 py-1.5">{d.eventType}</td>
                <td className="px-2 py-1.5 tabular-nums">{d.issuanceNumber}</td>
                <td className="px-2 py-1.5 text-right tabular-nums">{d.attempts}</td>
                <td className="px-2 py-1.5">{d.lastError ?? (d.lastStatusCode ? `HTTP ${d.lastStatusCode}` : '—')}</td>
                <td className="px-2 py-1.5 tabular-nums">{d.deliveredAt ? formatTimestampUtc(d.deliveredAt) : d.status === 'failed' ? '—' : formatTimestampUtc(d.nextAttemptAt)}</td>
                <td className="px-2 py-1.5 font-mono text-[12px]">{d.messageId}</td>
                <td className="px-2 py-1.5">
                  {d.status === 'failed' ? (
                    <Button variant="secondary" size="sm" busy={retry.isPending && retry.variables === d.id} onClick={() => retry.mutate(d.id)}>
                      Retry
                    </Button>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
