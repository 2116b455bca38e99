import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { bufrFixtureFiles, type FixtureSounding } from '../../../tests/fixtures/bufr/generate-bufr-fixtures';
import { readRadiosondes } from './read-radiosondes';
import { runTool } from './run-tool';

const fixtures = path.resolve(import.meta.dirname, '../../../tests/fixtures/bufr');
const limits = { timeoutMs: 30_000, maxOutputBytes: 20_000_000 };

async function dump(fileName: string): Promise<unknown> {
  const out = await runTool('bufr_dump', ['-js', path.join(fixtures, fileName)], limits);
  if (!out.ok) throw new Error(out.error.reason);
  return JSON.parse(out.value);
}

const launchIso = (s: FixtureSounding) => new Date(Date.UTC(s.launch.year, s.launch.month - 1, s.launch.day, s.launch.hour, s.launch.minute, s.launch.second)).toISOString();

describe('readRadiosondes (decoded by ecCodes bufr_dump)', () => {
  for (const file of bufrFixtureFiles) {
    it(`When ${file.fileName} (${file.compressed ? 'compressed' : 'uncompressed'}, ${file.soundings.length} subsets) is read, then every value round-trips to what the generator wrote`, async () => {
      const read = readRadiosondes(await dump(file.fileName));
      if (!read.ok) throw new Error(read.error);
      expect(read.value).toHaveLength(file.soundings.length);
      read.value.forEach((sonde, index) => {
        const written = file.soundings[index];
        if (!written) throw new Error('more soundings than written');
        expect(sonde.station).toBe(`${written.blockNumber}${written.stationNumber}`);
        expect(sonde.latitude).toBeCloseTo(written.latitude, 5);
        expect(sonde.longitude).toBeCloseTo(written.longitude, 5);
        expect(sonde.elevationM).toBeCloseTo(written.elevationM, 1);
        expect(sonde.launchTime).toBe(launchIso(written));
        expect(sonde.levels).toHaveLength(written.levels.length);
        sonde.levels.forEach((level, i) => {
          const w = written.levels[i];
          if (!w) throw new Error('more levels than written');
          expect(level.pressurePa).toBe(w.pressurePa);
          expect(level.geopotentialHeightM).toBe(w.geopotentialHeightM);
          expect(level.temperatureK).toBeCloseTo(w.temperatureK, 2);
          expect(level.dewpointK).toBeCloseTo(w.dewpointK, 2);
          expect(level.windDirectionDeg).toBe(w.windDirectionDeg);
          expect(level.windSpeedMs).toBeCloseTo(w.windSpeedMs, 1);
        });
      });
    });
  }

  it('When the file holds more subsets than the limit, then it is refused with the limit named', async () => {
    const read = readRadiosondes(await dump('three-stations.bufr'), { maxSubsets: 2, maxLevels: 5000 });
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.error).toMatch(/more than 2 soundings/);
  });

  it('When a sounding has more levels than the limit, then it is refused with the limit named', async () => {
    const read = readRadiosondes(await dump('three-stations.bufr'), { maxSubsets: 10, maxLevels: 5 });
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.error).toMatch(/more than 5 levels/);
  });

  it('When the dump is not a message list, then the reason says so', () => {
    expect(readRadiosondes({ nothing: true })).toEqual({ ok: false, error: 'the decoder returned no messages' });
    expect(readRadiosondes({ messages: ['ERROR: unreadable message'] })).toEqual({ ok: false, error: 'message 1 is not readable BUFR (unreadable message)' });
  });

  it('When a pressure repeats (standard and significant level), then the two are merged into one level', () => {
    const tree = [
      { key: 'blockNumber', value: 72 },
      [{ key: 'stationNumber', value: 5 }],
      [{ key: 'pressure', value: 85000 }, { key: 'airTemperature', value: 280 }],
      [{ key: 'pressure', value: 85000 }, { key: 'windDirection', value: 200 }, { key: 'windSpeed', value: 12 }],
      [{ key: 'pressure', value: 70000 }],
    ];
    const read = readRadiosondes({ messages: [[{ key: 'numberOfSubsets', value: 1 }, { key: 'compressedData', value: 0 }, [tree]]] });
    if (!read.ok) throw new Error(read.error);
    const [sonde] = read.value;
    expect(sonde?.station).toBe('72005');
    expect(sonde?.levels).toEqual([{ pressurePa: 85000, geopotentialHeightM: null, temperatureK: 280, dewpointK: null, windDirectionDeg: 200, windSpeedMs: 12 }]);
    expect(sonde?.levelsWithoutTemperature).toBe(1);
  });
});

describe('the committed BUFR fixtures', () => {
  it('When the generator runs again, then it writes the same bytes as the committed files (deterministic)', async () => {
    const { mkdtemp, rm } = await import('node:fs/promises');
    const { tmpdir } = await import('node:os');
    const { writeBufrFixtures } = await import('../../../tests/fixtures/bufr/generate-bufr-fixtures');
    const folder = await mkdtemp(path.join(tmpdir(), 'bufr-fixtures-'));
    try {
      const written = await writeBufrFixtures(folder);
      for (const file of written) {
        const name = path.basename(file);
        expect(Buffer.compare(await readFile(file), await readFile(path.join(fixtures, name))), name).toBe(0);
      }
    } finally {
      await rm(folder, { recursive: true, force: true });
    }
  });
});
