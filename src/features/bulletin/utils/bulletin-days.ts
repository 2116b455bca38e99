import { isInForce } from '../../../../shared/issuances/in-force';
import type { BulletinDay } from '../../../../shared/contracts/issuances';
import type { Issuance } from '../api/issuance-schema';
import { dayLabel, formatInstant } from './issuance-format';

/** A bulletin day as the page shows it, judged again at the page's clock (the answer may be a minute old). */
export type ShownDay =
  | { day: number; kind: 'in_force'; issuance: Issuance; withdrawn: BulletinDay['withdrawn'] }
  | { day: number; kind: 'none_in_force'; since: string | null; withdrawn: BulletinDay['withdrawn'] };

/**
 * Pairs each day with its issuance and applies the in-force rule once more at `now`: an issuance
 * that expired since the server answered is not shown as current; the day says since when.
 */
export function shownDays(days: readonly BulletinDay[], issuances: readonly Issuance[], now: Date): ShownDay[] {
  return days.map((d): ShownDay => {
    const issuance = issuances.find((i) => i.number === d.issuanceNumber);
    if (d.status === 'in_force' && issuance && isInForce(issuance, now)) return { day: d.day, kind: 'in_force', issuance, withdrawn: d.withdrawn };
    const since = d.status === 'in_force' ? (issuance?.validUntil ?? null) : d.since;
    return { day: d.day, kind: 'none_in_force', since, withdrawn: d.withdrawn };
  });
}

/** "No Day 2 outlook in force since Tue 1 Dec, 12:00 UTC (06:00 CST)", or without "since" when there never was one. */
export function noneInForceText(day: number, since: string | null, officeTimeZone: string): string {
  if (since === null) return `No ${dayLabel(day)} outlook is in force.`;
  const local = officeTimeZone === 'UTC' ? '' : ` (${formatInstant(since, officeTimeZone)})`;
  return `No ${dayLabel(day)} outlook in force since ${formatInstant(since)}${local}.`;
}
