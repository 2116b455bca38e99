import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';

/**
 * Issue 11 item 4: the four-eyes rule is about content, not about who saved last. Nobody who
 * edited the content of the version under review (any revision since the last approval or
 * return) approves it, and a save that changes nothing writes no revision.
 */
let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
let secondLead: TestAgent;

beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  const admin = await signedInAgent(sd.app, 'admin');
  const created = await admin.post('/api/users').send({ name: 'Second Lead', email: 'four-eyes-lead2@office.test', password: 'long-enough-2', role: 'lead' });
  if (created.status !== 201) throw new Error(`second lead: ${created.status} ${JSON.stringify(created.body)}`);
  secondLead = agentFor(sd.app);
  const signIn = await secondLead.post('/api/auth/sign-in/email').send({ email: 'four-eyes-lead2@office.test', password: 'long-enough-2' });
  if (signIn.status !== 200) throw new Error(`second lead sign-in: ${signIn.status}`);
});
afterAll(async () => {
  await sd?.close();
});

const square = { type: 'Polygon', coordinates: [[[-94, 37], [-92, 37], [-92, 39], [-94, 39], [-94, 37]]] };

interface OutlookBody {
  id: string;
  version: number;
  headline: string;
  discussion: string;
  hazardNotes: Record<string, string>;
  validFrom: string;
  validUntil: string;
  areas: { id: string; levelKey: string; hazards: unknown[]; geometry: unknown; label: string }[];
  lastEditedByName: string | null;
}

async function read(id: string): Promise<OutlookBody> {
  const res = await lead.get(`/api/outlooks/${id}`);
  expect(res.status).toBe(200);
  return res.body as OutlookBody;
}

/** Sends the outlook back exactly as it was read, with optional changes (what a client autosave does). */
async function save(agent: TestAgent, id: string, change: Partial<Pick<OutlookBody, 'headline' | 'discussion'>> = {}) {
  const o = await read(id);
  const body = { version: o.version, headline: o.headline, discussion: o.discussion, hazardNotes: o.hazardNotes, validFrom: o.validFrom, validUntil: o.validUntil, areas: o.areas.map(({ id: areaId, levelKey, hazards, geometry, label }) => ({ id: areaId, levelKey, hazards, geometry, label })), ...change };
  const res = await agent.put(`/api/outlooks/${id}`).send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as OutlookBody;
}

async function act(agent: TestAgent, id: string, action: 'submit' | 'approve' | 'return', comment?: string) {
  const o = await read(id);
  return agent.post(`/api/outlooks/${id}/${action}`).send({ version: o.version, ...(comment ? { comment } : {}) });
}

/** A draft whose content the given agent wrote. */
async function draftWrittenBy(agent: TestAgent): Promise<string> {
  const created = await agent.post('/api/outlooks').send({ day: 1, issuanceTime: '2027-04-18T15:00:00Z', headline: 'Four-eyes' });
  expect(created.status).toBe(201);
  const o = created.body as OutlookBody;
  const saved = await agent.put(`/api/outlooks/${o.id}`).send({ version: o.version, headline: 'Written by the lead', discussion: 'Text', hazardNotes: {}, validFrom: o.validFrom, validUntil: o.validUntil, areas: [{ levelKey: 'level2', hazards: [], geometry: square }] });
  expect(saved.status).toBe(200);
  return o.id;
}

async function revisionCount(id: string): Promise<number> {
  const res = await lead.get(`/api/outlooks/${id}/revisions`);
  return (res.body as { revisions: unknown[] }).revisions.length;
}

describe('saves that change nothing', () => {
  it('When a colleague saves the draft unchanged, then no revision is written, the version stays and the last editor stays', async () => {
    const id = await draftWrittenBy(lead);
    const before = await read(id);
    const revisionsBefore = await revisionCount(id);
    const after = await save(forecaster, id);
    expect(after.version).toBe(before.version);
    expect(await revisionCount(id)).toBe(revisionsBefore);
    expect(after.lastEditedByName).toBe(before.lastEditedByName);
    expect(before.lastEditedByName).not.toBe(null);
  });

  it('When a colleague changes the headline, then a revision is written and the version moves on', async () => {
    const id = await draftWrittenBy(lead);
    const before = await read(id);
    const revisionsBefore = await revisionCount(id);
    const after = await save(forecaster, id, { headline: 'Changed by the forecaster' });
    expect(after.version).toBe(before.version + 1);
    expect(await revisionCount(id)).toBe(revisionsBefore + 1);
  });
});

describe('four-eyes by content edits', () => {
  it('When a lead wrote the content and a forecaster then saved it unchanged and submitted, then the lead may not approve; another lead may', async () => {
    const id = await draftWrittenBy(lead);
    await save(forecaster, id);
    expect((await act(forecaster, id, 'submit')).status).toBe(200);
    const self = await act(lead, id, 'approve');
    expect(self.status).toBe(403);
    expect(self.body.error.message).toMatch(/four-eyes/);
    expect((await act(secondLead, id, 'approve')).status).toBe(200);
  });

  it('When a lead edited an earlier revision and a forecaster edited later, then the lead still may not approve', async () => {
    const id = await draftWrittenBy(lead);
    await save(forecaster, id, { discussion: 'The forecaster rewrote the discussion.' });
    expect((await act(forecaster, id, 'submit')).status).toBe(200);
    expect((await act(lead, id, 'approve')).status).toBe(403);
  });

  it('When the lead’s edits came before a return and only the forecaster edited since, then the lead may approve', async () => {
    const id = await draftWrittenBy(lead);
    expect((await act(lead, id, 'submit')).status).toBe(200);
    expect((await act(secondLead, id, 'return', 'Tighten the Level 2 edge.')).status).toBe(200);
    await save(forecaster, id, { headline: 'Tightened by the forecaster' });
    expect((await act(forecaster, id, 'submit')).status).toBe(200);
    expect((await act(lead, id, 'approve')).status).toBe(200);
  });

  it('When a lead opens an outlook, then the payload names who edited the version under review', async () => {
    const id = await draftWrittenBy(lead);
    await save(forecaster, id, { headline: 'Both edited' });
    const me = await lead.get('/api/me');
    const fc = await forecaster.get('/api/me');
    const body = (await lead.get(`/api/outlooks/${id}`)).body as { reviewEditorIds: string[] };
    expect([...body.reviewEditorIds].sort()).toEqual([me.body.user.id, fc.body.user.id].sort());
  });
});
