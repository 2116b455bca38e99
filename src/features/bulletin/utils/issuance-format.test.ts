import { describe, expect, it } from 'vitest';
import { hazardsText, issuanceDownloads, levelsPresent, stepFor, validPeriodText } from './issuance-format';

const ladder = [
  { key: 'thunder', label: 'Thunderstorms', colour: '#dbe4ee', meaning: '' },
  { key: 'level1', label: 'Level 1 · Isolated', colour: '#a9c6e8', meaning: '' },
  { key: 'level2', label: 'Level 2 · Scattered', colour: '#6f9fd8', meaning: '' },
];

describe('issuance formatting', () => {
  it('when the office is in Chicago, gives the valid period in UTC and in local time', () => {
    const text = validPeriodText('2027-04-18T12:00:00Z', '2027-04-19T12:00:00Z', 'America/Chicago');
    expect(text.utc).toBe('Sun 18 Apr, 12:00 UTC – Mon 19 Apr, 12:00 UTC');
    expect(text.local).toBe('Sun 18 Apr, 07:00 CDT – Mon 19 Apr, 07:00 CDT');
  });

  it('when areas repeat a level, the legend lists each level once, lowest first', () => {
    expect(levelsPresent(ladder, ['level2', 'thunder', 'level2']).map((l) => l.key)).toEqual(['thunder', 'level2']);
  });

  it('when a snapshot names a level the ladder lacks, falls back to the key as its label', () => {
    expect(stepFor(ladder, 'level9').label).toBe('level9');
  });

  it('lists hazards in a fixed order and marks significant ones', () => {
    expect(hazardsText([{ hazard: 'hail', significant: false }, { hazard: 'tornado', significant: true }])).toBe('Tornado (significant), Large hail');
  });

  it('links every export by the permanent issuance number', () => {
    expect(issuanceDownloads('2027-0142').map((d) => d.href)).toEqual([
      '/api/public/issuances/2027-0142/geojson',
      '/api/public/issuances/2027-0142/kml',
      '/api/public/issuances/2027-0142/map.svg',
      '/api/public/issuances/2027-0142/map.png',
    ]);
  });
});
