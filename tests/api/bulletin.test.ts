import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { XMLParser } from 'fast-xml-parser';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { atomFeed, currentBulletin } from '../../server/services/issuances.service';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';

/**
 * "Current means current" (issue 13): the public bulletin JSON and the Atom feed show, per day,
 * only issuances whose valid period has not ended; a day whose last issuance expired says since when.
 */
let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
let anonymous: TestAgent;

const square = { type: 'Polygon', coordinates: [[[-94, 37], [-92, 37], [-92, 39], [-94, 39], [-94, 37]]] };

/** Writes, submits, approves and publishes an outlook issued at `issuanceTime`; returns its issuance. */
async function publish(day: 1 | 2 | 3, issuanceTime: string, headline: string): Promise<{ number: string; validFrom: string; validUntil: string }> {
  const created = (await forecaster.post('/api/outlooks').send({ day, issuanceTime, headline })).body;
  const saved = await forecaster
    .put(`/api/outlooks/${created.id}`)
    .send({ version: created.version, headline, discussion: 'Text', hazardNotes: {}, validFrom: created.validFrom, validUntil: created.validUntil, areas: [{ levelKey: 'level2', hazards: [], geometry: square }] });
  expect(saved.status).toBe(200);
  let version: number = saved.body.version;
  for (const [agent, action] of [[forecaster, 'submit'], [lead, 'approve'], [lead, 'publish']] as const) {
    const res = await agent.post(`/api/outlooks/${created.id}/${action}`).send({ version });
    expect(res.status).toBe(200);
    version = res.body.version;
    if (action === 'publish') return { number: res.body.issuanceNumber, validFrom: created.validFrom, validUntil: created.validUntil };
  }
  throw new Error('unreachable');
}

const feedEntries = (xmlText: string): { id: string; title: string | { '#text': string }; summary?: string | { '#text': string } }[] => {
  const xml = new XMLParser({ ignoreAttributes: false }).parse(xmlText);
  const entry = xml.feed.entry ?? [];
  return Array.isArray(entry) ? entry : [entry];
};
const text = (value: string | { '#text': string } | undefined) => (typeof value === 'object' ? value['#text'] : (value ?? ''));

let expiredDay2: { number: string; validFrom: string; validUntil: string };
let day3: { number: string; validFrom: string; validUntil: string };

beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  anonymous = agentFor(sd.app);
  // A Day 2 issued long ago: its period ended long before the test runs.
  expiredDay2 = await publish(2, '2025-05-01T15:00:00Z', 'Old Day 2 that must not show');
  // A Day 3 issued in a fixed spring, used with an explicit clock inside and after its period.
  day3 = await publish(3, '2026-04-18T15:00:00Z', 'Day 3 for the clock tests');
});
afterAll(async () => {
  await sd?.close();
});

describe('public bulletin JSON', () => {
  it('When a Day 2 issuance has expired, then the bulletin does not show it and says since when no Day 2 is in force', async () => {
    const res = await anonymous.get('/api/public/bulletin');
    expect(res.status).toBe(200);
    const numbers = res.body.issuances.map((i: { number: string }) => i.number);
    expect(numbers).not.toContain(expiredDay2.number);
    expect(res.body.issuances.every((i: { day: number }) => i.day !== 2)).toBe(true);
    const day2 = res.body.days.find((d: { day: number }) => d.day === 2);
    expect(day2).toMatchObject({ status: 'none_in_force', issuanceNumber: null });
    // The Day 3 of 2026-04-18 ended later than the Day 2 of 2025, but each day keeps its own ending.
    expect(new Date(day2.since).toISOString()).toBe(new Date(expiredDay2.validUntil).toISOString());
    expect(res.body.caution).toMatch(/planning guidance/);
  });

  it('When the demo Day 1 issuance is in its period, then it is shown as the Day 1 in force', async () => {
    const res = await anonymous.get('/api/public/bulletin');
    const day1 = res.body.days.find((d: { day: number }) => d.day === 1);
    expect(day1.status).toBe('in_force');
    const shown = res.body.issuances.find((i: { number: string }) => i.number === day1.issuanceNumber);
    expect(shown.state).toBe('published');
    expect(new Date(shown.validUntil).getTime()).toBeGreaterThan(Date.now());
  });

  it('When the clock passes the end of a valid period, then the same issuance stops being current', async () => {
    const inside = new Date(new Date(day3.validFrom).getTime() + 3_600_000);
    const before = await currentBulletin(sd.ctx.db, inside);
    if (!before.ok) throw new Error(before.error.message);
    expect(before.value.days.find((d) => d.day === 3)).toMatchObject({ status: 'in_force', issuanceNumber: day3.number });
    expect(before.value.issuances.map((i) => i.number)).toContain(day3.number);

    const after = await currentBulletin(sd.ctx.db, new Date(day3.validUntil));
    if (!after.ok) throw new Error(after.error.message);
    expect(after.value.days.find((d) => d.day === 3)).toMatchObject({ status: 'none_in_force', issuanceNumber: null, since: new Date(day3.validUntil).toISOString() });
    expect(after.value.issuances.map((i) => i.number)).not.toContain(day3.number);
  });

  it('When an issuance is withdrawn inside its period, then the bulletin drops it and carries the withdrawal notice', async () => {
    const day1 = (await anonymous.get('/api/public/bulletin')).body.days.find((d: { day: number }) => d.day === 1);
    const withdrawn = await lead.post(`/api/issuances/${day1.issuanceNumber}/withdraw`).send({ reason: 'Issued for the wrong region.' });
    expect(withdrawn.status).toBe(200);
    const res = await anonymous.get('/api/public/bulletin');
    expect(res.body.issuances.map((i: { number: string }) => i.number)).not.toContain(day1.issuanceNumber);
    const after = res.body.days.find((d: { day: number }) => d.day === 1);
    expect(after).toMatchObject({ status: 'none_in_force', withdrawn: { number: day1.issuanceNumber, reason: 'Issued for the wrong region.' } });
    expect(after.since).toBe(withdrawn.body.withdrawnAt);

    const feed = await anonymous.get('/api/public/feed.atom');
    const entry = feedEntries(feed.text).find((e) => e.id.endsWith(`/issuances/${day1.issuanceNumber}`));
    expect(text(entry?.title)).toMatch(/withdrawn/);
    expect(text(entry?.summary)).toMatch(/no longer in force/);
  });
});

describe('Atom feed', () => {
  it('When an issuance has expired, then the feed leaves it out', async () => {
    const res = await anonymous.get('/api/public/feed.atom');
    expect(res.status).toBe(200);
    const ids = feedEntries(res.text).map((e) => e.id);
    expect(ids.some((id) => id.endsWith(`/issuances/${expiredDay2.number}`))).toBe(false);
    expect(ids.some((id) => id.endsWith(`/issuances/${day3.number}`))).toBe(false);
  });

  it('When the clock is inside a period and then past it, then the feed lists the issuance and then no longer does', async () => {
    const inside = await atomFeed(sd.ctx.db, 'http://localhost', new Date(new Date(day3.validFrom).getTime() + 3_600_000));
    if (!inside.ok) throw new Error(inside.error.message);
    expect(feedEntries(inside.value).map((e) => e.id)).toContain(`http://localhost/issuances/${day3.number}`);
    const after = await atomFeed(sd.ctx.db, 'http://localhost', new Date(day3.validUntil));
    if (!after.ok) throw new Error(after.error.message);
    expect(feedEntries(after.value).map((e) => e.id)).not.toContain(`http://localhost/issuances/${day3.number}`);
  });
});
