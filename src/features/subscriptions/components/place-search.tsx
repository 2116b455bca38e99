import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { inputClasses } from '../../../components/ui/field';
import { usePlaces } from '../api/get-places';
import { placeLabel } from '../utils/alert-settings';

interface PlaceSearchProps {
  /** FIPS codes already among the areas of interest; they show as added. */
  addedCodes: readonly string[];
  busy: boolean;
  onPick: (place: { fipsCode: string; kind: 'county' | 'state' }) => void;
}

/** Finds counties and states by name; each result has an Add button. */
export function PlaceSearch({ addedCodes, busy, onPick }: PlaceSearchProps) {
  const [query, setQuery] = useState('');
  const [kind, setKind] = useState<'county' | 'state' | undefined>(undefined);
  const places = usePlaces(query, kind);
  const trimmed = query.trim();

  return (
    <div>
      <div className="flex gap-2">
        <label className="sr-only" htmlFor="place-search">
          Search counties and states
        </label>
        <input id="place-search" type="search" className={inputClasses} placeholder="County or state name, e.g. Boone" value={query} onChange={(event) => setQuery(event.target.value)} />
        <label className="sr-only" htmlFor="place-kind">
          Kind of place
        </label>
        <select
          id="place-kind"
          className={`${inputClasses} w-32`}
          value={kind ?? ''}
          onChange={(event) => setKind(event.target.value === 'county' || event.target.value === 'state' ? event.target.value : undefined)}
        >
          <option value="">Both</option>
          <option value="county">Counties</option>
          <option value="state">States</option>
        </select>
      </div>
      {trimmed.length === 1 ? <p className="mt-1 text-[13px] text-ink-muted">Type at least 2 letters.</p> : null}
      {places.isError ? <p className="mt-1 text-[13px] text-danger">{places.error.message}</p> : null}
      {places.data ? (
        places.data.places.length === 0 ? (
          <p className="mt-2 text-[13px] text-ink-muted">No county or state matches “{trimmed}”. Check the spelling, or draw the area on the map instead.</p>
        ) : (
          <ul aria-label="Matching places" className="mt-2 max-h-56 divide-y divide-line overflow-y-auto rounded-md border border-line">
            {places.data.places.map((place) => {
              const added = addedCodes.includes(place.fipsCode);
              return (
                <li key={place.fipsCode} className="flex items-center justify-between gap-2 px-2 py-1.5 text-sm">
                  <span>
                    {placeLabel(place)} <span className="text-[12px] text-ink-muted">{place.kind === 'county' ? 'county' : 'state'}</span>
                  </span>
                  <Button size="sm" variant="secondary" disabled={added || busy} onClick={() => onPick({ fipsCode: place.fipsCode, kind: place.kind })} aria-label={`Add ${placeLabel(place)}`}>
                    {added ? 'Added' : 'Add'}
                  </Button>
                </li>
              );
            })}
          </ul>
        )
      ) : null}
    </div>
  );
}
