import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Webhook } from 'lucide-react';
import type { CreatedWebhookEndpoint } from '../../../../shared/contracts/webhooks';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { useDeleteWebhookEndpoint } from '../api/delete-webhook-endpoint';
import { webhookEndpointsQueryOptions, useWebhookEndpoints } from '../api/get-webhook-endpoints';
import { DeliveryLog } from '../components/delivery-log';
import { RegisterEndpointForm } from '../components/register-endpoint-form';

export const webhooksLoader = (queryClient: QueryClient) => () => queryClient.prefetchQuery(webhookEndpointsQueryOptions());

/** Webhook endpoints: register one, keep its secret (shown once), read each endpoint's delivery log. */
export function WebhooksPage() {
  const endpoints = useWebhookEndpoints();
  const remove = useDeleteWebhookEndpoint();
  const [created, setCreated] = useState<CreatedWebhookEndpoint | null>(null);
  const [open, setOpen] = useState<string | null>(null);

  return (
    <>
      <PageHeader
        title="Webhooks"
        description="Your systems receive a signed JSON event (Standard Webhooks: webhook-id, webhook-timestamp, webhook-signature) whenever an outlook is published, amended or withdrawn, with its GeoJSON and CAP link. Failed deliveries are retried with growing delays."
      />
      <RegisterEndpointForm onCreated={setCreated} />
      {created ? (
        <Notice tone="success" title="Endpoint registered: copy its signing secret now" className="mt-3">
          <p>This secret is shown only once. Your receiver uses it to check the webhook-signature header of every delivery.</p>
          <p className="mt-2 font-mono text-[13px] break-all" aria-label="Signing secret">
            {created.secret}
          </p>
          <Button variant="secondary" size="sm" className="mt-2" onClick={() => setCreated(null)}>
            I have stored it
          </Button>
        </Notice>
      ) : null}
      <div className="mt-5">
        {endpoints.isPending ? <Loading label="Loading your endpoints…" /> : null}
        {endpoints.isError ? (
          <Notice tone="error" title="We could not load your endpoints">
            {endpoints.error.message}
          </Notice>
        ) : null}
        {remove.isError ? (
          <Notice tone="error" title="The endpoint was not removed" className="mb-3">
            {remove.error.message}
          </Notice>
        ) : null}
        {endpoints.data && endpoints.data.endpoints.length === 0 ? (
          <EmptyState icon={<Webhook aria-hidden className="size-5" />} title="No endpoints yet.">
            Register the address of your alerting hub or GIS to receive outlooks as they are published.
          </EmptyState>
        ) : null}
        <ul className="grid gap-3">
          {endpoints.data?.endpoints.map((endpoint) => (
            <li key={endpoint.id} className="rounded-lg border border-line bg-panel p-3">
              <div className="flex flex-wrap items-start justify-between gap-2">
                <div className="min-w-0">
                  <p className="font-mono text-[13px] break-all">{endpoint.url}</p>
                  <p className="text-[13px] text-ink-muted">
                    {endpoint.description || 'No description'} · {endpoint.ownerEmail}
                  </p>
                </div>
                <div className="flex gap-2">
                  <Button variant="secondary" size="sm" aria-expanded={open === endpoint.id} onClick={() => setOpen(open === endpoint.id ? null : endpoint.id)}>
                    {open === endpoint.id ? 'Hide delivery log' : 'Delivery log'}
                  </Button>
                  <Button variant="danger" size="sm" busy={remove.isPending && remove.variables === endpoint.id} onClick={() => remove.mutate(endpoint.id)}>
                    Remove
                  </Button>
                </div>
              </div>
              {open === endpoint.id ? (
                <div className="mt-3">
                  <DeliveryLog endpointId={endpoint.id} />
                </div>
              ) : null}
            </li>
          ))}
        </ul>
      </div>
    </>
  );
}
