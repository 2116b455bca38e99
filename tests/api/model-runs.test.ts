import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { count, eq } from 'drizzle-orm';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { gridSoundings, offices } from '../../server/db/schema';
import { ingestGribFile } from '../../server/ingest/grib/ingest-grib';
import { runRetentionIdle } from '../../server/services/model-runs.service';
import type { Stormdraft } from '../../server/start';
import { closeSoundingPool } from '../../server/workers/sounding-pool';
import type { ModelRunSummary } from '../../shared/contracts/model-runs';
import { generateGribFixture, gribPresets } from '../fixtures/grib/generate-grib';
import { signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
let admin: TestAgent;
let dir: string;
let runIds: string[] = [];

beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  admin = await signedInAgent(sd.app, 'admin');
  dir = await mkdtemp(join(tmpdir(), 'model-runs-api-'));
  const file = join(dir, 'small.grib2');
  await generateGribFixture(gribPresets.small, file);
  const [office] = await sd.ctx.db.select({ id: offices.id }).from(offices);
  const result = await ingestGribFile(sd.ctx, { officeId: office?.id ?? '', filePath: file, model: 'APITEST' });
  if (!result.ok) throw new Error(result.error.reason);
  runIds = result.value.runIds;
}, 60_000);

afterAll(async () => {
  await runRetentionIdle();
  await closeSoundingPool();
  await sd?.close();
  await rm(dir, { recursive: true, force: true });
});

async function gridRows(runId: string): Promise<number> {
  const [row] = await sd.ctx.db.select({ value: count() }).from(gridSoundings).where(eq(gridSoundings.runId, runId));
  return row?.value ?? 0;
}

describe('GET /api/model-runs', () => {
  it('When a forecaster lists runs, then each run shows model, cycle, hour, valid time, counts, state and bytes', async () => {
    const res = await forecaster.get('/api/model-runs?model=APITEST');
    expect(res.status).toBe(200);
    const runs = res.body as ModelRunSummary[];
    expect(runs.map((r) => [r.model, r.cycleTime, r.forecastHour, r.validTime, r.soundingCount, r.state])).toEqual([
      ['APITEST', '2027-04-18T12:00:00.000Z', 9, '2027-04-18T21:00:00.000Z', 8, 'ready'],
      ['APITEST', '2027-04-18T12:00:00.000Z', 6, '2027-04-18T18:00:00.000Z', 8, 'ready'],
    ]);
    expect(runs[0]?.storedBytes).toBeGreaterThan(8 * 100);
    expect(runs[0]?.bytesPerSounding).toBe(Math.round((runs[0]?.storedBytes ?? 0) / 8));
  });

  it('When the model filter is too long, then 400 names the field', async () => {
    const res = await forecaster.get(`/api/model-runs?model=${'x'.repeat(65)}`);
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toContain('model');
  });
});

describe('grid soundings of a run', () => {
  it('When the run\'s soundings are paged, then each has its id, position and key figures', async () => {
    const res = await forecaster.get(`/api/model-runs/${runIds[0]}/soundings?limit=3`);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(8);
    expect(res.body.items).toHaveLength(3);
    expect(res.body.items[0].id).toBe(`${runIds[0]}:${res.body.items[0].pointIndex}`);
    expect(typeof res.body.items[0].keyFigures.mlCape).toBe('number');
  });

  it('When a grid sounding is opened by id, then its levels come back with a fresh analysis', async () => {
    const list = await forecaster.get(`/api/model-runs/${runIds[0]}/soundings?limit=1`);
    const id = list.body.items[0].id as string;
    const res = await forecaster.get(`/api/grid-soundings/${id}`);
    expect(res.status).toBe(200);
    expect(res.body.levels.length).toBeGreaterThanOrEqual(5);
    expect(res.body.analysis.mixedLayer.cape).toBeCloseTo(res.body.keyFigures.mlCape, 0);
    expect(res.body.model).toBe('APITEST');
  });

  it('When the id is not a grid sounding id, then 400 says what one looks like', async () => {
    const res = await forecaster.get('/api/grid-soundings/not-an-id');
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].message).toContain('run id');
  });
});

describe('retention setting', () => {
  it('When an admin sets runs kept per model, then it is stored; a value out of range is refused naming the rule', async () => {
    const bad = await admin.put('/api/model-runs/retention').send({ runsKeptPerModel: 0 });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain('at least 1');
    const res = await admin.put('/api/model-runs/retention').send({ runsKeptPerModel: 10 });
    expect(res.status).toBe(200);
    expect((await forecaster.get('/api/model-runs/retention')).body).toEqual({ runsKeptPerModel: 10 });
  });
});

describe('DELETE /api/model-runs/:runId', () => {
  it('When a forecaster tries, then 403 and nothing is deleted; when a lead does, then the run and its grid soundings go', async () => {
    const runId = runIds[1] ?? '';
    expect((await forecaster.delete(`/api/model-runs/${runId}`)).status).toBe(403);
    expect(await gridRows(runId)).toBe(8);
    const res = await lead.delete(`/api/model-runs/${runId}`);
    expect(res.status).toBe(200);
    expect(await gridRows(runId)).toBe(0);
    const list = await forecaster.get('/api/model-runs?model=APITEST');
    expect((list.body as ModelRunSummary[]).map((r) => r.id)).toEqual([runIds[0]]);
    expect((await lead.delete(`/api/model-runs/${runId}`)).status).toBe(404);
  });
});

describe('intake while the app is in use', () => {
  it('When a 3,600-point run is being taken in, then other requests are answered before it finishes', async () => {
    const file = join(dir, 'busy.grib2');
    await generateGribFixture({ ...gribPresets.bench, grid: { kind: 'regular_ll', nx: 60, ny: 60, north: 41, west: -96, stepDeg: 0.08 }, forecastHours: [3] }, file);
    const [office] = await sd.ctx.db.select({ id: offices.id }).from(offices);
    let finished = false;
    let firstProgress: () => void = () => {};
    const started = new Promise<void>((resolve) => (firstProgress = resolve));
    const intake = ingestGribFile(sd.ctx, { officeId: office?.id ?? '', filePath: file, model: 'BUSY', onProgress: (done) => (done > 0 ? firstProgress() : undefined) }).then((result) => {
      finished = true;
      return result;
    });
    await started;
    // Once the first batch is stored, a signed-in request (session lookup and a list query)
    // comes back while the other 2,600 soundings are still being analysed and stored.
    const res = await forecaster.get('/api/model-runs?model=APITEST');
    const answeredWhileBusy = !finished;
    const result = await intake;
    expect(res.status).toBe(200);
    expect(result.ok && result.value.soundingCount).toBe(3600);
    expect(answeredWhileBusy).toBe(true);
  }, 120_000);
});
