import { describe, expect, it } from 'vitest';
import type { Issuance } from '../api/issuance-schema';
import { noneInForceText, shownDays } from './bulletin-days';

const issuance = { number: '2027-0001', day: 2, state: 'published', validFrom: '2027-04-19T11:00:00Z', validUntil: '2027-04-20T11:00:00Z' } as Issuance;
const day2 = { day: 2, status: 'in_force' as const, issuanceNumber: '2027-0001', since: null, withdrawn: null };

describe('shownDays', () => {
  it('when the page clock is inside the period, shows the issuance as in force', () => {
    expect(shownDays([day2], [issuance], new Date('2027-04-19T18:00:00Z'))[0]?.kind).toBe('in_force');
  });
  it('when the period ended after the server answered, never shows the expired Day 2 as current and says since when', () => {
    expect(shownDays([day2], [issuance], new Date('2027-04-20T11:00:00Z'))[0]).toMatchObject({ kind: 'none_in_force', since: '2027-04-20T11:00:00Z' });
  });
});

describe('noneInForceText', () => {
  it('when given a time, says it in UTC and in the office zone', () => {
    // America/Chicago is on daylight time (CDT, UTC−5) in April 2027: 11:00 UTC is 06:00 CDT.
    expect(noneInForceText(2, '2027-04-20T11:00:00Z', 'America/Chicago')).toBe('No Day 2 outlook in force since Tue 20 Apr, 11:00 UTC (Tue 20 Apr, 06:00 CDT).');
  });
  it('when there never was one, says so without a time', () => {
    expect(noneInForceText(3, null, 'America/Chicago')).toBe('No Day 3 outlook is in force.');
  });
});
