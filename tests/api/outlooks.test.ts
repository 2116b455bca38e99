import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { signedInAgent, startTestApp } from './helpers/test-app';

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

const square = (w: number, s: number, e: number, n: number) => ({ type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] });

async function newDraft() {
  const res = await forecaster.post('/api/outlooks').send({ day: 1, issuanceTime: '2027-04-18T15:00:00Z', headline: 'Test' });
  expect(res.status).toBe(201);
  return res.body;
}

function saveBody(outlook: { version: number; validFrom: string; validUntil: string }, areas: unknown[], headline = 'Saved') {
  return { version: outlook.version, headline, discussion: '## Discussion', hazardNotes: {}, validFrom: outlook.validFrom, validUntil: outlook.validUntil, areas };
}

describe('POST /api/outlooks', () => {
  it('When a forecaster starts a Day 1 outlook at 15 UTC, then it is a draft valid until 06:00 office time next day', async () => {
    const outlook = await newDraft();
    expect(outlook).toMatchObject({ state: 'draft', day: 1, validFrom: '2027-04-18T15:00:00.000Z', validUntil: '2027-04-19T11:00:00.000Z', areas: [] });
  });

  it('When the day is 4, then 400 names the field', async () => {
    const res = await forecaster.post('/api/outlooks').send({ day: 4 });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('day');
  });
});

describe('PUT /api/outlooks/:outlookId', () => {
  it('When the draft is saved with areas, then the version moves on, areas come back and a revision is written', async () => {
    const outlook = await newDraft();
    const res = await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [{ levelKey: 'level1', hazards: [{ hazard: 'hail', significant: true }], geometry: square(-94, 37, -92, 39) }]));
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(outlook.version + 1);
    expect(res.body.areas).toHaveLength(1);
    const revisions = await forecaster.get(`/api/outlooks/${outlook.id}/revisions`);
    expect(revisions.body.revisions.map((r: { revisionNumber: number }) => r.revisionNumber)).toEqual([2, 1]);
    const first = await forecaster.get(`/api/outlook-revisions/${revisions.body.revisions[1].id}`);
    expect(first.body.snapshot.areas).toEqual([]);
  });

  it('When two people save from the same version, then the second gets 409 and the first save stays', async () => {
    const outlook = await newDraft();
    const mine = await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [], 'Mine'));
    expect(mine.status).toBe(200);
    const theirs = await lead.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [], 'Theirs'));
    expect(theirs.status).toBe(409);
    expect(theirs.body.error.message).toMatch(/changed by someone else/);
    expect((await lead.get(`/api/outlooks/${outlook.id}`)).body.headline).toBe('Mine');
  });

  it('When an area names a level not on the ladder or an open ring, then 400 names the area field', async () => {
    const outlook = await newDraft();
    const badLevel = await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [{ levelKey: 'level9', geometry: square(-94, 37, -92, 39) }]));
    expect(badLevel.status).toBe(400);
    expect(badLevel.body.error.issues[0].path).toBe('areas.0.levelKey');
    const openRing = await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [{ levelKey: 'level1', geometry: { type: 'Polygon', coordinates: [[[-94, 37], [-92, 37], [-92, 39], [-94, 39]]] } }]));
    expect(openRing.status).toBe(400);
    expect(openRing.body.error.issues[0].path).toMatch(/^areas\.0\.geometry/);
  });
});

describe('evidence and support check', () => {
  it('When the demo draft is read, then each area has evidence from the demo soundings and the dryline area is thin', async () => {
    const list = await forecaster.get('/api/outlooks').query({ state: 'draft' });
    const demo = list.body.outlooks.find((o: { headline: string }) => o.headline.startsWith('Scattered severe storms'));
    expect(demo).toBeDefined();
    const detail = await forecaster.get(`/api/outlooks/${demo.id}`);
    const res = await forecaster.get(`/api/outlooks/${demo.id}/evidence`);
    expect(res.status).toBe(200);
    expect(res.body.soundingCount).toBeGreaterThanOrEqual(60);
    const byLabel = new Map<string, { support: { result: string }; evidence: { count: number } }>(
      res.body.areas.map((a: { areaId: string }) => [detail.body.areas.find((d: { id: string; label: string }) => d.id === a.areaId).label, a]),
    );
    expect(byLabel.get('Dryline and low')?.support.result).toBe('thin');
    expect(byLabel.get('General thunder')?.evidence.count).toBeGreaterThan(50);
    const results = new Set(res.body.areas.map((a: { support: { result: string } }) => a.support.result));
    expect(results.size, 'the demo areas are supported to different degrees').toBeGreaterThan(2);
  });

  it('When an area lies where no sounding is, then the result is "none"', async () => {
    const outlook = await newDraft();
    const saved = await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [{ levelKey: 'level1', geometry: square(-80, 30, -79, 31) }]));
    const res = await forecaster.get(`/api/outlooks/${saved.body.id}/evidence`);
    expect(res.body.areas[0].support.result).toBe('none');
    expect(res.body.areas[0].checks.map((c: { code: string }) => c.code)).toContain('OUTSIDE_REGION');
  });
});

describe('GeoJSON in and out', () => {
  it('When areas are exported and imported again, then the same levels and geometries come back', async () => {
    const outlook = await newDraft();
    await forecaster.put(`/api/outlooks/${outlook.id}`).send(saveBody(outlook, [{ levelKey: 'level2', hazards: [], geometry: square(-94, 37, -92, 39), label: 'A' }]));
    const exported = await forecaster.get(`/api/outlooks/${outlook.id}/geojson`);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-type']).toMatch(/application\/geo\+json/);
    const geojson = JSON.parse(exported.text);
    expect(geojson.type).toBe('FeatureCollection');
    const imported = await forecaster.post('/api/outlooks/area-imports').send({ geojson });
    expect(imported.status).toBe(200);
    expect(imported.body.areas[0]).toMatchObject({ levelKey: 'level2', label: 'A', geometry: square(-94, 37, -92, 39) });
  });

  it('When an imported feature has a point or an unknown level, then 400 names the feature', async () => {
    const res = await forecaster.post('/api/outlooks/area-imports').send({
      geojson: {
        type: 'FeatureCollection',
        features: [
          { type: 'Feature', geometry: { type: 'Point', coordinates: [-93, 38] }, properties: { level: 'level1' } },
          { type: 'Feature', geometry: square(-94, 37, -92, 39), properties: { level: 'extreme' } },
        ],
      },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['features.0.geometry', 'features.1.properties.level']);
  });
});

describe('demo draft diagnostics', () => {
  it('When the demo draft is checked, then its nested areas raise no nesting warnings', async () => {
    const list = await forecaster.get('/api/outlooks').query({ state: 'draft' });
    const demo = list.body.outlooks.find((o: { headline: string }) => o.headline.startsWith('Scattered severe storms'));
    const res = await forecaster.get(`/api/outlooks/${demo.id}/evidence`);
    const codes = res.body.areas.flatMap((a: { checks: { code: string }[] }) => a.checks.map((c) => c.code));
    expect(codes).not.toContain('NOT_NESTED');
  });
});
