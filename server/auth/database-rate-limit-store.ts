import type { Options, Store, ClientRateLimitInfo } from 'express-rate-limit';
import { eq, lt, sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { rateLimitHits } from '../db/schema';

/**
 * An express-rate-limit store backed by the `rate_limit_hits` table, so that every instance
 * on one database counts the same hits. Each increment is one atomic upsert: a window that has
 * ended starts again at 1.
 */
export class DatabaseRateLimitStore implements Store {
  windowMs = 60_000;
  readonly localKeys = false;
  /** Every this many increments, rows whose window has ended are deleted, so the table stays small. */
  private incrementsUntilCleanup = 200;

  constructor(
    private readonly db: Database,
    readonly prefix = 'auth:',
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await this.db.select().from(rateLimitHits).where(eq(rateLimitHits.key, this.prefix + key));
    if (!row || row.resetAt.getTime() <= Date.now()) return undefined;
    return { totalHits: row.hits, resetTime: row.resetAt };
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const now = new Date();
    const resetAt = new Date(now.getTime() + this.windowMs);
    const [row] = await this.db
      .insert(rateLimitHits)
      .values({ key: this.prefix + key, hits: 1, resetAt })
      .onConflictDoUpdate({
        target: rateLimitHits.key,
        set: {
          hits: sql`case when ${rateLimitHits.resetAt} <= ${now.toISOString()}::timestamptz then 1 else ${rateLimitHits.hits} + 1 end`,
          resetAt: sql`case when ${rateLimitHits.resetAt} <= ${now.toISOString()}::timestamptz then ${resetAt.toISOString()}::timestamptz else ${rateLimitHits.resetAt} end`,
        },
      })
      .returning();
    if (!row) throw new Error('rate limit upsert returned no row');
    if (--this.incrementsUntilCleanup <= 0) {
      this.incrementsUntilCleanup = 200;
      await this.db.delete(rateLimitHits).where(lt(rateLimitHits.resetAt, now));
    }
    return { totalHits: row.hits, resetTime: row.resetAt };
  }

  async decrement(key: string): Promise<void> {
    await this.db
      .update(rateLimitHits)
      .set({ hits: sql`greatest(${rateLimitHits.hits} - 1, 0)` })
      .where(eq(rateLimitHits.key, this.prefix + key));
  }

  async resetKey(key: string): Promise<void> {
    await this.db.delete(rateLimitHits).where(eq(rateLimitHits.key, this.prefix + key));
  }
}
