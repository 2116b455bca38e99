import { integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Request counters for the rate limiter in front of the auth routes, kept in the database so
 * that several app instances on one PostgreSQL count the same requests. `key` is the limiter's
 * key (e.g. the client address); the window ends at `resetAt`.
 */
export const rateLimitHits = pgTable('rate_limit_hits', {
  key: text().primaryKey(),
  hits: integer().notNull(),
  resetAt: timestamp({ withTimezone: true }).notNull(),
});

/**
 * Failed sign-ins per account (by normalised e-mail address, whether or not the account exists).
 * After a few failures the account is locked for a delay that doubles with each further failure;
 * a successful sign-in clears the row.
 */
export const signInThrottles = pgTable('sign_in_throttles', {
  email: text().primaryKey(),
  failures: integer().notNull(),
  lockedUntil: timestamp({ withTimezone: true }),
  lastFailureAt: timestamp({ withTimezone: true }).notNull(),
});
