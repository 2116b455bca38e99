import type { QueryClient } from '@tanstack/react-query';
import { clsx } from 'clsx';
import { CloudLightning } from 'lucide-react';
import { useState } from 'react';
import { Link } from 'react-router';
import { ButtonLink } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import { useMe } from '../../../hooks/use-me';
import { useNow } from '../../../hooks/use-now';
import { useOffice } from '../../../hooks/use-office';
import { bulletinQuery, useBulletin } from '../../../api/issuances/get-bulletin';
import { IssuanceDetails } from '../components/issuance-details';
import { noneInForceText, shownDays } from '../utils/bulletin-days';
import { dayLabel, formatInstant } from '../utils/issuance-format';

/** Warms the bulletin while the page's code loads. */
export const bulletinLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(bulletinQuery());
  return null;
};

/** The public bulletin: per outlook day, the issuance in force now, open to everyone. */
export function BulletinPage() {
  const office = useOffice();
  const me = useMe();
  const bulletin = useBulletin();
  const now = useNow();
  const signedIn = Boolean(me.data);
  const days = bulletin.data ? shownDays(bulletin.data.days, bulletin.data.issuances, now) : [];
  const [chosenDay, setChosenDay] = useState<number | null>(null);
  const shown = days.find((d) => d.day === chosenDay) ?? days.find((d) => d.kind === 'in_force') ?? days[0];
  const timeZone = office.data?.timeZone ?? 'UTC';

  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm font-medium text-ink-muted">{office.data?.name ?? 'Regional forecast office'}</p>
        <h1 className="mt-1 text-2xl font-semibold tracking-tight">Severe-thunderstorm outlook</h1>
        <p className="mt-1 max-w-prose text-sm text-ink-muted">
          Where thunderstorms and severe storms are expected over the next one to three days, graded by risk level, with the
          forecasters’ discussion. Only outlooks in force are shown here.{' '}
          <Link to="/archive" className="text-accent hover:underline">
            Earlier issuances are in the archive.
          </Link>
        </p>
      </header>

      <Caution />

      {bulletin.isPending ? <Loading label="Loading the current outlook…" /> : null}
      {bulletin.isError ? (
        <Notice tone="error" title="The bulletin could not be loaded">
          {bulletin.error.message}
        </Notice>
      ) : null}

      {bulletin.isSuccess && shown === undefined ? (
        <EmptyState
          icon={<CloudLightning aria-hidden className="size-5" />}
          title="No outlook has been published yet"
          actions={
            signedIn ? null : (
              <ButtonLink to="/sign-in" variant="secondary">
                Sign in
              </ButtonLink>
            )
          }
        >
          When the office publishes its first outlook, the risk map, the headline and the discussion appear here. Emergency
          managers can register to be e-mailed when their area reaches the level they care about.
        </EmptyState>
      ) : null}

      {shown ? (
        <section aria-label="Outlooks in force" className="rounded-lg border border-line bg-panel">
          <div role="tablist" aria-label="Outlook day" className="flex gap-1 overflow-x-auto border-b border-line px-3 pt-2">
            {days.map((day) => {
              const selected = day.day === shown.day;
              return (
                <button
                  key={day.day}
                  type="button"
                  role="tab"
                  id={`tab-day-${day.day}`}
                  aria-selected={selected}
                  aria-controls={`panel-day-${day.day}`}
                  onClick={() => setChosenDay(day.day)}
                  className={clsx(
                    '-mb-px shrink-0 rounded-t-md border px-3.5 py-1.5 text-sm font-medium',
                    selected ? 'border-line border-b-panel bg-panel text-ink' : 'border-transparent text-ink-muted hover:text-ink',
                  )}
                >
                  {dayLabel(day.day)}
                  {day.kind === 'none_in_force' ? <span className="ml-1 font-normal text-ink-muted">· none in force</span> : null}
                </button>
              );
            })}
          </div>
          <div role="tabpanel" id={`panel-day-${shown.day}`} aria-labelledby={`tab-day-${shown.day}`} className="space-y-4 p-3 sm:p-4">
            {shown.withdrawn ? (
              <Notice tone="warning" title={`${dayLabel(shown.day)} issuance ${shown.withdrawn.number} was withdrawn`}>
                {shown.withdrawn.withdrawnAt ? `Withdrawn ${formatInstant(shown.withdrawn.withdrawnAt)}. ` : null}
                Reason: {shown.withdrawn.reason ?? 'none given'}. Do not use it for planning.{' '}
                <Link to={`/issuances/${shown.withdrawn.number}`} className="font-semibold text-accent hover:underline">
                  Read the withdrawn issuance.
                </Link>
              </Notice>
            ) : null}
            {shown.kind === 'in_force' ? (
              <IssuanceDetails issuance={shown.issuance} variant="bulletin" now={now} />
            ) : (
              <p className="rounded-md border border-line bg-sunken px-3 py-3 text-sm font-medium text-ink">
                {noneInForceText(shown.day, shown.since, timeZone)}{' '}
                <Link to="/archive" className="font-normal text-accent hover:underline">
                  Earlier issuances are in the archive.
                </Link>
              </p>
            )}
          </div>
        </section>
      ) : null}

      {office.data ? (
        <section aria-labelledby="ladder-title" className="rounded-lg border border-line bg-panel p-4">
          <h2 id="ladder-title" className="text-sm font-semibold">
            How to read the risk levels
          </h2>
          <ol className="mt-3 grid grid-cols-[auto_minmax(0,1fr)] items-center gap-x-3 gap-y-1.5">
            {office.data.riskLadder.map((level) => (
              <li key={level.key} className="col-span-2 grid grid-cols-subgrid items-center text-sm">
                <RiskSwatch label={level.label} colour={level.colour} />
                <span className="text-ink-muted">{level.meaning}</span>
              </li>
            ))}
          </ol>
        </section>
      ) : null}
    </div>
  );
}
