import { copyFile, mkdtemp, readdir, rm, writeFile } from 'node:fs/promises';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { intakeFileListSchema, intakeSourceListSchema, pullResultSchema, type IntakeFile } from '../../shared/contracts/intake';
import { soundingListSchema } from '../../shared/contracts/soundings';
import type { Stormdraft } from '../../server/start';
import { bufrFixtureFiles } from '../fixtures/bufr/generate-bufr-fixtures';
import { signedInAgent, startTestApp } from './helpers/test-app';

const bufrFolder = path.resolve(import.meta.dirname, '../fixtures/bufr');
const csvFixture = path.resolve(import.meta.dirname, '../fixtures/soundings/oax_20140616_19z.csv');
const pullSecret = 'Bearer pull-secret-0c5e7a';

let sd: Stormdraft;
let folder: string;
let forecaster: TestAgent;
let admin: TestAgent;
let fileServer: Server;
let fileServerUrl: string;
const fileServerRequests: { url: string; authorization: string | undefined }[] = [];

beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), 'intake-'));
  sd = await startTestApp({ intakeDir: folder, intakeSettleMs: 200, intakePollMs: 0 });
  forecaster = await signedInAgent(sd.app, 'forecaster');
  admin = await signedInAgent(sd.app, 'admin');
  // A local stand-in for a data server: f000 of any cycle is the compressed BUFR fixture, other hours are not there yet.
  fileServer = createServer((req, res) => {
    fileServerRequests.push({ url: req.url ?? '', authorization: req.headers.authorization });
    if (req.headers.authorization !== pullSecret) return void res.writeHead(401).end('who are you');
    if (/^\/data\/\d{8}\/\d{2}\/sondes-f000\.bufr$/.test(req.url ?? '')) {
      void import('node:fs/promises').then(async ({ readFile }) => res.writeHead(200, { 'content-type': 'application/octet-stream' }).end(await readFile(path.join(bufrFolder, 'two-stations-compressed.bufr'))));
      return;
    }
    res.writeHead(404).end('not yet');
  });
  await new Promise<void>((resolve) => fileServer.listen(0, '127.0.0.1', resolve));
  fileServerUrl = `http://127.0.0.1:${(fileServer.address() as AddressInfo).port}`;
});

afterAll(async () => {
  await sd?.close();
  await new Promise((resolve) => fileServer?.close(resolve));
  await rm(folder, { recursive: true, force: true });
});

async function files(): Promise<IntakeFile[]> {
  const res = await forecaster.get('/api/intake-files');
  expect(res.status).toBe(200);
  return intakeFileListSchema.parse(res.body).files;
}

/** Waits (up to `seconds`) until the intake list holds a finished record of `fileName`. */
async function finished(fileName: string, count = 1, seconds = 60): Promise<IntakeFile[]> {
  for (let i = 0; i < seconds * 5; i++) {
    const list = (await files()).filter((f) => f.fileName === fileName && f.finishedAt !== null);
    if (list.length >= count) return list;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`${fileName} was not taken in within ${seconds} s`);
}

async function observed(station: string) {
  const res = await forecaster.get(`/api/soundings?station=${station}&source=observed`);
  expect(res.status).toBe(200);
  return soundingListSchema.parse(res.body).soundings;
}

describe('intake folder', () => {
  it('When a CSV and a multi-subset BUFR are dropped in the folder, then each is taken in once, one observed sounding per subset, and both move to done/', async () => {
    await copyFile(csvFixture, path.join(folder, 'oax.csv'));
    await copyFile(path.join(bufrFolder, 'three-stations.bufr'), path.join(folder, 'morning.bufr'));
    const [csv] = await finished('oax.csv');
    const [bufr] = await finished('morning.bufr');
    expect(csv).toMatchObject({ state: 'done', format: 'csv', soundingCount: 1, origin: 'folder', sourceName: 'intake folder' });
    expect(bufr).toMatchObject({ state: 'done', format: 'bufr', soundingCount: 3, failure: null });
    expect(bufr?.durationMs).toBeGreaterThanOrEqual(0);
    expect(bufr?.sizeBytes).toBe(1206);
    expect((await readdir(path.join(folder, 'done'))).sort()).toEqual(['morning.bufr', 'oax.csv']);
    expect((await readdir(folder)).sort()).toEqual(['.pulling', 'done', 'failed']);

    // Placed and timed as the generator wrote them.
    const written = bufrFixtureFiles[0]?.soundings ?? [];
    expect(written).toHaveLength(3);
    for (const sonde of written) {
      const station = `${sonde.blockNumber}${sonde.stationNumber}`;
      const stored = await observed(station);
      expect(stored).toHaveLength(1);
      const launch = new Date(Date.UTC(sonde.launch.year, sonde.launch.month - 1, sonde.launch.day, sonde.launch.hour, sonde.launch.minute, sonde.launch.second)).toISOString();
      expect(stored[0]).toMatchObject({ stationId: station, source: 'observed', validTime: launch });
      expect(stored[0]?.latitude).toBeCloseTo(sonde.latitude, 5);
      expect(stored[0]?.longitude).toBeCloseTo(sonde.longitude, 5);
    }
    expect(await observed('OAX')).toHaveLength(1);
  });

  it('When the same BUFR content is dropped again under another name, then it is listed as a duplicate and nothing new is stored', async () => {
    await copyFile(path.join(bufrFolder, 'three-stations.bufr'), path.join(folder, 'morning-again.bufr'));
    const [again] = await finished('morning-again.bufr');
    expect(again).toMatchObject({ state: 'duplicate', soundingCount: 0 });
    expect(await observed('72901')).toHaveLength(1);
    expect(await readdir(path.join(folder, 'done'))).toContain('morning-again.bufr');
  });

  it('When a truncated and a corrupt BUFR are dropped, then each is failed with a reason, moved to failed/, and nothing else changes', async () => {
    const before = (await files()).length;
    await copyFile(path.join(bufrFolder, 'truncated.bufr'), path.join(folder, 'cut.bufr'));
    await copyFile(path.join(bufrFolder, 'corrupt.bufr'), path.join(folder, 'noise.bufr'));
    const [cut] = await finished('cut.bufr');
    const [noise] = await finished('noise.bufr');
    for (const failed of [cut, noise]) {
      expect(failed).toMatchObject({ state: 'failed', format: 'bufr', soundingCount: 0 });
      expect(failed?.failure).toMatch(/could not read|not readable/);
      expect(failed?.failure).not.toContain(folder);
    }
    expect((await readdir(path.join(folder, 'failed'))).sort()).toEqual(['cut.bufr', 'noise.bufr']);
    const after = await files();
    expect(after).toHaveLength(before + 2);
    expect(after.filter((f) => f.state === 'done').map((f) => f.fileName).sort()).toEqual(['morning.bufr', 'oax.csv']);
    const health = await forecaster.get('/api/health');
    expect(health.status).toBe(200);
  });

  it('When a file is neither GRIB2, BUFR nor our CSV, then it is failed with a reason that says so', async () => {
    await writeFile(path.join(folder, 'notes.txt'), 'shopping list: milk, eggs\n');
    const [notes] = await finished('notes.txt');
    expect(notes).toMatchObject({ state: 'failed', format: 'unknown' });
    expect(notes?.failure).toMatch(/neither GRIB2, BUFR nor a sounding CSV/);
  });

  it('When a GRIB2 file is dropped, then it is recognised by content (GRIB, edition 2) whatever its name', async () => {
    await copyFile('/usr/share/eccodes/samples/regular_ll_pl_grib2.tmpl', path.join(folder, 'model-field.dat'));
    const [grib] = await finished('model-field.dat');
    expect(grib?.format).toBe('grib2');
    expect(['done', 'failed']).toContain(grib?.state);
  });
});

describe('scheduled pulls', () => {
  let sourceId: string;

  it('When an admin adds a source with a public http:// or an unknown placeholder, then it is refused naming urlTemplate', async () => {
    for (const urlTemplate of ['http://data.example.org/{yyyy}/f{fff}.bufr', `${'https://data.example.org'}/{cycle}.bufr`, 'https://user:pw@data.example.org/x.bufr']) {
      const res = await admin.post('/api/intake-sources').send({ name: 'bad', urlTemplate, cycleHours: [0], forecastHours: [0] });
      expect(res.status, urlTemplate).toBe(400);
      expect(res.body.error.issues[0].path).toBe('urlTemplate');
    }
  });

  it('When an admin adds a source with credentials, then the API never shows them back', async () => {
    const res = await admin.post('/api/intake-sources').send({
      name: 'Local sondes',
      urlTemplate: `${fileServerUrl}/data/{yyyy}{mm}{dd}/{hh}/sondes-f{fff}.bufr`,
      cycleHours: Array.from({ length: 24 }, (_, h) => h),
      forecastHours: [0, 3],
      intervalMinutes: 30,
      authorization: pullSecret,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.hasAuthorization).toBe(true);
    expect(JSON.stringify(res.body)).not.toContain('pull-secret');
    sourceId = res.body.id;
    const list = await admin.get('/api/intake-sources');
    expect(intakeSourceListSchema.parse(list.body).sources.map((s) => s.name)).toEqual(['Local sondes']);
    expect(list.text).not.toContain('pull-secret');
  });

  it('When the source is pulled, then the file of the due cycle is fetched with the credentials and taken in; a second pull fetches nothing again', async () => {
    const res = await admin.post(`/api/intake-sources/${sourceId}/pull`).send({});
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(pullResultSchema.parse(res.body)).toEqual({ fetched: 1, alreadyFetched: 0, notYetAvailable: 1, errors: [] });
    expect(fileServerRequests.map((r) => r.authorization)).toEqual([pullSecret, pullSecret]);
    const [pulled] = (await files()).filter((f) => f.origin === 'pull');
    expect(pulled).toMatchObject({ sourceName: 'Local sondes', fileName: 'sondes-f000.bufr', state: 'done', soundingCount: 2, format: 'bufr' });
    expect(await observed('72911')).toHaveLength(1);
    expect(await readdir(path.join(folder, 'done'))).toContain('sondes-f000.bufr');

    const second = await admin.post(`/api/intake-sources/${sourceId}/pull`).send({});
    expect(pullResultSchema.parse(second.body)).toMatchObject({ fetched: 0, alreadyFetched: 1 });
  });

  it('When the data server refuses the request, then the source shows the error and no file is recorded', async () => {
    const other = await admin.post('/api/intake-sources').send({ name: 'No key', urlTemplate: `${fileServerUrl}/data/{yyyy}{mm}{dd}/{hh}/sondes-f{fff}.bufr`, cycleHours: [0, 12], forecastHours: [0] });
    expect(other.status).toBe(201);
    const before = (await files()).length;
    const res = await admin.post(`/api/intake-sources/${other.body.id}/pull`).send({});
    expect(pullResultSchema.parse(res.body).errors).toEqual(['f0: the server answered 401']);
    expect((await files()).length).toBe(before);
    const list = intakeSourceListSchema.parse((await admin.get('/api/intake-sources')).body);
    expect(list.sources.find((s) => s.name === 'No key')?.lastError).toBe('f0: the server answered 401');
  });

  it('When an admin turns a source off and deletes it, then it is off and then gone (404 afterwards)', async () => {
    const off = await admin.patch(`/api/intake-sources/${sourceId}`).send({ enabled: false });
    expect(off.body.enabled).toBe(false);
    expect((await admin.delete(`/api/intake-sources/${sourceId}`)).status).toBe(200);
    expect((await admin.delete(`/api/intake-sources/${sourceId}`)).status).toBe(404);
  });
});

describe('intake status', () => {
  it('When a forecaster asks, then the status says the folder is watched and whether ecCodes is there', async () => {
    const res = await forecaster.get('/api/intake/status');
    expect(res.status).toBe(200);
    expect(res.body.folder).toEqual({ watching: true, path: folder });
    expect(res.body.eccodes.available).toBe(true);
    expect(res.body.eccodes.installHint).toMatch(/libeccodes-tools/);
  });
});
