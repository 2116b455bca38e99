import { createHash, createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import { and, asc, eq, isNull, notInArray } from 'drizzle-orm';
import type { AreaOfInterestInput, SubscriptionSettingsInput } from '../../shared/contracts/subscriptions';
import type { AreaGeometry } from '../../shared/contracts/outlooks';
import { countVertices, MAX_VERTICES_PER_SUBSCRIPTION, tooManyVerticesMessage } from '../../shared/geometry/limits';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database, DatabaseOrTransaction } from '../db/client';
import { areasOfInterest, subscriptionEmailConfirmations, subscriptions, users } from '../db/schema';
import { renderTemplate } from '../mail/render-template';
import { allPlaces, searchPlaces } from '../geo/places';
import { findOffice } from './office.service';
import { queueMail } from './outbox.service';

type SubscriptionRow = typeof subscriptions.$inferSelect;

export interface AreaOfInterestView {
  id: string;
  name: string;
  kind: 'drawn' | 'county' | 'state';
  fipsCode: string | null;
  geometry: AreaGeometry;
}

export interface SubscriptionView {
  id: string;
  alertThreshold: string;
  hazards: string[];
  days: number[];
  /** Every address the subscriber gave: the confirmed ones (which receive alerts), then the unconfirmed. */
  emails: string[];
  /** Extra addresses waiting for their owner to follow the confirmation link; they receive nothing yet. */
  unconfirmedEmails: string[];
  paused: boolean;
  unsubscribed: boolean;
  version: number;
  areas: AreaOfInterestView[];
}

async function view(db: DatabaseOrTransaction, row: SubscriptionRow): Promise<SubscriptionView> {
  const areas = await db.select().from(areasOfInterest).where(eq(areasOfInterest.subscriptionId, row.id));
  const pending = await db.select({ email: subscriptionEmailConfirmations.email }).from(subscriptionEmailConfirmations).where(eq(subscriptionEmailConfirmations.subscriptionId, row.id)).orderBy(asc(subscriptionEmailConfirmations.createdAt));
  const unconfirmed = pending.map((p) => p.email).filter((e) => !row.emails.includes(e));
  return {
    id: row.id,
    alertThreshold: row.alertThreshold,
    hazards: row.hazards,
    days: row.days,
    emails: [...row.emails, ...unconfirmed],
    unconfirmedEmails: unconfirmed,
    paused: row.paused,
    unsubscribed: row.unsubscribedAt !== null,
    version: row.version,
    areas: areas.map((a) => ({ id: a.id, name: a.name, kind: a.kind, fipsCode: a.fipsCode, geometry: a.geometry })),
  };
}

/** The signed-in subscriber's alert settings, created with sensible defaults on first visit. */
export async function getMySubscription(db: Database, actor: Actor): Promise<Result<SubscriptionView, AppError>> {
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  const [existing] = await db.select().from(subscriptions).where(and(eq(subscriptions.officeId, office.id), eq(subscriptions.userId, actor.userId)));
  if (existing) return ok(await view(db, existing));
  const threshold = office.riskLadder[1]?.key ?? office.riskLadder[0]?.key ?? 'thunder';
  const [created] = await db
    .insert(subscriptions)
    .values({ officeId: office.id, userId: actor.userId, alertThreshold: threshold, emails: [actor.email], days: [1, 2, 3], hazards: [] })
    .onConflictDoNothing()
    .returning();
  const row = created ?? (await db.select().from(subscriptions).where(and(eq(subscriptions.officeId, office.id), eq(subscriptions.userId, actor.userId))))[0];
  if (!row) throw new Error('subscription vanished');
  return ok(await view(db, row));
}

/** How long the link in an address-confirmation mail works. */
export const addressConfirmationValidDays = 7;

const tokenHash = (token: string) => createHash('sha256').update(token).digest('hex');

/**
 * Saves threshold, hazards, days, addresses and pause with optimistic concurrency (409 when
 * stale). Alerts go only to confirmed addresses: the account's own address, and each extra
 * address once its owner followed the link in the confirmation mail queued here (issue 11,
 * item 10). An address removed from the list loses its confirmation.
 */
export async function saveMySubscription(db: Database, actor: Actor, input: SubscriptionSettingsInput, links: { publicUrl?: string } = {}): Promise<Result<SubscriptionView, AppError>> {
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  if (!office.riskLadder.some((l) => l.key === input.alertThreshold)) {
    return err(appError('VALIDATION_FAILED', `"${input.alertThreshold}" is not a level of the office's risk ladder.`, { issues: [{ path: 'alertThreshold', message: 'Choose a level of the risk ladder.' }] }));
  }
  const current = await getMySubscription(db, actor);
  if (!current.ok) return current;
  const { version, emails: wanted, ...fields } = input;
  const addresses = [...new Set(wanted)];
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(subscriptions).where(eq(subscriptions.id, current.value.id)).for('update');
    if (!before || before.version !== version) return err(appError('CONFLICT', 'Your alert settings were changed elsewhere since you opened them. Reload and try again.'));
    const known = new Set([actor.email.toLowerCase(), ...before.emails.map((e) => e.toLowerCase())]);
    const confirmed = addresses.filter((a) => known.has(a));
    const unconfirmed = addresses.filter((a) => !confirmed.includes(a));
    await tx.delete(subscriptionEmailConfirmations).where(and(eq(subscriptionEmailConfirmations.subscriptionId, before.id), unconfirmed.length ? notInArray(subscriptionEmailConfirmations.email, unconfirmed) : undefined));
    const open = await tx.select().from(subscriptionEmailConfirmations).where(eq(subscriptionEmailConfirmations.subscriptionId, before.id));
    const now = new Date();
    for (const email of unconfirmed) {
      const existing = open.find((o) => o.email === email);
      if (existing && existing.expiresAt > now) continue; // its link is still good: no second mail
      if (!links.publicUrl) throw new Error('an unconfirmed address needs publicUrl for its confirmation link');
      const token = randomBytes(32).toString('base64url');
      const expiresAt = new Date(now.getTime() + addressConfirmationValidDays * 86_400_000);
      const [row] = await tx
        .insert(subscriptionEmailConfirmations)
        .values({ subscriptionId: before.id, email, tokenHash: tokenHash(token), expiresAt })
        .onConflictDoUpdate({ target: [subscriptionEmailConfirmations.subscriptionId, subscriptionEmailConfirmations.email], set: { tokenHash: tokenHash(token), expiresAt, createdAt: now } })
        .returning({ id: subscriptionEmailConfirmations.id });
      if (!row) throw new Error('confirmation upsert returned no row');
      const rendered = renderTemplate('confirm-address', { name: actor.name, email, officeName: office.name, validDays: addressConfirmationValidDays, url: `${links.publicUrl}/api/email-confirmations?token=${encodeURIComponent(token)}` });
      await queueMail(tx, { dedupeKey: `confirm-address:${row.id}:${tokenHash(token).slice(0, 16)}`, toAddress: email, ...rendered });
    }
    const [row] = await tx
      .update(subscriptions)
      .set({ ...fields, emails: confirmed, unsubscribedAt: null, version: version + 1, updatedAt: now })
      .where(and(eq(subscriptions.id, before.id), eq(subscriptions.version, version)))
      .returning();
    if (!row) return err(appError('CONFLICT', 'Your alert settings were changed elsewhere since you opened them. Reload and try again.'));
    return ok(await view(tx, row));
  });
}

/**
 * Confirms an extra address from the link mailed to it: from now on it receives the
 * subscription's alerts. An unknown, used or expired link changes nothing.
 */
export async function confirmSubscriptionEmail(db: Database, token: string): Promise<Result<{ email: string }, AppError>> {
  return db.transaction(async (tx) => {
    const [pending] = await tx.select().from(subscriptionEmailConfirmations).where(eq(subscriptionEmailConfirmations.tokenHash, tokenHash(token))).for('update');
    if (!pending || pending.expiresAt <= new Date()) {
      return err(appError('VALIDATION_FAILED', 'This confirmation link is not valid or has expired. Ask the subscriber to save the address again in their alert settings for a new link.', { issues: [{ path: 'token', message: 'Unknown or expired link.' }] }));
    }
    const [sub] = await tx.select().from(subscriptions).where(eq(subscriptions.id, pending.subscriptionId)).for('update');
    if (!sub) throw new Error('confirmation without subscription'); // cascade deletes it with the subscription
    if (!sub.emails.includes(pending.email)) await tx.update(subscriptions).set({ emails: [...sub.emails, pending.email], updatedAt: new Date() }).where(eq(subscriptions.id, sub.id));
    await tx.delete(subscriptionEmailConfirmations).where(eq(subscriptionEmailConfirmations.id, pending.id));
    return ok({ email: pending.email });
  });
}

/** Adds an area of interest: drawn, or a county/state picked by FIPS code (outline from us-atlas). */
export async function addAreaOfInterest(db: Database, actor: Actor, input: AreaOfInterestInput): Promise<Result<SubscriptionView, AppError>> {
  const current = await getMySubscription(db, actor);
  if (!current.ok) return current;
  if (current.value.areas.length >= 50) return err(appError('VALIDATION_FAILED', 'At most 50 areas of interest per subscription.'));
  let values: { name: string; kind: 'drawn' | 'county' | 'state'; fipsCode: string | null; geometry: AreaGeometry };
  if (input.kind === 'drawn') {
    const drawnSoFar = current.value.areas.filter((a) => a.kind === 'drawn').reduce((sum, a) => sum + countVertices(a.geometry), 0);
    const total = drawnSoFar + countVertices(input.geometry);
    if (total > MAX_VERTICES_PER_SUBSCRIPTION) {
      const message = tooManyVerticesMessage('Together your drawn areas', total, MAX_VERTICES_PER_SUBSCRIPTION);
      return err(appError('VALIDATION_FAILED', message, { issues: [{ path: 'geometry', message }] }));
    }
    values = { name: input.name, kind: 'drawn', fipsCode: null, geometry: input.geometry };
  } else {
    const place = allPlaces().get(input.fipsCode);
    if (!place || place.kind !== input.kind) {
      return err(appError('VALIDATION_FAILED', `There is no ${input.kind} with FIPS code ${input.fipsCode}.`, { issues: [{ path: 'fipsCode', message: 'Pick a place from the search.' }] }));
    }
    values = { name: place.kind === 'county' ? `${place.name}, ${place.stateName}` : place.name, kind: place.kind, fipsCode: place.fipsCode, geometry: place.geometry };
  }
  await db.insert(areasOfInterest).values({ subscriptionId: current.value.id, ...values });
  return getMySubscription(db, actor);
}

export async function removeAreaOfInterest(db: Database, actor: Actor, areaId: string): Promise<Result<SubscriptionView, AppError>> {
  const current = await getMySubscription(db, actor);
  if (!current.ok) return current;
  const deleted = await db
    .delete(areasOfInterest)
    .where(and(eq(areasOfInterest.id, areaId), eq(areasOfInterest.subscriptionId, current.value.id)))
    .returning({ id: areasOfInterest.id });
  if (deleted.length === 0) return err(appError('NOT_FOUND', 'That area is not one of yours.'));
  return getMySubscription(db, actor);
}

export function findPlaces(query: string, kind?: 'county' | 'state') {
  return ok({ places: searchPlaces(query, kind) });
}

/** For leads and admins: every subscriber with their settings and areas. */
export async function listSubscribers(db: Database): Promise<Result<{ count: number; subscribers: (SubscriptionView & { name: string; email: string })[] }, AppError>> {
  const rows = await db.select({ subscription: subscriptions, name: users.name, email: users.email }).from(subscriptions).innerJoin(users, eq(users.id, subscriptions.userId)).where(isNull(subscriptions.unsubscribedAt));
  const subscribers = await Promise.all(rows.map(async (r) => ({ ...(await view(db, r.subscription)), name: r.name, email: r.email })));
  return ok({ count: subscribers.length, subscribers });
}

/** A token that lets the holder unsubscribe one subscription without signing in (HMAC-SHA256). */
export function unsubscribeToken(secret: string, subscriptionId: string): string {
  const mac = createHmac('sha256', secret).update(`unsubscribe:${subscriptionId}`).digest('base64url');
  return `${subscriptionId}.${mac}`;
}

function verifyToken(secret: string, token: string): string | null {
  const [id, mac] = token.split('.');
  if (!id || !mac) return null;
  const expected = unsubscribeToken(secret, id).split('.')[1] ?? '';
  const a = Buffer.from(mac);
  const b = Buffer.from(expected);
  return a.length === b.length && timingSafeEqual(a, b) ? id : null;
}

/** One-click unsubscribe (RFC 8058): a valid token ends the subscription's mail at once. */
export async function unsubscribe(db: Database, secret: string, token: string): Promise<Result<{ unsubscribed: true }, AppError>> {
  const id = verifyToken(secret, token);
  if (!id) return err(appError('VALIDATION_FAILED', 'This unsubscribe link is not valid. Open your alert settings to stop the e-mails.'));
  const [row] = await db.update(subscriptions).set({ unsubscribedAt: new Date(), updatedAt: new Date() }).where(eq(subscriptions.id, id)).returning({ id: subscriptions.id });
  if (!row) return err(appError('NOT_FOUND', 'That subscription no longer exists.'));
  return ok({ unsubscribed: true });
}
