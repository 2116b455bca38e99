import { boolean, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { offices } from './offices';
import { issuances } from './issuances';
import { users } from './auth';
import type { VerificationResult } from '../../../shared/contracts/verification';

export const reportHazardEnum = pgEnum('report_hazard', ['tornado', 'hail', 'wind', 'flood']);
export const reportSourceEnum = pgEnum('report_source', ['spotter', 'emergency_manager', 'public', 'measured']);

/** A storm report: a point event (time, place, hazard, magnitude) used to verify outlooks. */
export const stormReports = pgTable(
  'storm_reports',
  {
    id: uuid().primaryKey().defaultRandom(),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    time: timestamp({ withTimezone: true }).notNull(),
    latitude: doublePrecision().notNull(),
    longitude: doublePrecision().notNull(),
    hazard: reportHazardEnum().notNull(),
    hailCm: doublePrecision(),
    gustKmh: doublePrecision(),
    gustMeasured: boolean(),
    efRating: integer(),
    source: reportSourceEnum().notNull(),
    remark: text().notNull().default(''),
    /** How it arrived: upload, api, folder or demo. */
    intake: text().notNull(),
    fileName: text(),
    createdBy: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.officeId, t.time), index().on(t.hazard, t.time)],
);

/**
 * The verification of one issuance, stored beside it (the issuance itself never changes).
 * `status` is `scored` or `not_scored` (withdrawn issuances, with the reason).
 */
export const issuanceVerifications = pgTable(
  'issuance_verifications',
  {
    issuanceId: uuid()
      .primaryKey()
      .references(() => issuances.id, { onDelete: 'cascade' }),
    officeId: uuid()
      .notNull()
      .references(() => offices.id, { onDelete: 'cascade' }),
    status: text().notNull(),
    reason: text(),
    windowFrom: timestamp({ withTimezone: true }).notNull(),
    windowUntil: timestamp({ withTimezone: true }).notNull(),
    reportsUsed: integer().notNull().default(0),
    result: jsonb().$type<VerificationResult>(),
    /** How many times it was computed (late reports re-score it within the late window). */
    runs: integer().notNull().default(1),
    computedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.officeId, t.windowFrom)],
);
