import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { issuances } from './issuances';

export const distributionJobStatusEnum = pgEnum('distribution_job_status', ['queued', 'running', 'done', 'failed']);

/**
 * Work left by publishing: the publish transaction writes one row here and commits; a worker
 * then matches subscribers, renders the map images and queues the mail. A row left "running"
 * by a crash is taken up again once its lease has run out; matching is idempotent (one
 * notification per issuance and subscription), so every subscriber is told exactly once.
 */
export const distributionJobs = pgTable(
  'distribution_jobs',
  {
    id: uuid().primaryKey().defaultRandom(),
    issuanceId: uuid()
      .notNull()
      .references(() => issuances.id),
    status: distributionJobStatusEnum().notNull().default('queued'),
    attempts: integer().notNull().default(0),
    claimedAt: timestamp({ withTimezone: true }),
    lastError: text(),
    queued: integer().notNull().default(0),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp({ withTimezone: true }),
  },
  (t) => [unique().on(t.issuanceId), index().on(t.status, t.createdAt)],
);

/**
 * Map images of an issuance, rendered once and kept (issuances never change): the public map
 * per state and format, and one image per distinct set of a subscriber's areas for the alerts.
 * `content` is the SVG text or the PNG in base64.
 */
export const issuanceImages = pgTable(
  'issuance_images',
  {
    id: uuid().primaryKey().defaultRandom(),
    issuanceId: uuid()
      .notNull()
      .references(() => issuances.id),
    variant: text().notNull(),
    format: text().$type<'svg' | 'png'>().notNull(),
    content: text().notNull(),
    details: jsonb().$type<Record<string, unknown>>().notNull().default({}),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.issuanceId, t.variant, t.format)],
);
