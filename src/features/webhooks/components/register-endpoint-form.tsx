import { useState, type FormEvent } from 'react';
import { createWebhookEndpointInputSchema, type CreatedWebhookEndpoint } from '../../../../shared/contracts/webhooks';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { fieldErrorsFrom, isApiError, issuesFromZod, type FieldErrors } from '../../../lib/api-client';
import { useCreateWebhookEndpoint } from '../api/create-webhook-endpoint';

/** Registers an endpoint (checked with the shared schema first) and reports the new secret to the page. */
export function RegisterEndpointForm({ onCreated }: { onCreated: (created: CreatedWebhookEndpoint) => void }) {
  const create = useCreateWebhookEndpoint();
  const [url, setUrl] = useState('');
  const [description, setDescription] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = createWebhookEndpointInputSchema.safeParse({ url, description });
    if (!parsed.success) return setErrors(fieldErrorsFrom(issuesFromZod(parsed.error)));
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (created) => {
        setUrl('');
        setDescription('');
        onCreated(created);
      },
      onError: (error) => {
        if (isApiError(error) && error.issues.length) setErrors(fieldErrorsFrom(error.issues));
      },
    });
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-3 rounded-lg border border-line bg-panel p-4 md:grid-cols-[2fr_1fr_auto] md:items-start">
      <TextField label="Endpoint address" type="url" value={url} onChange={(e) => setUrl(e.target.value)} error={errors.url} placeholder="https://alerts.example.org/stormdraft" hint="https:// only." />
      <TextField label="Description" value={description} onChange={(e) => setDescription(e.target.value)} error={errors.description} placeholder="County alerting hub" />
      <Button type="submit" busy={create.isPending} className="md:mt-6">
        Register endpoint
      </Button>
      {create.isError && !(isApiError(create.error) && create.error.issues.length) ? (
        <Notice tone="error" title="The endpoint was not registered" className="md:col-span-3">
          {create.error.message}
        </Notice>
      ) : null}
    </form>
  );
}
