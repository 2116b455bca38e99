import { index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { offices } from './offices';
import { outlooks } from './outlooks';
import { users } from './auth';
import type { IssuanceSnapshotInput } from '../../../shared/contracts/issuances';
import { issuanceStates } from '../../../shared/contracts/workflow';

export const issuanceStateEnum = pgEnum('issuance_state', issuanceStates);

/**
 * A published, immutable version of an outlook, numbered per office and year (`2027-0142`).
 * Only its state may move on (superseded, withdrawn); the snapshot never changes.
 */
export const issuances = pgTable(
  'issuances',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    outlookId: uuid()
      .notNull()
      .references(() => outlooks.id),
    number: text().notNull(),
    year: integer().notNull(),
    sequence: integer().notNull(),
    day: integer().notNull(),
    validFrom: timestamp({ withTimezone: true }).notNull(),
    validUntil: timestamp({ withTimezone: true }).notNull(),
    snapshot: jsonb().$type<IssuanceSnapshotInput>().notNull(),
    state: issuanceStateEnum().notNull().default('published'),
    supersedesId: uuid(),
    supersededById: uuid(),
    withdrawnReason: text(),
    withdrawnAt: timestamp({ withTimezone: true }),
    withdrawnBy: text().references(() => users.id, { onDelete: 'set null' }),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    approverId: text().references(() => users.id, { onDelete: 'set null' }),
    publishedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.officeId, t.year, t.sequence), unique().on(t.officeId, t.number), index().on(t.officeId, t.day, t.publishedAt)],
);

/**
 * The last issuance number handed out per office and year. Publishing takes the next number
 * with one atomic upsert on this row, which locks it until the publish commits, so concurrent
 * publishes on PostgreSQL queue for a number instead of colliding on `max(sequence) + 1`.
 */
export const issuanceCounters = pgTable(
  'issuance_counters',
  {
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    year: integer().notNull(),
    lastSequence: integer().notNull(),
  },
  (t) => [primaryKey({ columns: [t.officeId, t.year] })],
);

/** Append-only audit trail: every transition and every save (who, when, from, to, comment). */
export const auditEvents = pgTable(
  'audit_events',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    outlookId: uuid(),
    issuanceId: uuid(),
    actorId: text().references(() => users.id, { onDelete: 'set null' }),
    action: text().notNull(),
    fromState: text(),
    toState: text(),
    comment: text(),
    details: jsonb().$type<Record<string, unknown>>().notNull().default({}),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.outlookId), index().on(t.officeId, t.createdAt)],
);
