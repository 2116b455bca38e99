import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { outlookRevisionSchema, type OutlookSummary, type RevisionSummary } from '../../shared/contracts/outlooks';
import type { Stormdraft } from '../../server/start';
import { signedInAgent, startTestApp } from './helpers/test-app';

/**
 * Issue 12 item 3: an amendment's first revision was stored without its valid period, so the
 * client's revision schema refused it ("The server sent an answer this page does not
 * understand"). Every revision is now read through the one shared schema the client parses with.
 */
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

async function revisionsOf(outlookId: string): Promise<RevisionSummary[]> {
  const res = await forecaster.get(`/api/outlooks/${outlookId}/revisions`);
  expect(res.status).toBe(200);
  return (res.body as { revisions: RevisionSummary[] }).revisions;
}

describe('GET /api/outlook-revisions/:revisionId', () => {
  it('When every revision of every demo outlook is opened, then each matches the shared revision contract', async () => {
    const list = await forecaster.get('/api/outlooks');
    const outlooks = (list.body as { outlooks: OutlookSummary[] }).outlooks;
    expect(outlooks.length).toBeGreaterThanOrEqual(3);
    let opened = 0;
    for (const outlook of outlooks) {
      for (const revision of await revisionsOf(outlook.id)) {
        const res = await forecaster.get(`/api/outlook-revisions/${revision.id}`);
        expect(res.status).toBe(200);
        const parsed = outlookRevisionSchema.safeParse(res.body);
        expect(parsed.success, `revision ${revision.revisionNumber} of ${outlook.headline}: ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
        opened++;
      }
    }
    expect(opened).toBeGreaterThanOrEqual(6);
  });

  it('When a lead amends an issuance, then revision 1 of the amendment carries its valid period, hazard notes and the number it amends', async () => {
    const created = await forecaster.post('/api/outlooks').send({ day: 2, issuanceTime: '2027-04-18T15:00:00Z', headline: 'To amend' });
    const o = created.body as { id: string; version: number; validFrom: string; validUntil: string };
    const saved = await forecaster.put(`/api/outlooks/${o.id}`).send({ version: o.version, headline: 'To amend', discussion: 'Text', hazardNotes: { hail: 'Large hail west.' }, validFrom: o.validFrom, validUntil: '2099-01-01T00:00:00Z', areas: [] });
    expect(saved.status).toBe(200);
    let version = (saved.body as { version: number }).version;
    let issuanceNumber = '';
    for (const action of ['submit', 'approve', 'publish'] as const) {
      const res = await (action === 'submit' ? forecaster : lead).post(`/api/outlooks/${o.id}/${action}`).send({ version });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      version = res.body.version;
      issuanceNumber = res.body.issuanceNumber ?? issuanceNumber;
    }
    const amended = await forecaster.post(`/api/issuances/${issuanceNumber}/amend`).send({});
    expect(amended.status).toBe(201);
    const amendmentId = (amended.body as { outlookId: string }).outlookId;
    const draft = (await forecaster.get(`/api/outlooks/${amendmentId}`)).body as { validFrom: string; validUntil: string };
    const [first] = await revisionsOf(amendmentId);
    expect(first?.revisionNumber).toBe(1);
    const revision = outlookRevisionSchema.parse((await forecaster.get(`/api/outlook-revisions/${first?.id}`)).body);
    expect(revision.snapshot).toMatchObject({ validFrom: draft.validFrom, validUntil: draft.validUntil, hazardNotes: { hail: 'Large hail west.' }, amends: issuanceNumber, state: 'draft' });
  });
});
