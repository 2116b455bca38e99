import type { FeatureCollection, Point } from 'geojson';
import { MapPin, Pencil, Trash2 } from 'lucide-react';
import { useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { AreaEditorMap, type EditorMode } from '../../../lib/map/area-editor-map';
import type { MapRegion, PointProperties } from '../../../lib/map/point-map';
import { useAddAreaOfInterest } from '../api/add-area-of-interest';
import { useRemoveAreaOfInterest } from '../api/remove-area-of-interest';
import type { Subscription } from '../api/subscription-schemas';
import type { AreaGeometry } from '../../../../shared/contracts/outlooks';
import { areaGeometryFromShape, areasOfInterestCollection } from '../utils/alert-settings';
import { PlaceSearch } from './place-search';

const noPoints: FeatureCollection<Point, PointProperties> = { type: 'FeatureCollection', features: [] };
const PENDING_ID = 'new-area';

const kindLabels = { drawn: 'Drawn', county: 'County', state: 'State' } as const;

/** The subscriber's areas of interest: a map, the list with remove, and two ways to add one. */
export function AreasOfInterestPanel({ subscription, region }: { subscription: Subscription; region: MapRegion }) {
  const [mode, setMode] = useState<EditorMode>('select');
  const [pending, setPending] = useState<AreaGeometry | null>(null);
  const [name, setName] = useState('');
  const [nameProblem, setNameProblem] = useState<string | undefined>(undefined);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const add = useAddAreaOfInterest();
  const remove = useRemoveAreaOfInterest();

  const features = useMemo(() => {
    const shown = [...subscription.areas.map((a) => ({ id: a.id, name: a.name, geometry: a.geometry }))];
    if (pending) shown.push({ id: PENDING_ID, name: name.trim() || 'New area (unsaved)', geometry: pending });
    return areasOfInterestCollection(shown);
  }, [subscription.areas, pending, name]);

  const savePending = () => {
    if (!pending) return;
    if (name.trim() === '') {
      setNameProblem('Name the area, e.g. "Boone County EOC".');
      return;
    }
    add.mutate(
      { kind: 'drawn', name: name.trim(), geometry: pending },
      {
        onSuccess: () => {
          setPending(null);
          setName('');
          setNameProblem(undefined);
        },
      },
    );
  };

  const addedCodes = subscription.areas.flatMap((a) => (a.fipsCode ? [a.fipsCode] : []));

  return (
    <div className="space-y-4">
      <div className="relative">
        <AreaEditorMap
          label="Areas of interest map"
          className="h-[52dvh] min-h-80"
          region={region}
          areas={features}
          selectedId={selectedId}
          points={noPoints}
          layers={{ counties: true, soundings: false, areas: true }}
          mode={mode}
          onSelect={setSelectedId}
          onCreate={(shape) => {
            const geometry = areaGeometryFromShape(shape);
            if (geometry.ok) {
              setPending(geometry.value);
              setNameProblem(undefined);
            } else setNameProblem(geometry.error);
          }}
          onModeChange={setMode}
        />
        {mode === 'draw' ? (
          <p role="status" className="absolute top-2 left-1/2 z-[1000] -translate-x-1/2 rounded-md bg-ink px-3 py-1.5 text-[13px] text-white shadow">
            Click the corners of your area; click the first corner again to finish.
          </p>
        ) : null}
      </div>

      <div className="flex flex-wrap items-center gap-2">
        {mode === 'draw' ? (
          <Button variant="secondary" onClick={() => setMode('select')}>
            Stop drawing
          </Button>
        ) : (
          <Button variant="secondary" onClick={() => setMode('draw')} disabled={pending !== null}>
            <Pencil aria-hidden className="size-3.5" />
            Draw an area
          </Button>
        )}
        <span className="text-[13px] text-ink-muted">or search for a county or state below.</span>
      </div>

      {pending ? (
        <div className="rounded-md border border-accent bg-accent-soft p-3">
          <p className="mb-2 text-sm font-semibold">Name the area you drew, then save it.</p>
          <div className="flex flex-wrap items-end gap-2">
            <TextField label="Area name" className="min-w-60 flex-1" value={name} maxLength={80} error={nameProblem} onChange={(event) => setName(event.target.value)} />
            <Button onClick={savePending} busy={add.isPending}>
              Save area
            </Button>
            <Button
              variant="ghost"
              onClick={() => {
                setPending(null);
                setName('');
              }}
            >
              Discard
            </Button>
          </div>
        </div>
      ) : null}

      {add.isError ? (
        <Notice tone="error" title="The area was not added">
          {add.error.message}
        </Notice>
      ) : null}
      {remove.isError ? (
        <Notice tone="error" title="The area was not removed">
          {remove.error.message}
        </Notice>
      ) : null}

      <section aria-labelledby="areas-heading">
        <h3 id="areas-heading" className="mb-1.5 text-[13px] font-semibold text-ink">
          Your areas of interest ({subscription.areas.length})
        </h3>
        {subscription.areas.length === 0 ? (
          <p className="rounded-md border border-dashed border-line-strong px-3 py-4 text-sm text-ink-muted">
            <MapPin aria-hidden className="mr-1 inline size-4" />
            No areas yet, so no alerts can reach you. Draw your jurisdiction on the map, or search for its county or state below.
          </p>
        ) : (
          <ul aria-label="Areas of interest" className="divide-y divide-line rounded-md border border-line">
            {subscription.areas.map((area) => (
              <li key={area.id} className={`flex items-center justify-between gap-2 px-3 py-1.5 text-sm ${area.id === selectedId ? 'bg-accent-soft' : ''}`}>
                <button type="button" className="truncate text-left hover:underline" onClick={() => setSelectedId(area.id)}>
                  {area.name}
                  <span className="ml-2 text-[12px] text-ink-muted">{kindLabels[area.kind]}</span>
                </button>
                <Button variant="ghost" size="sm" aria-label={`Remove ${area.name}`} busy={remove.isPending && remove.variables === area.id} onClick={() => remove.mutate(area.id)}>
                  <Trash2 aria-hidden className="size-3.5" />
                  Remove
                </Button>
              </li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="place-search-heading">
        <h3 id="place-search-heading" className="mb-1.5 text-[13px] font-semibold text-ink">
          Add a county or state
        </h3>
        <PlaceSearch addedCodes={addedCodes} busy={add.isPending} onPick={(place) => add.mutate(place)} />
      </section>
    </div>
  );
}
