import { describe, expect, it } from 'vitest';
import { distanceKm, parseReportsCsv, parseReportsGeoJson, parseUtcTime } from './parse-reports';

const header = 'time_utc,latitude,longitude,hazard,hail_cm,gust_kmh,gust_measured,ef_rating,source,remark';
const good = '2027-04-18T21:15Z,38.41,-91.27,hail,4.5,,,,spotter,"Hail to 4.5 cm, trees stripped"';

function csv(...rows: string[]) {
  return ['# source: spotter', header, ...rows].join('\n');
}

function issuesOf(text: string) {
  const result = parseReportsCsv(text);
  if (result.ok) throw new Error('expected problems');
  return result.error;
}

describe('parseReportsCsv', () => {
  it('reads a file with metadata, a quoted remark holding a comma, and a default source', () => {
    const result = parseReportsCsv(csv(good, '2027-04-18T22:40Z,38.9,-90.8,tornado,,,,EF2,,Barn destroyed'));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.reports).toHaveLength(2);
    expect(result.value.reports[0]).toMatchObject({ hazard: 'hail', hailCm: 4.5, remark: 'Hail to 4.5 cm, trees stripped', source: 'spotter', time: '2027-04-18T21:15:00.000Z' });
    expect(result.value.reports[1]).toMatchObject({ hazard: 'tornado', efRating: 2, source: 'spotter' });
  });

  // Line numbers count the metadata line (1) and the header (2): the first report is on line 3.
  it.each([
    ['an impossible date (30 February)', '2027-02-30T21:15Z,38.41,-91.27,hail,4.5,,,,spotter,', 'time_utc'],
    ['a month 13', '2027-13-01T21:15Z,38.41,-91.27,hail,4.5,,,,spotter,', 'time_utc'],
    ['a time without zone', '2027-04-18T21:15,38.41,-91.27,hail,4.5,,,,spotter,', 'time_utc'],
    ['a latitude past 90', '2027-04-18T21:15Z,91,-91.27,hail,4.5,,,,spotter,', 'latitude'],
    ['a longitude that is not a number', '2027-04-18T21:15Z,38.41,west,hail,4.5,,,,spotter,', 'longitude'],
    ['an unknown hazard', '2027-04-18T21:15Z,38.41,-91.27,snow,,,,,spotter,', 'hazard'],
    ['hail of 1e308 cm', '2027-04-18T21:15Z,38.41,-91.27,hail,1e308,,,,spotter,', 'hail_cm'],
    ['a gust of 900 km/h', '2027-04-18T21:15Z,38.41,-91.27,wind,,900,yes,,spotter,', 'gust_kmh'],
    ['a gust-measured flag that is not yes/no', '2027-04-18T21:15Z,38.41,-91.27,wind,,100,maybe,,spotter,', 'gust_measured'],
    ['an EF rating of 7', '2027-04-18T21:15Z,38.41,-91.27,tornado,,,,EF7,spotter,', 'ef_rating'],
    ['an EF rating on a hail report', '2027-04-18T21:15Z,38.41,-91.27,hail,3,,,EF1,spotter,', 'ef_rating'],
    ['an unknown source', '2027-04-18T21:15Z,38.41,-91.27,hail,3,,,,newspaper,', 'source'],
  ])('refuses %s with the line and column', (_what, row, column) => {
    const issues = issuesOf(csv(good, row));
    expect(issues).toEqual([expect.objectContaining({ line: 4, column })]);
  });

  it('refuses a row with the wrong number of cells, naming the line', () => {
    expect(issuesOf(csv(good, '2027-04-18T21:15Z,38.41'))).toEqual([expect.objectContaining({ line: 4 })]);
  });

  it('refuses an unknown column and a missing required column on the header line', () => {
    const issues = issuesOf(['time_utc,latitude,hazard,colour', '2027-04-18T21:15Z,38.41,hail,red'].join('\n'));
    expect(issues.map((i) => i.column).sort()).toEqual(['colour', 'longitude']);
    expect(issues.every((i) => i.line === 1)).toBe(true);
  });

  it('refuses an unknown metadata key on its line', () => {
    expect(issuesOf(['# station: X1', header, good].join('\n'))).toEqual([expect.objectContaining({ line: 1 })]);
  });

  it('refuses an empty file and a file with no reports', () => {
    expect(issuesOf('')[0]?.message).toMatch(/header/);
    expect(issuesOf(header)[0]?.message).toMatch(/no reports/);
  });

  it('refuses a file over the size limit before parsing it', () => {
    const big = csv(...Array.from({ length: 30_000 }, () => good));
    expect(issuesOf(big)[0]?.message).toMatch(/larger than 2 MB/);
  });

  it('merges duplicates (same hazard, 5 km and 15 min apart at most), keeping the largest magnitude', () => {
    const result = parseReportsCsv(
      csv(
        '2027-04-18T21:15Z,38.41,-91.27,hail,2.5,,,,spotter,first',
        '2027-04-18T21:25Z,38.43,-91.27,hail,4.4,,,,public,second', // 2.2 km north, 10 min later: same event
        '2027-04-18T21:50Z,38.41,-91.27,hail,3.0,,,,public,later', // 35 min later: another event
        '2027-04-18T21:20Z,38.41,-91.27,wind,,100,no,,public,', // another hazard: kept
      ),
    );
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.merged).toBe(1);
    expect(result.value.reports).toHaveLength(3);
    expect(result.value.reports[0]).toMatchObject({ hazard: 'hail', hailCm: 4.4, remark: 'first / second' });
  });
});

describe('parseReportsGeoJson', () => {
  it('reads Point features with camelCase properties', () => {
    const result = parseReportsGeoJson({
      type: 'FeatureCollection',
      features: [{ type: 'Feature', geometry: { type: 'Point', coordinates: [-91.27, 38.41] }, properties: { time: '2027-04-18T21:15:00Z', hazard: 'wind', gustKmh: 130, gustMeasured: true, source: 'measured' } }],
    });
    expect(result.ok && result.value.reports[0]).toMatchObject({ hazard: 'wind', gustKmh: 130, gustMeasured: true, latitude: 38.41, longitude: -91.27 });
  });

  it('names the feature of each problem', () => {
    const result = parseReportsGeoJson({
      type: 'FeatureCollection',
      features: [
        { type: 'Feature', geometry: { type: 'Point', coordinates: [-91.27, 38.41] }, properties: { time: '2027-04-18T21:15:00Z', hazard: 'wind', source: 'public' } },
        { type: 'Feature', geometry: { type: 'LineString', coordinates: [[0, 0], [1, 1]] }, properties: {} },
      ],
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error).toEqual([expect.objectContaining({ feature: 1 })]);
  });

  it('refuses anything that is not a FeatureCollection', () => {
    expect(parseReportsGeoJson({ type: 'Feature' }).ok).toBe(false);
    expect(parseReportsGeoJson(null).ok).toBe(false);
  });
});

describe('helpers', () => {
  it('distanceKm: one degree of latitude is about 111.2 km (mean Earth radius 6371 km: 2π·6371/360 = 111.19 km)', () => {
    expect(distanceKm({ latitude: 10, longitude: 0 }, { latitude: 11, longitude: 0 })).toBeCloseTo(111.19, 1);
  });
  it('parseUtcTime keeps real dates and refuses rolled-over ones', () => {
    expect(parseUtcTime('2028-02-29T00:00Z')).toBe('2028-02-29T00:00:00.000Z'); // 2028 is a leap year
    expect(parseUtcTime('2027-02-29T00:00Z')).toBeUndefined();
    expect(parseUtcTime('0000-01-01T00:00Z')).toBeUndefined();
  });
});
