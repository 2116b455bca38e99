import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { hazardKinds, hazardLabels } from '../../../../shared/contracts/risk-areas';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import type { Issuance } from '../api/issuance-schema';
import { dayLabel, formatInstant, hazardsText, levelsPresent, stepFor, validPeriodText } from '../utils/issuance-format';
import { boundsOfAreas, mapAreasOf } from '../utils/map-areas';
import { DiscussionText } from './discussion-text';
import { IssuanceDownloads } from './issuance-downloads';
import { IssuanceMap } from './issuance-map';
import { IssuanceStateBadge } from './issuance-state-badge';
import { MapLegend } from './map-legend';

interface IssuanceDetailsProps {
  issuance: Issuance;
  /** The bulletin links to the permanent page; the permanent page adds evidence and names (as children). */
  variant: 'bulletin' | 'page';
  /** The time "in force" is judged at (the page's clock). */
  now: Date;
  children?: ReactNode;
}

/** Everything the public needs from one issuance: map, legend, headline, valid times, discussion. */
export function IssuanceDetails({ issuance, variant, now, children }: IssuanceDetailsProps) {
  const snapshot = issuance.snapshot;
  const ladder = snapshot.riskLadder;
  const areas = mapAreasOf(snapshot.areas, ladder);
  const bounds = snapshot.office.region ?? boundsOfAreas(snapshot.areas) ?? { west: -100, south: 30, east: -85, north: 45 };
  const period = validPeriodText(issuance.validFrom, issuance.validUntil, snapshot.office.timeZone);
  const notes = hazardKinds.filter((kind) => (snapshot.hazardNotes[kind] ?? '').trim() !== '');

  return (
    <article aria-labelledby={`headline-${issuance.number}`} className="space-y-4">
      <header className="space-y-1.5">
        <div className="flex flex-wrap items-center gap-2 text-[13px] text-ink-muted">
          <span className="font-semibold text-ink">{dayLabel(issuance.day)}</span>
          <span aria-hidden>·</span>
          <span>
            Issuance{' '}
            {variant === 'bulletin' ? (
              <Link to={`/issuances/${issuance.number}`} className="font-semibold text-accent hover:underline">
                {issuance.number}
              </Link>
            ) : (
              <span className="font-semibold text-ink">{issuance.number}</span>
            )}
          </span>
          <IssuanceStateBadge issuance={issuance} now={now} />
          <span aria-hidden>·</span>
          <span>Published {formatInstant(issuance.publishedAt)}</span>
        </div>
        <h2 id={`headline-${issuance.number}`} className="text-lg font-semibold tracking-tight text-ink">
          {snapshot.headline || 'Severe-thunderstorm outlook'}
        </h2>
        <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-0.5 text-sm">
          <dt className="text-ink-muted">Valid (UTC)</dt>
          <dd>{period.utc}</dd>
          <dt className="text-ink-muted">Valid (office time)</dt>
          <dd>{period.local}</dd>
        </dl>
      </header>

      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <div className="space-y-2">
          <IssuanceMap label={`Risk map of issuance ${issuance.number}`} bounds={bounds} areas={areas} />
          <MapLegend levels={levelsPresent(ladder, snapshot.areas.map((a) => a.levelKey))} significantShown={areas.some((a) => a.significant)} />
        </div>
        <section aria-labelledby={`areas-${issuance.number}`} className="rounded-md border border-line bg-panel p-3">
          <h3 id={`areas-${issuance.number}`} className="text-[13px] font-semibold">
            Risk areas
          </h3>
          {areas.length === 0 ? (
            <p className="mt-1 text-sm text-ink-muted">No risk areas: severe storms are not expected.</p>
          ) : (
            <ul className="mt-2 space-y-2">
              {[...areas].reverse().map((area) => {
                const source = snapshot.areas.find((a) => a.id === area.id);
                return (
                  <li key={area.id} className="text-sm">
                    <RiskSwatch label={stepFor(ladder, source?.levelKey ?? '').label} colour={area.colour} />
                    {source?.label ? <span className="ml-1.5 text-ink">{source.label}</span> : null}
                    <p className="mt-0.5 text-[13px] text-ink-muted">{source && source.hazards.length ? hazardsText(source.hazards) : 'No specific hazard named'}</p>
                  </li>
                );
              })}
            </ul>
          )}
        </section>
      </div>

      <section aria-labelledby={`discussion-${issuance.number}`} className="rounded-md border border-line bg-panel p-4">
        <h3 id={`discussion-${issuance.number}`} className="mb-2 text-sm font-semibold">
          Discussion
        </h3>
        <DiscussionText markdown={snapshot.discussion} />
        {notes.length ? (
          <dl className="mt-3 space-y-1 border-t border-line pt-3 text-sm">
            {notes.map((kind) => (
              <div key={kind}>
                <dt className="inline font-semibold">{hazardLabels[kind]}: </dt>
                <dd className="inline text-ink-muted">{snapshot.hazardNotes[kind]}</dd>
              </div>
            ))}
          </dl>
        ) : null}
      </section>

      {children}

      <IssuanceDownloads issuanceNumber={issuance.number} />
    </article>
  );
}
