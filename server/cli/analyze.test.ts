import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = new URL('../../', import.meta.url).pathname;

function runCli(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['--import', 'tsx', 'server/cli/analyze.ts', ...args], { cwd: root, encoding: 'utf8' });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

describe('analyze CLI', () => {
  it('when given an observed fixture with --json, then prints the SCIENCE.md contract and exits 0', () => {
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
