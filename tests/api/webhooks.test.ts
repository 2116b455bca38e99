import { createServer, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Webhook } from 'standardwebhooks';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { processWebhookDeliveries, queueWebhookEvents, webhookLeaseMs, webhookMaxAttempts, webhookRetryDelayMs } from '../../server/services/webhooks.service';
import { issuances, webhookDeliveries } from '../../server/db/schema';
import { eq } from 'drizzle-orm';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';
import { amendAndPublish, areaAround, publishOutlook } from './open-standards-helpers';

interface Received {
  headers: IncomingHttpHeaders;
  body: string;
}

/** A local receiver on 127.0.0.1: records every POST and answers with the status `answer()` gives. */
class Receiver {
  received: Received[] = [];
  answer: () => number = () => 204;
  private server: Server | undefined;
  port = 0;

  async start(port = 0): Promise<void> {
    this.server = createServer((req, res) => {
      const chunks: Buffer[] = [];
      req.on('data', (c: Buffer) => chunks.push(c));
      req.on('end', () => {
        this.received.push({ headers: req.headers, body: Buffer.concat(chunks).toString('utf8') });
        res.statusCode = this.answer();
        res.end();
      });
    });
    await new Promise<void>((resolve) => this.server?.listen(port, '127.0.0.1', resolve));
    this.port = (this.server.address() as AddressInfo).port;
  }

  async stop(): Promise<void> {
    const server = this.server;
    this.server = undefined;
    if (server) await new Promise<void>((resolve) => server.close(() => resolve()));
  }
}

let sd: Stormdraft;
let subscriber: TestAgent;
let admin: TestAgent;
let forecaster: TestAgent;
let lead: TestAgent;
const receiver = new Receiver();
let endpointId: string;
let secret: string;
let clockOffsetMs = 0;
/** Drives the delivery worker with a clock that runs ahead of real time by the backoffs skipped so far. */
async function deliver(advanceMs = 0) {
  clockOffsetMs += advanceMs;
  return processWebhookDeliveries(sd.ctx.db, new Date(Date.now() + clockOffsetMs));
}

const headersOf = (r: Received) => ({ 'webhook-id': String(r.headers['webhook-id']), 'webhook-timestamp': String(r.headers['webhook-timestamp']), 'webhook-signature': String(r.headers['webhook-signature']) });
/** Verifies with the Standard Webhooks library; returns the parsed payload (throws when the signature is wrong). */
const verified = (r: Received) => new Webhook(secret).verify(r.body, headersOf(r)) as { type: string; data: Record<string, unknown> & { geojson: { type: string; features: unknown[] } } };

beforeAll(async () => {
  sd = await startTestApp();
  subscriber = await signedInAgent(sd.app, 'subscriber');
  admin = await signedInAgent(sd.app, 'admin');
  forecaster = await signedInAgent(sd.app, 'forecaster');
  lead = await signedInAgent(sd.app, 'lead');
  await receiver.start();
});
afterAll(async () => {
  await receiver.stop();
  await sd?.close();
});

describe('registering endpoints', () => {
  it('When a subscriber registers a local receiver, then the answer shows the signing secret once and later lists never include it', async () => {
    const res = await subscriber.post('/api/webhook-endpoints').send({ url: `http://127.0.0.1:${receiver.port}/hooks`, description: 'County EOC hub' });
    expect(res.status).toBe(201);
    expect(res.body.secret).toMatch(/^whsec_[A-Za-z0-9+/=]{32}$/);
    endpointId = res.body.endpoint.id;
    secret = res.body.secret;
    const list = await subscriber.get('/api/webhook-endpoints');
    expect(list.body.endpoints.map((e: { id: string }) => e.id)).toEqual([endpointId]);
    expect(JSON.stringify(list.body)).not.toContain(secret.slice(6));
  });

  it('When the address is plain http to another host, or not a URL, then 400 names the url field', async () => {
    for (const url of ['http://alerts.example.org/hook', 'ftp://alerts.example.org/hook', 'alerts']) {
      const res = await subscriber.post('/api/webhook-endpoints').send({ url });
      expect(res.status, url).toBe(400);
      expect(res.body.error.issues[0].path).toBe('url');
    }
  });

  it('When an admin lists endpoints, then they see every endpoint with its owner; another role cannot register', async () => {
    const list = await admin.get('/api/webhook-endpoints');
    expect(list.body.endpoints.find((e: { id: string }) => e.id === endpointId)?.ownerEmail).toBe('subscriber@demo.stormdraft.test');
    expect((await forecaster.post('/api/webhook-endpoints').send({ url: 'https://alerts.example.org/hook' })).status).toBe(403);
  });
});

describe('signed deliveries', () => {
  let number: string;

  it('When an outlook is published, then the event is queued with the publish and delivered once, signed per Standard Webhooks, with GeoJSON, the CAP link and the caution', async () => {
    number = await publishOutlook(forecaster, lead, { day: 2, issuanceTime: new Date().toISOString(), headline: 'Hail in the west', areas: [{ levelKey: 'level2', geometry: areaAround(-96, 38) }] });
    const log = await subscriber.get(`/api/webhook-endpoints/${endpointId}/deliveries`);
    expect(log.body.deliveries).toMatchObject([{ eventType: 'issuance.published', issuanceNumber: number, status: 'queued', attempts: 0 }]);
    expect(receiver.received).toHaveLength(0);

    expect(await deliver()).toEqual({ delivered: 1, failed: 0 });
    expect(receiver.received).toHaveLength(1);
    const request = receiver.received[0];
    if (!request) throw new Error('no request');
    expect(request.headers['content-type']).toBe('application/json');
    const payload = verified(request);
    expect(payload.type).toBe('issuance.published');
    expect(payload.data).toMatchObject({ issuance: number, capUrl: expect.stringMatching(new RegExp(`/api/public/cap/${number}$`)), caution: expect.stringMatching(/planning guidance, not a warning/) });
    expect(payload.data.geojson.type).toBe('FeatureCollection');
    expect(payload.data.geojson.features).toHaveLength(1);
    expect(request.headers['webhook-id']).toBe(log.body.deliveries[0].messageId);
    // A second pass sends nothing more.
    expect(await deliver(3_600_000)).toEqual({ delivered: 0, failed: 0 });
    expect(receiver.received).toHaveLength(1);
  });

  it('When the body is altered or signed with another secret, then verification fails (the check is real)', () => {
    const request = receiver.received[0];
    if (!request) throw new Error('no request');
    expect(() => new Webhook(secret).verify(request.body.replace('Hail', 'Rain'), headersOf(request))).toThrow();
    expect(() => new Webhook(`whsec_${Buffer.alloc(24, 7).toString('base64')}`).verify(request.body, headersOf(request))).toThrow();
  });

  it('When the receiver is down, then answers 500, then is back, the amendment event is retried with backoff under the same webhook-id and accepted exactly once', async () => {
    receiver.received = [];
    const port = receiver.port;
    await receiver.stop();
    const amended = await amendAndPublish(forecaster, lead, number, [{ levelKey: 'level3', geometry: areaAround(-95, 38) }], 'Hail spreading east');

    expect(await deliver()).toEqual({ delivered: 0, failed: 1 });
    let log = (await subscriber.get(`/api/webhook-endpoints/${endpointId}/deliveries`)).body.deliveries;
    expect(log[0]).toMatchObject({ eventType: 'issuance.amended', issuanceNumber: amended, status: 'queued', attempts: 1, lastError: expect.stringMatching(/ECONNREFUSED/) });
    // Not yet due: the backoff has not passed.
    expect(await deliver(webhookRetryDelayMs(1) - 1000)).toEqual({ delivered: 0, failed: 0 });

    await receiver.start(port);
    receiver.answer = () => 500;
    expect(await deliver(1000)).toEqual({ delivered: 0, failed: 1 });
    log = (await subscriber.get(`/api/webhook-endpoints/${endpointId}/deliveries`)).body.deliveries;
    expect(log[0]).toMatchObject({ status: 'queued', attempts: 2, lastStatusCode: 500 });

    receiver.answer = () => 200;
    expect(await deliver(webhookRetryDelayMs(2))).toEqual({ delivered: 1, failed: 0 });
    expect(await deliver(3_600_000)).toEqual({ delivered: 0, failed: 0 });
    log = (await subscriber.get(`/api/webhook-endpoints/${endpointId}/deliveries`)).body.deliveries;
    expect(log[0]).toMatchObject({ status: 'delivered', attempts: 3, lastStatusCode: 200 });

    expect(receiver.received).toHaveLength(2); // the 500 and the accepted one
    const ids = new Set(receiver.received.map((r) => r.headers['webhook-id']));
    expect(ids).toEqual(new Set([log[0].messageId]));
    for (const r of receiver.received) expect(verified(r)).toMatchObject({ type: 'issuance.amended', data: { issuance: amended, supersedes: number } });
  });

  it('When an issuance is withdrawn, then the withdrawal event carries the reason and the CAP Cancel link', async () => {
    receiver.received = [];
    receiver.answer = () => 204;
    const day3 = await publishOutlook(forecaster, lead, { day: 3, issuanceTime: new Date().toISOString(), headline: 'Wrong day', areas: [{ levelKey: 'thunder', geometry: areaAround(-90, 36) }] });
    expect((await lead.post(`/api/issuances/${day3}/withdraw`).send({ reason: 'Issued for the wrong day.' })).status).toBe(200);
    expect(await deliver()).toEqual({ delivered: 2, failed: 0 });
    const events = receiver.received.map(verified);
    expect(events.map((e) => e.type).sort()).toEqual(['issuance.published', 'issuance.withdrawn']);
    const withdrawal = events.find((e) => e.type === 'issuance.withdrawn');
    expect(withdrawal?.data).toMatchObject({ issuance: day3, state: 'withdrawn', withdrawnReason: 'Issued for the wrong day.', capUrl: expect.stringMatching(/\/withdrawal$/) });
  });

  it('When an event is queued twice for the same issuance, then one delivery exists per endpoint', async () => {
    const [row] = await sd.ctx.db.select({ id: issuances.id }).from(issuances).where(eq(issuances.number, number));
    if (!row) throw new Error('no issuance');
    await sd.ctx.db.transaction((tx) => queueWebhookEvents(tx, sd.ctx.config, 'issuance.published', row.id));
    const log = (await subscriber.get(`/api/webhook-endpoints/${endpointId}/deliveries`)).body.deliveries;
    expect(log.filter((d: { eventType: string; issuanceNumber: string }) => d.eventType === 'issuance.published' && d.issuanceNumber === number)).toHaveLength(1);
  });
});

describe('claiming with a lease', () => {
  it('When two workers run at once, then the event is sent once', async () => {
    receiver.received = [];
    receiver.answer = () => 204;
    await publishOutlook(forecaster, lead, { day: 2, issuanceTime: new Date().toISOString(), headline: 'Two workers', areas: [{ levelKey: 'level1', geometry: areaAround(-94, 39) }] });
    const [a, b] = await Promise.all([deliver(), deliver()]);
    expect((a?.delivered ?? 0) + (b?.delivered ?? 0)).toBe(1);
    expect(receiver.received).toHaveLength(1);
  });

  it('When a worker died holding a delivery, then the row waits for its lease to run out and is then delivered once', async () => {
    receiver.received = [];
    await publishOutlook(forecaster, lead, { day: 2, issuanceTime: new Date().toISOString(), headline: 'Crashed worker', areas: [{ levelKey: 'level1', geometry: areaAround(-93, 39) }] });
    // Simulate a worker that claimed the row and crashed before finishing: status delivering, lease 60 s ahead.
    const leaseUntil = new Date(Date.now() + clockOffsetMs + webhookLeaseMs);
    await sd.ctx.db.update(webhookDeliveries).set({ status: 'delivering', leaseUntil }).where(eq(webhookDeliveries.status, 'queued'));
    expect(await deliver()).toEqual({ delivered: 0, failed: 0 });
    expect(receiver.received).toHaveLength(0);
    expect(await deliver(webhookLeaseMs + 1000)).toEqual({ delivered: 1, failed: 0 });
    expect(receiver.received).toHaveLength(1);
  });
});

describe('giving up and retrying by hand', () => {
  it('When every attempt fails, then the delivery is marked failed after the last one; a retry from the log queues it again and it arrives once', async () => {
    receiver.received = [];
    receiver.answer = () => 503;
    await publishOutlook(forecaster, lead, { day: 2, issuanceTime: new Date().toISOString(), headline: 'Receiver sick', areas: [{ levelKey: 'level1', geometry: areaAround(-92, 39) }] });
    for (let attempt = 1; attempt <= webhookMaxAttempts; attempt++) expect(await deliver(attempt === 1 ? 0 : webhookRetryDelayMs(attempt - 1))).toEqual({ delivered: 0, failed: 1 });
    let log = (await subscriber.get(`/api/webhook-endpoints/${endpointId}/deliveries`)).body.deliveries;
    expect(log[0]).toMatchObject({ status: 'failed', attempts: webhookMaxAttempts, lastStatusCode: 503 });
    expect(await deliver(86_400_000)).toEqual({ delivered: 0, failed: 0 });

    expect((await forecaster.post(`/api/webhook-deliveries/${log[0].id}/retry`).send({})).status).toBe(403);
    receiver.answer = () => 204;
    expect((await subscriber.post(`/api/webhook-deliveries/${log[0].id}/retry`).send({})).status).toBe(200);
    expect((await subscriber.post(`/api/webhook-deliveries/${log[0].id}/retry`).send({})).status).toBe(409);
    expect(await deliver()).toEqual({ delivered: 1, failed: 0 });
    log = (await subscriber.get(`/api/webhook-endpoints/${endpointId}/deliveries`)).body.deliveries;
    expect(log[0]).toMatchObject({ status: 'delivered', attempts: 1 });
    expect(receiver.received.filter((r) => r.headers['webhook-id'] === log[0].messageId)).toHaveLength(webhookMaxAttempts + 1);
  });
});

describe('delivery log and removal', () => {
  it('When someone else asks for an endpoint\'s log, then 404; the owner and an admin see it; a bad id is 400', async () => {
    expect((await admin.get(`/api/webhook-endpoints/${endpointId}/deliveries`)).status).toBe(200);
    const other = await admin.post('/api/webhook-endpoints').send({ url: 'https://agency.example.org/hook', description: 'State agency' });
    expect(other.status).toBe(201);
    expect((await subscriber.get(`/api/webhook-endpoints/${other.body.endpoint.id}/deliveries`)).status).toBe(404);
    expect((await subscriber.delete(`/api/webhook-endpoints/${other.body.endpoint.id}`)).status).toBe(404);
    expect((await subscriber.get('/api/webhook-endpoints/not-an-id/deliveries')).status).toBe(400);
    // An admin may remove any endpoint (and this one must never be called: tests talk to loopback only).
    expect((await admin.delete(`/api/webhook-endpoints/${other.body.endpoint.id}`)).status).toBe(200);
  });

  it('When the owner removes an endpoint, then it is gone from the list and receives nothing more', async () => {
    expect((await subscriber.delete(`/api/webhook-endpoints/${endpointId}`)).status).toBe(200);
    expect((await subscriber.get('/api/webhook-endpoints')).body.endpoints).toEqual([]);
    receiver.received = [];
    await publishOutlook(forecaster, lead, { day: 2, issuanceTime: new Date().toISOString(), headline: 'After removal', areas: [{ levelKey: 'thunder', geometry: areaAround(-92, 37) }] });
    await deliver();
    expect(receiver.received).toHaveLength(0);
  });
});

it('When the app is read anonymously, then webhook routes need a sign-in', async () => {
  expect((await agentFor(sd.app).get('/api/webhook-endpoints')).status).toBe(401);
});
