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
