import { integer, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { outlooks } from './outlooks';

/**
 * The model runs an author picked to feed an outlook's evidence. No row (or an empty list) means
 * the default: the ready runs valid in the outlook period. `version` guards concurrent edits the
 * way the outlook's own version does. Run ids of runs deleted later (retention) are ignored on read.
 */
export const outlookEvidenceRuns = pgTable('outlook_evidence_runs', {
  outlookId: uuid()
    .primaryKey()
    .references(() => outlooks.id, { onDelete: 'cascade' }),
  runIds: uuid().array().notNull().default([]),
  version: integer().notNull().default(0),
  updatedBy: text().references(() => users.id, { onDelete: 'set null' }),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});
