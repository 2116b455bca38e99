import { clsx } from 'clsx';
import { hasExpired, isInForce } from '../../../../shared/issuances/in-force';
import type { Issuance } from '../api/issuance-schema';

type Standing = 'in_force' | 'expired' | 'superseded' | 'withdrawn';

const styles: Record<Standing, { label: string; className: string }> = {
  in_force: { label: 'In force', className: 'bg-ok-soft text-ok ring-ok/30' },
  expired: { label: 'Expired', className: 'bg-sunken text-ink-muted ring-line-strong' },
  superseded: { label: 'Superseded', className: 'bg-sunken text-ink-muted ring-line-strong' },
  withdrawn: { label: 'Withdrawn', className: 'bg-danger-soft text-danger ring-danger/30' },
};

/** Where an issuance stands at `now`, by the one in-force rule: a published one whose period ended is "Expired", never current. */
export function issuanceStanding(issuance: Pick<Issuance, 'state' | 'validFrom' | 'validUntil'>, now: Date): Standing {
  if (issuance.state === 'superseded' || issuance.state === 'withdrawn') return issuance.state;
  if (isInForce(issuance, now)) return 'in_force';
  return hasExpired(issuance, now) ? 'expired' : 'in_force';
}

/** In force, expired, superseded or withdrawn, in words. */
export function IssuanceStateBadge({ issuance, now }: { issuance: Pick<Issuance, 'state' | 'validFrom' | 'validUntil'>; now: Date }) {
  const style = styles[issuanceStanding(issuance, now)];
  return <span className={clsx('inline-flex rounded px-1.5 py-0.5 text-xs font-semibold ring-1 ring-inset', style.className)}>{style.label}</span>;
}
