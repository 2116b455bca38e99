import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import type { Units } from '../../../../shared/contracts/users';
import { formatHeight, formatSpeed, formatTemperature, heightUnitLabel, speedUnitLabel, temperatureUnitLabel } from '../../../utils/units';
import { formFailureFrom } from '../../../utils/form';
import { useUpdatePreferences } from '../api/update-preferences';

interface ChoiceGroupProps<K extends string> {
  legend: string;
  name: string;
  value: K;
  options: Record<K, string>;
  onChange: (value: K) => void;
}

function ChoiceGroup<K extends string>({ legend, name, value, options, onChange }: ChoiceGroupProps<K>) {
  const keys = Object.keys(options) as K[];
  return (
    <fieldset>
      <legend className="mb-1.5 text-[13px] font-medium">{legend}</legend>
      <div className="inline-flex rounded-md border border-line-strong bg-panel p-0.5">
        {keys.map((key) => (
          <label
            key={key}
            className="cursor-pointer rounded px-3 py-1 text-sm text-ink-muted has-checked:bg-accent has-checked:text-white has-focus-visible:outline-2 has-focus-visible:outline-accent"
          >
            <input type="radio" className="sr-only" name={name} value={key} checked={value === key} onChange={() => onChange(key)} />
            {options[key]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** Sample values (SI) that show what a choice looks like: a warm surface, a cloud base, a jet. */
const SAMPLE_TEMPERATURE_K = 297.15;
const SAMPLE_HEIGHT_M = 1250;
const SAMPLE_SPEED_MPS = 25;

export function UnitsForm({ initial }: { initial: Units }) {
  const [units, setUnits] = useState<Units>(initial);
  const [saved, setSaved] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const update = useUpdatePreferences();

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setSaved(false);
    setError(null);
    update.mutate(
      { units },
      {
        onSuccess: () => setSaved(true),
        onError: (failure) => setError(formFailureFrom(failure).message),
      },
    );
  }

  const change = (patch: Partial<Units>) => {
    setSaved(false);
    setUnits((current) => ({ ...current, ...patch }));
  };

  return (
    <form onSubmit={handleSubmit} className="space-y-4">
      <div className="flex flex-wrap gap-6">
        <ChoiceGroup legend="Temperature" name="temperature" value={units.temperature} options={temperatureUnitLabel} onChange={(temperature) => change({ temperature })} />
        <ChoiceGroup legend="Height" name="height" value={units.height} options={heightUnitLabel} onChange={(height) => change({ height })} />
        <ChoiceGroup legend="Wind speed" name="speed" value={units.speed} options={speedUnitLabel} onChange={(speed) => change({ speed })} />
      </div>
      <p className="text-sm text-ink-muted" aria-live="polite">
        Example: a surface temperature of <strong className="text-ink">{formatTemperature(SAMPLE_TEMPERATURE_K, units.temperature)}</strong>, a
        cloud base at <strong className="text-ink">{formatHeight(SAMPLE_HEIGHT_M, units.height)}</strong> and a mid-level wind of{' '}
        <strong className="text-ink">{formatSpeed(SAMPLE_SPEED_MPS, units.speed)}</strong>.
      </p>
      {error ? <Notice tone="error">{error}</Notice> : null}
      {saved ? <Notice tone="success">Units saved. Soundings and evidence will show in these units.</Notice> : null}
      <Button type="submit" busy={update.isPending}>
        {update.isPending ? 'Saving…' : 'Save units'}
      </Button>
    </form>
  );
}
