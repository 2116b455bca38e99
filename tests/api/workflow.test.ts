import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { eq } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { issuances, outlooks, users } from '../../server/db/schema';
import { transitionOutlook } from '../../server/services/workflow.service';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
let secondLead: TestAgent;
let admin: TestAgent;
let subscriber: TestAgent;

beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  admin = await signedInAgent(sd.app, 'admin');
  subscriber = await signedInAgent(sd.app, 'subscriber');
  await admin.post('/api/users').send({ name: 'Second Lead', email: 'lead2@office.test', password: 'long-enough-2', role: 'lead' });
  secondLead = agentFor(sd.app);
  await secondLead.post('/api/auth/sign-in/email').send({ email: 'lead2@office.test', password: 'long-enough-2' });
});
afterAll(async () => {
  await sd?.close();
});

const square = { type: 'Polygon', coordinates: [[[-94, 37], [-92, 37], [-92, 39], [-94, 39], [-94, 37]]] };

async function draftBy(agent: TestAgent) {
  const created = await agent.post('/api/outlooks').send({ day: 1, issuanceTime: '2027-04-18T15:00:00Z', headline: 'Workflow test' });
  const o = created.body;
  const saved = await agent.put(`/api/outlooks/${o.id}`).send({ version: o.version, headline: 'Workflow test', discussion: 'Text', hazardNotes: {}, validFrom: o.validFrom, validUntil: o.validUntil, areas: [{ levelKey: 'level2', hazards: [], geometry: square }] });
  return saved.body as { id: string; version: number };
}

async function act(agent: TestAgent, id: string, action: string, comment?: string) {
  const current = await lead.get(`/api/outlooks/${id}`);
  return agent.post(`/api/outlooks/${id}/${action}`).send({ version: current.body.version, ...(comment ? { comment } : {}) });
}

/** Brings a fresh outlook (last edited by the forecaster) to the given state. */
async function outlookIn(state: 'draft' | 'in_review' | 'approved' | 'returned') {
  const o = await draftBy(forecaster);
  if (state === 'draft') return o.id;
  expect((await act(forecaster, o.id, 'submit')).status).toBe(200);
  if (state === 'returned') expect((await act(lead, o.id, 'return', 'Tighten the Level 2 edge.')).status).toBe(200);
  if (state === 'approved') expect((await act(lead, o.id, 'approve')).status).toBe(200);
  return o.id;
}

type Caller = 'subscriber' | 'forecaster' | 'lead' | 'admin';
const agents = () => ({ subscriber, forecaster, lead, admin }) as Record<Caller, TestAgent>;

/** Every transition × every role: allowed (200) or refused (403), from a state the transition leaves. */
const table: { action: string; from: 'draft' | 'in_review' | 'approved' | 'returned'; expect: Record<Caller, number> }[] = [
  { action: 'submit', from: 'draft', expect: { subscriber: 403, forecaster: 200, lead: 200, admin: 403 } },
  { action: 'submit', from: 'returned', expect: { subscriber: 403, forecaster: 200, lead: 200, admin: 403 } },
  { action: 'return', from: 'in_review', expect: { subscriber: 403, forecaster: 403, lead: 200, admin: 403 } },
  { action: 'approve', from: 'in_review', expect: { subscriber: 403, forecaster: 403, lead: 200, admin: 403 } },
  { action: 'publish', from: 'approved', expect: { subscriber: 403, forecaster: 403, lead: 200, admin: 403 } },
];

describe('transition × role table', () => {
  const cases = table.flatMap((row) => (Object.keys(row.expect) as Caller[]).map((caller) => ({ ...row, caller })));
  it.each(cases.map((c) => [c.action, c.from, c.caller, c.expect[c.caller], c] as const))('When %s is tried from %s by %s, then the status is %i', async (action, _from, caller, expected, row) => {
    const id = await outlookIn(row.from);
    const res = await act(agents()[caller], id, action, 'A comment for the record.');
    expect(res.status, JSON.stringify(res.body)).toBe(expected);
  });

  it('When a transition does not leave from the current state, then 409 says why', async () => {
    const id = await outlookIn('draft');
    const res = await act(lead, id, 'publish');
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/a draft/);
  });

  it('When a lead returns without a comment, then 400 asks for one', async () => {
    const id = await outlookIn('in_review');
    const res = await act(lead, id, 'return');
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('comment');
  });
});

describe('four-eyes rule', () => {
  it('When the lead who last edited the draft approves it, then 403; another lead may approve', async () => {
    const o = await draftBy(lead);
    expect((await act(lead, o.id, 'submit')).status).toBe(200);
    const self = await act(lead, o.id, 'approve');
    expect(self.status).toBe(403);
    expect(self.body.error.message).toMatch(/four-eyes/);
    expect((await act(secondLead, o.id, 'approve')).status).toBe(200);
  });

  it('When the office relaxes the rule, then self-approval works and the audit trail records it', async () => {
    const office = (await admin.get('/api/office')).body;
    const { offices } = await import('../../server/db/schema');
    await sd.ctx.db.update(offices).set({ allowSelfApproval: true }).where(eq(offices.id, office.id));
    try {
      const o = await draftBy(lead);
      await act(lead, o.id, 'submit');
      expect((await act(lead, o.id, 'approve')).status).toBe(200);
      const audit = await lead.get(`/api/outlooks/${o.id}/audit`);
      const approval = audit.body.events.find((e: { action: string }) => e.action === 'approve');
      expect(approval.details.fourEyesRelaxed).toBe(true);
    } finally {
      await sd.ctx.db.update(offices).set({ allowSelfApproval: false }).where(eq(offices.id, office.id));
    }
  });
});

describe('publishing', () => {
  it('When a lead publishes, then an issuance numbered YYYY-NNNN is written, the draft is frozen, and every save is refused', async () => {
    const id = await outlookIn('approved');
    const res = await act(lead, id, 'publish');
    expect(res.status).toBe(200);
    expect(res.body.issuanceNumber).toMatch(/^\d{4}-\d{4}$/);
    const [issued] = await sd.ctx.db.select().from(issuances).where(eq(issuances.outlookId, id));
    expect(issued?.number).toBe(res.body.issuanceNumber);
    expect((issued?.snapshot as { areas: unknown[] }).areas).toHaveLength(1);
    const current = (await forecaster.get(`/api/outlooks/${id}`)).body;
    const save = await forecaster.put(`/api/outlooks/${id}`).send({ version: current.version, headline: 'Changed', discussion: '', hazardNotes: {}, validFrom: current.validFrom, validUntil: current.validUntil, areas: [] });
    expect(save.status).toBe(409);
    for (const action of ['submit', 'return', 'approve', 'publish']) expect((await act(lead, id, action, 'x')).status).toBe(409);
  });

  it('When two outlooks are published, then their numbers follow each other', async () => {
    const a = await act(lead, await outlookIn('approved'), 'publish');
    const b = await act(lead, await outlookIn('approved'), 'publish');
    const [ya, na] = String(a.body.issuanceNumber).split('-').map(Number);
    const [yb, nb] = String(b.body.issuanceNumber).split('-').map(Number);
    expect(yb).toBe(ya);
    expect(nb).toBe((na ?? 0) + 1);
  });

  it('When a fault strikes after the issuance row is written, then no half issuance is left and the draft is unchanged', async () => {
    const id = await outlookIn('approved');
    const before = (await lead.get(`/api/outlooks/${id}`)).body;
    const [leadRow] = await sd.ctx.db.select().from(users).where(eq(users.email, 'lead@demo.stormdraft.test'));
    if (!leadRow) throw new Error('no demo lead');
    const actor = { userId: leadRow.id, name: leadRow.name, email: leadRow.email, role: 'lead' as const };
    await expect(
      transitionOutlook(sd.ctx.db, sd.ctx.config, actor, id, 'publish', { version: before.version }, {
        afterIssuanceWritten: () => {
          throw new Error('injected fault');
        },
      }),
    ).rejects.toThrow('injected fault');
    expect(await sd.ctx.db.select().from(issuances).where(eq(issuances.outlookId, id))).toHaveLength(0);
    const [row] = await sd.ctx.db.select().from(outlooks).where(eq(outlooks.id, id));
    expect(row?.state).toBe('approved');
    expect(row?.version).toBe(before.version);
  });
});

describe('comments and audit trail', () => {
  it('When a lead returns with a comment and pins another to an area, then both read back and the audit trail lists every step', async () => {
    const id = await outlookIn('in_review');
    const outlook = (await lead.get(`/api/outlooks/${id}`)).body;
    expect((await lead.post(`/api/outlooks/${id}/comments`).send({ body: 'Edge too far east.', riskAreaId: outlook.areas[0].id })).status).toBe(201);
    expect((await act(lead, id, 'return', 'See the pinned comment.')).status).toBe(200);
    const comments = await forecaster.get(`/api/outlooks/${id}/comments`);
    expect(comments.body.comments[0]).toMatchObject({ body: 'Edge too far east.', riskAreaId: outlook.areas[0].id });
    const audit = await forecaster.get(`/api/outlooks/${id}/audit`);
    expect(audit.body.events.map((e: { action: string }) => e.action)).toEqual(['return', 'comment', 'submit', 'save', 'create']);
    expect(audit.body.events[0]).toMatchObject({ fromState: 'in_review', toState: 'returned', comment: 'See the pinned comment.' });
  });
});

describe('issuances: public pages, amendments, withdrawal', () => {
  it('When an issuance is published, then the public bulletin and archive show it without sign-in, with the caution', async () => {
    const published = await act(lead, await outlookIn('approved'), 'publish');
    const number = published.body.issuanceNumber;
    const anonymous = agentFor(sd.app);
    const bulletin = await anonymous.get('/api/public/bulletin');
    expect(bulletin.status).toBe(200);
    expect(bulletin.body.issuances.map((i: { number: string }) => i.number)).toContain(number);
    expect(bulletin.body.caution).toMatch(/planning guidance/);
    const archive = await anonymous.get('/api/public/issuances').query({ q: number });
    expect(archive.body.issuances[0].number).toBe(number);
    const geojson = await anonymous.get(`/api/public/issuances/${number}/geojson`);
    expect(geojson.status).toBe(200);
    const doc = JSON.parse(geojson.text);
    expect(doc.properties).toMatchObject({ issuance: number, caution: expect.stringMatching(/planning guidance/) });
    expect(doc.features[0].properties.issuance).toBe(number);
  });

  it('When an amendment is published, then the old issuance is superseded and both link to each other', async () => {
    const first = await act(lead, await outlookIn('approved'), 'publish');
    const amend = await forecaster.post(`/api/issuances/${first.body.issuanceNumber}/amend`).send({});
    expect(amend.status).toBe(201);
    const id = amend.body.outlookId;
    expect((await act(forecaster, id, 'submit')).status).toBe(200);
    expect((await act(lead, id, 'approve')).status).toBe(200);
    const second = await act(lead, id, 'publish');
    expect(second.status).toBe(200);
    const old = await agentFor(sd.app).get(`/api/public/issuances/${first.body.issuanceNumber}`);
    expect(old.body).toMatchObject({ state: 'superseded', supersededByNumber: second.body.issuanceNumber });
    const current = await agentFor(sd.app).get(`/api/public/issuances/${second.body.issuanceNumber}`);
    expect(current.body.supersedesNumber).toBe(first.body.issuanceNumber);
  });

  it('When a lead withdraws an issuance, then it stays readable, says so, and cannot be withdrawn twice', async () => {
    const published = await act(lead, await outlookIn('approved'), 'publish');
    const number = published.body.issuanceNumber;
    expect((await forecaster.post(`/api/issuances/${number}/withdraw`).send({ reason: 'Issued for the wrong day.' })).status).toBe(403);
    const res = await lead.post(`/api/issuances/${number}/withdraw`).send({ reason: 'Issued for the wrong day.' });
    expect(res.status).toBe(200);
    const page = await agentFor(sd.app).get(`/api/public/issuances/${number}`);
    expect(page.body).toMatchObject({ state: 'withdrawn', withdrawnReason: 'Issued for the wrong day.' });
    expect((await lead.post(`/api/issuances/${number}/withdraw`).send({ reason: 'Again and again.' })).status).toBe(409);
  });
});

describe('demo seed', () => {
  it('When the demo office starts, then it has a published Day 1 issuance, a Day 1 draft amending it and a Day 2 draft in review', async () => {
    // Earlier tests in this file publish other Day 1 issuances, so find the demo one in the archive.
    const archive = await agentFor(sd.app).get('/api/public/issuances').query({ q: 'Isolated severe storms' });
    const day1 = archive.body.issuances.find((i: { day: number }) => i.day === 1);
    expect(day1).toBeDefined();
    const review = await lead.get('/api/outlooks').query({ state: 'in_review' });
    expect(review.body.outlooks.some((o: { day: number; headline: string }) => o.day === 2 && o.headline.startsWith('Storms return'))).toBe(true);
    const drafts = await forecaster.get('/api/outlooks').query({ state: 'draft' });
    const amendment = drafts.body.outlooks.find((o: { headline: string }) => o.headline.startsWith('Scattered severe storms'));
    expect((await forecaster.get(`/api/outlooks/${amendment.id}`)).body.amendsIssuanceId).toBe(day1.id);
  });
});
