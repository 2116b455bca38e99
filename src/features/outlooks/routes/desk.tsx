import { PencilRuler, Plus } from 'lucide-react';
import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { SelectField, TextField } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import { useMe } from '../../../hooks/use-me';
import { useOffice } from '../../../hooks/use-office';
import { fieldErrorsFrom, isApiError, issuesFromZod, type FieldErrors } from '../../../lib/api-client';
import { formatTimestampUtc } from '../../../utils/time';
import { createOutlookInputSchema, outlookStates, type OutlookListQuery, type OutlookState } from '../../../../shared/contracts/outlooks';
import { useCreateOutlook } from '../../../api/outlooks/create-outlook';
import { useOutlooks } from '../../../api/outlooks/get-outlooks';
import { ladderLevel } from '../../../../shared/workflow/levels';
import { authoringRoles, hasRole } from '../../../../shared/workflow/roles';
import { outlookStateLabels } from '../../../../shared/workflow/states';
import { formatPeriod } from '../utils/valid-period';

const dayOptions = [
  { value: '', label: 'All days' },
  { value: '1', label: 'Day 1' },
  { value: '2', label: 'Day 2' },
  { value: '3', label: 'Day 3' },
];
const stateOptions = [{ value: '', label: 'All states' }, ...outlookStates.map((state) => ({ value: state, label: outlookStateLabels[state] }))];
const isState = (value: string): value is OutlookState => (outlookStates as readonly string[]).includes(value);

function NewOutlookForm() {
  const navigate = useNavigate();
  const create = useCreateOutlook();
  const [day, setDay] = useState('1');
  const [headline, setHeadline] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = createOutlookInputSchema.safeParse({ day: Number(day), headline });
    if (!parsed.success) {
      setErrors(fieldErrorsFrom(issuesFromZod(parsed.error)));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (outlook) => void navigate(`/outlooks/${outlook.id}`, { state: 'created' }),
      onError: (error) => setErrors(isApiError(error) ? fieldErrorsFrom(error.issues) : {}),
    });
  };

  return (
    <Panel title="New outlook" description="The valid period (06:00 to 06:00 office time) is computed from now; you can change it in the workspace.">
      <form onSubmit={submit} className="flex flex-wrap items-end gap-3" aria-label="New outlook">
        <SelectField label="Day" className="w-28" value={day} options={dayOptions.slice(1)} error={errors.day} onChange={(event) => setDay(event.target.value)} />
        <TextField label="Headline (optional)" className="min-w-64 flex-1" value={headline} maxLength={200} error={errors.headline} onChange={(event) => setHeadline(event.target.value)} />
        <Button type="submit" busy={create.isPending}>
          <Plus aria-hidden className="size-4" /> Start draft
        </Button>
      </form>
      {create.isError && !isApiError(create.error) ? (
        <Notice tone="error" className="mt-3">
          {create.error.message}
        </Notice>
      ) : null}
      {create.isError && isApiError(create.error) && create.error.issues.length === 0 ? (
        <Notice tone="error" className="mt-3">
          {create.error.message}
        </Notice>
      ) : null}
    </Panel>
  );
}

/** The forecast desk: outlooks (drafts, in review, published) with filters, and a new draft. */
export function DeskPage() {
  const me = useMe();
  const office = useOffice();
  const [day, setDay] = useState('');
  const [date, setDate] = useState('');
  const [state, setState] = useState('');
  const filters: OutlookListQuery = {
    ...(day ? { day: Number(day) } : {}),
    ...(/^\d{4}-\d{2}-\d{2}$/.test(date) ? { date } : {}),
    ...(isState(state) ? { state } : {}),
  };
  const outlooks = useOutlooks(filters);
  const timeZone = office.data?.timeZone ?? 'UTC';
  const ladder = office.data?.riskLadder ?? [];
  const mayAuthor = me.data ? hasRole(me.data.user.role, authoringRoles) : false;

  return (
    <>
      <PageHeader title="Forecast desk" description="Day 1, Day 2 and Day 3 outlooks: drafts in progress, drafts in review and published issues." />
      <div className="space-y-4">
        {mayAuthor ? <NewOutlookForm /> : null}
        <div className="flex flex-wrap items-end gap-3" role="group" aria-label="Filters">
          <SelectField label="Day" className="w-32" value={day} options={dayOptions} onChange={(event) => setDay(event.target.value)} />
          <TextField label="Valid on (date)" type="date" className="w-44" value={date} onChange={(event) => setDate(event.target.value)} />
          <SelectField label="State" className="w-40" value={state} options={stateOptions} onChange={(event) => setState(event.target.value)} />
          {day || date || state ? (
            <Button
              variant="ghost"
              size="sm"
              className="mb-1"
              onClick={() => {
                setDay('');
                setDate('');
                setState('');
              }}
            >
              Clear filters
            </Button>
          ) : null}
        </div>
        {outlooks.isError ? (
          <Notice tone="error" title="We could not load the outlooks">
            {outlooks.error.message}
          </Notice>
        ) : null}
        {outlooks.isPending ? <Loading label="Loading outlooks…" /> : null}
        {outlooks.data && outlooks.data.outlooks.length === 0 ? (
          <EmptyState icon={<PencilRuler aria-hidden className="size-5" />} title={day || date || state ? 'No outlooks match these filters.' : 'No outlooks yet.'}>
            Start a draft above, draw its risk areas on the map and back each one with soundings.
          </EmptyState>
        ) : null}
        {outlooks.data && outlooks.data.outlooks.length > 0 ? (
          <div className="relative overflow-x-auto rounded-lg border border-line bg-panel">
            <table className="w-full text-sm">
              <caption className="sr-only">Outlooks</caption>
              <thead className="border-b border-line bg-sunken text-left text-[12px] text-ink-muted">
                <tr>
                  <th scope="col" className="px-3 py-2 font-medium">
                    Outlook
                  </th>
                  <th scope="col" className="px-3 py-2 font-medium">
                    State
                  </th>
                  <th scope="col" className="px-3 py-2 font-medium">
                    Valid
                  </th>
                  <th scope="col" className="px-3 py-2 font-medium">
                    Highest level
                  </th>
                  <th scope="col" className="px-3 py-2 font-medium">
                    Areas
                  </th>
                  <th scope="col" className="px-3 py-2 font-medium">
                    Last edit
                  </th>
                </tr>
              </thead>
              <tbody>
                {outlooks.data.outlooks.map((outlook) => {
                  const highest = outlook.highestLevelKey ? ladderLevel(ladder, outlook.highestLevelKey) : null;
                  return (
                    <tr key={outlook.id} className="border-b border-line last:border-0 hover:bg-sunken/60">
                      <th scope="row" className="px-3 py-2 text-left font-normal">
                        <Link to={`/outlooks/${outlook.id}`} className="font-semibold text-accent hover:underline">
                          Day {outlook.day}: {outlook.headline.trim() || 'No headline yet'}
                        </Link>
                      </th>
                      <td className="px-3 py-2">
                        <span className="rounded bg-sunken px-1.5 py-0.5 text-[12px] font-semibold">{outlookStateLabels[outlook.state]}</span>
                      </td>
                      <td className="px-3 py-2 text-[13px]">
                        {formatPeriod(outlook.validFrom, outlook.validUntil, 'UTC')}
                        <span className="block text-[12px] text-ink-muted">{formatPeriod(outlook.validFrom, outlook.validUntil, timeZone)}</span>
                      </td>
                      <td className="px-3 py-2">{highest ? <RiskSwatch label={highest.label} colour={highest.colour} /> : <span className="text-[13px] text-ink-faint">none</span>}</td>
                      <td className="px-3 py-2">{outlook.areaCount}</td>
                      <td className="px-3 py-2 text-[12px] text-ink-muted">
                        {outlook.lastEditedByName ?? '—'}
                        <span className="block">{formatTimestampUtc(outlook.updatedAt)}</span>
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        ) : null}
      </div>
    </>
  );
}
