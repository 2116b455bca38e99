import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { eq } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { issuances } from '../../server/db/schema';
import { issuanceSnapshotSchema } from '../../shared/contracts/issuances';
import { signedInAgent, startTestApp } from './helpers/test-app';

/*
 * Issue 14: publishing stores the guidance the outlook was checked against with the issuance,
 * and a published outlook's support check keeps using it after the office changes its rules.
 * The rule values are test guidance chosen to flip the result, not advice.
 */

let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
let admin: TestAgent;
beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  admin = await signedInAgent(sd.app, 'admin');
});
afterAll(async () => {
  await sd?.close();
});

/** The whole demo region: every demo sounding of the day lies inside. */
const wholeRegion = { type: 'Polygon', coordinates: [[[-100, 33], [-86, 33], [-86, 44], [-100, 44], [-100, 33]]] };
const rule = (value: number) => ({ rules: [{ figure: 'mlCape', bound: 'min', value }], minimumSharePercent: null, minimumCount: 3 });
/** Level 1 backed by any sounding with an MLCAPE value; Level 2 out of reach (so no "exceeds"). */
const lenient = { levels: { level1: rule(0), level2: rule(99_999) }, hazards: {} };
/** Level 1 out of reach. */
const strict = { levels: { level1: rule(99_999), level2: rule(99_999) }, hazards: {} };

async function setGuidance(guidance: unknown) {
  const current = (await admin.get('/api/office')).body;
  const res = await admin.put('/api/office').send({ name: current.name, region: current.region, timeZone: current.timeZone, riskLadder: current.riskLadder, guidance, version: current.version });
  expect(res.status).toBe(200);
}

/** 15 UTC on the demo day (today): the demo soundings are valid at 12, 18 and 24 UTC of it. */
function demoDayAt15Utc(): string {
  const now = new Date();
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate(), 15)).toISOString();
}

async function draftWithLevel1() {
  const created = await forecaster.post('/api/outlooks').send({ day: 1, issuanceTime: demoDayAt15Utc(), headline: 'Versioning test' });
  const o = created.body;
  const saved = await forecaster
    .put(`/api/outlooks/${o.id}`)
    .send({ version: o.version, headline: 'Versioning test', discussion: 'Text', hazardNotes: {}, validFrom: o.validFrom, validUntil: o.validUntil, areas: [{ levelKey: 'level1', hazards: [], geometry: wholeRegion }] });
  expect(saved.status).toBe(200);
  return saved.body.id as string;
}

async function act(agent: TestAgent, id: string, action: string) {
  const current = await lead.get(`/api/outlooks/${id}`);
  const res = await agent.post(`/api/outlooks/${id}/${action}`).send({ version: current.body.version });
  expect(res.status, `${action}: ${JSON.stringify(res.body)}`).toBe(200);
  return res.body;
}

const supportOf = async (id: string) => (await forecaster.get(`/api/outlooks/${id}/evidence`)).body.areas[0].support as { result: string; reasons: string[] };

describe('the demo office (issue 14 acceptance)', () => {
  it('When the demo outlooks are checked, then every area with soundings inside names counts of backing soundings, and each hazard flag has its own judgement', async () => {
    const list = await forecaster.get('/api/outlooks');
    expect(list.status).toBe(200);
    const ids: string[] = list.body.outlooks.map((o: { id: string }) => o.id);
    expect(ids.length).toBeGreaterThan(0);
    let areasWithSoundings = 0;
    for (const id of ids) {
      const [detail, evidence] = await Promise.all([forecaster.get(`/api/outlooks/${id}`), forecaster.get(`/api/outlooks/${id}/evidence`)]);
      for (const report of evidence.body.areas as { areaId: string; evidence: { count: number }; support: { reasons: string[]; hazards: { hazard: string; significant: boolean }[] } }[]) {
        const area = detail.body.areas.find((a: { id: string }) => a.id === report.areaId) as { hazards: { hazard: string; significant: boolean }[] };
        expect(report.support.hazards.map((h) => [h.hazard, h.significant])).toEqual(area.hazards.map((h) => [h.hazard, h.significant]));
        if (report.evidence.count === 0) continue;
        areasWithSoundings += 1;
        expect(report.support.reasons[0]).toMatch(new RegExp(`^\\d+ of ${report.evidence.count} soundings? backs? `));
      }
    }
    expect(areasWithSoundings).toBeGreaterThan(2);
  });
});

describe('guidance versioned with the issuance', () => {
  it('When an outlook is published and the office then tightens its rules, then the issuance keeps the guidance it was checked against and its support check uses it', async () => {
    await setGuidance(lenient);
    const id = await draftWithLevel1();
    expect((await supportOf(id)).result).toBe('supported');
    await act(forecaster, id, 'submit');
    await act(lead, id, 'approve');
    const published = await act(lead, id, 'publish');

    const [row] = await sd.ctx.db.select({ snapshot: issuances.snapshot }).from(issuances).where(eq(issuances.number, published.issuanceNumber));
    const snapshot = issuanceSnapshotSchema.parse(row?.snapshot);
    expect(snapshot.guidance?.levels.level1?.rules).toEqual([{ figure: 'mlCape', bound: 'min', value: 0 }]);
    expect(snapshot.evidence[0]?.support.result).toBe('supported');

    await setGuidance(strict);
    // The published outlook: checked against the guidance stored with its issuance.
    const kept = await supportOf(id);
    expect(kept.result).toBe('supported');
    expect(kept.reasons[0]).toMatch(/^(\d+) of \1 soundings back Level 1 · Isolated/);
    // The same area in a new draft: checked against today's guidance.
    const fresh = await supportOf(await draftWithLevel1());
    expect(fresh.result).toBe('thin');
    expect(fresh.reasons[0]).toMatch(/^0 of \d+ soundings back Level 1 · Isolated; \d+ fall short \(MLCAPE below 99,999 J\/kg/);
  });
});
