import { createHmac, timingSafeEqual } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import type { AreaOfInterestInput, SubscriptionSettingsInput } from '../../shared/contracts/subscriptions';
import type { AreaGeometry } from '../../shared/contracts/outlooks';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database } from '../db/client';
import { areasOfInterest, subscriptions, users } from '../db/schema';
import { allPlaces, searchPlaces } from '../geo/places';
import { findOffice } from './office.service';

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
  emails: string[];
  paused: boolean;
  unsubscribed: boolean;
  version: number;
  areas: AreaOfInterestView[];
}

async function view(db: Database, row: SubscriptionRow): Promise<SubscriptionView> {
  const areas = await db.select().from(areasOfInterest).where(eq(areasOfInterest.subscriptionId, row.id));
  return {
    id: row.id,
    alertThreshold: row.alertThreshold,
    hazards: row.hazards,
    days: row.days,
    emails: row.emails,
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

/** Saves threshold, hazards, days, addresses and pause with optimistic concurrency (409 when stale). */
export async function saveMySubscription(db: Database, actor: Actor, input: SubscriptionSettingsInput): Promise<Result<SubscriptionView, AppError>> {
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  if (!office.riskLadder.some((l) => l.key === input.alertThreshold)) {
    return err(appError('VALIDATION_FAILED', `"${input.alertThreshold}" is not a level of the office's risk ladder.`, { issues: [{ path: 'alertThreshold', message: 'Choose a level of the risk ladder.' }] }));
  }
  const current = await getMySubscription(db, actor);
  if (!current.ok) return current;
  const { version, ...fields } = input;
  const [row] = await db
    .update(subscriptions)
    .set({ ...fields, unsubscribedAt: null, version: version + 1, updatedAt: new Date() })
    .where(and(eq(subscriptions.id, current.value.id), eq(subscriptions.version, version)))
    .returning();
  if (!row) return err(appError('CONFLICT', 'Your alert settings were changed elsewhere since you opened them. Reload and try again.'));
  return ok(await view(db, row));
}

/** Adds an area of interest: drawn, or a county/state picked by FIPS code (outline from us-atlas). */
export async function addAreaOfInterest(db: Database, actor: Actor, input: AreaOfInterestInput): Promise<Result<SubscriptionView, AppError>> {
  const current = await getMySubscription(db, actor);
  if (!current.ok) return current;
  if (current.value.areas.length >= 50) return err(appError('VALIDATION_FAILED', 'At most 50 areas of interest per subscription.'));
  let values: { name: string; kind: 'drawn' | 'county' | 'state'; fipsCode: string | null; geometry: AreaGeometry };
  if (input.kind === 'drawn') {
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
