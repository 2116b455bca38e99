import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { eq } from 'drizzle-orm';
import { issuances, issuanceVerifications } from '../../server/db/schema';
import type { Stormdraft } from '../../server/start';
import { verifyDueIssuances, verifyIssuance } from '../../server/services/verification.service';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
let anonymous: TestAgent;

interface ArchiveItem {
  number: string;
  day: number;
  validFrom: string;
  validUntil: string;
  state: string;
}

async function pastIssuance(): Promise<ArchiveItem> {
  const archive = await anonymous.get('/api/public/issuances');
  const past = (archive.body.issuances as ArchiveItem[]).find((i) => Date.parse(i.validUntil) < Date.now());
  if (!past) throw new Error('the demo has no issuance whose period ended');
  return past;
}

beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  anonymous = agentFor(sd.app);
});
afterAll(async () => {
  await sd?.close();
});

describe('GET /api/public/issuances/:number/verification', () => {
  it('When the demo issuance two days back is opened, then its reports, contingency tables and scores are there', async () => {
    const past = await pastIssuance();
    const res = await anonymous.get(`/api/public/issuances/${past.number}/verification`);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('scored');
    expect(res.body.reports.length).toBeGreaterThan(10);
    expect(res.body.result.reportsUsed).toBe(res.body.reports.length);
    const thunder = res.body.result.levels.find((l: { levelKey: string }) => l.levelKey === 'thunder');
    // The demo reports cluster where the demo areas are and a few fall outside every area.
    expect(thunder.table.hits).toBeGreaterThan(0);
    expect(thunder.table.misses).toBeGreaterThan(0);
    const { hits, falseAlarms, misses, correctNegatives } = thunder.table;
    expect(hits + falseAlarms + misses + correctNegatives).toBe(res.body.result.cells);
  });

  it('When the issuance is still in force, then verification is pending and shows no reports', async () => {
    const archive = await anonymous.get('/api/public/issuances');
    const current = (archive.body.issuances as ArchiveItem[]).find((i) => Date.parse(i.validUntil) > Date.now());
    expect(current).toBeTruthy();
    const res = await anonymous.get(`/api/public/issuances/${current!.number}/verification`);
    expect(res.body).toMatchObject({ status: 'pending', reports: [], result: null });
  });

  it('When the number does not exist, then 404', async () => {
    expect((await anonymous.get('/api/public/issuances/1999-0001/verification')).status).toBe(404);
  });
});

describe('POST /api/storm-reports and /api/storm-reports/uploads', () => {
  it('When a late report falls inside a scored window, then the issuance is scored again with it', async () => {
    const past = await pastIssuance();
    const before = (await anonymous.get(`/api/public/issuances/${past.number}/verification`)).body;
    const time = new Date(Date.parse(past.validFrom) + 6 * 3_600_000).toISOString();
    const res = await forecaster.post('/api/storm-reports').send({ reports: [{ time, latitude: 37.2, longitude: -89.1, hazard: 'hail', hailCm: 3, source: 'spotter', remark: 'late report' }] });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ stored: 1, merged: 0, rescored: [past.number] });
    const after = (await anonymous.get(`/api/public/issuances/${past.number}/verification`)).body;
    expect(after.result.reportsUsed).toBe(before.result.reportsUsed + 1);
    // The same report again is a duplicate: merged, not stored twice.
    const again = await forecaster.post('/api/storm-reports').send({ reports: [{ time, latitude: 37.2, longitude: -89.1, hazard: 'hail', hailCm: 3, source: 'public' }] });
    expect(again.body).toMatchObject({ stored: 0, merged: 1, rescored: [] });
  });

  it('When a JSON report is invalid, then 400 names the report and field', async () => {
    const res = await forecaster.post('/api/storm-reports').send({ reports: [{ time: '2027-02-30T10:00Z', latitude: 37, longitude: -90, hazard: 'hail', source: 'spotter' }] });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toContain('reports.0');
    expect(res.body.error.issues[0].path).toContain('time_utc');
  });

  it('When a CSV file has a bad line, then that file is refused with the line and a good file beside it is stored', async () => {
    const good = ['# source: spotter', 'time_utc,latitude,longitude,hazard,gust_kmh,gust_measured,remark', '2027-05-02T20:00Z,38.0,-90.0,wind,110,no,"Trees down, road closed"'].join('\n');
    const bad = ['time_utc,latitude,longitude,hazard,source', '2027-05-02T20:00Z,38.0,-90.0,wind,spotter', '2027-05-02T20:10Z,38.0,-190.0,wind,spotter'].join('\n');
    const res = await forecaster.post('/api/storm-reports/uploads').attach('files', Buffer.from(good), 'good.csv').attach('files', Buffer.from(bad), 'bad.csv');
    expect(res.status).toBe(200);
    expect(res.body.files[0]).toMatchObject({ fileName: 'good.csv', ok: true, stored: 1 });
    expect(res.body.files[1]).toMatchObject({ fileName: 'bad.csv', ok: false });
    expect(res.body.files[1].error.issues[0]).toMatchObject({ path: 'line 3 · longitude' });
    const listed = await lead.get('/api/storm-reports').query({ from: '2027-05-02', to: '2027-05-02' });
    expect(listed.body.reports).toHaveLength(1);
    expect(listed.body.reports[0].remark).toBe('Trees down, road closed');
  });

  it('When a GeoJSON file of points is uploaded, then its reports are stored', async () => {
    const collection = { type: 'FeatureCollection', features: [{ type: 'Feature', geometry: { type: 'Point', coordinates: [-91, 37.5] }, properties: { time: '2027-05-03T21:00:00Z', hazard: 'tornado', efRating: 1, source: 'emergency_manager' } }] };
    const res = await forecaster.post('/api/storm-reports/uploads').attach('files', Buffer.from(JSON.stringify(collection)), 'reports.geojson');
    expect(res.body.files[0]).toMatchObject({ ok: true, stored: 1 });
  });
});

describe('scoring amended and withdrawn issuances', () => {
  it('When an issuance is replaced by an amendment mid-period, then it is scored only until the amendment was published', async () => {
    const drafts = await forecaster.get('/api/outlooks').query({ state: 'draft' });
    const amendment = (drafts.body.outlooks as { id: string; headline: string }[]).find((o) => o.headline.startsWith('Scattered severe storms this afternoon'));
    expect(amendment).toBeTruthy();
    const id = amendment!.id;
    const step = async (agent: TestAgent, action: string) => {
      const current = await lead.get(`/api/outlooks/${id}`);
      const res = await agent.post(`/api/outlooks/${id}/${action}`).send({ version: current.body.version });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
    };
    await step(forecaster, 'submit');
    await step(lead, 'approve');
    await step(lead, 'publish');
    const [replaced] = await sd.ctx.db.select().from(issuances).where(eq(issuances.state, 'superseded'));
    expect(replaced).toBeTruthy();
    const [replacement] = await sd.ctx.db.select().from(issuances).where(eq(issuances.id, replaced!.supersededById!));
    // Make the replaced issuance's period start an hour before the amendment went out, whatever the time of day the test runs.
    const [moved] = await sd.ctx.db.update(issuances).set({ validFrom: new Date(replacement!.publishedAt.getTime() - 3_600_000) }).where(eq(issuances.id, replaced!.id)).returning();
    await verifyIssuance(sd.ctx.db, moved!);
    const [stored] = await sd.ctx.db.select().from(issuanceVerifications).where(eq(issuanceVerifications.issuanceId, replaced!.id));
    expect(stored!.windowUntil.toISOString()).toBe(replacement!.publishedAt.toISOString());
    expect(stored!.windowUntil < replaced!.validUntil).toBe(true);
  });

  it('When an issuance is withdrawn, then it is listed on the Verification page as not scored, with the reason', async () => {
    const archive = await anonymous.get('/api/public/issuances');
    const inForce = (archive.body.issuances as ArchiveItem[]).find((i) => i.state === 'published' && Date.parse(i.validUntil) > Date.now());
    expect(inForce).toBeTruthy();
    const withdrawn = await lead.post(`/api/issuances/${inForce!.number}/withdraw`).send({ reason: 'Issued for the wrong region' });
    expect(withdrawn.status, JSON.stringify(withdrawn.body)).toBe(200);
    expect(await verifyDueIssuances(sd.ctx.db)).toContain(inForce!.number);
    const summary = await lead.get('/api/verification');
    expect(summary.body.notScored).toContainEqual({ issuanceNumber: inForce!.number, reason: expect.stringContaining('Issued for the wrong region') });
    expect(summary.body.rows.length).toBeGreaterThan(0);
    const csv = await lead.get('/api/verification/export.csv');
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.text.split('\n')[0]).toBe('issuance,day,valid_from,valid_until,shift,kind,key,hits,false_alarms,misses,correct_negatives,pod,success_ratio,csi,bias');
    expect(csv.text).toContain(',level,level1,');
  });
});
