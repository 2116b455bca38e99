import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { and, eq, like } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { caughtMail, mailOutbox } from '../../server/db/schema';
import { processOutbox } from '../../server/services/outbox.service';
import { processDistributionJobs } from '../../server/services/distribution.service';
import { agentFor, signedInAgent, startTestApp, waitFor } from './helpers/test-app';

// Issue 11 item 10: alert mail goes only to confirmed addresses.

let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
let subscriber: TestAgent;
const own = 'subscriber@demo.stormdraft.test';
const extra = 'deputy@county.test';

beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  subscriber = await signedInAgent(sd.app, 'subscriber');
});
afterAll(async () => {
  await sd?.close();
});

// Boone County, Missouri (FIPS 29019, one of the demo subscriber's counties) lies near 92.3° W, 39.0° N: inside this box.
const overBoone = { type: 'Polygon', coordinates: [[[-93, 38.6], [-91.8, 38.6], [-91.8, 39.4], [-93, 39.4], [-93, 38.6]]] };

async function publishOverBoone(headline: string): Promise<string> {
  const id = (await forecaster.post('/api/outlooks').send({ day: 1, headline })).body.id;
  const o = (await forecaster.get(`/api/outlooks/${id}`)).body;
  const saved = await forecaster.put(`/api/outlooks/${id}`).send({ version: o.version, headline, discussion: 'Storms.', hazardNotes: {}, validFrom: o.validFrom, validUntil: o.validUntil, areas: [{ levelKey: 'level3', hazards: [], geometry: overBoone }] });
  let v = (await forecaster.post(`/api/outlooks/${id}/submit`).send({ version: saved.body.version })).body.version;
  v = (await lead.post(`/api/outlooks/${id}/approve`).send({ version: v })).body.version;
  const res = await lead.post(`/api/outlooks/${id}/publish`).send({ version: v });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  // Publishing leaves a distribution job; run it as the worker would, so the alerts are queued.
  await processDistributionJobs(sd.ctx.db, sd.ctx.config);
  return res.body.issuanceNumber;
}

async function saveAddresses(emails: string[]) {
  const current = (await subscriber.get('/api/subscriptions/me')).body;
  const res = await subscriber.put('/api/subscriptions/me').send({ version: current.version, alertThreshold: current.alertThreshold, hazards: current.hazards, days: current.days, emails, paused: false });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
}

const confirmationMails = () => sd.ctx.db.select().from(mailOutbox).where(and(eq(mailOutbox.toAddress, extra), like(mailOutbox.subject, 'Confirm this address%')));
const alertsFor = (number: string) => sd.ctx.db.select().from(mailOutbox).where(like(mailOutbox.subject, `%${number}%`));

function linkIn(text: string): URL {
  const match = /https?:\/\/\S+\/api\/email-confirmations\?token=\S+/.exec(text);
  if (!match) throw new Error(`no confirmation link in:\n${text}`);
  return new URL(match[0]);
}

describe('extra alert addresses are confirmed before they receive anything', () => {
  it('When a subscriber adds an address, then it gets one confirmation mail with the caution, and alerts still go only to the confirmed address', async () => {
    const saved = await saveAddresses([own, extra]);
    expect(saved).toMatchObject({ emails: [own, extra], unconfirmedEmails: [extra] });
    const mails = await confirmationMails();
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toMatch(/planning guidance, not a warning/); // one mail, checked above
    expect(mails[0]!.html).toMatch(/planning guidance, not a warning/);
    // Saving again while the link is still good sends no second mail.
    await saveAddresses([own, extra]);
    expect(await confirmationMails()).toHaveLength(1);
    await processOutbox(sd.ctx.db, sd.ctx.mailer);
    await waitFor(async () => ((await sd.ctx.db.select().from(caughtMail).where(eq(caughtMail.toAddress, extra))).length ? true : undefined), 'the confirmation mail in the catcher');

    const number = await publishOverBoone('Before confirmation');
    const alerts = await alertsFor(number);
    expect(alerts.map((a) => a.toAddress)).toEqual([own]);
  });

  it('When the link is followed, then the address receives the next alert; the link works once', async () => {
    const [mail] = await confirmationMails();
    const link = linkIn(mail!.text); // queued by the previous test
    const anonymous = agentFor(sd.app);
    const page = await anonymous.get(link.pathname + link.search);
    expect(page.status).toBe(200);
    expect(page.text).toContain('<form method="post"');
    expect((await subscriber.get('/api/subscriptions/me')).body.unconfirmedEmails, 'opening the page confirms nothing').toEqual([extra]);
    const confirmed = await anonymous.post(link.pathname + link.search).set('Accept', 'application/json').send({});
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(200);
    expect(confirmed.body).toEqual({ email: extra });
    expect((await subscriber.get('/api/subscriptions/me')).body).toMatchObject({ emails: [own, extra], unconfirmedEmails: [] });
    expect((await anonymous.post(link.pathname + link.search).set('Accept', 'application/json').send({})).status).toBe(400);

    const number = await publishOverBoone('After confirmation');
    const alerts = await alertsFor(number);
    expect(alerts.map((a) => a.toAddress)).toEqual([`${own}, ${extra}`]);
  });

  it('When an unconfirmed address is removed, then its link stops working; added again, it needs a new confirmation', async () => {
    const other = 'night-desk@county.test';
    await saveAddresses([own, extra, other]);
    const [mail] = await sd.ctx.db.select().from(mailOutbox).where(eq(mailOutbox.toAddress, other));
    const link = linkIn(mail!.text); // the save above queued it
    const removed = await saveAddresses([own]);
    expect(removed).toMatchObject({ emails: [own], unconfirmedEmails: [] });
    expect((await agentFor(sd.app).post(link.pathname + link.search).set('Accept', 'application/json').send({})).status).toBe(400);
    const again = await saveAddresses([own, extra]);
    expect(again.unconfirmedEmails, 'a removed address loses its confirmation').toEqual([extra]);
  });

  it('When a confirmation link is forged, then it is refused with 400 naming the link', async () => {
    const res = await agentFor(sd.app).post('/api/email-confirmations?token=forged-token-forged-token').set('Accept', 'application/json').send({});
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('token');
  });
});
