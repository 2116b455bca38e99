import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

/**
 * An attachment of a queued message: its bytes in base64, or (for alert maps shared by many
 * messages) the id of a cached issuance image, read when the message is sent.
 */
export interface OutboxAttachment {
  filename: string;
  cid: string;
  contentType: string;
  contentBase64: string;
  issuanceImageId?: string;
}

export const outboxStatusEnum = pgEnum('outbox_status', ['queued', 'sending', 'sent', 'failed']);

/**
 * Durable outbox: a message is written in the same transaction as the event that causes it,
 * then a worker sends it with retries. `dedupeKey` makes queueing idempotent.
 */
export const mailOutbox = pgTable(
  'mail_outbox',
  {
    id: uuid().primaryKey().defaultRandom(),
    dedupeKey: text().notNull().unique(),
    toAddress: text().notNull(),
    subject: text().notNull(),
    html: text().notNull(),
    text: text().notNull(),
    headers: jsonb().$type<Record<string, string>>().notNull().default({}),
    attachments: jsonb().$type<OutboxAttachment[]>().notNull().default([]),
    status: outboxStatusEnum().notNull().default('queued'),
    attempts: integer().notNull().default(0),
    nextAttemptAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    /** When a worker claimed the row ("sending"); after the lease runs out another may re-claim it. */
    claimedAt: timestamp({ withTimezone: true }),
    lastError: text(),
    sentAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.status, t.nextAttemptAt)],
);

/** Messages received by the local SMTP catcher (development, demo and tests). */
export const caughtMail = pgTable(
  'caught_mail',
  {
    id: uuid().primaryKey().defaultRandom(),
    fromAddress: text().notNull(),
    toAddress: text().notNull(),
    subject: text().notNull(),
    html: text(),
    text: text(),
    headers: jsonb().$type<Record<string, string>>().notNull().default({}),
    receivedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.receivedAt)],
);
