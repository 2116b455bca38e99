import { sql } from 'drizzle-orm';
import { doublePrecision, index, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { offices } from './offices';
import { users } from './auth';
import type { SoundingIssue, SoundingLevel } from '../../../shared/sounding/types';
import type { SoundingAnalysis } from '../../../shared/sounding/analyze';

export const soundingSourceEnum = pgEnum('sounding_source', ['observed', 'model', 'unknown']);

/**
 * A balloon (observed) or model forecast sounding. Levels are stored as parsed (SI-ish units);
 * the analysis is cached with the engine version that produced it and recomputed when the
 * engine version changes. A modified (what-if) sounding points at its original.
 * Station ('' when unknown), position and valid time may be missing after an upload: such a
 * sounding stays out of evidence until an author fills them in. `contentHash` (SHA-256 of
 * the parsed metadata and levels) makes a re-sent file a duplicate instead of a second row.
 */
export const soundings = pgTable(
  'soundings',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    stationId: text().notNull(),
    stationName: text().notNull().default(''),
    latitude: doublePrecision(),
    longitude: doublePrecision(),
    elevationM: doublePrecision(),
    validTime: timestamp({ withTimezone: true }),
    source: soundingSourceEnum().notNull(),
    fileName: text(),
    levels: jsonb().$type<SoundingLevel[]>().notNull(),
    warnings: jsonb().$type<SoundingIssue[]>().notNull().default([]),
    analysis: jsonb().$type<SoundingAnalysis>(),
    engineVersion: text(),
    modifiedFromId: uuid(),
    modificationName: text(),
    modificationNote: text(),
    uploadedBy: text().references(() => users.id, { onDelete: 'set null' }),
    contentHash: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index().on(t.officeId, t.validTime),
    index().on(t.stationId),
    index().on(t.modifiedFromId),
    uniqueIndex('soundings_office_id_content_hash_idx').on(t.officeId, t.contentHash).where(sql`${t.modifiedFromId} is null`),
  ],
);
