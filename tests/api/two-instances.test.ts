import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { and, count, eq } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { areasOfInterest, mailOutbox, subscriptions, users } from '../../server/db/schema';
import { findOffice } from '../../server/services/office.service';
import { startMailCatcher, type MailCatcher } from '../../server/mail/mail-catcher';
import { signedInAgent, startTestApp, testPostgresUrl, waitFor } from './helpers/test-app';

// "Several instances on one PostgreSQL" (issue 11): two app instances, each with its own outbox
// worker and database pool, share one PostgreSQL database and one SMTP relay. Runs in the
// PostgreSQL pass only (tests/ensure-postgres.sh); PGlite is one process's embedded database.

const subscriberCount = 1000;
const demoSubscriber = 'subscriber@demo.stormdraft.test';
// Boone County, Missouri (FIPS 29019, one of the demo subscriber's counties) lies near 92.3° W, 39.0° N: inside this box.
const overBoone = { type: 'Polygon', coordinates: [[[-93, 38.6], [-91.8, 38.6], [-91.8, 39.4], [-93, 39.4], [-93, 38.6]]] };
const received = new Map<string, number>();
const subjects: string[] = [];
let catcher: MailCatcher;
const instances: Stormdraft[] = [];

beforeAll(async () => {
  if (!testPostgresUrl()) return;
  catcher = await startMailCatcher(async (message) => {
    for (const to of message.to.split(',').map((a) => a.trim())) {
      received.set(to, (received.get(to) ?? 0) + 1);
      subjects.push(`${to} ${message.subject}`);
    }
  });
});
afterAll(async () => {
  for (const instance of instances) await instance.close();
  await catcher?.close();
});

describe.skipIf(!testPostgresUrl())('two app instances on one PostgreSQL', () => {
  it('When an outlook reaching 1,000 subscribers is published while two instances distribute and drain the outbox, then each gets exactly one message and a live claim is left alone', async () => {
    // The first instance seeds the database; its worker is off while the distribution is queued.
    const first = await startTestApp({ smtpUrl: catcher.url, outboxIntervalMs: 0 });
    instances.push(first);
    const { db } = first.ctx;
    const databaseUrl = first.ctx.config.databaseUrl;
    expect(databaseUrl).toMatch(/^postgres:/);
    const office = await findOffice(db);
    const people = Array.from({ length: subscriberCount }, (_, i) => ({ id: randomUUID(), name: `Subscriber ${i}`, email: `em${i}@county.test`, emailVerified: true, role: 'subscriber' }));
    await db.insert(users).values(people);
    const subs = await db
      .insert(subscriptions)
      .values(people.map((p) => ({ officeId: office!.id, userId: p.id, alertThreshold: 'level1', emails: [p.email] }))) // the seeded office exists
      .returning({ id: subscriptions.id, emails: subscriptions.emails });
    // Each of them watches Boone County (the demo subscriber's county): the publish below reaches all 1,000.
    const [boone] = await db.select().from(areasOfInterest).where(eq(areasOfInterest.fipsCode, '29019'));
    expect(boone?.geometry.type).toMatch(/Polygon/);
    await db.insert(areasOfInterest).values(subs.map((sub) => ({ subscriptionId: sub.id, name: 'Boone County', kind: boone!.kind, fipsCode: '29019', geometry: boone!.geometry }))); // checked just above
    const issuanceId = randomUUID();
    // A message another instance claimed a moment ago and is still sending: nobody else may send it.
    await db.insert(mailOutbox).values({ dedupeKey: `alert:${issuanceId}:in-flight`, toAddress: 'in-flight@county.test', subject: 'In flight', html: '<p>x</p>', text: 'x', status: 'sending', claimedAt: new Date() });

    for (let i = 0; i < 2; i++) instances.push(await startTestApp({ databaseUrl, smtpUrl: catcher.url, outboxIntervalMs: 25, seedDemo: false }));
    // And a real publish through one instance, signed in on the other (sessions live in the database).
    const [second, third] = [instances[1]!, instances[2]!]; // both started just above
    const forecaster = await signedInAgent(second.app, 'forecaster');
    const lead = await signedInAgent(third.app, 'lead');
    const id = (await forecaster.post('/api/outlooks').send({ day: 1, headline: 'Two instances' })).body.id;
    const o = (await forecaster.get(`/api/outlooks/${id}`)).body;
    const saved = await forecaster.put(`/api/outlooks/${id}`).send({ version: o.version, headline: 'Two instances', discussion: 'Storms.', hazardNotes: {}, validFrom: o.validFrom, validUntil: o.validUntil, areas: [{ levelKey: 'level3', hazards: [], geometry: overBoone }] });
    const submitted = await forecaster.post(`/api/outlooks/${id}/submit`).send({ version: saved.body.version });
    const approved = await lead.post(`/api/outlooks/${id}/approve`).send({ version: submitted.body.version });
    const published = await lead.post(`/api/outlooks/${id}/publish`).send({ version: approved.body.version });
    expect(published.status, JSON.stringify(published.body)).toBe(200);
    await waitFor(
      async () => {
        const queued = await db.select({ value: count() }).from(mailOutbox).where(and(eq(mailOutbox.status, 'queued')));
        const number = published.body.issuanceNumber as string;
        return people.every((p) => received.has(p.email)) && subjects.some((line) => line.includes(number)) && queued[0]?.value === 0 ? true : undefined;
      },
      'the two instances to send 1,000 messages',
      1200,
    );
    for (const instance of instances.splice(1)) await instance.close();

    const counts = people.map((p) => received.get(p.email) ?? 0);
    expect(counts.filter((c) => c === 1)).toHaveLength(subscriberCount);
    const number = published.body.issuanceNumber as string;
    expect(subjects.filter((line) => line.startsWith(`${demoSubscriber} `) && line.includes(number)), 'the demo subscriber (Boone County) is alerted once').toHaveLength(1);
    expect(received.get('in-flight@county.test')).toBeUndefined();
    const [inFlight] = await db.select().from(mailOutbox).where(eq(mailOutbox.toAddress, 'in-flight@county.test'));
    expect(inFlight?.status).toBe('sending');
  });
});
