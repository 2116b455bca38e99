import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { and, desc, eq, like } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { caughtMail, mailOutbox, subscriptions, users } from '../../server/db/schema';
import { maxAttempts, processOutbox } from '../../server/services/outbox.service';
import { processDistributionJobs } from '../../server/services/distribution.service';
import { agentFor, signedInAgent, startTestApp, waitFor } from './helpers/test-app';

let sd: Stormdraft;
let forecaster: TestAgent;
let lead: TestAgent;
let subscriber: TestAgent;

beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  subscriber = await signedInAgent(sd.app, 'subscriber');
});
afterAll(async () => {
  await sd?.close();
});

const box = (w: number, s: number, e: number, n: number) => ({ type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] });
// Boone County, Missouri (FIPS 29019) lies near 92.3° W, 39.0° N: inside this box.
const overBoone = box(-93, 38.6, -91.8, 39.4);
const farAway = box(-96, 36, -95.5, 36.3);

async function publish(headline: string, areas: unknown[], amends?: string): Promise<string> {
  let id: string;
  if (amends) id = (await forecaster.post(`/api/issuances/${amends}/amend`).send({})).body.outlookId;
  else id = (await forecaster.post('/api/outlooks').send({ day: 1, headline })).body.id;
  const o = (await forecaster.get(`/api/outlooks/${id}`)).body;
  const saved = await forecaster.put(`/api/outlooks/${id}`).send({ version: o.version, headline, discussion: 'First paragraph of the discussion.\n\nSecond one.', hazardNotes: {}, validFrom: o.validFrom, validUntil: o.validUntil, areas });
  expect(saved.status, JSON.stringify(saved.body)).toBe(200);
  let v = (await forecaster.post(`/api/outlooks/${id}/submit`).send({ version: saved.body.version })).body.version;
  v = (await lead.post(`/api/outlooks/${id}/approve`).send({ version: v })).body.version;
  const res = await lead.post(`/api/outlooks/${id}/publish`).send({ version: v });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  // Publishing only records a distribution job; the worker (driven here) matches and queues mail.
  await processDistributionJobs(sd.ctx.db, sd.ctx.config);
  return res.body.issuanceNumber;
}

const outboxFor = (email: string, subjectPart: string) =>
  sd.ctx.db.select().from(mailOutbox).where(and(eq(mailOutbox.toAddress, email), like(mailOutbox.subject, `%${subjectPart}%`)));

describe('subscriber self-service', () => {
  it('When the demo subscriber opens their settings, then the seeded counties and threshold are there', async () => {
    const res = await subscriber.get('/api/subscriptions/me');
    expect(res.status).toBe(200);
    expect(res.body.alertThreshold).toBe('level2');
    expect(res.body.areas.map((a: { name: string }) => a.name)).toEqual(['Boone, Missouri', 'Cole, Missouri']);
  });

  it('When a county is searched and added by FIPS code, then it becomes an area of interest; an unknown code is refused', async () => {
    const places = await subscriber.get('/api/places').query({ q: 'Sangamon', kind: 'county' });
    expect(places.body.places[0]).toMatchObject({ fipsCode: '17167', stateName: 'Illinois' });
    const bad = await subscriber.post('/api/areas-of-interest').send({ kind: 'county', fipsCode: '99999' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('fipsCode');
  });

  it('When two tabs save settings from the same version, then the second gets 409', async () => {
    const current = (await subscriber.get('/api/subscriptions/me')).body;
    const body = { version: current.version, alertThreshold: 'level2', hazards: [], days: [1, 2, 3], emails: ['subscriber@demo.stormdraft.test'], paused: false };
    expect((await subscriber.put('/api/subscriptions/me').send(body)).status).toBe(200);
    expect((await subscriber.put('/api/subscriptions/me').send(body)).status).toBe(409);
  });
});

describe('matching and the outbox', () => {
  it('When the demo issuance was published, then the demo subscriber got one alert queued by its distribution job', async () => {
    const rows = await sd.ctx.db.select().from(mailOutbox).where(eq(mailOutbox.toAddress, 'subscriber@demo.stormdraft.test'));
    expect(rows.length).toBe(1);
    expect(rows[0]?.subject).toMatch(/Level 2/);
  });

  it('When an issuance reaches a subscriber at Level 3, then one message is sent through SMTP with unsubscribe headers, the caution, escaped text and the inline map', async () => {
    const number = await publish('Storms <b>today</b> & tonight', [{ levelKey: 'level3', hazards: [{ hazard: 'tornado', significant: false }], geometry: overBoone }]);
    const queued = await outboxFor('subscriber@demo.stormdraft.test', number);
    expect(queued).toHaveLength(1);
    expect(queued[0]?.attachments[0]?.contentType).toBe('image/png');
    await processOutbox(sd.ctx.db, sd.ctx.mailer);
    const mail = await waitFor(async () => {
      const [row] = await sd.ctx.db.select().from(caughtMail).where(like(caughtMail.subject, `%${number}%`)).orderBy(desc(caughtMail.receivedAt));
      return row;
    }, 'the alert in the catcher');
    expect(mail.headers['list-unsubscribe']).toMatch(/\/api\/unsubscribe\?token=/);
    expect(mail.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
    expect(mail.html).toContain('Storms &lt;b&gt;today&lt;/b&gt; &amp; tonight');
    // mailparser inlines cid: images as data URIs, so the PNG arrived attached and referenced.
    expect(mail.html).toContain('data:image/png;base64,');
    expect(mail.html).toContain('planning guidance');
    expect(mail.text).toContain('Level 3 · Numerous');
    const [row] = await outboxFor('subscriber@demo.stormdraft.test', number);
    expect(row?.status).toBe('sent');
  });

  it('When an amendment lowers the risk and a later one removes it, then "lowered" and "no longer at risk" notices follow', async () => {
    const first = await publish('Level 3 first', [{ levelKey: 'level3', hazards: [], geometry: overBoone }]);
    const lowered = await publish('Lowered', [{ levelKey: 'level1', hazards: [], geometry: overBoone }], first);
    expect((await outboxFor('subscriber@demo.stormdraft.test', lowered))[0]?.subject).toMatch(/Risk lowered/);
    const amendAgain = await publish('Raised', [{ levelKey: 'level3', hazards: [], geometry: overBoone }], lowered);
    const cleared = await publish('Cleared', [{ levelKey: 'level2', hazards: [], geometry: farAway }], amendAgain);
    expect((await outboxFor('subscriber@demo.stormdraft.test', cleared))[0]?.subject).toMatch(/no longer at risk/);
  });

  it('When an issuance stays below the threshold, then nothing is queued', async () => {
    const number = await publish('Only thunder', [{ levelKey: 'level1', hazards: [], geometry: overBoone }]);
    expect(await outboxFor('subscriber@demo.stormdraft.test', number)).toHaveLength(0);
  });

  it('When the subscriber pauses alerts, or follows other days, then nothing is queued for them', async () => {
    const current = (await subscriber.get('/api/subscriptions/me')).body;
    const base = { alertThreshold: 'level1', hazards: [], emails: ['subscriber@demo.stormdraft.test'] };
    const paused = await subscriber.put('/api/subscriptions/me').send({ ...base, version: current.version, days: [1, 2, 3], paused: true });
    expect(paused.status).toBe(200);
    const whilePaused = await publish('While paused', [{ levelKey: 'level3', hazards: [], geometry: overBoone }]);
    expect(await outboxFor('subscriber@demo.stormdraft.test', whilePaused)).toHaveLength(0);
    const day2Only = await subscriber.put('/api/subscriptions/me').send({ ...base, version: paused.body.version, days: [2], paused: false });
    expect(day2Only.status).toBe(200);
    const dayOne = await publish('Day 1 while following Day 2', [{ levelKey: 'level3', hazards: [], geometry: overBoone }]);
    expect(await outboxFor('subscriber@demo.stormdraft.test', dayOne)).toHaveLength(0);
    await subscriber.put('/api/subscriptions/me').send({ ...base, alertThreshold: 'level2', version: day2Only.body.version, days: [1, 2, 3], paused: false });
  });

  it('When an issuance that alerted a subscriber is withdrawn, then they are told, once', async () => {
    const number = await publish('To be withdrawn', [{ levelKey: 'level3', hazards: [], geometry: overBoone }]);
    expect(await outboxFor('subscriber@demo.stormdraft.test', number)).toHaveLength(1);
    expect((await lead.post(`/api/issuances/${number}/withdraw`).send({ reason: 'Issued for the wrong day.' })).status).toBe(200);
    const rows = await outboxFor('subscriber@demo.stormdraft.test', number);
    const withdrawn = rows.filter((r) => /withdrawn/.test(r.subject));
    expect(withdrawn).toHaveLength(1);
    expect(withdrawn[0]?.text).toContain('Issued for the wrong day.');
  });

  it('When SMTP fails, then the message is retried with backoff and marked failed after the last attempt; an admin can resend it', async () => {
    const number = await publish('Retry test', [{ levelKey: 'level3', hazards: [], geometry: overBoone }]);
    const failing = { send: async () => Promise.reject(new Error('relay refused')), close: () => {} };
    let now = new Date();
    for (let attempt = 1; attempt <= maxAttempts; attempt++) {
      await processOutbox(sd.ctx.db, failing, now);
      now = new Date(now.getTime() + 3_600_000 * 24);
    }
    const [row] = await outboxFor('subscriber@demo.stormdraft.test', number);
    expect(row).toMatchObject({ status: 'failed', attempts: maxAttempts, lastError: 'relay refused' });
    const admin = await signedInAgent(sd.app, 'admin');
    expect((await admin.post(`/api/mail-outbox/${row?.id}/resend`).send({})).status).toBe(200);
    await processOutbox(sd.ctx.db, sd.ctx.mailer);
    expect((await outboxFor('subscriber@demo.stormdraft.test', number))[0]?.status).toBe('sent');
  });

  it('When the subscriber clicks one-click unsubscribe, then later issuances queue nothing for them', async () => {
    const [mail] = await sd.ctx.db.select().from(mailOutbox).where(eq(mailOutbox.toAddress, 'subscriber@demo.stormdraft.test')).limit(1);
    const url = new URL((mail?.headers['List-Unsubscribe'] ?? '').replace(/[<>]/g, ''));
    const res = await agentFor(sd.app).post(url.pathname + url.search).type('form').send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(200);
    const [user] = await sd.ctx.db.select().from(users).where(eq(users.email, 'subscriber@demo.stormdraft.test'));
    const [sub] = await sd.ctx.db.select().from(subscriptions).where(eq(subscriptions.userId, user?.id ?? ''));
    expect(sub?.unsubscribedAt).not.toBeNull();
    const number = await publish('After unsubscribe', [{ levelKey: 'level3', hazards: [], geometry: overBoone }]);
    expect(await outboxFor('subscriber@demo.stormdraft.test', number)).toHaveLength(0);
    const forged = await agentFor(sd.app).post(`/api/unsubscribe?token=${sub?.id}.forged-signature-xx`).set('Accept', 'application/json').send({});
    expect(forged.status).toBe(400);
  });
});

describe('outbox faults with a real SMTP server on 127.0.0.1', () => {
  async function freePort(): Promise<number> {
    const { createServer } = await import('node:net');
    return new Promise((resolve) => {
      const probe = createServer();
      probe.listen(0, '127.0.0.1', () => {
        const address = probe.address();
        const port = typeof address === 'object' && address ? address.port : 0;
        probe.close(() => resolve(port));
      });
    });
  }

  async function queueOneFor(email: string, headline: string): Promise<string> {
    const admin = await signedInAgent(sd.app, 'admin');
    const password = 'long-enough-9';
    await admin.post('/api/users').send({ name: headline, email, password, role: 'subscriber' });
    const person = agentFor(sd.app);
    await person.post('/api/auth/sign-in/email').send({ email, password });
    const current = (await person.get('/api/subscriptions/me')).body;
    await person.put('/api/subscriptions/me').send({ version: current.version, alertThreshold: 'level1', hazards: [], days: [1, 2, 3], emails: [email], paused: false });
    await person.post('/api/areas-of-interest').send({ kind: 'county', fipsCode: '29019' });
    // Send everything already queued so only the new message is due.
    await processOutbox(sd.ctx.db, sd.ctx.mailer);
    return publish(headline, [{ levelKey: 'level2', hazards: [], geometry: overBoone }]);
  }

  it('When the SMTP server is down, then the message is retried and delivered exactly once when it comes back', async () => {
    const { startMailCatcher } = await import('../../server/mail/mail-catcher');
    const { createMailer } = await import('../../server/mail/send-mail');
    const email = 'down@county.test';
    const number = await queueOneFor(email, 'Relay down');
    const port = await freePort();
    const mailer = createMailer(`smtp://127.0.0.1:${port}`, 'outlooks@stormdraft.test');
    try {
      const first = await processOutbox(sd.ctx.db, mailer);
      expect(first.failed).toBeGreaterThanOrEqual(1);
      const [row] = await outboxFor(email, number);
      expect(row).toMatchObject({ status: 'queued', attempts: 1 });
      expect(row?.lastError).toBeTruthy();
      const received: string[] = [];
      const catcher = await startMailCatcher(async (m) => {
        received.push(m.subject);
      }, port);
      try {
        const later = new Date(Date.now() + 10 * 60_000);
        await processOutbox(sd.ctx.db, mailer, later);
        await processOutbox(sd.ctx.db, mailer, new Date(later.getTime() + 3_600_000));
        expect(received.filter((s) => s.includes(number))).toHaveLength(1);
        expect((await outboxFor(email, number))[0]?.status).toBe('sent');
      } finally {
        await catcher.close();
      }
    } finally {
      mailer.close();
    }
  });

  it('When a worker died mid-send (a row left "sending"), then no one takes it while its lease runs and one worker sends it once after', async () => {
    const { claimLeaseMs } = await import('../../server/services/outbox.service');
    const email = 'crash@county.test';
    const number = await queueOneFor(email, 'Crash mid-send');
    const [row] = await outboxFor(email, number);
    const claimedAt = new Date();
    // What a worker killed between claiming and sending leaves behind.
    await sd.ctx.db.update(mailOutbox).set({ status: 'sending', claimedAt }).where(eq(mailOutbox.id, row?.id ?? ''));
    // Another worker polling now must not resend it: the first may still be sending.
    await processOutbox(sd.ctx.db, sd.ctx.mailer, new Date(claimedAt.getTime() + claimLeaseMs - 1000));
    expect((await outboxFor(email, number))[0]?.status, 'a claimed row is left alone while its lease runs').toBe('sending');
    const afterLease = new Date(claimedAt.getTime() + claimLeaseMs + 1000);
    await Promise.all([processOutbox(sd.ctx.db, sd.ctx.mailer, afterLease), processOutbox(sd.ctx.db, sd.ctx.mailer, afterLease)]);
    await processOutbox(sd.ctx.db, sd.ctx.mailer, new Date(afterLease.getTime() + 1000));
    const delivered = await waitFor(async () => {
      const rows = await sd.ctx.db.select().from(caughtMail).where(like(caughtMail.subject, `%${number}%`));
      return rows.length ? rows : undefined;
    }, 'the re-claimed message');
    expect(delivered.filter((m) => m.toAddress === email)).toHaveLength(1);
    expect((await outboxFor(email, number))[0]).toMatchObject({ status: 'sent', claimedAt: null });
  });
});
