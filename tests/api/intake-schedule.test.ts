import { mkdtemp, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { intakeFileListSchema, intakeSourceListSchema, type IntakeFile } from '../../shared/contracts/intake';
import type { Stormdraft } from '../../server/start';
import { signedInAgent, startTestApp } from './helpers/test-app';

const bufrFolder = path.resolve(import.meta.dirname, '../fixtures/bufr');
/** The intake's size limit in this app: the BUFR fixtures fit, the big files below do not. */
const maxBytes = 100_000;

let sd: Stormdraft;
let folder: string;
let admin: TestAgent;
let fileServer: Server;
let fileServerUrl: string;

beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), 'intake-schedule-'));
  sd = await startTestApp({ intakeDir: folder, intakeSettleMs: 200, intakePollMs: 250, intakeMaxBytes: maxBytes });
  admin = await signedInAgent(sd.app, 'admin');
  const fixture = await readFile(path.join(bufrFolder, 'three-stations.bufr'));
  fileServer = createServer((req, res) => {
    if (req.url?.endsWith('/obs-f000.bufr')) return void res.writeHead(200).end(fixture);
    // Larger than the limit, and says so in advance; then one that does not say (chunked).
    if (req.url?.endsWith('/big-f000.bin')) return void res.writeHead(200, { 'content-length': String(maxBytes * 3) }).end(Buffer.alloc(maxBytes * 3));
    if (req.url?.endsWith('/chunked-f000.bin')) {
      res.writeHead(200);
      for (let i = 0; i < 30; i++) res.write(Buffer.alloc(10_000, 66));
      return void res.end();
    }
    // A redirect to a file that exists: never followed (it could lead anywhere).
    if (req.url?.endsWith('/moved-f000.bufr')) return void res.writeHead(302, { location: '/x/obs-f000.bufr' }).end();
    res.writeHead(404).end();
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
  return intakeFileListSchema.parse((await admin.get('/api/intake-files')).body).files;
}

async function until<T>(probe: () => Promise<T | undefined>, what: string, seconds = 60): Promise<T> {
  for (let i = 0; i < seconds * 5; i++) {
    const value = await probe();
    if (value !== undefined) return value;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`timed out waiting for ${what}`);
}

describe('scheduled pulls on their own', () => {
  it('When an enabled source is due, then the timer pulls it with nobody asking and the file is taken in', async () => {
    const created = await admin.post('/api/intake-sources').send({ name: 'Sondes', urlTemplate: `${fileServerUrl}/{yyyy}{mm}{dd}{hh}/obs-f{fff}.bufr`, cycleHours: [0, 6, 12, 18], forecastHours: [0], intervalMinutes: 60 });
    expect(created.status).toBe(201);
    const pulled = await until(async () => (await files()).find((f) => f.sourceName === 'Sondes' && f.finishedAt !== null), 'the scheduled pull');
    expect(pulled).toMatchObject({ origin: 'pull', fileName: 'obs-f000.bufr', state: 'done', soundingCount: 3 });
    const source = intakeSourceListSchema.parse((await admin.get('/api/intake-sources')).body).sources.find((s) => s.name === 'Sondes');
    expect(source?.lastPolledAt).not.toBeNull();
    expect(source?.lastError).toBeNull();
  });

  it('When a download is larger than the limit (declared or not), then it is stopped and the source says why', async () => {
    for (const name of ['big', 'chunked']) {
      const created = await admin.post('/api/intake-sources').send({ name, urlTemplate: `${fileServerUrl}/{yyyy}/${name}-f{fff}.bin`, cycleHours: [0, 6, 12, 18], forecastHours: [0], enabled: false });
      const res = await admin.post(`/api/intake-sources/${created.body.id}/pull`).send({});
      expect(res.body.fetched, name).toBe(0);
      expect(res.body.errors[0], name).toMatch(name === 'big' ? /^f0: the file is 0\.3 MB, over the 0\.1 MB limit$/ : /^f0: the file is over the 0\.1 MB limit$/);
    }
    expect((await files()).filter((f) => f.sourceName === 'big' || f.sourceName === 'chunked')).toEqual([]);
    expect(await readdir(path.join(folder, '.pulling'))).toEqual([]);
  });
});

describe('pull safety', () => {
  it('When the data server answers with a redirect, then it is not followed and nothing is taken in', async () => {
    const created = await admin.post('/api/intake-sources').send({ name: 'moved', urlTemplate: `${fileServerUrl}/{yyyy}/moved-f{fff}.bufr`, cycleHours: [0, 6, 12, 18], forecastHours: [0], enabled: false });
    const res = await admin.post(`/api/intake-sources/${created.body.id}/pull`).send({});
    expect(res.body).toMatchObject({ fetched: 0, errors: ['f0: the server could not be reached (or it answered with a redirect, which is not followed)'] });
    expect((await files()).filter((f) => f.sourceName === 'moved')).toEqual([]);
  });
});

describe('intake limits', () => {
  it('When a dropped file is larger than the intake limit, then it is failed with the limit named and moved to failed/', async () => {
    await writeFile(path.join(folder, 'huge.csv'), Buffer.alloc(maxBytes + 1, 65));
    const huge = await until(async () => (await files()).find((f) => f.fileName === 'huge.csv'), 'the oversize file');
    expect(huge.state).toBe('failed');
    expect(huge.failure).toBe('huge.csv is 0.1 MB; the intake takes files up to 0.1 MB.');
    await until(async () => ((await readdir(path.join(folder, 'failed'))).includes('huge.csv') ? true : undefined), 'the move to failed/');
  });
});
