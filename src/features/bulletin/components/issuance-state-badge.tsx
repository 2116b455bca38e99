import { clsx } from 'clsx';
import type { Issuance } from '../api/issuance-schema';

const styles: Record<Issuance['state'], { label: string; className: string }> = {
  published: { label: 'Current', className: 'bg-ok-soft text-ok ring-ok/30' },
  superseded: { label: 'Superseded', className: 'bg-sunken text-ink-muted ring-line-strong' },
  withdrawn: { label: 'Withdrawn', className: 'bg-danger-soft text-danger ring-danger/30' },
};

/** Current, superseded or withdrawn, in words. */
export function IssuanceStateBadge({ state }: { state: Issuance['state'] }) {
  const style = styles[state];
  return <span className={clsx('inline-flex rounded px-1.5 py-0.5 text-xs font-semibold ring-1 ring-inset', style.className)}>{style.label}</span>;
}
