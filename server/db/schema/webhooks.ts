import { boolean, index, integer, pgEnum, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { offices } from './offices';
import { users } from './auth';
import { issuances } from './issuances';

/**
 * A subscriber's (or, for an agency, an admin's) HTTPS endpoint that receives signed events when
 * an issuance is published, amended or withdrawn. The secret signs every delivery (Standard
 * Webhooks); it is shown once when the endpoint is registered and never returned again.
 */
export const webhookEndpoints = pgTable(
  'webhook_endpoints',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    ownerId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    url: text().notNull(),
    description: text().notNull().default(''),
    secret: text().notNull(),
    active: boolean().notNull().default(true),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.ownerId)],
);

export const webhookDeliveryStatusEnum = pgEnum('webhook_delivery_status', ['queued', 'delivering', 'delivered', 'failed']);

/**
 * Durable delivery queue and log: one row per event and endpoint, written in the transaction of
 * the publish, amendment or withdrawal. A worker claims a due row by setting a lease
 * (`leaseUntil`); a lease that ran out (a crashed worker) makes the row claimable again. The
 * body is stored as the exact bytes that are signed, so every retry sends the same message.
 */
export const webhookDeliveries = pgTable(
  'webhook_deliveries',
  {
    id: uuid().primaryKey().defaultRandom(),
    endpointId: uuid()
      .notNull()
      .references(() => webhookEndpoints.id, { onDelete: 'cascade' }),
    issuanceId: uuid()
      .notNull()
      .references(() => issuances.id),
    eventType: text().notNull(),
    /** The `webhook-id` header: the same on every attempt, so receivers can drop duplicates. */
    messageId: text().notNull().unique(),
    body: text().notNull(),
    status: webhookDeliveryStatusEnum().notNull().default('queued'),
    attempts: integer().notNull().default(0),
    nextAttemptAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    leaseUntil: timestamp({ withTimezone: true }),
    lastStatusCode: integer(),
    lastError: text(),
    deliveredAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.endpointId, t.eventType, t.issuanceId), index().on(t.status, t.nextAttemptAt), index().on(t.endpointId, t.createdAt)],
);
