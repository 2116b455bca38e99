import { and, eq, isNull, lt, or, sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { signInThrottles } from '../db/schema';

/** Failed sign-ins allowed before an account is locked. */
export const FREE_SIGN_IN_FAILURES = 4;
/** The first lock lasts this long; each further failure doubles it. */
export const FIRST_LOCK_SECONDS = 2;
/** No lock is longer than this. */
export const LONGEST_LOCK_SECONDS = 15 * 60;
/** Failures older than this are forgotten. */
const FORGET_AFTER_MS = 24 * 60 * 60 * 1000;

/** How long the account is locked after `failures` consecutive failed sign-ins (0 = not locked). */
export function lockSecondsAfter(failures: number): number {
  if (failures <= FREE_SIGN_IN_FAILURES) return 0;
  return Math.min(LONGEST_LOCK_SECONDS, FIRST_LOCK_SECONDS * 2 ** (failures - FREE_SIGN_IN_FAILURES - 1));
}

const normalise = (email: string) => email.trim().toLowerCase();

/**
 * Seconds until `email` may try to sign in again (0 when it may now). Kept in the database, so
 * the lock holds across instances and whichever address the attempts come from.
 */
export async function secondsUntilSignInAllowed(db: Database, email: string, now = new Date()): Promise<number> {
  const [row] = await db.select().from(signInThrottles).where(eq(signInThrottles.email, normalise(email)));
  if (!row?.lockedUntil) return 0;
  return Math.max(0, Math.ceil((row.lockedUntil.getTime() - now.getTime()) / 1000));
}

/** Records one failed sign-in for `email`; returns the lock it now has, in seconds. */
export async function recordFailedSignIn(db: Database, email: string, now = new Date()): Promise<number> {
  const forgetBefore = new Date(now.getTime() - FORGET_AFTER_MS).toISOString();
  const [row] = await db
    .insert(signInThrottles)
    .values({ email: normalise(email), failures: 1, lastFailureAt: now })
    .onConflictDoUpdate({
      target: signInThrottles.email,
      set: {
        failures: sql`case when ${signInThrottles.lastFailureAt} < ${forgetBefore}::timestamptz then 1 else ${signInThrottles.failures} + 1 end`,
        lastFailureAt: now,
      },
    })
    .returning();
  if (!row) throw new Error('sign-in throttle upsert returned no row');
  // Forget stale rows now and then (guesses at many made-up addresses must not pile up).
  if (row.failures === 1) {
    await db.delete(signInThrottles).where(and(lt(signInThrottles.lastFailureAt, new Date(forgetBefore)), or(isNull(signInThrottles.lockedUntil), lt(signInThrottles.lockedUntil, now))));
  }
  const lockSeconds = lockSecondsAfter(row.failures);
  if (lockSeconds > 0) {
    await db
      .update(signInThrottles)
      .set({ lockedUntil: new Date(now.getTime() + lockSeconds * 1000) })
      .where(eq(signInThrottles.email, row.email));
  }
  return lockSeconds;
}

/** A successful sign-in clears the account's failures. */
export async function clearSignInFailures(db: Database, email: string): Promise<void> {
  await db.delete(signInThrottles).where(eq(signInThrottles.email, normalise(email)));
}
