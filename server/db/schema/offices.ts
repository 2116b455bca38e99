import { boolean, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { LegacyGuidanceThresholds, Region, RiskLadder, SupportGuidance } from '../../../shared/contracts/office';

/**
 * One forecast office and its settings. The risk ladder is read from here by the whole app.
 * `version` gives optimistic concurrency for the settings page.
 */
export const offices = pgTable('offices', {
  id: uuid().primaryKey().defaultRandom(),
  slug: text().notNull().unique(),
  name: text().notNull(),
  region: jsonb().$type<Region>().notNull(),
  timeZone: text().notNull(),
  riskLadder: jsonb().$type<RiskLadder>().notNull(),
  /**
   * Minimum medians per level, as stored before issue 14. Read only: when `supportGuidance` is
   * null they are converted to minimum rules on read (supportGuidanceFromStored).
   */
  guidanceThresholds: jsonb().$type<LegacyGuidanceThresholds>().notNull().default({}),
  /** Support-check rules per level and per hazard (issue 14); null until first saved. */
  supportGuidance: jsonb().$type<SupportGuidance>(),
  /** Four-eyes rule relaxed (one-person night shift); every use is written to the audit trail. */
  allowSelfApproval: boolean().notNull().default(false),
  version: integer().notNull().default(0),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});
