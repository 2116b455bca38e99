import { booleanPointInPolygon, point } from '@turf/turf';
import { eq } from 'drizzle-orm';
import type TestAgent from 'supertest/lib/agent';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { issuances, modelRuns } from '../../server/db/schema';
import type { Stormdraft } from '../../server/start';
import { fieldDefinitions } from '../../shared/model-fields/field-bands';
import { quantile } from '../../shared/evidence/evidence';
import { insertGridRun, type GridRunSpec } from './helpers/grid-runs';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
let subscriber: TestAgent;

// A small skewed grid (rows and columns cross parallels and meridians, as on a Lambert grid)
// with a CAPE dome over column 9, row 6; invented values.
const nx = 16;
const ny = 12;
const position = (c: number, r: number) => ({ longitude: -96 + 0.25 * c + 0.08 * r, latitude: 36 - 0.06 * c + 0.25 * r });
const capeAt = (c: number, r: number) => Math.max(0, 3200 - 300 * Math.hypot(c - 9, r - 6));
const domeRun = (overrides: Partial<GridRunSpec> = {}): GridRunSpec => ({
  model: 'TESTNEST',
  cycleTime: '2031-06-01T12:00:00Z',
  forecastHour: 6,
  nx,
  ny,
  gridKind: 'lambert',
  position,
  figures: (c, r) => ({ mlCape: capeAt(c, r), mlCin: -10 * c, bulkShear0to6kmMs: 10 + r, flagCount: 0 }),
  ...overrides,
});

let runId: string;
beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  subscriber = await signedInAgent(sd.app, 'subscriber');
  runId = await insertGridRun(sd.ctx.db, domeRun());
});
afterAll(async () => {
  await sd?.close();
});

describe('GET /api/model-runs/:runId/field', () => {
  it('When a forecaster asks for MLCAPE, then the bands, their colours and MultiPolygons come back with the dome in the top band', async () => {
    const res = await forecaster.get(`/api/model-runs/${runId}/field?figure=mlCape`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ figure: 'mlCape', label: 'MLCAPE', unit: 'J/kg', sense: 'above', valuedPoints: nx * ny, stride: 1 });
    expect(res.body.bands.map((b: { from: number }) => b.from)).toEqual(fieldDefinitions.mlCape.breaks);
    const features = res.body.features.features as { geometry: { type: string; coordinates: number[][][][] }; properties: { band: number; from: number; colour: string } }[];
    // 3200 J/kg at the centre reaches the 3000 J/kg band; nothing reaches 4000.
    expect(features.map((f) => f.properties.from)).toEqual([100, 250, 500, 1000, 1500, 2000, 3000]);
    for (const f of features) {
      expect(f.geometry.type).toBe('MultiPolygon');
      expect(f.properties.colour).toBe(fieldDefinitions.mlCape.colours[f.properties.band]);
    }
    const top = features.at(-1);
    if (!top) throw new Error('no band');
    const centre = position(9, 6);
    const edge = position(2, 1); // about 620 J/kg: outside the 1000 J/kg band
    const band1000 = features.find((f) => f.properties.from === 1000);
    expect(booleanPointInPolygon(point([centre.longitude, centre.latitude]), top.geometry as never)).toBe(true);
    expect(booleanPointInPolygon(point([edge.longitude, edge.latitude]), band1000?.geometry as never)).toBe(false);
    const decimals = JSON.stringify(res.body.features).match(/\d+\.(\d+)/g) ?? [];
    expect(Math.max(...decimals.map((d) => d.split('.')[1]?.length ?? 0))).toBeLessThanOrEqual(3);
  });

  it('When the figure is unknown, then 400 names it', async () => {
    const res = await forecaster.get(`/api/model-runs/${runId}/field?figure=hailSizeGuess`);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toContain('hailSizeGuess');
    expect(res.body.error.issues[0].path).toBe('figure');
  });

  it('When no figure is given, then 400 says how to name one', async () => {
    const res = await forecaster.get(`/api/model-runs/${runId}/field`);
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('figure');
  });

  it('When the run does not exist, then 404', async () => {
    const res = await forecaster.get('/api/model-runs/00000000-0000-4000-8000-000000000000/field?figure=mlCape');
    expect(res.status).toBe(404);
  });

  it('When a subscriber or nobody asks, then 403 and 401', async () => {
    expect((await subscriber.get(`/api/model-runs/${runId}/field?figure=mlCape`)).status).toBe(403);
    expect((await agentFor(sd.app).get(`/api/model-runs/${runId}/field?figure=mlCape`)).status).toBe(401);
  });

  it('When the run is still being analysed, then 409 says so', async () => {
    const busy = await insertGridRun(sd.ctx.db, domeRun({ model: 'BUSY', state: 'analysing', nx: 2, ny: 2 }));
    const res = await forecaster.get(`/api/model-runs/${busy}/field?figure=mlCape`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain('analysing');
  });

  it('When runs are listed for the map, then the ready run is there with its grid', async () => {
    const res = await lead.get('/api/model-fields');
    expect(res.status).toBe(200);
    expect(res.body.runs).toContainEqual(expect.objectContaining({ id: runId, model: 'TESTNEST', nx, ny, forecastHour: 6, validTime: '2031-06-01T18:00:00.000Z' }));
    expect(res.body.runs.map((r: { model: string }) => r.model)).not.toContain('BUSY');
  });
});

async function draftOn2031() {
  const res = await forecaster.post('/api/outlooks').send({ day: 1, issuanceTime: '2031-06-01T15:00:00Z', headline: 'Grid evidence' });
  expect(res.status).toBe(201);
  return res.body as { id: string; version: number; validFrom: string; validUntil: string };
}

// An irregular area over the dome's south-east flank (not a rectangle, so the polygon test matters).
const area = { type: 'Polygon', coordinates: [[[-94.6, 36.2], [-93.3, 36.5], [-93.5, 37.9], [-94.4, 38.4], [-95.2, 37.3], [-94.6, 36.2]]] };

describe('evidence over grid soundings', () => {
  it('When an outlook has an area over a run, then the evidence counts and medians match testing every grid point, and name the run', async () => {
    const draft = await draftOn2031();
    const saved = await forecaster.put(`/api/outlooks/${draft.id}`).send({ version: draft.version, headline: 'x', discussion: '', hazardNotes: {}, validFrom: draft.validFrom, validUntil: draft.validUntil, areas: [{ levelKey: 'level1', hazards: [], geometry: area }] });
    expect(saved.status).toBe(200);
    const res = await forecaster.get(`/api/outlooks/${draft.id}/evidence`);
    expect(res.status).toBe(200);
    // Brute force: every grid point, one by one.
    const inside: number[] = [];
    for (let r = 0; r < ny; r++) for (let c = 0; c < nx; c++) if (booleanPointInPolygon(point([position(c, r).longitude, position(c, r).latitude]), area as never)) inside.push(capeAt(c, r));
    expect(inside.length).toBeGreaterThan(5);
    const [report] = res.body.areas;
    expect(report.evidence.count).toBe(inside.length);
    const sorted = inside.map((v) => Math.fround(v)).sort((a, b) => a - b);
    expect(report.evidence.stats.mlCape.median).toBeCloseTo(quantile(sorted, 0.5), 3);
    expect(report.evidence.soundingIds.every((id: string) => id.startsWith(`${runId}:`))).toBe(true);
    expect(res.body.runs).toEqual([expect.objectContaining({ id: runId, model: 'TESTNEST', cycleTime: '2031-06-01T12:00:00.000Z', forecastHour: 6 })]);
    expect(res.body.sourcesByArea[report.areaId]).toEqual([{ runId, count: inside.length }]);
    expect(res.body.soundingCount).toBe(nx * ny);
  });

  it('When the outlook is published, then the frozen evidence counts the grid soundings as the panel does', async () => {
    const draft = await draftOn2031();
    await forecaster.put(`/api/outlooks/${draft.id}`).send({ version: draft.version, headline: 'x', discussion: '', hazardNotes: {}, validFrom: draft.validFrom, validUntil: draft.validUntil, areas: [{ levelKey: 'level1', hazards: [], geometry: area }] });
    // Only the dome run feeds it, so later runs of this file cannot change the count.
    expect((await forecaster.patch(`/api/outlooks/${draft.id}/evidence-runs`).send({ version: 0, runIds: [runId] })).status).toBe(200);
    const panel = await forecaster.get(`/api/outlooks/${draft.id}/evidence`);
    const act = async (agent: TestAgent, action: string) => {
      const current = await lead.get(`/api/outlooks/${draft.id}`);
      return agent.post(`/api/outlooks/${draft.id}/${action}`).send({ version: current.body.version });
    };
    expect((await act(forecaster, 'submit')).status).toBe(200);
    expect((await act(lead, 'approve')).status).toBe(200);
    const published = await act(lead, 'publish');
    expect(published.status).toBe(200);
    const [issued] = await sd.ctx.db.select().from(issuances).where(eq(issuances.number, published.body.issuanceNumber));
    expect(issued?.snapshot.evidence?.[0]?.count).toBe(panel.body.areas[0].evidence.count);
    expect(issued?.snapshot.evidence?.[0]?.count).toBeGreaterThan(5);
  });

  it('When the run is deleted, then the evidence forgets it (no stale cache)', async () => {
    const gone = await insertGridRun(sd.ctx.db, domeRun({ model: 'GONE', cycleTime: '2031-06-01T13:00:00Z', forecastHour: 5 }));
    const draft = await draftOn2031();
    await forecaster.put(`/api/outlooks/${draft.id}`).send({ version: draft.version, headline: 'x', discussion: '', hazardNotes: {}, validFrom: draft.validFrom, validUntil: draft.validUntil, areas: [{ levelKey: 'level1', hazards: [], geometry: area }] });
    const before = await forecaster.get(`/api/outlooks/${draft.id}/evidence`);
    expect(before.body.runs.map((r: { id: string }) => r.id)).toContain(gone);
    await sd.ctx.db.delete(modelRuns).where(eq(modelRuns.id, gone));
    const after = await forecaster.get(`/api/outlooks/${draft.id}/evidence`);
    expect(after.body.runs.map((r: { id: string }) => r.id)).not.toContain(gone);
    expect(after.body.areas[0].evidence.soundingIds.some((id: string) => id.startsWith(`${gone}:`))).toBe(false);
  });
});

describe('/api/outlooks/:outlookId/evidence-runs', () => {
  it('When nothing is picked, then the default is the ready runs valid in the outlook period', async () => {
    const late = await insertGridRun(sd.ctx.db, domeRun({ model: 'LATE', forecastHour: 30, nx: 2, ny: 2 }));
    const draft = await draftOn2031();
    const res = await forecaster.get(`/api/outlooks/${draft.id}/evidence-runs`);
    expect(res.status).toBe(200);
    expect(res.body.mode).toBe('default');
    const ids = res.body.runs.map((r: { id: string }) => r.id);
    expect(ids).toContain(runId);
    expect(ids).not.toContain(late);
  });

  it('When the author picks a run, then it is stored, feeds the evidence, and a second edit from the old version gets 409', async () => {
    const draft = await draftOn2031();
    const other = await insertGridRun(sd.ctx.db, domeRun({ model: 'OTHER', cycleTime: '2031-06-01T14:00:00Z', forecastHour: 2, nx: 3, ny: 3 }));
    const picked = await forecaster.patch(`/api/outlooks/${draft.id}/evidence-runs`).send({ version: 0, runIds: [other] });
    expect(picked.status).toBe(200);
    expect(picked.body).toMatchObject({ mode: 'chosen', version: 1, runs: [expect.objectContaining({ id: other, model: 'OTHER' })] });
    const again = await forecaster.get(`/api/outlooks/${draft.id}/evidence-runs`);
    expect(again.body.runs.map((r: { id: string }) => r.id)).toEqual([other]);
    const stale = await lead.patch(`/api/outlooks/${draft.id}/evidence-runs`).send({ version: 0, runIds: [runId] });
    expect(stale.status).toBe(409);
    const evidence = await forecaster.get(`/api/outlooks/${draft.id}/evidence`);
    expect(evidence.body.runs.map((r: { id: string }) => r.id)).toEqual([other]);
    const back = await lead.patch(`/api/outlooks/${draft.id}/evidence-runs`).send({ version: 1, runIds: [] });
    expect(back.status).toBe(200);
    expect(back.body.mode).toBe('default');
  });

  it('When a picked run is valid outside the period, then 400 names it', async () => {
    const draft = await draftOn2031();
    const late = await insertGridRun(sd.ctx.db, domeRun({ model: 'OUTSIDE', forecastHour: 48, nx: 2, ny: 2 }));
    const res = await forecaster.patch(`/api/outlooks/${draft.id}/evidence-runs`).send({ version: 0, runIds: [late] });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0]).toMatchObject({ path: 'runIds.0' });
    expect(res.body.error.message).toContain('OUTSIDE');
  });

  it('When a subscriber or an admin tries to pick, then 403', async () => {
    const draft = await draftOn2031();
    expect((await subscriber.patch(`/api/outlooks/${draft.id}/evidence-runs`).send({ version: 0, runIds: [] })).status).toBe(403);
    const admin = await signedInAgent(sd.app, 'admin');
    expect((await admin.patch(`/api/outlooks/${draft.id}/evidence-runs`).send({ version: 0, runIds: [] })).status).toBe(403);
  });
});
