import { randomBytes, randomUUID } from 'node:crypto';
import { and, asc, count, desc, eq, lt, lte, or } from 'drizzle-orm';
import { Webhook } from 'standardwebhooks';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import { webhookEndpointsPerOwner, type CreateWebhookEndpointInput, type CreatedWebhookEndpoint, type WebhookDelivery, type WebhookEndpoint, type WebhookEventType } from '../../shared/contracts/webhooks';
import type { Actor } from '../auth/require-role';
import type { Config } from '../config';
import type { Database, DatabaseOrTransaction, Transaction } from '../db/client';
import { issuances, users, webhookDeliveries, webhookEndpoints } from '../db/schema';
import { capCancelUrl, capUrl } from './cap.service';
import { issuanceGeoJson } from './issuances.service';
import { publicCaution } from '../../shared/workflow/caution';
import { findOffice } from './office.service';
import { webhookUrlProblem } from './webhook-url';

/** After this many failed attempts a delivery is marked failed. */
export const webhookMaxAttempts = 8;
/** Backoff before attempt n+1: 30 s × 2^(n−1), at most one hour (30 s, 1 min, 2 min, … ≈ 1 h in all). */
export const webhookRetryDelayMs = (attempts: number) => Math.min(3_600_000, 30_000 * 2 ** Math.max(0, attempts - 1));
/** A claimed delivery is someone's for this long; a worker that dies mid-delivery frees it when it runs out. */
export const webhookLeaseMs = 60_000;
/** Each delivery attempt waits at most this long for the receiver. */
export const webhookTimeoutMs = 10_000;

type EndpointRow = typeof webhookEndpoints.$inferSelect;

/** A new signing secret in the Standard Webhooks form: "whsec_" + base64 of 24 random bytes. */
function newSecret(): string {
  return `whsec_${randomBytes(24).toString('base64')}`;
}

/**
 * Queues one signed event per active endpoint for an issuance that was just published, amended
 * or withdrawn. Runs inside that transaction (pass its `tx`), so the event exists exactly when
 * the change commits; the unique key (endpoint, event, issuance) makes a second call a no-op.
 */
export async function queueWebhookEvents(tx: Transaction, config: Config, eventType: WebhookEventType, issuanceId: string): Promise<void> {
  const [row] = await tx.select().from(issuances).where(eq(issuances.id, issuanceId));
  if (!row) throw new Error(`queueWebhookEvents: no issuance ${issuanceId}`);
  const endpoints = await tx.select({ id: webhookEndpoints.id }).from(webhookEndpoints).where(and(eq(webhookEndpoints.officeId, row.officeId), eq(webhookEndpoints.active, true)));
  if (!endpoints.length) return;
  // issuanceGeoJson reads through whatever handle it is given; inside the transaction that must be tx (PGlite has one connection).
  const geojson = await issuanceGeoJson(tx, row.number);
  if (!geojson.ok) throw new Error(`queueWebhookEvents: ${geojson.error.message}`);
  const [previous] = row.supersedesId ? await tx.select({ number: issuances.number }).from(issuances).where(eq(issuances.id, row.supersedesId)) : [];
  const publicUrl = config.publicUrl;
  const timestamp = new Date().toISOString();
  const body = JSON.stringify({
    type: eventType,
    timestamp,
    data: {
      issuance: row.number,
      day: row.day,
      state: row.state,
      headline: String(row.snapshot.headline ?? ''),
      validFrom: row.validFrom.toISOString(),
      validUntil: row.validUntil.toISOString(),
      publishedAt: row.publishedAt.toISOString(),
      supersedes: previous?.number ?? null,
      withdrawnReason: row.withdrawnReason,
      issuanceUrl: `${publicUrl}/issuances/${row.number}`,
      capUrl: eventType === 'issuance.withdrawn' ? capCancelUrl(publicUrl, row.number) : capUrl(publicUrl, row.number),
      geojsonUrl: `${publicUrl}/api/public/issuances/${row.number}/geojson`,
      geojson: geojson.value,
      caution: publicCaution,
    },
  });
  await tx
    .insert(webhookDeliveries)
    .values(endpoints.map((endpoint) => ({ endpointId: endpoint.id, issuanceId: row.id, eventType, messageId: `msg_${randomUUID()}`, body })))
    .onConflictDoNothing();
}

function endpointView(row: EndpointRow, ownerEmail: string): WebhookEndpoint {
  return { id: row.id, url: row.url, description: row.description, active: row.active, ownerEmail, createdAt: row.createdAt.toISOString() };
}

/** Registers an endpoint for the actor (a subscriber for themselves, an admin for an agency); the secret is returned this once. */
export async function registerWebhookEndpoint(db: Database, config: Config, actor: Actor, input: CreateWebhookEndpointInput): Promise<Result<CreatedWebhookEndpoint, AppError>> {
  const problem = webhookUrlProblem(input.url, config.env);
  if (problem) return err(appError('VALIDATION_FAILED', problem, { issues: [{ path: 'url', message: problem }] }));
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  const [owned] = await db.select({ value: count() }).from(webhookEndpoints).where(eq(webhookEndpoints.ownerId, actor.userId));
  if ((owned?.value ?? 0) >= webhookEndpointsPerOwner) {
    return err(appError('CONFLICT', `You already have ${webhookEndpointsPerOwner} endpoints, the most one account may register. Remove one first.`));
  }
  const secret = newSecret();
  const [row] = await db.insert(webhookEndpoints).values({ officeId: office.id, ownerId: actor.userId, url: input.url, description: input.description, secret }).returning();
  if (!row) throw new Error('endpoint insert returned no row');
  return ok({ endpoint: endpointView(row, actor.email), secret });
}

/** The actor's endpoints (an admin sees every endpoint, with its owner). Secrets are never listed. */
export async function listWebhookEndpoints(db: Database, actor: Actor): Promise<Result<{ endpoints: WebhookEndpoint[] }, AppError>> {
  const rows = await db
    .select({ endpoint: webhookEndpoints, ownerEmail: users.email })
    .from(webhookEndpoints)
    .innerJoin(users, eq(users.id, webhookEndpoints.ownerId))
    .where(actor.role === 'admin' ? undefined : eq(webhookEndpoints.ownerId, actor.userId))
    .orderBy(asc(webhookEndpoints.createdAt));
  return ok({ endpoints: rows.map((r) => endpointView(r.endpoint, r.ownerEmail)) });
}

/** The endpoint if the actor may manage it (owner, or any admin); others get the same 404 as a missing one. */
async function manageable(db: DatabaseOrTransaction, actor: Actor, endpointId: string): Promise<Result<EndpointRow, AppError>> {
  const [row] = await db.select().from(webhookEndpoints).where(eq(webhookEndpoints.id, endpointId));
  if (!row || (actor.role !== 'admin' && row.ownerId !== actor.userId)) return err(appError('NOT_FOUND', 'There is no such webhook endpoint among yours.'));
  return ok(row);
}

/** Removes an endpoint and its delivery log. */
export async function deleteWebhookEndpoint(db: Database, actor: Actor, endpointId: string): Promise<Result<{ id: string }, AppError>> {
  const found = await manageable(db, actor, endpointId);
  if (!found.ok) return found;
  await db.delete(webhookEndpoints).where(eq(webhookEndpoints.id, endpointId));
  return ok({ id: endpointId });
}

/** The delivery log of one endpoint, newest first (at most 200 rows). */
export async function listWebhookDeliveries(db: Database, actor: Actor, endpointId: string): Promise<Result<{ deliveries: WebhookDelivery[] }, AppError>> {
  const found = await manageable(db, actor, endpointId);
  if (!found.ok) return found;
  const rows = await db
    .select({ delivery: webhookDeliveries, number: issuances.number })
    .from(webhookDeliveries)
    .innerJoin(issuances, eq(issuances.id, webhookDeliveries.issuanceId))
    .where(eq(webhookDeliveries.endpointId, endpointId))
    .orderBy(desc(webhookDeliveries.createdAt))
    .limit(200);
  return ok({
    deliveries: rows.map(({ delivery: d, number }) => ({
      id: d.id,
      eventType: d.eventType,
      issuanceNumber: number,
      messageId: d.messageId,
      status: d.status,
      attempts: d.attempts,
      lastStatusCode: d.lastStatusCode,
      lastError: d.lastError,
      nextAttemptAt: d.nextAttemptAt.toISOString(),
      deliveredAt: d.deliveredAt?.toISOString() ?? null,
      createdAt: d.createdAt.toISOString(),
    })),
  });
}

/** Puts a failed delivery back in the queue (same webhook-id and body) for the next worker pass. */
export async function retryWebhookDelivery(db: Database, actor: Actor, deliveryId: string): Promise<Result<{ id: string; status: string }, AppError>> {
  const [delivery] = await db.select({ endpointId: webhookDeliveries.endpointId }).from(webhookDeliveries).where(eq(webhookDeliveries.id, deliveryId));
  const endpoint = delivery ? await manageable(db, actor, delivery.endpointId) : undefined;
  if (!endpoint?.ok) return err(appError('NOT_FOUND', 'There is no such delivery among your endpoints.'));
  const [row] = await db
    .update(webhookDeliveries)
    .set({ status: 'queued', attempts: 0, nextAttemptAt: new Date(), leaseUntil: null })
    .where(and(eq(webhookDeliveries.id, deliveryId), eq(webhookDeliveries.status, 'failed')))
    .returning();
  if (!row) return err(appError('CONFLICT', 'Only a failed delivery can be retried; this one is queued, being delivered or delivered.'));
  return ok({ id: row.id, status: row.status });
}

/** A short, secret-free reason for a failed attempt (network errors carry their code). */
function failureReason(error: unknown): string {
  if (error instanceof Error) {
    const cause: unknown = error.cause;
    const code = typeof cause === 'object' && cause !== null && 'code' in cause && typeof cause.code === 'string' ? cause.code : undefined;
    if (error.name === 'TimeoutError') return `No answer within ${webhookTimeoutMs / 1000} s.`;
    return code ? `Could not connect (${code}).` : error.message.slice(0, 200);
  }
  return 'Delivery failed.';
}

/** Sends one delivery attempt; resolves with the HTTP status or throws on a network error. */
async function post(url: string, secret: string, messageId: string, body: string): Promise<number> {
  const sentAt = new Date();
  const signature = new Webhook(secret).sign(messageId, sentAt, body);
  const response = await fetch(url, {
    method: 'POST',
    headers: {
      'content-type': 'application/json',
      'user-agent': 'Stormdraft-Webhooks/1',
      'webhook-id': messageId,
      'webhook-timestamp': String(Math.floor(sentAt.getTime() / 1000)),
      'webhook-signature': signature,
    },
    body,
    redirect: 'manual',
    signal: AbortSignal.timeout(webhookTimeoutMs),
  });
  await response.body?.cancel();
  return response.status;
}

/**
 * Delivers due events: each row is claimed with a lease before it is sent, so two workers (or
 * two app instances) never send the same row at once, and a row whose worker died is taken up
 * again when its lease runs out. A 2xx answer marks it delivered; anything else schedules a
 * retry with backoff, or after the last attempt marks it failed.
 */
export async function processWebhookDeliveries(db: Database, now = new Date(), batch = 20): Promise<{ delivered: number; failed: number }> {
  const claimable = or(and(eq(webhookDeliveries.status, 'queued'), lte(webhookDeliveries.nextAttemptAt, now)), and(eq(webhookDeliveries.status, 'delivering'), lt(webhookDeliveries.leaseUntil, now)));
  const due = await db.select({ id: webhookDeliveries.id }).from(webhookDeliveries).where(claimable).orderBy(asc(webhookDeliveries.nextAttemptAt)).limit(batch);
  let delivered = 0;
  let failed = 0;
  for (const { id } of due) {
    const [claimed] = await db
      .update(webhookDeliveries)
      .set({ status: 'delivering', leaseUntil: new Date(now.getTime() + webhookLeaseMs) })
      .where(and(eq(webhookDeliveries.id, id), claimable))
      .returning();
    if (!claimed) continue;
    const [endpoint] = await db.select().from(webhookEndpoints).where(eq(webhookEndpoints.id, claimed.endpointId));
    const attempts = claimed.attempts + 1;
    let statusCode: number | null = null;
    let problem: string | null = null;
    if (!endpoint?.active) problem = 'The endpoint was turned off.';
    else {
      try {
        statusCode = await post(endpoint.url, endpoint.secret, claimed.messageId, claimed.body);
        if (statusCode < 200 || statusCode > 299) problem = `The endpoint answered HTTP ${statusCode}.`;
      } catch (error) {
        problem = failureReason(error);
      }
    }
    if (!problem) {
      await db.update(webhookDeliveries).set({ status: 'delivered', attempts, lastStatusCode: statusCode, lastError: null, deliveredAt: new Date(), leaseUntil: null }).where(eq(webhookDeliveries.id, id));
      delivered++;
      continue;
    }
    const giveUp = attempts >= webhookMaxAttempts || !endpoint?.active;
    await db
      .update(webhookDeliveries)
      .set({ status: giveUp ? 'failed' : 'queued', attempts, lastStatusCode: statusCode, lastError: problem, leaseUntil: null, ...(giveUp ? {} : { nextAttemptAt: new Date(now.getTime() + webhookRetryDelayMs(attempts)) }) })
      .where(eq(webhookDeliveries.id, id));
    failed++;
  }
  return { delivered, failed };
}

/** Runs processWebhookDeliveries every `intervalMs` until stopped (its own loop, beside the mail outbox). */
export function startWebhookWorker(db: Database, intervalMs: number, onError: (error: unknown) => void): () => Promise<void> {
  let running: Promise<unknown> = Promise.resolve();
  const timer = setInterval(() => {
    running = running.then(() => processWebhookDeliveries(db)).catch(onError);
  }, intervalMs);
  return async () => {
    clearInterval(timer);
    await running;
  };
}
