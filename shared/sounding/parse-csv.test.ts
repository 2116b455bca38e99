import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decimalValue, parseSoundingCsv } from './parse-csv';
import { BASE_HEADER, BASE_ROWS, buildCsv, rowLine } from './testing/csv';
import type { ParsedSounding, SoundingIssue } from './types';

function parsed(text: string): ParsedSounding {
  const result = parseSoundingCsv(text, 'test.csv');
  if (!result.ok) throw new Error(`expected success, got ${JSON.stringify(result.error)}`);
  return result.value;
}

function issues(text: string): SoundingIssue[] {
  const result = parseSoundingCsv(text, 'test.csv');
  if (result.ok) throw new Error('expected failure');
  return result.error;
}

function errorWith(text: string, code: string): SoundingIssue {
  const found = issues(text).find((issue) => issue.code === code && issue.severity === 'error');
  if (!found) throw new Error(`no ${code} error in ${JSON.stringify(issues(text))}`);
  return found;
}

function warningWith(text: string, code: string): SoundingIssue {
  const found = parsed(text).warnings.find((issue) => issue.code === code);
  if (!found) throw new Error(`no ${code} warning`);
  return found;
}

const fixture = (name: string): string => readFileSync(new URL(`../../tests/fixtures/soundings/${name}`, import.meta.url), 'utf8');

describe('parseSoundingCsv: valid input', () => {
  it('reads metadata, levels and converts knots and direction to u/v', () => {
    const sounding = parsed(buildCsv());
    expect(sounding.metadata).toEqual({
      station: 'TST',
      name: 'Test Station',
      latitude: 38.4,
      longitude: -91.3,
      elevationM: 100,
      validTime: '2027-04-18T18:00:00.000Z',
      source: 'model',
    });
    expect(sounding.levels).toHaveLength(10);
    const surface = sounding.levels[0];
    // 10 kt from 170°: 1 kt = 1852/3600 m/s exactly (definition of the knot).
    expect(surface?.uMs).toBeCloseTo(-10 * (1852 / 3600) * Math.sin((170 * Math.PI) / 180), 10);
    expect(surface?.vMs).toBeCloseTo(-10 * (1852 / 3600) * Math.cos((170 * Math.PI) / 180), 10);
    expect(sounding.warnings).toEqual([]);
  });

  it('finds columns by header name in any order and converts Pa, K, °F, ft and u/v in knots', () => {
    const text = buildCsv({
      header: 'temperature_K,pressure_Pa,dewpoint_F,height_ft,u_kt,v_kt',
      rows: BASE_ROWS.map((row) => {
        const [p, z, t, td] = row.split(',').map(Number) as [number, number, number, number];
        return [t + 273.15, p * 100, (td * 9) / 5 + 32, z / 0.3048, 10, -5].join(',');
      }),
    });
    const sounding = parsed(text);
    expect(sounding.levels[2]?.pressureHpa).toBeCloseTo(900, 9);
    expect(sounding.levels[2]?.temperatureC).toBeCloseTo(21, 9);
    expect(sounding.levels[2]?.dewpointC).toBeCloseTo(15, 9);
    expect(sounding.levels[2]?.heightM).toBeCloseTo(1030, 6);
    expect(sounding.levels[2]?.uMs).toBeCloseTo(10 * (1852 / 3600), 9);
  });

  it('accepts wind speed in m/s, km/h and mph', () => {
    for (const [unit, factor] of [
      ['ms', 1],
      ['kmh', 3.6],
      ['mph', 3600 / 1609.344],
    ] as const) {
      const text = buildCsv({
        header: `pressure_hPa,height_m,temperature_C,dewpoint_C,wind_direction_deg,wind_speed_${unit}`,
        rows: BASE_ROWS.map((row) => row.replace(/,[^,]+,[^,]+$/, `,270,${10 * factor}`)),
      });
      expect(parsed(text).levels[0]?.uMs).toBeCloseTo(10, 9);
    }
  });

  it('takes relative humidity in place of dewpoint (rh_pct)', () => {
    const text = buildCsv({
      header: 'pressure_hPa,height_m,temperature_C,rh_pct',
      rows: BASE_ROWS.map((row) => row.split(',').slice(0, 3).join(',') + ',50'),
    });
    // 28 °C at 50 % RH: dewpoint about 16.7 °C (common practice).
    expect(parsed(text).levels[0]?.dewpointC).toBeCloseTo(16.7, 0);
  });

  it('sorts levels given in increasing pressure, with identical results', () => {
    const reversed = parsed(buildCsv({ rows: [...BASE_ROWS].reverse() }));
    expect(reversed.levels).toEqual(parsed(buildCsv()).levels);
  });

  it('treats empty, NA and -9999 cells as missing', () => {
    const rows = [...BASE_ROWS];
    rows[4] = '700,3100,8,NA,,';
    rows[5] = '500,5800,-10,-9999,-9999,-9999';
    const sounding = parsed(buildCsv({ rows }));
    expect(sounding.levels[4]?.dewpointC).toBeNull();
    expect(sounding.levels[4]?.uMs).toBeNull();
    expect(sounding.levels[5]?.dewpointC).toBeNull();
  });

  it('fills missing heights hypsometrically from the station elevation', () => {
    const rows = BASE_ROWS.map((row) => row.replace(/^([^,]+),[^,]+,/, '$1,,'));
    const sounding = parsed(buildCsv({ rows }));
    expect(sounding.levels[0]?.heightM).toBe(100);
    // 1000→950 hPa at Tv ≈ 300 K: Δz = (Rd/g)·Tv·ln(1000/950) ≈ 450 m (WallaceHobbs2006 eq. 3.29).
    expect((sounding.levels[1]?.heightM ?? 0) - 100).toBeGreaterThan(440);
    expect((sounding.levels[1]?.heightM ?? 0) - 100).toBeLessThan(460);
  });

  it.each(['bna_20021111_00z.csv', 'bna_20140728_00z.csv', 'oax_20140616_19z.csv'])('parses the observed fixture %s as it is', (name) => {
    const result = parseSoundingCsv(fixture(name), name);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.levels.length).toBeGreaterThan(50);
    expect(result.value.warnings.every((issue) => issue.severity === 'warning')).toBe(true);
    const pressures = result.value.levels.map((level) => level.pressureHpa);
    expect(pressures).toEqual([...pressures].sort((a, b) => b - a));
  });

  it('keeps the blank upper winds of the 2002 Nashville fixture as null', () => {
    const result = parseSoundingCsv(fixture('bna_20021111_00z.csv'), 'bna.csv');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const top = result.value.levels.at(-1);
    expect(top?.uMs).toBeNull();
    expect(result.value.warnings.some((issue) => issue.code === 'WIND_MISSING')).toBe(true);
  });
});

describe('parseSoundingCsv: one test per class of bad input', () => {
  it('FILE_TOO_LARGE: more than 2 MB', () => {
    expect(errorWith('#'.repeat(2 * 1024 * 1024 + 1), 'FILE_TOO_LARGE').message).toMatch(/2 MB/);
  });

  it('EMPTY_FILE: only metadata lines', () => {
    expect(errorWith('# station: X\n\n', 'EMPTY_FILE').message).toMatch(/header/);
  });

  it('MISSING_COLUMN: no temperature column, naming the header line', () => {
    const issue = errorWith(buildCsv({ header: 'pressure_hPa,height_m,temp,dewpoint_C,wind_direction_deg,wind_speed_kt' }), 'MISSING_COLUMN');
    expect(issue.line).toBe(rowLine(-1));
    expect(issue.message).toMatch(/temperature/);
  });

  it('UNSUPPORTED_UNIT: temperature in Rankine', () => {
    const issue = errorWith(buildCsv({ header: 'pressure_hPa,height_m,temperature_R,dewpoint_C,wind_direction_deg,wind_speed_kt' }), 'UNSUPPORTED_UNIT');
    expect(issue.column).toBe('temperature_R');
  });

  it('DUPLICATE_COLUMN: two temperature columns', () => {
    const issue = errorWith(buildCsv({ header: 'pressure_hPa,height_m,temperature_C,temperature_K,wind_direction_deg,wind_speed_kt' }), 'DUPLICATE_COLUMN');
    expect(issue.column).toBe('temperature_K');
  });

  it('UNKNOWN_COLUMN: an extra column is ignored with a warning', () => {
    const text = buildCsv({ header: `pressure_hPa,height_m,temperature_C,dewpoint_C,wind_direction_deg,wind_speed_kt,ozone_ppb`, rows: BASE_ROWS.map((r) => `${r},40`) });
    expect(warningWith(text, 'UNKNOWN_COLUMN').column).toBe('ozone_ppb');
  });

  it('NO_WIND_COLUMNS: a sounding without winds parses with a warning', () => {
    const text = buildCsv({ header: 'pressure_hPa,height_m,temperature_C,dewpoint_C', rows: BASE_ROWS.map((r) => r.split(',').slice(0, 4).join(',')) });
    expect(warningWith(text, 'NO_WIND_COLUMNS').severity).toBe('warning');
  });

  it('FIELD_COUNT: a row with a missing cell, naming its line', () => {
    const rows = [...BASE_ROWS];
    rows[3] = '850,1520,18,12,230';
    expect(errorWith(buildCsv({ rows }), 'FIELD_COUNT').line).toBe(rowLine(3));
  });

  it('NOT_A_NUMBER: text in a cell, naming line and column', () => {
    const rows = [...BASE_ROWS];
    rows[2] = '900,1030,warm,15,210,30';
    const issue = errorWith(buildCsv({ rows }), 'NOT_A_NUMBER');
    expect(issue).toMatchObject({ line: rowLine(2), column: 'temperature_C' });
    expect(issue.message).toMatch(/^test\.csv, line \d+, column temperature_C/);
  });

  it('MISSING_VALUE: a level without pressure', () => {
    const rows = [...BASE_ROWS];
    rows[2] = ',1030,21,15,210,30';
    expect(errorWith(buildCsv({ rows }), 'MISSING_VALUE')).toMatchObject({ line: rowLine(2), column: 'pressure_hPa' });
  });

  it('MISSING_TEMPERATURE: a level without temperature is dropped with a warning', () => {
    const rows = [...BASE_ROWS];
    rows[2] = '900,1030,NA,15,210,30';
    const sounding = parsed(buildCsv({ rows }));
    expect(sounding.levels).toHaveLength(9);
    expect(sounding.warnings.find((w) => w.code === 'MISSING_TEMPERATURE')).toMatchObject({ line: rowLine(2), column: 'temperature_C' });
  });

  it('PRESSURE_OUT_OF_RANGE: 1200 hPa is an error', () => {
    const rows = ['1200,0,30,20,170,10', ...BASE_ROWS];
    expect(errorWith(buildCsv({ rows }), 'PRESSURE_OUT_OF_RANGE').line).toBe(rowLine(0));
  });

  it('PRESSURE_OUT_OF_RANGE: levels above 10 hPa are dropped with a warning', () => {
    const rows = [...BASE_ROWS, '8,33000,-35,-70,90,20'];
    const sounding = parsed(buildCsv({ rows }));
    expect(sounding.levels).toHaveLength(10);
    expect(sounding.warnings.find((w) => w.code === 'PRESSURE_OUT_OF_RANGE')?.line).toBe(rowLine(10));
  });

  it('TEMPERATURE_OUT_OF_RANGE: 75 °C', () => {
    const rows = [...BASE_ROWS];
    rows[0] = '1000,100,75,20,170,10';
    expect(errorWith(buildCsv({ rows }), 'TEMPERATURE_OUT_OF_RANGE')).toMatchObject({ line: rowLine(0), column: 'temperature_C' });
  });

  it('DEWPOINT_OUT_OF_RANGE: −200 °C', () => {
    const rows = [...BASE_ROWS];
    rows[7] = '300,9500,-38,-200,270,60';
    expect(errorWith(buildCsv({ rows }), 'DEWPOINT_OUT_OF_RANGE').column).toBe('dewpoint_C');
  });

  it('RELATIVE_HUMIDITY_OUT_OF_RANGE: 130 %', () => {
    const text = buildCsv({
      header: 'pressure_hPa,height_m,temperature_C,rh_pct',
      rows: BASE_ROWS.map((row, i) => row.split(',').slice(0, 3).join(',') + (i === 1 ? ',130' : ',50')),
    });
    expect(errorWith(text, 'RELATIVE_HUMIDITY_OUT_OF_RANGE')).toMatchObject({ line: rowLine(1), column: 'rh_pct' });
  });

  it('DEWPOINT_ABOVE_TEMPERATURE: 1 K above is clipped to the temperature with a warning naming the line', () => {
    const rows = [...BASE_ROWS];
    rows[1] = '950,560,24,25,190,20';
    const sounding = parsed(buildCsv({ rows }));
    expect(sounding.levels[1]?.dewpointC).toBe(24);
    expect(warningWith(buildCsv({ rows }), 'DEWPOINT_ABOVE_TEMPERATURE')).toMatchObject({ line: rowLine(1), column: 'dewpoint_C' });
  });

  it('DEWPOINT_ABOVE_TEMPERATURE: up to 0.5 K above is capped with a warning', () => {
    const rows = [...BASE_ROWS];
    rows[1] = '950,560,24,24.3,190,20';
    const sounding = parsed(buildCsv({ rows }));
    expect(sounding.levels[1]?.dewpointC).toBe(24);
    expect(sounding.warnings.find((w) => w.code === 'DEWPOINT_ABOVE_TEMPERATURE')?.line).toBe(rowLine(1));
  });

  it('WIND_OUT_OF_RANGE: direction 400°', () => {
    const rows = [...BASE_ROWS];
    rows[2] = '900,1030,21,15,400,30';
    expect(errorWith(buildCsv({ rows }), 'WIND_OUT_OF_RANGE')).toMatchObject({ line: rowLine(2), column: 'wind_direction_deg' });
  });

  it('WIND_INCOMPLETE: direction without speed is a warning and the wind is missing', () => {
    const rows = [...BASE_ROWS];
    rows[2] = '900,1030,21,15,210,';
    const sounding = parsed(buildCsv({ rows }));
    expect(sounding.levels[2]?.uMs).toBeNull();
    expect(sounding.warnings.find((w) => w.code === 'WIND_INCOMPLETE')?.column).toBe('wind_speed_kt');
  });

  it('DUPLICATE_PRESSURE: two different levels at 850 hPa are refused, naming both lines', () => {
    const rows = [...BASE_ROWS];
    rows.splice(4, 0, '850,1530,17,11,230,35');
    const issue = errorWith(buildCsv({ rows }), 'DUPLICATE_PRESSURE');
    expect(issue).toMatchObject({ line: rowLine(4), column: 'pressure_hPa' });
    expect(issue.message).toContain(`line ${rowLine(3)}`);
  });

  it('DUPLICATE_PRESSURE: an identical repeated level is merged with a warning', () => {
    const rows = [...BASE_ROWS];
    rows.splice(4, 0, rows[3] as string);
    const sounding = parsed(buildCsv({ rows }));
    expect(sounding.levels).toHaveLength(BASE_ROWS.length);
    expect(warningWith(buildCsv({ rows }), 'DUPLICATE_PRESSURE').line).toBe(rowLine(4));
  });

  it('LEVELS_SORTED: levels in any order are sorted by decreasing pressure, with a warning', () => {
    const rows = [BASE_ROWS[3], BASE_ROWS[0], BASE_ROWS[7], BASE_ROWS[1], BASE_ROWS[9], BASE_ROWS[2], BASE_ROWS[4], BASE_ROWS[8], BASE_ROWS[5], BASE_ROWS[6]] as string[];
    const sounding = parsed(buildCsv({ rows }));
    expect(sounding.levels.map((l) => l.pressureHpa)).toEqual([1000, 950, 900, 850, 700, 500, 400, 300, 250, 200]);
    expect(sounding.levels).toEqual(parsed(buildCsv()).levels);
    expect(warningWith(buildCsv({ rows }), 'LEVELS_SORTED').severity).toBe('warning');
  });

  it('HEIGHT_NOT_INCREASING: a height below the level beneath is a warning and heights are computed instead', () => {
    const rows = [...BASE_ROWS];
    rows[3] = '850,900,18,12,230,35';
    expect(warningWith(buildCsv({ rows }), 'HEIGHT_NOT_INCREASING')).toMatchObject({ line: rowLine(3), column: 'height_m' });
    const heights = parsed(buildCsv({ rows })).levels.map((l) => l.heightM);
    for (let i = 1; i < heights.length; i++) expect(heights[i]).toBeGreaterThan(heights[i - 1] as number);
  });

  it('no heights and no elevation: heights above ground start at 0 m, with a warning', () => {
    const rows = BASE_ROWS.map((row) => row.replace(/^([^,]+),[^,]+,/, '$1,,'));
    const sounding = parsed(buildCsv({ rows, metadata: { elevation_m: null } }));
    expect(sounding.levels[0]?.heightM).toBe(0);
    expect(sounding.metadata.elevationM).toBeNull();
    expect(sounding.warnings.some((w) => w.code === 'MISSING_METADATA' && /start at 0 m/.test(w.message))).toBe(true);
  });

  it('ELEVATION_MISMATCH: lowest height 400 m from the station elevation (warning)', () => {
    expect(warningWith(buildCsv({ metadata: { elevation_m: '500' } }), 'ELEVATION_MISMATCH').severity).toBe('warning');
  });

  it('TOO_FEW_LEVELS: four levels', () => {
    expect(errorWith(buildCsv({ rows: [BASE_ROWS[0], BASE_ROWS[3], BASE_ROWS[5], BASE_ROWS[8]] as string[] }), 'TOO_FEW_LEVELS').message).toMatch(/at least 5/);
  });

  it('TOO_MANY_LEVELS: more than 5,000 levels', () => {
    const rows = Array.from({ length: 5001 }, (_, i) => `${1000 - i * 0.19},,20,10,180,10`);
    expect(errorWith(buildCsv({ rows }), 'TOO_MANY_LEVELS').message).toMatch(/5000/);
  });

  it('TOP_TOO_LOW: a sounding that ends at 700 hPa is kept with a warning naming its top line', () => {
    expect(warningWith(buildCsv({ rows: BASE_ROWS.slice(0, 5) }), 'TOP_TOO_LOW')).toMatchObject({ line: rowLine(4) });
  });

  it('SURFACE_DEWPOINT_MISSING: no dewpoint at the lowest level', () => {
    const rows = [...BASE_ROWS];
    rows[0] = '1000,100,28,,170,10';
    expect(errorWith(buildCsv({ rows }), 'SURFACE_DEWPOINT_MISSING')).toMatchObject({ line: rowLine(0), column: 'dewpoint_C' });
  });

  it('DATA_GAP: 400 to 250 hPa with nothing between is a warning', () => {
    const rows = BASE_ROWS.filter((_, i) => i !== 7);
    expect(warningWith(buildCsv({ rows }), 'DATA_GAP').line).toBe(rowLine(7));
  });

  it.each(['station', 'latitude', 'longitude', 'valid'])('MISSING_METADATA: no "# %s" line is a warning, never an error', (key) => {
    const issue = warningWith(buildCsv({ metadata: { [key]: null } }), 'MISSING_METADATA');
    expect(issue.column).toBe(`# ${key}`);
  });

  it('MISSING_METADATA: no source is a warning and the source is "unknown", never "observed"', () => {
    const sounding = parsed(buildCsv({ metadata: { source: null } }));
    expect(sounding.metadata.source).toBe('unknown');
    expect(sounding.warnings.some((w) => w.code === 'MISSING_METADATA')).toBe(true);
  });

  it('a file with only the header row and levels (no metadata, empty heights) parses with warnings', () => {
    const rows = BASE_ROWS.map((row) => row.replace(/^([^,]+),[^,]+,/, '$1,,'));
    const text = [BASE_HEADER, ...rows].join('\n');
    const sounding = parsed(text);
    expect(sounding.metadata).toEqual({ station: '', name: '', latitude: null, longitude: null, elevationM: null, validTime: null, source: 'unknown' });
    expect(sounding.levels[0]?.heightM).toBe(0);
    expect(sounding.warnings.filter((w) => w.code === 'MISSING_METADATA')).toHaveLength(6);
  });

  // Issue 11 item 12: Date.parse rolls 30 February over to 2 March; the parser must refuse it.
  it.each(['2027-02-30T00:00:00Z', '2027-04-31T12:00Z', '2027-13-01T00:00Z', '2027-04-18T24:00Z', '2026-02-29T00:00Z'])('INVALID_METADATA: the impossible date %s is refused with a clear message', (valid) => {
    const issue = errorWith(buildCsv({ metadata: { valid } }), 'INVALID_METADATA');
    expect(issue.column).toBe('# valid');
    expect(issue.message).toMatch(/not a real date/);
  });

  it('accepts 29 February of a leap year (2028)', () => {
    expect(parsed(buildCsv({ metadata: { valid: '2028-02-29T00:00:00Z' } })).metadata.validTime).toBe('2028-02-29T00:00:00.000Z');
  });

  // Issue 11 item 12: a wind speed of 1e308 kt was accepted.
  it('WIND_OUT_OF_RANGE: an absurd wind speed (1e308 kt) is refused, naming line and column', () => {
    const rows = [...BASE_ROWS];
    rows[4] = '700,3100,8,-2,250,1e308';
    expect(errorWith(buildCsv({ rows }), 'WIND_OUT_OF_RANGE')).toMatchObject({ line: rowLine(4), column: 'wind_speed_kt' });
  });

  it('WIND_OUT_OF_RANGE: an absurd u component is refused, naming line and column', () => {
    const header = 'pressure_hPa,height_m,temperature_C,dewpoint_C,u_ms,v_ms';
    const rows = BASE_ROWS.map((row, i) => row.split(',').slice(0, 4).join(',') + (i === 2 ? ',1e308,3' : ',5,3'));
    expect(errorWith(buildCsv({ header, rows }), 'WIND_OUT_OF_RANGE')).toMatchObject({ line: rowLine(2), column: 'u_ms' });
  });

  it('quoted cells may hold commas (papaparse tokenizer) and line numbers stay right', () => {
    const text = buildCsv({ metadata: { name: 'Cedar Ford, Missouri' }, header: 'pressure_hPa,height_m,temperature_C,dewpoint_C,wind_direction_deg,wind_speed_kt,"note, free text"' , rows: BASE_ROWS.map((row, i) => `${row},"${i === 2 ? 'a, b' : 'x'}"`) });
    const sounding = parsed(text);
    expect(sounding.metadata.name).toBe('Cedar Ford, Missouri');
    expect(sounding.levels).toHaveLength(BASE_ROWS.length);
    const broken = buildCsv({ rows: BASE_ROWS.map((row, i) => (i === 3 ? row.replace('850', '"850') : row)) });
    expect(issues(broken).some((issue) => issue.line === rowLine(3))).toBe(true);
  });

  it('reads every cell as Number() does (the fast decimal path gives the same double)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, min: -1e6, max: 1e6 }), fc.integer({ min: 0, max: 12 }), (value, digits) => {
        for (const text of [value.toFixed(digits), String(value), value.toFixed(digits).replace(/^(-?)/, '$100')]) {
          expect(Object.is(decimalValue(text), Number(text))).toBe(true);
        }
      }),
      { numRuns: 2000 },
    );
    for (const text of ['', '-', '.', '1.', '.5', '-.5', '+3', '1e3', '1.2.3', '12a', '-0', '0.000000000000001', '123456789012345.6', 'Infinity']) {
      expect(Object.is(decimalValue(text), Number(text))).toBe(true);
    }
  });

  it('LF, CRLF and lone-CR files, with or without quotes, give the same levels and line numbers', () => {
    const rows = [...BASE_ROWS];
    rows[3] = (rows[3] as string).replace(/^[^,]+/, 'abc');
    const lf = buildCsv({ rows });
    // A quoted header cell sends the file through papaparse; the others take the plain split.
    const quoted = lf.replace('wind_speed_kt', '"wind_speed_kt"');
    const variants = [lf, lf.replace(/\n/g, '\r\n'), lf.replace(/\n/g, '\r'), quoted, quoted.replace(/\n/g, '\r\n')];
    const seen = variants.map((text) => issues(text).map((issue) => [issue.code, issue.line, issue.column]));
    expect(seen[0]).toContainEqual(['NOT_A_NUMBER', rowLine(3), 'pressure_hPa']);
    for (const other of seen.slice(1)) expect(other).toEqual(seen[0]);
    const good = buildCsv({});
    const levels = parsed(good).levels;
    expect(parsed(good.replace(/\n/g, '\r\n')).levels).toEqual(levels);
    expect(parsed(good.replace('wind_speed_kt', '"wind_speed_kt"')).levels).toEqual(levels);
  });

  it.each([
    ['latitude', '95'],
    ['longitude', 'west'],
    ['valid', '2027-04-18 18:00'],
    ['source', 'guess'],
  ])('INVALID_METADATA: %s "%s", naming the metadata line', (key, value) => {
    const issue = errorWith(buildCsv({ metadata: { [key]: value } }), 'INVALID_METADATA');
    expect(issue.column).toBe(`# ${key}`);
    expect(issue.line).toBe(Object.keys({ station: 1, name: 1, latitude: 1, longitude: 1, elevation_m: 1, valid: 1, source: 1 }).indexOf(key) + 1);
  });

  it('never throws on arbitrary text', () => {
    for (const text of ['', ',,,', 'a,b\n1,2', '\u0000\u0001', 'pressure_hPa,temperature_C,dewpoint_C\n1e999,NaN,Infinity']) {
      expect(() => parseSoundingCsv(text)).not.toThrow();
      expect(parseSoundingCsv(text).ok).toBe(false);
    }
  });
});
