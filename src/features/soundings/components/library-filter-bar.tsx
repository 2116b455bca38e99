import { useEffect, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { inputClasses, SelectField } from '../../../components/ui/field';
import type { SoundingListQuery } from '../../../../shared/contracts/soundings';
import { isoToUtcInput, utcInputToIso } from '../utils/valid-time';

interface LibraryFilterBarProps {
  filters: SoundingListQuery;
  onChange: (change: Partial<SoundingListQuery>) => void;
  onClear: () => void;
}

const sourceOptions = [
  { value: '', label: 'All sources' },
  { value: 'observed', label: 'Observed' },
  { value: 'model', label: 'Model' },
];

const modifiedOptions = [
  { value: 'include', label: 'Originals and modified' },
  { value: 'exclude', label: 'Originals only' },
  { value: 'only', label: 'Modified only' },
];

/** Station search, valid-time range (UTC), source and modified filters for the library. */
export function LibraryFilterBar({ filters, onChange, onClear }: LibraryFilterBarProps) {
  const [station, setStation] = useState(filters.station ?? '');

  // Search as the forecaster types, after a short pause.
  useEffect(() => {
    const trimmed = station.trim();
    if (trimmed === (filters.station ?? '')) return;
    const timer = window.setTimeout(() => onChange({ station: trimmed === '' ? undefined : trimmed }), 300);
    return () => window.clearTimeout(timer);
  }, [station, filters.station, onChange]);

  const filtered =
    filters.station !== undefined || filters.source !== undefined || filters.validFrom !== undefined || filters.validTo !== undefined || filters.modified !== 'include';

  return (
    <form role="search" aria-label="Filter soundings" className="flex flex-wrap items-end gap-3 rounded-lg border border-line bg-panel px-3 py-3" onSubmit={(event) => event.preventDefault()}>
      <div className="w-36">
        <label htmlFor="library-station" className="mb-1 block text-[13px] font-medium text-ink">
          Station
        </label>
        <input id="library-station" type="search" className={inputClasses} value={station} placeholder="e.g. MV12" maxLength={16} onChange={(event) => setStation(event.target.value)} />
      </div>
      <div className="w-48">
        <label htmlFor="library-valid-from" className="mb-1 block text-[13px] font-medium text-ink">
          Valid from (UTC)
        </label>
        <input
          id="library-valid-from"
          type="datetime-local"
          className={inputClasses}
          value={isoToUtcInput(filters.validFrom)}
          onChange={(event) => onChange({ validFrom: utcInputToIso(event.target.value) })}
        />
      </div>
      <div className="w-48">
        <label htmlFor="library-valid-to" className="mb-1 block text-[13px] font-medium text-ink">
          Valid to (UTC)
        </label>
        <input
          id="library-valid-to"
          type="datetime-local"
          className={inputClasses}
          value={isoToUtcInput(filters.validTo)}
          onChange={(event) => onChange({ validTo: utcInputToIso(event.target.value) })}
        />
      </div>
      <SelectField
        label="Source"
        className="w-36"
        value={filters.source ?? ''}
        options={sourceOptions}
        onChange={(event) => {
          const value = event.target.value;
          onChange({ source: value === 'observed' || value === 'model' ? value : undefined });
        }}
      />
      <SelectField
        label="Modified soundings"
        className="w-60"
        value={filters.modified}
        options={modifiedOptions}
        onChange={(event) => {
          const value = event.target.value;
          if (value === 'include' || value === 'exclude' || value === 'only') onChange({ modified: value });
        }}
      />
      {filtered ? (
        <Button
          variant="ghost"
          onClick={() => {
            setStation('');
            onClear();
          }}
        >
          Clear filters
        </Button>
      ) : null}
    </form>
  );
}
