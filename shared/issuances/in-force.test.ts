import { describe, expect, it } from 'vitest';
import { hasExpired, isInForce } from './in-force';

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
