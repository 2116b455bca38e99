import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { signedInAgent, startTestApp, testOrigin } from './helpers/test-app';

let sd: Stormdraft;
let forecaster: TestAgent;
let admin: TestAgent;
beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  admin = await signedInAgent(sd.app, 'admin');
});
afterAll(async () => {
  await sd?.close();
});

const square = (w: number, s: number, e: number, n: number) => ({ type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] });
const areaId = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;

async function newDraft() {
  const res = await forecaster.post('/api/outlooks').send({ day: 1, issuanceTime: '2027-04-18T15:00:00Z', headline: 'Bad input' });
  expect(res.status).toBe(201);
  return res.body as { id: string; version: number; validFrom: string; validUntil: string };
}

function saveBody(outlook: { version: number; validFrom: string; validUntil: string }, areas: unknown[], overrides: Record<string, unknown> = {}) {
  return { version: outlook.version, headline: 'Saved', discussion: '', hazardNotes: {}, validFrom: outlook.validFrom, validUntil: outlook.validUntil, areas, ...overrides };
}

/** The answer must be a 400 whose issues name `field`. */
function expectFieldError(res: request.Response, field: string) {
  expect(res.status, JSON.stringify(res.body)).toBe(400);
  const paths: string[] = (res.body.error?.issues ?? []).map((i: { path: string }) => i.path);
  expect(paths.some((p) => p === field || p.startsWith(`${field}.`)), `issues ${paths.join(', ')} name ${field}`).toBe(true);
}

describe('issue 11 item 7: bad input is a 400 naming the field, never a 5xx', () => {
  it('When a public search holds U+0000, then 400 names q', async () => {
    expectFieldError(await request(sd.app).get('/api/public/issuances?q=%00'), 'q');
  });

  it('When a text field of a save holds U+0000, then 400 names it', async () => {
    const outlook = await newDraft();
    expectFieldError(await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [], { discussion: 'storms\u0000' })), 'discussion');
    expectFieldError(await forecaster.post('/api/outlooks').send({ day: 1, headline: 'a\u0000b' }), 'headline');
  });

  it.each(['2027-13-45', '2027-02-30', '0000-01-01', '10000-01-01'])('When the archive date is %s, then 400 names date', async (date) => {
    expectFieldError(await request(sd.app).get(`/api/public/issuances?date=${date}`), 'date');
    expectFieldError(await forecaster.get(`/api/outlooks?date=${date}`), 'date');
  });

  it.each(['0000-04-18T15:00:00Z', '2027-13-45T15:00:00Z', '+010000-01-01T00:00:00Z'])('When an issuance time is %s, then 400 names issuanceTime', async (time) => {
    expectFieldError(await forecaster.post('/api/outlooks').send({ day: 1, issuanceTime: time }), 'issuanceTime');
  });

  it('When a valid period starts in year 0000, then 400 names validFrom', async () => {
    const outlook = await newDraft();
    expectFieldError(await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [], { validFrom: '0000-01-01T00:00:00Z' })), 'validFrom');
  });

  it('When version is 2^31 or more, then 400 names version', async () => {
    const outlook = await newDraft();
    expectFieldError(await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [], { version: 2 ** 31 })), 'version');
    expectFieldError(await forecaster.post(`/api/outlooks/${outlook.id}/submit`).send({ version: 2 ** 53 }), 'version');
    const office = await admin.get('/api/office');
    expectFieldError(await admin.put('/api/office').send({ ...office.body, version: 2 ** 31 }), 'version');
  });

  it('When the same risk-area id is sent twice in one save, then 400 names the second', async () => {
    const outlook = await newDraft();
    const area = { id: areaId(1), levelKey: 'level1', hazards: [], geometry: square(-94, 37, -92, 39) };
    expectFieldError(await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [area, { ...area, geometry: square(-90, 37, -88, 39) }])), 'areas.1.id');
  });

  it("When a save reuses another outlook's risk-area id, then 400 names it and the other outlook keeps its area", async () => {
    const first = await newDraft();
    const saved = await forecaster.put(`/api/outlooks/${first.id}`).send(saveBody(first, [{ levelKey: 'level1', hazards: [], geometry: square(-94, 37, -92, 39) }]));
    expect(saved.status).toBe(200);
    const stolenId: string = saved.body.areas[0].id;
    const second = await newDraft();
    expectFieldError(await forecaster.put(`/api/outlooks/${second.id}`).send(saveBody(second, [{ id: stolenId, levelKey: 'level2', hazards: [], geometry: square(-90, 37, -88, 39) }])), 'areas.0.id');
    const again = await forecaster.get(`/api/outlooks/${first.id}`);
    expect(again.body.areas[0]).toMatchObject({ id: stolenId, levelKey: 'level1' });
  });

  it('When a multipart upload is cut off mid-body, then 400 names the files', async () => {
    const res = await forecaster
      .post('/api/soundings/uploads')
      .set('Content-Type', 'multipart/form-data; boundary=XYZ')
      .send('--XYZ\r\nContent-Disposition: form-data; name="files"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\npressure_hpa,height_m\r\n1000,100');
    expectFieldError(res, 'files');
  });

  it('When a multipart upload has no boundary, then 400 names the files', async () => {
    const res = await forecaster.post('/api/soundings/uploads').set('Content-Type', 'multipart/form-data').send('garbage');
    expectFieldError(res, 'files');
  });

  it.each(['1e300', '9007199254740993', '2147483648'])('When page is %s, then 400 names page', async (page) => {
    expectFieldError(await request(sd.app).get(`/api/public/issuances?page=${page}`), 'page');
    expectFieldError(await forecaster.get(`/api/soundings?page=${page}`), 'page');
  });

  it('When a JSON body is malformed, then 400 says where', async () => {
    const res = await forecaster.post('/api/outlooks').set('Content-Type', 'application/json').send('{\n  "day": 1,\n  "headline": "x",,\n}');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/line 3, column \d+/);
  });

  it('When an address does not decode, then 400 and not 500', async () => {
    const res = await request(sd.app).get('/api/public/issuances/%E0%A4%A').set('Origin', testOrigin);
    expect(res.status).toBeLessThan(500);
    expect(res.status).toBeGreaterThanOrEqual(400);
  });
});
