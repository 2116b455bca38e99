import { sql } from 'drizzle-orm';
import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, unique, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { Geometry } from 'geojson';
import { offices } from './offices';
import { outlookStates, type RevisionSnapshot } from '../../../shared/contracts/outlooks';
import { users } from './auth';

export const outlookStateEnum = pgEnum('outlook_state', outlookStates);

export interface HazardFlag {
  hazard: 'tornado' | 'hail' | 'wind' | 'flood';
  significant: boolean;
}

/**
 * A draft outlook being authored for Day 1, 2 or 3. Publishing freezes it into an issuance;
 * the draft row then stays in state `published` and is never edited again.
 */
export const outlooks = pgTable(
  'outlooks',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    day: integer().notNull(),
    state: outlookStateEnum().notNull().default('draft'),
    validFrom: timestamp({ withTimezone: true }).notNull(),
    validUntil: timestamp({ withTimezone: true }).notNull(),
    headline: text().notNull().default(''),
    discussion: text().notNull().default(''),
    hazardNotes: jsonb().$type<Record<string, string>>().notNull().default({}),
    /** The issuance this draft amends (an amendment supersedes it when published). */
    amendsIssuanceId: uuid(),
    version: integer().notNull().default(0),
    createdBy: text().references(() => users.id, { onDelete: 'set null' }),
    lastEditedBy: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index().on(t.officeId, t.state),
    index().on(t.officeId, t.validFrom),
    // One open (unpublished) amendment per issuance: a second "amend" finds the first.
    uniqueIndex('outlooks_open_amendment_idx').on(t.amendsIssuanceId).where(sql`${t.state} <> 'published'`),
  ],
);

/** A risk area of an outlook: a polygon (GeoJSON, WGS 84) at one ladder level, with hazards. */
export const riskAreas = pgTable(
  'risk_areas',
  {
    id: uuid().primaryKey().defaultRandom(),
    outlookId: uuid()
      .notNull()
      .references(() => outlooks.id, { onDelete: 'cascade' }),
    levelKey: text().notNull(),
    hazards: jsonb().$type<HazardFlag[]>().notNull().default([]),
    geometry: jsonb().$type<Geometry>().notNull(),
    label: text().notNull().default(''),
    sortOrder: integer().notNull().default(0),
  },
  (t) => [index().on(t.outlookId)],
);

/** Every save of an outlook is a revision: a full snapshot, who and when. */
export const outlookRevisions = pgTable(
  'outlook_revisions',
  {
    id: uuid().primaryKey().defaultRandom(),
    outlookId: uuid()
      .notNull()
      .references(() => outlooks.id, { onDelete: 'cascade' }),
    revisionNumber: integer().notNull(),
    snapshot: jsonb().$type<RevisionSnapshot>().notNull(),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.outlookId, t.revisionNumber)],
);

/** Review comments, general or pinned to a risk area. */
export const outlookComments = pgTable(
  'outlook_comments',
  {
    id: uuid().primaryKey().defaultRandom(),
    outlookId: uuid()
      .notNull()
      .references(() => outlooks.id, { onDelete: 'cascade' }),
    riskAreaId: uuid(),
    revisionNumber: integer(),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    body: text().notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.outlookId)],
);
