/**
 * When an issuance is "in force": the one rule the bulletin, the public JSON, the feeds, CAP and
 * the OGC endpoints share. An issuance is in force from publication until the end of its valid
 * period, unless it was superseded by an amendment or withdrawn.
 */

export type IssuanceStatus = 'published' | 'superseded' | 'withdrawn';

export interface IssuanceTiming {
  state: IssuanceStatus;
  validFrom: string | Date;
  validUntil: string | Date;
}

/** True while the issuance is published (not superseded or withdrawn) and its valid period has not ended at `now`. */
export function isInForce(issuance: IssuanceTiming, now: Date): boolean {
  if (issuance.state !== 'published') return false;
  return new Date(issuance.validUntil).getTime() > now.getTime();
}

/** True when the valid period ended at or before `now`, whatever the state. */
export function hasExpired(issuance: Pick<IssuanceTiming, 'validUntil'>, now: Date): boolean {
  return new Date(issuance.validUntil).getTime() <= now.getTime();
}

/** One issuance that may still matter to the bulletin: published or withdrawn, period not yet ended. */
export interface BulletinCandidate extends IssuanceTiming {
  day: number;
  publishedAt: string | Date;
  withdrawnAt?: string | Date | null;
}

/** The moment a day's latest issuance stopped being in force (expiry or withdrawal), per day. */
export interface DayEnding {
  day: number;
  endedAt: string | Date;
}

/** What the bulletin shows for one outlook day. */
export type DayInForce<T extends BulletinCandidate> =
  | { day: number; status: 'in_force'; issuance: T; withdrawn: T | null }
  | { day: number; status: 'none_in_force'; since: Date | null; withdrawn: T | null };

const time = (value: string | Date) => new Date(value).getTime();

/**
 * Picks, per outlook day, what is in force at `now`: the most recently published issuance that is
 * in force (an amendment replaces what it supersedes, which is no longer `published`). A
 * withdrawal published after it, whose period has not ended, comes with it as a notice. When
 * nothing is in force the day says since when: the latest of its endings (an expiry or a
 * withdrawal at or before `now`), or null when the day has never had an issuance in force.
 * Days that have neither a candidate nor an ending are left out; the result is sorted by day.
 */
export function inForceByDay<T extends BulletinCandidate>(candidates: readonly T[], endings: readonly DayEnding[], now: Date): DayInForce<T>[] {
  const days = new Set<number>([...candidates.map((c) => c.day), ...endings.map((e) => e.day)]);
  const result: DayInForce<T>[] = [];
  for (const day of [...days].sort((a, b) => a - b)) {
    const ofDay = candidates.filter((c) => c.day === day).sort((a, b) => time(b.publishedAt) - time(a.publishedAt));
    const current = ofDay.find((c) => isInForce(c, now)) ?? null;
    const withdrawn =
      ofDay.find((c) => c.state === 'withdrawn' && !hasExpired(c, now) && (current === null || time(c.publishedAt) > time(current.publishedAt))) ?? null;
    if (current) {
      result.push({ day, status: 'in_force', issuance: current, withdrawn });
      continue;
    }
    const ended = [
      ...endings.filter((e) => e.day === day).map((e) => time(e.endedAt)),
      ...(withdrawn?.withdrawnAt ? [time(withdrawn.withdrawnAt)] : []),
    ].filter((t) => t <= now.getTime());
    result.push({ day, status: 'none_in_force', since: ended.length ? new Date(Math.max(...ended)) : null, withdrawn });
  }
  return result;
}
