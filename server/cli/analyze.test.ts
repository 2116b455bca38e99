import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Ajv } from 'ajv';
import { describe, expect, it } from 'vitest';

const root = new URL('../../', import.meta.url).pathname;

function runCli(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['--import', 'tsx', 'server/cli/analyze.ts', ...args], { cwd: root, encoding: 'utf8' });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const schema: unknown = JSON.parse(readFileSync(new URL('../../docs/analysis.schema.json', import.meta.url), 'utf8'));
const validate = new Ajv({ allErrors: true }).compile(schema as object);

function tempFile(name: string, text: string): string {
  const file = join(mkdtempSync(join(tmpdir(), 'stormdraft-cli-')), name);
  writeFileSync(file, text);
  return file;
}

describe('analyze CLI', () => {
  it.each(['bna_20021111_00z.csv', 'bna_20140728_00z.csv', 'oax_20140616_19z.csv'])('when given %s with --json, then the output validates against docs/analysis.schema.json', (name) => {
    const { status, stdout } = runCli([`tests/fixtures/soundings/${name}`, '--json']);
    expect(status).toBe(0);
    const output: unknown = JSON.parse(stdout);
    expect(validate(output), JSON.stringify(validate.errors)).toBe(true);
  });

  it('when the schema is given a parcel with positive CIN, then it refuses it (the schema can fail)', () => {
    const { stdout } = runCli(['tests/fixtures/soundings/oax_20140616_19z.csv', '--json']);
    const output = JSON.parse(stdout) as { surfaceBased: { cin: number } };
    output.surfaceBased.cin = 5;
    expect(validate(output)).toBe(false);
  });

  it('when the output lacks its hazard ingredients or has a critical angle above 180°, then the schema refuses it', () => {
    const { stdout } = runCli(['tests/fixtures/soundings/oax_20140616_19z.csv', '--json']);
    const output = JSON.parse(stdout) as { ingredients?: { criticalAngleDeg: number | null; corfidiUpwind: { u: number; v: number } | null } };
    expect(output.ingredients?.corfidiUpwind).toEqual({ u: expect.any(Number), v: expect.any(Number) });
    const { ingredients, ...without } = output;
    expect(validate(without)).toBe(false);
    expect(validate({ ...output, ingredients: { ...ingredients, criticalAngleDeg: 181 } })).toBe(false);
  });

  it('when a file has only the header row and levels (no metadata, empty heights), then exit 0, JSON on stdout and warnings on stderr', () => {
    const rows = ['1000,,28,20,170,10', '950,,24,18,190,20', '900,,21,15,210,30', '850,,18,12,230,35', '700,,8,-2,250,40', '500,,-10,-25,260,50', '300,,-38,-50,270,60', '200,,-55,-70,270,70'];
    const file = tempFile('bare.csv', ['pressure_hPa,height_m,temperature_C,dewpoint_C,wind_direction_deg,wind_speed_kt', ...rows].join('\n'));
    const { status, stdout, stderr } = runCli([file, '--json']);
    expect(status).toBe(0);
    const output = JSON.parse(stdout) as { metadata: { source: string; station: string }; surfaceBased: { cape: number } };
    expect(validate(output)).toBe(true);
    expect(output.metadata).toMatchObject({ source: 'unknown', station: '' });
    expect(output.surfaceBased.cape).toBeGreaterThan(0);
    expect(stderr).toMatch(/warning MISSING_METADATA: bare\.csv.*station/);
    expect(stderr).toMatch(/heights above ground start at 0 m/);
  });

  it('when heights in feet are labelled metres, then a HEIGHTS_REPLACED flag is printed on stderr and is in the JSON', () => {
    const text = readFileSync(new URL('../../tests/fixtures/soundings/bna_20140728_00z.csv', import.meta.url), 'utf8');
    let header = false;
    const feet = text.split('\n').map((line) => {
      if (line.startsWith('pressure_hPa')) header = true;
      else if (header && line.trim() !== '') {
        const cells = line.split(',');
        if (cells[1]) cells[1] = String(Math.round(Number(cells[1]) * 3.28084));
        return cells.join(',');
      }
      return line;
    });
    const { status, stdout, stderr } = runCli([tempFile('feet.csv', feet.join('\n')), '--json']);
    expect(status).toBe(0);
    expect(stderr).toMatch(/flag HEIGHTS_REPLACED: feet\.csv/);
    const output = JSON.parse(stdout) as { flags: { code: string }[] };
    expect(output.flags.map((f) => f.code)).toContain('HEIGHTS_REPLACED');
  });

  it('when given an observed fixture with --json, then prints the contract keys (docs/analysis.md) and exits 0', () => {
    const { status, stdout } = runCli(['tests/fixtures/soundings/bna_20140728_00z.csv', '--json']);
    expect(status).toBe(0);
    const output = JSON.parse(stdout) as Record<string, Record<string, unknown>>;
    for (const parcel of ['surfaceBased', 'mixedLayer', 'mostUnstable']) {
      for (const key of ['cape', 'cin', 'lclPressure', 'lclHeight', 'lfcPressure', 'elPressure', 'liftedIndex']) expect(output[parcel]).toHaveProperty(key);
    }
    expect(output.mostUnstable).toHaveProperty('parcelPressure');
    for (const key of ['precipitableWater', 'bulkShear0to6km', 'stormMotionRight', 'srh0to1km', 'srh0to3km']) expect(output).toHaveProperty(key);
    expect(output.stormMotionRight).toHaveProperty('u');
  });

  it('when given a fixture without --json, then prints the grouped table', () => {
    const { status, stdout } = runCli(['tests/fixtures/soundings/oax_20140616_19z.csv']);
    expect(status).toBe(0);
    for (const heading of ['INSTABILITY', 'MOISTURE', 'CLOUD BASE', 'KINEMATICS', 'COMPOSITES']) expect(stdout).toContain(heading);
  });

  it('when the file is invalid, then names file, line and column on stderr and exits 2', () => {
    const directory = mkdtempSync(join(tmpdir(), 'stormdraft-cli-'));
    const file = join(directory, 'bad.csv');
    writeFileSync(file, '# station: X\npressure_hPa,temperature_C,dewpoint_C\n1000,warm,10\n');
    const { status, stdout, stderr } = runCli([file, '--json']);
    expect(status).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).toContain('bad.csv, line 3, column temperature_C');
  });

  it('when the file does not exist, then exits 2', () => {
    expect(runCli(['no-such-file.csv']).status).toBe(2);
  });
});
