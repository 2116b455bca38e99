import { sql } from 'drizzle-orm';
import { bigint, boolean, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { offices } from './offices';

/**
 * A scheduled pull: an HTTP(S) address template expanded with a model cycle time and forecast
 * hour, fetched on a schedule. `authorization` is the value of the Authorization header sent with
 * each request; it stays on the server (the API only says whether one is set) and is never logged.
 */
export const intakeSources = pgTable(
  'intake_sources',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    urlTemplate: text().notNull(),
    /** Cycle hours (UTC) the source publishes, e.g. [0, 6, 12, 18]. */
    cycleHours: jsonb().$type<number[]>().notNull(),
    /** Forecast hours fetched per cycle, e.g. [0, 3, 6]. */
    forecastHours: jsonb().$type<number[]>().notNull(),
    /** How long after the cycle time the files are expected to be there, minutes. */
    delayMinutes: integer().notNull().default(0),
    /** How often the source is checked, minutes. */
    intervalMinutes: integer().notNull().default(15),
    model: text(),
    authorization: text(),
    enabled: boolean().notNull().default(true),
    lastPolledAt: timestamp({ withTimezone: true }),
    lastError: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('intake_sources_office_name_idx').on(t.officeId, t.name)],
);

/**
 * One file the intake received (from the folder or a pull) and what became of it. `state` moves
 * received → processing → done or failed; a file whose content (SHA-256) was already taken is
 * recorded as duplicate. Only one live record (not failed, not duplicate) per content hash.
 */
export const intakeFiles = pgTable(
  'intake_files',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    /** 'folder' or 'pull'. */
    origin: text().notNull(),
    /** The pull source's name, or "intake folder". */
    sourceName: text().notNull(),
    sourceId: uuid().references(() => intakeSources.id, { onDelete: 'set null' }),
    /** The address fetched (pulls; without credentials). */
    url: text(),
    fileName: text().notNull(),
    sizeBytes: bigint({ mode: 'number' }).notNull(),
    contentHash: text().notNull(),
    /** 'grib2', 'bufr', 'csv' or 'unknown'. */
    format: text().notNull(),
    state: text().notNull().default('received'),
    progressDone: integer().notNull().default(0),
    progressTotal: integer().notNull().default(0),
    soundingCount: integer().notNull().default(0),
    duplicateSoundingCount: integer().notNull().default(0),
    runIds: jsonb().$type<string[]>().notNull().default([]),
    notes: jsonb().$type<string[]>().notNull().default([]),
    failure: text(),
    duplicateOfId: uuid(),
    startedAt: timestamp({ withTimezone: true }),
    finishedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('intake_files_office_hash_idx').on(t.officeId, t.contentHash).where(sql`state in ('received', 'processing', 'done')`),
    index('intake_files_office_created_idx').on(t.officeId, t.createdAt),
    index('intake_files_source_url_idx').on(t.sourceId, t.url),
  ],
);
