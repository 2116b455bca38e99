import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { and, eq, ne } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { issuanceCounters, issuances, outlooks } from '../../server/db/schema';
import { signedInAgent, startTestApp } from './helpers/test-app';

// Issue 11 item 5. These run on PGlite in the usual pass and on a real PostgreSQL server in the
// second pass (tests/ensure-postgres.sh), where the requests really overlap in the database.

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

const square = { type: 'Polygon', coordinates: [[[-94, 37], [-92, 37], [-92, 39], [-94, 39], [-94, 37]]] };

/** Drafts (or amends `amends`), submits and approves an outlook; returns its id and version, ready to publish. */
async function approvedOutlook(headline: string, amends?: string): Promise<{ id: string; version: number }> {
  let id: string;
  if (amends) {
    const amended = await forecaster.post(`/api/issuances/${amends}/amend`).send({});
    expect(amended.status, JSON.stringify(amended.body)).toBe(201);
    id = amended.body.outlookId;
  } else {
    id = (await forecaster.post('/api/outlooks').send({ day: 1, headline })).body.id;
  }
  const o = (await forecaster.get(`/api/outlooks/${id}`)).body;
  const saved = await forecaster.put(`/api/outlooks/${id}`).send({ version: o.version, headline, discussion: 'Race test.', hazardNotes: {}, validFrom: o.validFrom, validUntil: o.validUntil, areas: [{ levelKey: 'level1', hazards: [], geometry: square }] });
  expect(saved.status, JSON.stringify(saved.body)).toBe(200);
  const submitted = await forecaster.post(`/api/outlooks/${id}/submit`).send({ version: saved.body.version });
  const approved = await lead.post(`/api/outlooks/${id}/approve`).send({ version: submitted.body.version });
  expect(approved.status, JSON.stringify(approved.body)).toBe(200);
  return { id, version: approved.body.version };
}

const publish = (o: { id: string; version: number }) => lead.post(`/api/outlooks/${o.id}/publish`).send({ version: o.version });

async function publishedIssuance(headline: string): Promise<string> {
  const res = await publish(await approvedOutlook(headline));
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.issuanceNumber;
}

describe('issuance numbers under simultaneous publishes', () => {
  it('When 8 different approved outlooks are published at once, then all 8 succeed with 8 consecutive numbers', async () => {
    const ready = [];
    for (let i = 0; i < 8; i++) ready.push(await approvedOutlook(`Simultaneous ${i}`));
    const results = await Promise.all(ready.map(publish));
    expect(results.map((r) => r.status)).toEqual(Array(8).fill(200));
    const numbers = results.map((r) => r.body.issuanceNumber as string).sort();
    const sequences = numbers.map((n) => Number(n.split('-')[1]));
    expect(new Set(numbers).size).toBe(8);
    expect(sequences.at(-1)! - sequences[0]!).toBe(7); // at(-1) and [0] exist: 8 numbers
  });

  it('When issuances were numbered before the counter existed, then the next number continues after the highest', async () => {
    const before = await publishedIssuance('Before');
    const [year, sequence] = before.split('-').map(Number) as [number, number];
    // An office upgraded from a version without the counter: its issuances exist, the counter does not.
    await sd.ctx.db.delete(issuanceCounters);
    const after = await publishedIssuance('After');
    expect(after).toBe(`${year}-${String(sequence + 1).padStart(4, '0')}`);
  });
});

describe('one open amendment per issuance', () => {
  it('When 10 amend requests for one issuance arrive at once, then one draft is made and the other 9 get 409 naming it', async () => {
    const number = await publishedIssuance('Amend me ten times');
    const results = await Promise.all(Array.from({ length: 10 }, () => forecaster.post(`/api/issuances/${number}/amend`).send({})));
    const created = results.filter((r) => r.status === 201);
    const refused = results.filter((r) => r.status === 409);
    expect(created).toHaveLength(1);
    expect(refused).toHaveLength(9);
    const draftId = created[0]!.body.outlookId; // one 201, checked above
    for (const r of refused) expect(r.body.error).toMatchObject({ details: { rule: 'ONE_OPEN_AMENDMENT', outlookId: draftId }, message: expect.stringMatching(/open amendment/) });
    const [issuance] = await sd.ctx.db.select({ id: issuances.id }).from(issuances).where(eq(issuances.number, number));
    const open = await sd.ctx.db.select({ id: outlooks.id }).from(outlooks).where(and(eq(outlooks.amendsIssuanceId, issuance!.id), ne(outlooks.state, 'published'))); // the issuance was just published
    expect(open.map((o) => o.id)).toEqual([draftId]);
  });

  it('When a second open amendment is written straight to the database, then the unique index refuses it', async () => {
    const number = await publishedIssuance('Index backstop');
    const first = await forecaster.post(`/api/issuances/${number}/amend`).send({});
    expect(first.status).toBe(201);
    const [row] = await sd.ctx.db.select().from(outlooks).where(eq(outlooks.id, first.body.outlookId));
    const { id: _id, ...copy } = row!; // the amendment just made
    await expect(sd.ctx.db.insert(outlooks).values(copy)).rejects.toThrow();
  });

  it('When an amendment has been published, then amending the superseded issuance again is refused with 409 naming the rule', async () => {
    const number = await publishedIssuance('Superseded soon');
    expect((await publish(await approvedOutlook('The amendment', number))).status).toBe(200);
    const again = await forecaster.post(`/api/issuances/${number}/amend`).send({});
    expect(again.status).toBe(409);
    expect(again.body.error.details.rule).toBe('AMENDED_ISSUANCE_NOT_IN_FORCE');
  });
});

describe('publishing an amendment checks that what it replaces is still in force', () => {
  it('When the amended issuance was withdrawn, then publishing the amendment is refused with 409 and nothing changes', async () => {
    const number = await publishedIssuance('Withdrawn under the amendment');
    const amendment = await approvedOutlook('Amends a withdrawn one', number);
    expect((await lead.post(`/api/issuances/${number}/withdraw`).send({ reason: 'Issued by mistake.' })).status).toBe(200);
    const res = await publish(amendment);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ details: { rule: 'AMENDED_ISSUANCE_NOT_IN_FORCE', issuanceState: 'withdrawn' } });
    expect((await forecaster.get(`/api/outlooks/${amendment.id}`)).body.state).toBe('approved');
    expect(await sd.ctx.db.select().from(issuances).where(eq(issuances.outlookId, amendment.id))).toHaveLength(0);
  });

  it('When an amendment is published while the issuance is being withdrawn, then exactly one of the two wins and the states agree', async () => {
    const number = await publishedIssuance('Publish or withdraw');
    const amendment = await approvedOutlook('Racing a withdrawal', number);
    const [published, withdrawn] = await Promise.all([publish(amendment), lead.post(`/api/issuances/${number}/withdraw`).send({ reason: 'Racing.' })]);
    expect([published.status, withdrawn.status].sort()).toEqual([200, 409]);
    const [old] = await sd.ctx.db.select().from(issuances).where(eq(issuances.number, number));
    const replacements = await sd.ctx.db.select().from(issuances).where(eq(issuances.supersedesId, old!.id)); // the issuance exists
    const amendmentWon = published.status === 200;
    expect(old!.state).toBe(amendmentWon ? 'superseded' : 'withdrawn');
    expect(replacements).toHaveLength(amendmentWon ? 1 : 0);
    expect(old!.supersededById).toBe(amendmentWon ? replacements[0]!.id : null);
  });
});
