import { useState, type FormEvent } from 'react';
import { createIntakeSourceInputSchema, type PullResult } from '../../../../shared/contracts/intake';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { fieldErrorsFrom, isApiError, issuesFromZod, type FieldErrors } from '../../../lib/api-client';
import { formatTimestampUtc } from '../../../utils/time';
import { useCreateIntakeSource } from '../api/create-intake-source';
import { useDeleteIntakeSource } from '../api/delete-intake-source';
import { useIntakeSources } from '../api/get-intake-sources';
import { usePullIntakeSource } from '../api/pull-intake-source';
import { parseHourList } from '../utils/hour-list';

const emptyForm = { name: '', urlTemplate: '', cycleHours: '0, 6, 12, 18', forecastHours: '0', intervalMinutes: '15', delayMinutes: '0', model: '', authorization: '' };

/** Admins: scheduled pull sources (address template, cycles, forecast hours, credentials kept on the server). */
export function PullSourcesPanel() {
  const sources = useIntakeSources(true);
  const create = useCreateIntakeSource();
  const remove = useDeleteIntakeSource();
  const pull = usePullIntakeSource();
  const [form, setForm] = useState(emptyForm);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [lastPull, setLastPull] = useState<{ name: string; result: PullResult } | null>(null);
  const set = (key: keyof typeof emptyForm) => (event: { target: { value: string } }) => setForm({ ...form, [key]: event.target.value });

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = createIntakeSourceInputSchema.safeParse({
      name: form.name,
      urlTemplate: form.urlTemplate,
      cycleHours: parseHourList(form.cycleHours),
      forecastHours: parseHourList(form.forecastHours),
      intervalMinutes: Number(form.intervalMinutes),
      delayMinutes: Number(form.delayMinutes),
      ...(form.model.trim() ? { model: form.model } : {}),
      ...(form.authorization.trim() ? { authorization: form.authorization } : {}),
    });
    // An hour list's problem (path "cycleHours.1") is shown under the list's own field.
    if (!parsed.success) return setErrors(fieldErrorsFrom(issuesFromZod(parsed.error).map((issue) => ({ ...issue, path: issue.path.split('.')[0] ?? issue.path }))));
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: () => setForm(emptyForm),
      onError: (error) => {
        if (isApiError(error) && error.issues.length) setErrors(fieldErrorsFrom(error.issues));
      },
    });
  }

  return (
    <section aria-labelledby="pull-sources-heading" className="mt-8">
      <h2 id="pull-sources-heading" className="mb-1 text-base font-semibold text-ink">
        Scheduled pulls
      </h2>
      <p className="mb-3 max-w-prose text-sm text-ink-muted">
        The server fetches each forecast hour of the latest cycle that should be published, from an address template with {'{yyyy}'} {'{mm}'} {'{dd}'} {'{hh}'} (cycle, UTC) and {'{fff}'} {'{ff}'} {'{fh}'} (forecast hour). The authorization value (e.g. “Bearer …”) stays on the server and is never shown again.
      </p>
      {sources.isError ? (
        <Notice tone="error" title="We could not load the pull sources">
          {sources.error.message}
        </Notice>
      ) : null}
      {lastPull ? (
        <Notice tone={lastPull.result.errors.length ? 'warning' : 'success'} title={`Pulled ${lastPull.name}`} className="mb-3">
          {lastPull.result.fetched} fetched · {lastPull.result.alreadyFetched} fetched before · {lastPull.result.notYetAvailable} not there yet
          {lastPull.result.errors.length ? ` · ${lastPull.result.errors.join('; ')}` : ''}
        </Notice>
      ) : null}
      {pull.isError ? (
        <Notice tone="error" title="The pull did not run" className="mb-3">
          {pull.error.message}
        </Notice>
      ) : null}
      <ul className="mb-4 grid gap-2">
        {sources.data?.sources.map((source) => (
          <li key={source.id} className="rounded-lg border border-line bg-panel p-3">
            <div className="flex flex-wrap items-start justify-between gap-2">
              <div className="min-w-0">
                <p className="font-medium">
                  {source.name} {source.enabled ? null : <span className="text-[13px] text-ink-muted">(off)</span>}
                </p>
                <p className="font-mono text-[13px] break-all">{source.urlTemplate}</p>
                <p className="text-[13px] text-ink-muted">
                  Cycles {source.cycleHours.join(', ')} UTC · hours {source.forecastHours.join(', ')} · every {source.intervalMinutes} min{source.hasAuthorization ? ' · credentials set' : ''}
                  {source.lastPolledAt ? ` · last checked ${formatTimestampUtc(source.lastPolledAt)}` : ''}
                </p>
                {source.lastError ? <p className="text-[13px] text-danger">{source.lastError}</p> : null}
              </div>
              <div className="flex gap-2">
                <Button size="sm" variant="secondary" busy={pull.isPending && pull.variables === source.id} onClick={() => pull.mutate(source.id, { onSuccess: (result) => setLastPull({ name: source.name, result }) })}>
                  Pull now
                </Button>
                <Button size="sm" variant="danger" busy={remove.isPending && remove.variables === source.id} onClick={() => remove.mutate(source.id)}>
                  Remove
                </Button>
              </div>
            </div>
          </li>
        ))}
      </ul>
      <form onSubmit={submit} noValidate className="grid gap-3 rounded-lg border border-line bg-panel p-4 md:grid-cols-2">
        <TextField label="Name" value={form.name} onChange={set('name')} error={errors.name} placeholder="Regional model" />
        <TextField label="Model (optional)" value={form.model} onChange={set('model')} error={errors.model} placeholder="RM3" />
        <TextField label="Address template" className="md:col-span-2" value={form.urlTemplate} onChange={set('urlTemplate')} error={errors.urlTemplate} placeholder="https://data.example.org/rm3/{yyyy}{mm}{dd}/{hh}/f{fff}.grib2" />
        <TextField label="Cycle hours (UTC)" value={form.cycleHours} onChange={set('cycleHours')} error={errors.cycleHours} />
        <TextField label="Forecast hours" value={form.forecastHours} onChange={set('forecastHours')} error={errors.forecastHours} />
        <TextField label="Check every (minutes)" inputMode="numeric" value={form.intervalMinutes} onChange={set('intervalMinutes')} error={errors.intervalMinutes} />
        <TextField label="Files expected after the cycle (minutes)" inputMode="numeric" value={form.delayMinutes} onChange={set('delayMinutes')} error={errors.delayMinutes} />
        <TextField label="Authorization (optional)" className="md:col-span-2" type="password" autoComplete="off" value={form.authorization} onChange={set('authorization')} error={errors.authorization} hint="Sent as the Authorization header; kept on the server." />
        <div className="md:col-span-2">
          <Button type="submit" busy={create.isPending}>
            Add pull source
          </Button>
        </div>
        {create.isError && !(isApiError(create.error) && create.error.issues.length) ? (
          <Notice tone="error" title="The source was not added" className="md:col-span-2">
            {create.error.message}
          </Notice>
        ) : null}
      </form>
    </section>
  );
}
