import { boolean, index, integer, jsonb, pgEnum, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import type { AreaGeometry, HazardKind } from '../../../shared/contracts/outlooks';
import { offices } from './offices';
import { users } from './auth';
import { issuances } from './issuances';

/** An emergency manager's alert settings for one office. */
export const subscriptions = pgTable(
  'subscriptions',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    alertThreshold: text().notNull(),
    hazards: jsonb().$type<HazardKind[]>().notNull().default([]),
    days: jsonb().$type<number[]>().notNull().default([1, 2, 3]),
    emails: jsonb().$type<string[]>().notNull().default([]),
    paused: boolean().notNull().default(false),
    unsubscribedAt: timestamp({ withTimezone: true }),
    version: integer().notNull().default(0),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.officeId, t.userId)],
);

export const areaKindEnum = pgEnum('area_of_interest_kind', ['drawn', 'county', 'state']);

/** One area of interest of a subscription: drawn, or a county/state picked from us-atlas. */
export const areasOfInterest = pgTable(
  'areas_of_interest',
  {
    id: uuid().primaryKey().defaultRandom(),
    subscriptionId: uuid()
      .notNull()
      .references(() => subscriptions.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    kind: areaKindEnum().notNull(),
    fipsCode: text(),
    geometry: jsonb().$type<AreaGeometry>().notNull(),
  },
  (t) => [index().on(t.subscriptionId)],
);

export const notificationKindEnum = pgEnum('notification_kind', ['alert', 'lowered', 'cleared', 'withdrawn']);

/** At most one message per issuance and subscription (the unique key makes sending idempotent). */
export const notifications = pgTable(
  'notifications',
  {
    id: uuid().primaryKey().defaultRandom(),
    issuanceId: uuid()
      .notNull()
      .references(() => issuances.id),
    subscriptionId: uuid()
      .notNull()
      .references(() => subscriptions.id, { onDelete: 'cascade' }),
    kind: notificationKindEnum().notNull(),
    highestLevelKey: text(),
    outboxMessageId: uuid(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.issuanceId, t.subscriptionId)],
);

/**
 * An extra address a subscriber added that has not been confirmed yet. It receives nothing
 * until its owner follows the link mailed to it; confirming moves it into
 * `subscriptions.emails` (the addresses alerts go to) and deletes this row. Only a hash of the
 * link's token is stored.
 */
export const subscriptionEmailConfirmations = pgTable(
  'subscription_email_confirmations',
  {
    id: uuid().primaryKey().defaultRandom(),
    subscriptionId: uuid()
      .notNull()
      .references(() => subscriptions.id, { onDelete: 'cascade' }),
    email: text().notNull(),
    tokenHash: text().notNull().unique(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.subscriptionId, t.email)],
);
