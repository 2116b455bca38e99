import type { FeatureCollection, Point } from 'geojson';
import { useMemo, useState } from 'react';
import { ButtonLink } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PointMap, type PointProperties } from '../../../lib/map/point-map';
import { soundingListQuerySchema, type SoundingSummary } from '../../../../shared/contracts/soundings';
import { useMe } from '../../../hooks/use-me';
import { useOffice } from '../../../hooks/use-office';
import { useUnits } from '../../../hooks/use-units';
import { useSoundings } from '../api/get-soundings';
import { FigureLegend } from '../components/figure-legend';
import { SoundingPopup } from '../components/sounding-popup';
import { colourFor, colourScales } from '../utils/map-colours';
import { figureDefinitions, isMapFigureKey, mapFigureKeys, type MapFigureKey } from '../utils/sounding-figures';
import { canWriteSoundings } from '../utils/sounding-permissions';
import { formatValidTimeShort } from '../utils/valid-time';
import { FieldControls } from '../../../components/model-fields/field-controls';
import { FieldLegend } from '../../../components/model-fields/field-legend';
import { useFieldLayer } from '../../../components/model-fields/use-field-layer';

const MAX_ROWS = 500;

/** The newest soundings (originals only) tell which valid times exist. */
const recentFilters = soundingListQuerySchema.parse({ pageSize: MAX_ROWS, sort: 'validTime', order: 'desc', modified: 'exclude' });

const parameterOptions = mapFigureKeys.map((key) => ({ value: key, label: figureDefinitions[key].name }));

function distinctValidTimes(soundings: readonly SoundingSummary[]): string[] {
  const times = new Set<string>();
  for (const sounding of soundings) if (sounding.validTime !== null) times.add(new Date(sounding.validTime).toISOString());
  return [...times].sort().reverse();
}

export function SoundingMapPage() {
  const office = useOffice();
  const me = useMe();
  const mayWrite = me.data !== undefined && me.data !== null && canWriteSoundings(me.data.user.role);
  const units = useUnits();
  const [parameter, setParameter] = useState<MapFigureKey>('mlCape');
  const fieldLayer = useFieldLayer();
  const [chosenTime, setChosenTime] = useState<string | null>(null);
  const recent = useSoundings(recentFilters);
  const validTimes = useMemo(() => distinctValidTimes(recent.data?.soundings ?? []), [recent.data]);
  const validTime = chosenTime !== null && validTimes.includes(chosenTime) ? chosenTime : (validTimes[0] ?? null);

  const atTime = useSoundings(
    soundingListQuerySchema.parse({ pageSize: MAX_ROWS, sort: 'stationId', order: 'asc', validFrom: validTime ?? undefined, validTo: validTime ?? undefined }),
  );
  const soundings = useMemo(() => (validTime === null ? [] : (atTime.data?.soundings ?? [])), [atTime.data, validTime]);
  const byId = useMemo(() => new Map(soundings.map((sounding) => [sounding.id, sounding])), [soundings]);

  const points = useMemo<FeatureCollection<Point, PointProperties>>(() => {
    const figure = figureDefinitions[parameter];
    return {
      type: 'FeatureCollection',
      features: soundings.flatMap((sounding) => (sounding.longitude === null || sounding.latitude === null ? [] : [{
        type: 'Feature' as const,
        geometry: { type: 'Point' as const, coordinates: [sounding.longitude, sounding.latitude] },
        properties: {
          id: sounding.id,
          colour: colourFor(sounding.figures[parameter], colourScales[parameter]),
          label: `${sounding.stationId}${sounding.modificationName !== null ? ` (modified: ${sounding.modificationName})` : ''}: ${figure.format(sounding.figures[parameter], units)}`,
          dashed: sounding.modificationName !== null,
        },
      }])),
    };
  }, [soundings, parameter, units]);

  const region = office.data?.region;

  return (
    <>
      <PageHeader
        title="Sounding map"
        description="Soundings at one valid time, coloured by the parameter you choose, over a model field if you pick one. Click a point for its key figures and the diagram."
        actions={
          <ButtonLink to="/soundings" variant="secondary">
            Sounding library
          </ButtonLink>
        }
      />
      <div className="mb-3 flex flex-wrap items-end gap-3">
        <SelectField
          label="Colour points by"
          className="w-64"
          value={parameter}
          options={parameterOptions}
          onChange={(event) => {
            if (isMapFigureKey(event.target.value)) setParameter(event.target.value);
          }}
        />
        <SelectField
          label="Valid time"
          className="w-56"
          value={validTime ?? ''}
          disabled={validTimes.length === 0}
          options={validTimes.length === 0 ? [{ value: '', label: 'No soundings yet' }] : validTimes.map((time) => ({ value: time, label: formatValidTimeShort(time) }))}
          onChange={(event) => setChosenTime(event.target.value)}
        />
        <FieldControls layer={fieldLayer} />
        {atTime.data && validTime !== null ? (
          <p className="pb-2 text-[13px] text-ink-muted" role="status">
            {soundings.length} {soundings.length === 1 ? 'sounding' : 'soundings'} at this time
            {atTime.data.total > soundings.length ? ` (showing the first ${soundings.length} of ${atTime.data.total})` : ''}
          </p>
        ) : null}
      </div>
      {office.isError || recent.isError || atTime.isError ? (
        <Notice tone="error" title="We could not load the map">
          {(office.error ?? recent.error ?? atTime.error)?.message}
        </Notice>
      ) : null}
      {recent.data && validTimes.length === 0 ? (
        <EmptyState title="No soundings to map yet" actions={mayWrite ? <ButtonLink to="/soundings/upload">Upload soundings</ButtonLink> : null}>
          {mayWrite ? 'Upload observed or model soundings; each appears here at its station for its valid time.' : 'Once forecasters upload soundings, each appears here at its station for its valid time.'}
        </EmptyState>
      ) : null}
      {region === undefined ? (
        <Loading label="Loading the map…" />
      ) : (
        <div className="grid grid-cols-[minmax(0,1fr)] items-start gap-3 xl:grid-cols-[minmax(0,1fr)_18rem]">
          <PointMap
            label="Map of soundings"
            className="h-[calc(100dvh-15rem)] min-h-96"
            region={region}
            points={points}
            tileUrl={office.data?.baseMap.tileUrl ?? undefined}
            tileAttribution={office.data?.baseMap.attribution ?? undefined}
            field={fieldLayer.mapField}
            renderPopup={(properties) => {
              const sounding = byId.get(properties.id);
              return sounding ? <SoundingPopup sounding={sounding} units={units} /> : null;
            }}
          />
          <div className="space-y-3">
            <FigureLegend figure={figureDefinitions[parameter]} scale={colourScales[parameter]} units={units} />
            {fieldLayer.field ? <FieldLegend field={fieldLayer.field} units={units.units} /> : null}
            {fieldLayer.error ? (
              <Notice tone="error" title="We could not draw the model field">
                {fieldLayer.error.message}
              </Notice>
            ) : null}
          </div>
        </div>
      )}
    </>
  );
}
