import { describe, expect, it } from 'vitest';
import { hasExpired, inForceByDay, isInForce, type BulletinCandidate } from './in-force';

const period = { validFrom: '2027-04-18T12:00:00Z', validUntil: '2027-04-19T12:00:00Z' };

describe('isInForce', () => {
  it('when published and the period has not ended, is in force', () => {
    expect(isInForce({ ...period, state: 'published' }, new Date('2027-04-18T18:00:00Z'))).toBe(true);
  });
  it('when the period has ended, is not in force', () => {
    expect(isInForce({ ...period, state: 'published' }, new Date('2027-04-19T12:00:00Z'))).toBe(false);
    expect(hasExpired(period, new Date('2027-04-21T00:00:00Z'))).toBe(true);
  });
  it('when superseded or withdrawn, is not in force even inside its period', () => {
    const now = new Date('2027-04-18T18:00:00Z');
    expect(isInForce({ ...period, state: 'superseded' }, now)).toBe(false);
    expect(isInForce({ ...period, state: 'withdrawn' }, now)).toBe(false);
  });
});

describe('inForceByDay', () => {
  const now = new Date('2027-04-19T18:00:00Z');
  const issuance = (number: string, day: number, state: BulletinCandidate['state'], publishedAt: string, validUntil: string, withdrawnAt: string | null = null) => ({
    number, day, state, publishedAt, validFrom: publishedAt, validUntil, withdrawnAt,
  });

  it('when a Day 2 period has ended, the day has nothing in force and says since when', () => {
    const days = inForceByDay([issuance('A', 1, 'published', '2027-04-19T12:00:00Z', '2027-04-20T12:00:00Z')], [{ day: 2, endedAt: '2027-04-19T12:00:00Z' }], now);
    expect(days.map((d) => [d.day, d.status])).toEqual([[1, 'in_force'], [2, 'none_in_force']]);
    const day2 = days[1];
    expect(day2?.status === 'none_in_force' ? day2.since?.toISOString() : 'in force').toBe('2027-04-19T12:00:00.000Z');
  });

  it('when a candidate has expired (it was fetched a moment before), it is not shown as in force', () => {
    const [day1] = inForceByDay([issuance('A', 1, 'published', '2027-04-18T12:00:00Z', '2027-04-19T12:00:00Z')], [], now);
    expect(day1?.status).toBe('none_in_force');
  });

  it('when two issuances of a day are in force, the most recently published one is shown', () => {
    const [day1] = inForceByDay(
      [issuance('A', 1, 'published', '2027-04-19T06:00:00Z', '2027-04-20T12:00:00Z'), issuance('B', 1, 'published', '2027-04-19T16:00:00Z', '2027-04-20T12:00:00Z')],
      [],
      now,
    );
    expect(day1?.status === 'in_force' ? day1.issuance.number : 'none').toBe('B');
  });

  it('when the latest issuance of a day was withdrawn, the day shows the notice and nothing in force since the withdrawal', () => {
    const [day1] = inForceByDay(
      [issuance('B', 1, 'withdrawn', '2027-04-19T16:00:00Z', '2027-04-20T12:00:00Z', '2027-04-19T17:00:00Z')],
      [{ day: 1, endedAt: '2027-04-19T12:00:00Z' }],
      now,
    );
    expect(day1).toMatchObject({ status: 'none_in_force', since: new Date('2027-04-19T17:00:00Z'), withdrawn: { number: 'B' } });
  });

  it('when an older issuance is still in force after a newer one was withdrawn, it is shown with the withdrawal notice', () => {
    const [day1] = inForceByDay(
      [issuance('A', 1, 'published', '2027-04-19T06:00:00Z', '2027-04-20T12:00:00Z'), issuance('B', 1, 'withdrawn', '2027-04-19T16:00:00Z', '2027-04-20T12:00:00Z', '2027-04-19T17:00:00Z')],
      [],
      now,
    );
    expect(day1).toMatchObject({ status: 'in_force', issuance: { number: 'A' }, withdrawn: { number: 'B' } });
  });

  it('when a day has no issuance at all, it is left out', () => {
    expect(inForceByDay([], [], now)).toEqual([]);
  });
});
