import { Link } from 'react-router';
import type { SoundingSummary } from '../../../../shared/contracts/soundings';
import type { UnitFormatters } from '../../../hooks/use-units';
import { figureDefinitions, type FigureKey } from '../utils/sounding-figures';
import { formatValidTimeUtc } from '../utils/valid-time';
import { ModifiedBadge } from './modified-badge';

const popupFigures: readonly FigureKey[] = ['mlCape', 'muCape', 'mlCin', 'mlLclHeightM', 'precipitableWaterMm', 'surfaceDewpointC', 'bulkShear0to6kmMs', 'srh0to1km', 'stp'];

/** Key figures of one sounding on the map, and the way to its diagram. */
export function SoundingPopup({ sounding, units }: { sounding: SoundingSummary; units: UnitFormatters }) {
  return (
    <div className="min-w-52 font-sans text-ink">
      <p className="text-sm font-semibold">
        {sounding.stationId}
        {sounding.stationName ? <span className="font-normal text-ink-muted"> · {sounding.stationName}</span> : null}
      </p>
      <p className="text-[12px] text-ink-muted">
        {formatValidTimeUtc(sounding.validTime)} · {sounding.source === 'observed' ? 'Observed' : sounding.source === 'model' ? 'Model' : 'Source unknown'}
      </p>
      {sounding.modificationName !== null ? (
        <p className="mt-1">
          <ModifiedBadge name={sounding.modificationName} />
        </p>
      ) : null}
      <dl className="mt-2 grid grid-cols-[auto_auto] gap-x-3 text-[12px]">
        {popupFigures.map((key) => (
          <div key={key} className="contents">
            <dt className="text-ink-muted">{figureDefinitions[key].label}</dt>
            <dd className="text-right font-medium">{figureDefinitions[key].format(sounding.figures[key], units)}</dd>
          </div>
        ))}
      </dl>
      <Link to={`/soundings/${sounding.id}`} className="mt-2 inline-block text-[13px] font-semibold text-accent hover:underline">
        Open the diagram →
      </Link>
    </div>
  );
}
