import { doublePrecision, index, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { offices } from './offices';
import { users } from './auth';
import type { SoundingIssue, SoundingLevel } from '../../../shared/sounding/types';
import type { SoundingAnalysis } from '../../../shared/sounding/analyze';

export const soundingSourceEnum = pgEnum('sounding_source', ['observed', 'model']);

/**
 * A balloon (observed) or model forecast sounding. Levels are stored as parsed (SI-ish units);
 * the analysis is cached with the engine version that produced it and recomputed when the
 * engine version changes. A modified (what-if) sounding points at its original.
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
    latitude: doublePrecision().notNull(),
    longitude: doublePrecision().notNull(),
    elevationM: doublePrecision().notNull(),
    validTime: timestamp({ withTimezone: true }).notNull(),
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
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.officeId, t.validTime), index().on(t.stationId), index().on(t.modifiedFromId)],
);
