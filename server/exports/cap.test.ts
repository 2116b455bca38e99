import { describe, expect, it } from 'vitest';
import { defaultRiskLadder, type RiskLevel } from '../../shared/contracts/office';
import { capCertainty, capDateTime, capPolygon, capReference, capSeverity, capUrgency } from './cap';

// Expected values are the mapping tables in docs/cap.md (our own mapping, not a published one).
describe('capSeverity', () => {
  it('When the default ladder is mapped, then it follows the docs/cap.md table', () => {
    expect(defaultRiskLadder.map((l) => capSeverity(l.key, defaultRiskLadder))).toEqual(['Minor', 'Moderate', 'Moderate', 'Severe', 'Severe', 'Extreme']);
  });
  it('When an admin shortens the ladder, then position still decides: lowest Minor, top Extreme', () => {
    const ladder: RiskLevel[] = [defaultRiskLadder[0], defaultRiskLadder[3], defaultRiskLadder[5]].filter((l): l is RiskLevel => l !== undefined);
    expect(ladder.map((l) => capSeverity(l.key, ladder))).toEqual(['Minor', 'Severe', 'Extreme']);
    const two = ladder.slice(0, 2);
    expect(two.map((l) => capSeverity(l.key, two))).toEqual(['Minor', 'Severe']);
  });
  it('When the level is not on the ladder, then Unknown', () => {
    expect(capSeverity('level9', defaultRiskLadder)).toBe('Unknown');
  });
});

describe('capUrgency and capCertainty', () => {
  const sent = new Date('2027-04-18T15:00:00Z');
  it('When the period has begun or begins within the hour, then Expected; later, Future; ended, Past; never Immediate', () => {
    expect(capUrgency(new Date('2027-04-18T12:00:00Z'), new Date('2027-04-19T12:00:00Z'), sent)).toBe('Expected');
    expect(capUrgency(new Date('2027-04-18T16:00:00Z'), new Date('2027-04-19T12:00:00Z'), sent)).toBe('Expected');
    expect(capUrgency(new Date('2027-04-18T16:00:01Z'), new Date('2027-04-19T12:00:00Z'), sent)).toBe('Future');
    expect(capUrgency(new Date('2027-04-17T12:00:00Z'), new Date('2027-04-18T15:00:00Z'), sent)).toBe('Past');
  });
  it('When the day is 1, then Likely; Days 2 and 3, Possible', () => {
    expect([1, 2, 3].map(capCertainty)).toEqual(['Likely', 'Possible', 'Possible']);
  });
});

describe('CAP value forms (OASIS CAP 1.2, section 3.2)', () => {
  it('When a UTC time is written, then it uses "-00:00" and never "Z"', () => {
    expect(capDateTime(new Date('2027-04-18T15:04:05.678Z'))).toBe('2027-04-18T15:04:05-00:00');
  });
  it('When a reference is written, then it is sender,identifier,sent', () => {
    expect(capReference({ sender: 'a@b', identifier: 'x-1', sent: new Date('2027-04-18T15:00:00Z') })).toBe('a@b,x-1,2027-04-18T15:00:00-00:00');
  });
  it('When a GeoJSON ring is converted, then pairs are lat,lon and the ring is closed', () => {
    expect(capPolygon([[-94, 38], [-93, 38], [-93, 39], [-94, 38]])).toBe('38,-94 38,-93 39,-93 38,-94');
    expect(capPolygon([[-94, 38], [-93, 38], [-93, 39]])).toBe('38,-94 38,-93 39,-93 38,-94');
  });
  it('When a ring has fewer than three distinct points, then no polygon is written', () => {
    expect(capPolygon([[-94, 38], [-93, 38]])).toBeNull();
  });
});
