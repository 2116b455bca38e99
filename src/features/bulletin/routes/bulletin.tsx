import { CloudLightning } from 'lucide-react';
import { ButtonLink } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { EmptyState } from '../../../components/ui/empty-state';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import { useMe } from '../../../hooks/use-me';
import { useOffice } from '../../../hooks/use-office';

/** The public bulletin: the latest published outlook of the office, open to everyone. */
export function BulletinPage() {
  const office = useOffice();
  const me = useMe();
  const signedIn = Boolean(me.data);

  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm font-medium text-ink-muted">{office.data?.name ?? 'Regional forecast office'}</p>
        <h1 className="mt-1 text-2xl font-semibold tracking-tight">Severe-thunderstorm outlook</h1>
        <p className="mt-1 max-w-prose text-sm text-ink-muted">
          Where thunderstorms and severe storms are expected over the next one to three days, graded by risk level, with the
          forecasters’ discussion.
        </p>
      </header>

      <Caution />

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
