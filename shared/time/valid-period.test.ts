import { describe, expect, it } from 'vitest';
import { timeZoneOffsetMs, validPeriod } from './valid-period';

describe('timeZoneOffsetMs', () => {
  // US Central time is UTC−6 in standard time and UTC−5 in daylight time (common practice).
  it('When the instant is in January or July, then America/Chicago is −6 h or −5 h', () => {
    expect(timeZoneOffsetMs(Date.parse('2027-01-15T12:00:00Z'), 'America/Chicago')).toBe(-6 * 3600_000);
    expect(timeZoneOffsetMs(Date.parse('2027-07-15T12:00:00Z'), 'America/Chicago')).toBe(-5 * 3600_000);
  });
});

describe('validPeriod', () => {
  it('When a Day 1 outlook is issued at 15:00 UTC on 18 April (10:00 CDT), then it runs to 06:00 CDT on 19 April (11:00 UTC)', () => {
    const { validFrom, validUntil } = validPeriod(1, new Date('2027-04-18T15:00:00Z'), 'America/Chicago');
    expect(validFrom.toISOString()).toBe('2027-04-18T15:00:00.000Z');
    expect(validUntil.toISOString()).toBe('2027-04-19T11:00:00.000Z');
  });

  it('When Day 2 and Day 3 are issued the same morning, then they are the next two full outlook days', () => {
    const issued = new Date('2027-04-18T15:00:00Z');
    expect(validPeriod(2, issued, 'America/Chicago')).toEqual({ validFrom: new Date('2027-04-19T11:00:00Z'), validUntil: new Date('2027-04-20T11:00:00Z') });
    expect(validPeriod(3, issued, 'America/Chicago')).toEqual({ validFrom: new Date('2027-04-20T11:00:00Z'), validUntil: new Date('2027-04-21T11:00:00Z') });
  });

  it('When a Day 1 outlook is issued at 03:00 local, then it ends at 06:00 local the same morning', () => {
    const { validUntil } = validPeriod(1, new Date('2027-04-18T08:00:00Z'), 'America/Chicago');
    expect(validUntil.toISOString()).toBe('2027-04-18T11:00:00.000Z');
  });

  it('When the outlook day spans the change to daylight time, then it still ends at 06:00 local', () => {
    // 14 March 2027 is the second Sunday of March: US clocks go forward (common practice).
    const { validUntil } = validPeriod(1, new Date('2027-03-13T18:00:00Z'), 'America/Chicago');
    expect(validUntil.toISOString()).toBe('2027-03-14T11:00:00.000Z');
  });
});
