import { ArrowLeft } from 'lucide-react';
import { Link } from 'react-router';
import type { SoundingSummary } from '../../../../shared/contracts/soundings';
import type { UnitFormatters } from '../../../hooks/use-units';
import { formatValidTimeLocal, formatValidTimeUtc } from '../utils/valid-time';
import { ModifiedBadge } from './modified-badge';

interface SoundingHeaderProps {
  sounding: SoundingSummary & { modificationNote: string | null };
  timeZone: string;
  units: UnitFormatters;
}

const coordinate = (value: number | null, positive: string, negative: string) => (value === null ? `no ${positive === 'N' ? 'latitude' : 'longitude'}` : `${Math.abs(value).toFixed(2)}° ${value >= 0 ? positive : negative}`);

const sourceLabel = { observed: 'Observed', model: 'Model', unknown: 'Source unknown' } as const;

/** Station, place, valid time (UTC and office time), source, uploader; modified soundings link to their original. */
export function SoundingHeader({ sounding, timeZone, units }: SoundingHeaderProps) {
  return (
    <header className="mb-4 border-b border-line pb-4">
      <Link to="/soundings" className="mb-2 inline-flex items-center gap-1 text-[13px] text-ink-muted hover:text-ink">
        <ArrowLeft aria-hidden className="size-3.5" />
        Sounding library
      </Link>
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h1 className="text-xl font-semibold tracking-tight text-ink">
          {sounding.stationId || 'No station'}
          {sounding.stationName ? <span className="font-normal text-ink-muted"> · {sounding.stationName}</span> : null}
        </h1>
        <span className="rounded bg-sunken px-1.5 py-0.5 text-[12px] font-semibold text-ink-muted">{sourceLabel[sounding.source]}</span>
        {sounding.modificationName !== null ? <ModifiedBadge name={sounding.modificationName} /> : null}
      </div>
      <dl className="mt-2 flex flex-wrap gap-x-6 gap-y-1 text-[13px] text-ink-muted">
        <div>
          <dt className="sr-only">Valid time</dt>
          <dd>
            <span className="font-medium text-ink">Valid {formatValidTimeUtc(sounding.validTime)}</span> ({formatValidTimeLocal(sounding.validTime, timeZone)})
          </dd>
        </div>
        <div>
          <dt className="sr-only">Position</dt>
          <dd>
            {coordinate(sounding.latitude, 'N', 'S')}, {coordinate(sounding.longitude, 'E', 'W')} · elevation {sounding.elevationM === null ? 'unknown' : units.height(sounding.elevationM)}
          </dd>
        </div>
        {sounding.uploadedByName ? (
          <div>
            <dt className="sr-only">Uploaded by</dt>
            <dd>Uploaded by {sounding.uploadedByName}</dd>
          </div>
        ) : null}
      </dl>
      {sounding.modifiedFromId !== null ? (
        <p className="mt-2 text-[13px] text-ink-muted">
          A what-if sounding made from{' '}
          <Link to={`/soundings/${sounding.modifiedFromId}`} className="font-medium text-accent hover:underline">
            the original {sounding.stationId} sounding
          </Link>
          .{sounding.modificationNote ? ` Note: ${sounding.modificationNote}` : ''}
        </p>
      ) : null}
    </header>
  );
}
