import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { count, eq } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { soundings } from '../../server/db/schema';
import { signedInAgent, startTestApp } from './helpers/test-app';

const fixtureDir = path.resolve(import.meta.dirname, '../fixtures/soundings');
const fixture = (name: string) => readFileSync(path.join(fixtureDir, name));

let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
});
afterAll(async () => {
  await sd?.close();
});

async function rowCount(): Promise<number> {
  const [row] = await sd.ctx.db.select({ value: count() }).from(soundings);
  return row?.value ?? 0;
}

const badCsv = `# station: ZZ9
# latitude: 38.0
# longitude: -92.0
# elevation_m: 200
# valid: 2027-04-18T18:00:00Z
pressure_hPa,temperature_C,dewpoint_C
1000,25,20
950,22,18
950,21,17
900,18,10
850,15,5
700,2,-10
500,-15,-30
`;

describe('POST /api/soundings/uploads', () => {
  it('When three good files are uploaded, then each is accepted and listed with its figures', async () => {
    const res = await forecaster
      .post('/api/soundings/uploads')
      .attach('files', fixture('oax_20140616_19z.csv'), 'oax_20140616_19z.csv')
      .attach('files', fixture('bna_20140728_00z.csv'), 'bna_20140728_00z.csv')
      .attach('files', fixture('bna_20021111_00z.csv'), 'bna_20021111_00z.csv');
    expect(res.status).toBe(200);
    expect(res.body.accepted).toBe(3);
    expect(res.body.rejected).toBe(0);
    for (const result of res.body.results) expect(result.soundingId).toBeTruthy();
    const list = await forecaster.get('/api/soundings').query({ station: 'OAX' });
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(1);
    expect(list.body.soundings[0].figures.muCape).toBeGreaterThan(0);
    // Regression: the figure is in g/kg. OAX's surface (965 hPa, dewpoint 23.8 °C) holds about
    // 19.6 g/kg: ε·e/(p − e) with e ≈ 29.5 hPa from Bolton (1980) eq. 10.
    expect(list.body.soundings[0].figures.surfaceMixingRatioGkg).toBeCloseTo(19.6, 0);
  });

  it('When a batch mixes a good and a bad file, then the good one is stored, the bad one is rejected with a line number and leaves no row', async () => {
    const before = await rowCount();
    const res = await forecaster
      .post('/api/soundings/uploads')
      .attach('files', Buffer.from(fixture('bna_20021111_00z.csv').toString('utf8').replace('# station: BNA', '# station: MIX')), 'good.csv')
      .attach('files', Buffer.from(badCsv), 'bad.csv');
    expect(res.status).toBe(200);
    const bad = res.body.results.find((r: { fileName: string }) => r.fileName === 'bad.csv');
    expect(bad.status).toBe('rejected');
    expect(bad.soundingId).toBeNull();
    const issue = bad.issues.find((i: { code: string }) => i.code === 'DUPLICATE_PRESSURE');
    expect(issue).toMatchObject({ severity: 'error', line: 9, column: 'pressure_hPa' });
    expect(await rowCount()).toBe(before + 1);
  });

  // Issue 11 item 8: before the fix, a file the database refused (here a NUL character in the
  // station id) made the whole request a 500 while file 1 stayed stored.
  it('When file 2 of 3 cannot be stored, then 200 with its own rejected result, and files 1 and 3 are stored', async () => {
    const before = await rowCount();
    const text = fixture('bna_20021111_00z.csv').toString('utf8');
    const res = await forecaster
      .post('/api/soundings/uploads')
      .attach('files', Buffer.from(text.replace('# station: BNA', '# station: AT1')), 'one.csv')
      .attach('files', Buffer.from(text.replace('# station: BNA', '# station: A\u0000B')), 'two.csv')
      .attach('files', Buffer.from(text.replace('# station: BNA', '# station: AT3')), 'three.csv');
    expect(res.status).toBe(200);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual(['accepted-with-warnings', 'rejected', 'accepted-with-warnings']);
    expect(res.body.results[1].soundingId).toBeNull();
    expect(await rowCount()).toBe(before + 2);
  });

  it('When the same file is sent three times, then it is stored once and reported as a duplicate twice (issue 11 item 8)', async () => {
    const before = await rowCount();
    const text = Buffer.from(fixture('bna_20021111_00z.csv').toString('utf8').replace('# station: BNA', '# station: DUP'));
    const first = await forecaster.post('/api/soundings/uploads').attach('files', text, 'dup.csv');
    const again = await forecaster.post('/api/soundings/uploads').attach('files', text, 'dup.csv').attach('files', text, 'dup-copy.csv');
    expect(first.body.results[0].status).toBe('accepted-with-warnings');
    expect(again.status).toBe(200);
    expect(again.body.results.map((r: { status: string }) => r.status)).toEqual(['duplicate', 'duplicate']);
    expect(again.body.results[0].soundingId).toBe(first.body.results[0].soundingId);
    expect(again.body.duplicates).toBe(2);
    expect(await rowCount()).toBe(before + 1);
  });

  it('When a file has no metadata at all, then it is kept, reported as not yet evidence, and an author can fill the fields in', async () => {
    const text = fixture('bna_20021111_00z.csv').toString('utf8').split('\n').filter((line) => !line.startsWith('#')).join('\n');
    const res = await forecaster.post('/api/soundings/uploads').attach('files', Buffer.from(text), 'bare.csv');
    expect(res.status).toBe(200);
    const result = res.body.results[0];
    expect(result.status).toBe('accepted-with-warnings');
    expect(result.missingForEvidence).toEqual(['station', 'latitude', 'longitude', 'validTime']);
    expect(result.issues.filter((i: { code: string }) => i.code === 'NOT_YET_EVIDENCE')).toHaveLength(4);
    const detail = await forecaster.get(`/api/soundings/${result.soundingId}`);
    expect(detail.body.source).toBe('unknown');
    expect(detail.body.validTime).toBeNull();
    const body = { station: 'BNA', name: 'Nashville', latitude: 36.25, longitude: -86.57, elevationM: 180, validTime: '2002-11-11T00:00:00Z', source: 'observed' };
    const admin = await signedInAgent(sd.app, 'admin');
    expect((await admin.patch(`/api/soundings/${result.soundingId}/metadata`).send(body)).status).toBe(403);
    expect((await forecaster.patch(`/api/soundings/${result.soundingId}/metadata`).send({ ...body, validTime: '2002-02-30T00:00:00Z' })).status).toBe(400);
    const saved = await forecaster.patch(`/api/soundings/${result.soundingId}/metadata`).send(body);
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ stationId: 'BNA', latitude: 36.25, validTime: '2002-11-11T00:00:00.000Z', source: 'observed' });
  });

  it('When a file is larger than 2 MB, then 413 explains the limit and nothing is stored', async () => {
    const before = await rowCount();
    const big = Buffer.alloc(2 * 1024 * 1024 + 10, 'a');
    const res = await forecaster.post('/api/soundings/uploads').attach('files', big, 'big.csv');
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/2 MB/);
    expect(await rowCount()).toBe(before);
  });

  it('When more than 500 files are sent, then 400 names the limit', async () => {
    let req = forecaster.post('/api/soundings/uploads');
    for (let i = 0; i < 501; i++) req = req.attach('files', Buffer.from('x'), `f${i}.csv`);
    const res = await req;
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/500/);
  });

  it('When a sounding has more than 5,000 levels, then it is rejected with TOO_MANY_LEVELS', async () => {
    const lines = ['# station: BIG', '# latitude: 38', '# longitude: -92', '# elevation_m: 100', '# valid: 2027-04-18T18:00:00Z', 'pressure_hPa,temperature_C,dewpoint_C'];
    for (let i = 0; i < 5001; i++) lines.push(`${(1000 - i * 0.18).toFixed(2)},${(25 - i * 0.015).toFixed(3)},${(15 - i * 0.02).toFixed(3)}`);
    const res = await forecaster.post('/api/soundings/uploads').attach('files', Buffer.from(lines.join('\n')), 'many.csv');
    expect(res.status).toBe(200);
    expect(res.body.results[0].status).toBe('rejected');
    expect(res.body.results[0].issues.map((i: { code: string }) => i.code)).toContain('TOO_MANY_LEVELS');
  });
});

describe('POST /api/soundings (JSON)', () => {
  const levels = [
    { pressureHpa: 1000, temperatureC: 28, dewpointC: 21, uMs: 2, vMs: 8 },
    { pressureHpa: 925, temperatureC: 23, dewpointC: 18, uMs: 6, vMs: 14 },
    { pressureHpa: 850, temperatureC: 18, dewpointC: 14, uMs: 10, vMs: 16 },
    { pressureHpa: 700, temperatureC: 6, dewpointC: -4, uMs: 18, vMs: 12 },
    { pressureHpa: 500, temperatureC: -12, dewpointC: -30, uMs: 26, vMs: 8 },
    { pressureHpa: 400, temperatureC: -25, dewpointC: -42, uMs: 30, vMs: 6 },
    { pressureHpa: 300, temperatureC: -40, dewpointC: -55, uMs: 34, vMs: 4 },
    { pressureHpa: 200, temperatureC: -54, dewpointC: -70, uMs: 36, vMs: 2 },
    { pressureHpa: 150, temperatureC: -55, dewpointC: -75, uMs: 30, vMs: 0 },
  ];
  const metadata = { station: 'MP01', name: 'Model point', latitude: 38.2, longitude: -92.4, elevationM: 150, validTime: '2027-04-18T21:00:00Z', source: 'model' };

  it('When a model pipeline posts a valid sounding, then 201 with its id', async () => {
    const res = await forecaster.post('/api/soundings').send({ metadata, levels });
    expect(res.status).toBe(201);
    expect(res.body.results[0].status).toBe('accepted');
  });

  it('When levels are out of order, then they are sorted and stored with a LEVELS_SORTED warning', async () => {
    const res = await forecaster.post('/api/soundings').send({ metadata: { ...metadata, station: 'MP02' }, levels: [...levels.slice(0, 2), levels[4], levels[3], levels[2], ...levels.slice(5)] });
    expect(res.status).toBe(201);
    expect(res.body.results[0].issues.map((i: { code: string }) => i.code)).toContain('LEVELS_SORTED');
  });

  it('When two levels share a pressure with different values, then 400 names the level', async () => {
    const res = await forecaster.post('/api/soundings').send({ metadata: { ...metadata, station: 'MP03' }, levels: [...levels, { ...levels[3], temperatureC: 4 }] });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/different values/);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain('levels.9.pressureHpa');
  });

  it('When a batch has one good and one bad sounding, then the answer lists both results', async () => {
    const res = await forecaster.post('/api/soundings/batch').send({ soundings: [{ metadata: { ...metadata, station: 'MP04' }, levels }, { metadata: { ...metadata, latitude: 95 }, levels }] });
    expect(res.status).toBe(200);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual(['accepted', 'rejected']);
  });
});

describe('library, detail, what-if and delete', () => {
  it('When the library is sorted by MLCAPE, then the rows come highest first and pages hold pageSize rows', async () => {
    const res = await lead.get('/api/soundings').query({ sort: 'mlCape', order: 'desc', pageSize: 10, modified: 'exclude' });
    expect(res.status).toBe(200);
    expect(res.body.soundings).toHaveLength(10);
    const capes = res.body.soundings.map((s: { figures: { mlCape: number } }) => s.figures.mlCape);
    expect([...capes].sort((a, b) => b - a)).toEqual(capes);
    expect(res.body.total).toBeGreaterThanOrEqual(90);
  });

  it('When the filter is not valid, then 400 names the field', async () => {
    const res = await lead.get('/api/soundings').query({ sort: 'colour' });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('sort');
  });

  it('When a forecaster saves a moister surface as a what-if, then it is stored apart, marked modified, with more CAPE', async () => {
    const list = await forecaster.get('/api/soundings').query({ station: 'OAX', modified: 'exclude' });
    const original = list.body.soundings[0];
    const detail = await forecaster.get(`/api/soundings/${original.id}`);
    expect(detail.status).toBe(200);
    const surface = detail.body.levels[0];
    const res = await forecaster.post(`/api/soundings/${original.id}/modified`).send({ name: 'Moister afternoon', surfaceDewpointC: surface.dewpointC + 2 });
    expect(res.status).toBe(201);
    expect(res.body.modifiedFromId).toBe(original.id);
    expect(res.body.figures.muCape).toBeGreaterThan(original.figures.muCape);
    const only = await forecaster.get('/api/soundings').query({ modified: 'only' });
    expect(only.body.soundings.map((s: { id: string }) => s.id)).toContain(res.body.id);
  });

  it('When the surface dewpoint would exceed the temperature, then 400 explains it', async () => {
    const list = await forecaster.get('/api/soundings').query({ station: 'OAX', modified: 'exclude' });
    const id = list.body.soundings[0].id;
    const res = await forecaster.post(`/api/soundings/${id}/modified`).send({ name: 'Impossible', surfaceTemperatureC: 20, surfaceDewpointC: 25 });
    expect(res.status).toBe(400);
  });

  it('When another forecaster tries to delete, then 403; when a lead deletes, then it is gone with its what-ifs', async () => {
    const list = await forecaster.get('/api/soundings').query({ station: 'OAX', modified: 'exclude' });
    const id = list.body.soundings[0].id;
    const admin = await signedInAgent(sd.app, 'admin');
    await admin.post('/api/users').send({ name: 'Other', email: 'other@office.test', password: 'long-enough-1', role: 'forecaster' });
    const other = (await import('./helpers/test-app')).agentFor(sd.app);
    await other.post('/api/auth/sign-in/email').send({ email: 'other@office.test', password: 'long-enough-1' });
    expect((await other.delete(`/api/soundings/${id}`)).status).toBe(403);
    const res = await lead.delete(`/api/soundings/${id}`);
    expect(res.status).toBe(200);
    expect(res.body.deleted).toBeGreaterThanOrEqual(2);
    expect((await lead.get(`/api/soundings/${id}`)).status).toBe(404);
    const [left] = await sd.ctx.db.select({ value: count() }).from(soundings).where(eq(soundings.modifiedFromId, id));
    expect(left?.value).toBe(0);
  });
});
