import { clsx } from 'clsx';
import { useId, useState, type FormEvent } from 'react';
import { saveModifiedSoundingInputSchema, type SaveModifiedSoundingInput } from '../../../../shared/contracts/soundings';
import type { Units } from '../../../../shared/contracts/users';
import type { SoundingLevel } from '../../../../shared/sounding';
import { describeDeltas } from './describe-deltas';
import { fromDisplayTemperature, temperatureUnitLabel, toDisplayTemperature } from './format';
import { PARCEL_LABELS, STANDARD_PARCELS } from './parcels';
import { parcelStartOptions, whatIfProblem, type WhatIfChange, type WhatIfResult } from './what-if';

export interface WhatIfEditorProps {
  /** The original (observed or modelled) levels. */
  levels: readonly SoundingLevel[];
  /** The current change (from useWhatIf). */
  change: WhatIfChange;
  /** Merge a partial change. */
  onChange: (partial: WhatIfChange) => void;
  onReset: () => void;
  /** Analyses of the original and of the modified sounding (from useWhatIf). */
  original: WhatIfResult;
  modified: WhatIfResult;
  units: Units;
  /** Save as a named modified sounding; the page sends it to POST /api/soundings/:soundingId/modified. */
  onSave?: (input: SaveModifiedSoundingInput) => void | Promise<unknown>;
  className?: string;
}

type Field = 'temperature' | 'dewpoint';
const inputClass =
  'block w-full rounded-md border border-line-strong bg-panel px-2.5 py-1.5 text-sm text-ink tabular-nums aria-[invalid=true]:border-danger';
const round1 = (value: number): number => Math.round(value * 10) / 10;

/** Change the surface temperature and dewpoint or the parcel start level; see the effect at once. */
export function WhatIfEditor({ levels, change, onChange, onReset, original, modified, units, onSave, className }: WhatIfEditorProps) {
  const id = useId();
  const surface = levels[0];
  const [drafts, setDrafts] = useState<Record<Field, string | null>>({ temperature: null, dewpoint: null });
  const [problem, setProblem] = useState<string | null>(null);
  const unitLabel = temperatureUnitLabel[units.temperature];

  if (!surface) return null;
  const temperatureC = change.surfaceTemperatureC ?? surface.temperatureC;
  const dewpointC = change.surfaceDewpointC ?? surface.dewpointC;
  const shown = (field: Field): string => {
    const draft = drafts[field];
    if (draft !== null) return draft;
    const value = field === 'temperature' ? temperatureC : dewpointC;
    return value === null ? '' : String(round1(toDisplayTemperature(value, units.temperature)));
  };

  const edit = (field: Field, text: string) => {
    setDrafts((old) => ({ ...old, [field]: text }));
    const number = Number(text);
    if (text.trim() === '' || !Number.isFinite(number)) {
      setProblem(`Enter the surface ${field} as a number in ${unitLabel}.`);
      return;
    }
    const valueC = fromDisplayTemperature(number, units.temperature);
    const next: WhatIfChange = field === 'temperature' ? { surfaceTemperatureC: valueC } : { surfaceDewpointC: valueC };
    const trouble = whatIfProblem(levels, { ...change, ...next });
    setProblem(trouble);
    if (!trouble) onChange(next);
  };

  const finishEditing = () => {
    setDrafts({ temperature: null, dewpoint: null });
    setProblem(null);
  };

  const startOptions = parcelStartOptions(levels);
  const parcelRows = [
    ...STANDARD_PARCELS.map((key) => ({ label: PARCEL_LABELS[key].long, before: original.analysis[key], after: modified.analysis[key] })),
    ...(original.chosenParcel && modified.chosenParcel
      ? [{ label: `From ${Math.round(modified.chosenParcel.parcelPressure)} hPa`, before: original.chosenParcel, after: modified.chosenParcel }]
      : []),
  ];
  const surfaceChanged = change.surfaceTemperatureC !== undefined || change.surfaceDewpointC !== undefined;

  return (
    <section className={clsx('space-y-3', className)} aria-labelledby={`${id}-title`}>
      <div className="flex items-center justify-between gap-2">
        <h3 id={`${id}-title`} className="text-sm font-semibold text-ink">
          What if…
        </h3>
        <button
          type="button"
          onClick={() => {
            finishEditing();
            onReset();
          }}
          className="h-7 rounded-md border border-line-strong bg-panel px-2.5 text-[13px] font-medium text-ink hover:bg-sunken"
        >
          Reset
        </button>
      </div>
      <div className="grid grid-cols-2 gap-3">
        {(['temperature', 'dewpoint'] as const).map((field) => (
          <div key={field}>
            <label htmlFor={`${id}-${field}`} className="mb-1 block text-[13px] font-medium text-ink">
              Surface {field} ({unitLabel})
            </label>
            <input
              id={`${id}-${field}`}
              type="number"
              step={0.5}
              inputMode="decimal"
              className={inputClass}
              value={shown(field)}
              onChange={(event) => edit(field, event.target.value)}
              onBlur={finishEditing}
              aria-invalid={problem && drafts[field] !== null ? true : undefined}
              aria-describedby={problem ? `${id}-problem` : undefined}
            />
          </div>
        ))}
      </div>
      {problem ? (
        <p id={`${id}-problem`} role="alert" className="text-[13px] font-medium text-danger">
          {problem}
        </p>
      ) : (
        <p className="text-[12px] text-ink-muted">Or drag the surface points on the diagram.</p>
      )}
      <div>
        <label htmlFor={`${id}-start`} className="mb-1 block text-[13px] font-medium text-ink">
          Lift a parcel from
        </label>
        <select
          id={`${id}-start`}
          className={inputClass}
          value={change.parcelStartPressureHpa === undefined ? '' : String(change.parcelStartPressureHpa)}
          onChange={(event) => onChange({ parcelStartPressureHpa: event.target.value === '' ? undefined : Number(event.target.value) })}
        >
          <option value="">Standard parcels only (SB, ML, MU)</option>
          {startOptions.map((pressure, index) => (
            <option key={pressure} value={String(pressure)}>
              {pressure} hPa{index === 0 ? ' (surface)' : ''}
            </option>
          ))}
        </select>
      </div>

      <div aria-live="polite">
        <h4 className="mb-1 text-[12px] font-semibold tracking-wide text-ink-muted uppercase">Against the original</h4>
        {surfaceChanged ? (
          <ul className="space-y-1 text-[13px] tabular-nums">
            {parcelRows.map((row) => {
              const delta = describeDeltas(row.before, row.after, units);
              return (
                <li key={row.label} title={delta.sentence}>
                  <span className="font-medium text-ink">{row.label}:</span> <span className={delta.changed ? 'text-ink' : 'text-ink-muted'}>{delta.text}</span>
                  <span className="sr-only"> ({delta.sentence})</span>
                </li>
              );
            })}
          </ul>
        ) : (
          <p className="text-[13px] text-ink-muted">No change yet: the sounding is as observed.</p>
        )}
      </div>

      {onSave ? <SaveForm change={change} onSave={onSave} /> : null}
    </section>
  );
}

function SaveForm({ change, onSave }: { change: WhatIfChange; onSave: (input: SaveModifiedSoundingInput) => void | Promise<unknown> }) {
  const id = useId();
  const [name, setName] = useState('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<{ name?: string; note?: string; form?: string }>({});
  const [status, setStatus] = useState<'idle' | 'saving' | 'saved'>('idle');

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const nothingChanged =
      change.surfaceTemperatureC === undefined && change.surfaceDewpointC === undefined && change.parcelStartPressureHpa === undefined;
    if (nothingChanged) {
      setErrors({ form: 'Change the surface values or choose a parcel level first: there is nothing to save yet.' });
      return;
    }
    const parsed = saveModifiedSoundingInputSchema.safeParse({
      name,
      note,
      ...(change.surfaceTemperatureC !== undefined ? { surfaceTemperatureC: round1(change.surfaceTemperatureC) } : {}),
      ...(change.surfaceDewpointC !== undefined ? { surfaceDewpointC: round1(change.surfaceDewpointC) } : {}),
      ...(change.parcelStartPressureHpa !== undefined ? { parcelStartPressureHpa: change.parcelStartPressureHpa } : {}),
    });
    if (!parsed.success) {
      const next: { name?: string; note?: string; form?: string } = {};
      for (const issue of parsed.error.issues) {
        const field = issue.path[0];
        if (field === 'name' || field === 'note') next[field] ??= issue.message;
        else next.form ??= issue.message;
      }
      setErrors(next);
      return;
    }
    setErrors({});
    setStatus('saving');
    try {
      await onSave(parsed.data);
      setStatus('saved');
    } catch {
      setStatus('idle');
      setErrors({ form: 'The modified sounding could not be saved. Check your connection and try again.' });
    }
  };

  return (
    <form onSubmit={(event) => void submit(event)} className="space-y-2 border-t border-line pt-3" aria-labelledby={`${id}-title`} noValidate>
      <h4 id={`${id}-title`} className="text-[12px] font-semibold tracking-wide text-ink-muted uppercase">
        Save as modified sounding
      </h4>
      <div>
        <label htmlFor={`${id}-name`} className="mb-1 block text-[13px] font-medium text-ink">
          Name
        </label>
        <input
          id={`${id}-name`}
          className={inputClass}
          value={name}
          maxLength={80}
          onChange={(event) => {
            setName(event.target.value);
            setStatus('idle');
          }}
          aria-invalid={errors.name ? true : undefined}
          aria-describedby={errors.name ? `${id}-name-error` : undefined}
        />
        {errors.name ? (
          <p id={`${id}-name-error`} className="mt-1 text-[13px] font-medium text-danger">
            {errors.name}
          </p>
        ) : null}
      </div>
      <div>
        <label htmlFor={`${id}-note`} className="mb-1 block text-[13px] font-medium text-ink">
          Note
        </label>
        <textarea
          id={`${id}-note`}
          className={clsx(inputClass, 'min-h-16')}
          value={note}
          maxLength={500}
          onChange={(event) => setNote(event.target.value)}
          aria-invalid={errors.note ? true : undefined}
        />
        {errors.note ? <p className="mt-1 text-[13px] font-medium text-danger">{errors.note}</p> : null}
      </div>
      {errors.form ? (
        <p role="alert" className="text-[13px] font-medium text-danger">
          {errors.form}
        </p>
      ) : null}
      <div className="flex items-center gap-3">
        <button
          type="submit"
          disabled={status === 'saving'}
          aria-busy={status === 'saving' || undefined}
          className="h-8 rounded-md bg-accent px-3 text-[13px] font-medium text-white hover:bg-accent-strong disabled:opacity-60"
        >
          Save as modified sounding
        </button>
        <span role="status" className="text-[13px] text-ok">
          {status === 'saved' ? 'Saved. The original is unchanged.' : ''}
        </span>
      </div>
    </form>
  );
}
