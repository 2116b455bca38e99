import { and, asc, desc, eq, inArray, isNull, lt, lte, or } from 'drizzle-orm';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Database, DatabaseOrTransaction } from '../db/client';
import { mailOutbox } from '../db/schema';
import type { Mailer } from '../mail/send-mail';
import { outboxAttachmentContents } from './issuance-images.service';

/** After this many failed attempts a message is marked failed (an admin can resend it). */
export const maxAttempts = 6;
/** Backoff before attempt n+1: 30 s × 2^(n−1) (30 s, 1 min, 2 min, …). */
export const retryDelayMs = (attempts: number) => 30_000 * 2 ** Math.max(0, attempts - 1);

/**
 * How long a claim on a message lasts. A worker that claimed a row and then died (crash,
 * kill -9, lost host) leaves it "sending"; once the lease has run out any instance may claim it
 * again. It is longer than a send can take (nodemailer gives up on a silent socket after
 * 10 minutes), so a live worker's message is never taken from it and sent twice.
 */
export const claimLeaseMs = 15 * 60_000;

type OutboxRow = typeof mailOutbox.$inferSelect;

/**
 * Queues one message in the outbox, inside the caller's transaction (so it exists exactly when
 * the change that causes it commits); a repeated `dedupeKey` queues nothing.
 */
export async function queueMail(tx: DatabaseOrTransaction, message: { dedupeKey: string; toAddress: string; subject: string; html: string; text: string }): Promise<boolean> {
  const inserted = await tx.insert(mailOutbox).values(message).onConflictDoNothing({ target: mailOutbox.dedupeKey }).returning({ id: mailOutbox.id });
  return inserted.length > 0;
}

/**
 * Claims up to `batch` due messages in one statement: queued rows whose next attempt is due,
 * and "sending" rows whose lease expired (or that carry no claim time: left by a version
 * without leases). `FOR UPDATE SKIP LOCKED` lets several instances on one
 * PostgreSQL claim at the same moment without waiting for or taking each other's rows.
 */
export async function claimOutboxMessages(db: Database, now: Date, batch: number): Promise<OutboxRow[]> {
  const leaseExpired = new Date(now.getTime() - claimLeaseMs);
  const due = db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(or(and(eq(mailOutbox.status, 'queued'), lte(mailOutbox.nextAttemptAt, now)), and(eq(mailOutbox.status, 'sending'), or(isNull(mailOutbox.claimedAt), lt(mailOutbox.claimedAt, leaseExpired)))))
    .orderBy(asc(mailOutbox.createdAt))
    .limit(batch)
    .for('update', { skipLocked: true });
  return db.update(mailOutbox).set({ status: 'sending', claimedAt: now }).where(inArray(mailOutbox.id, due)).returning();
}

/**
 * Sends due messages. Each is claimed first (see claimOutboxMessages), so two workers never send
 * the same row; success marks it sent, failure schedules a retry with backoff or, after the last
 * attempt, marks it failed with the error. The outcome is written only while the claim is still
 * ours (same claimed-at time).
 */
export async function processOutbox(db: Database, mailer: Mailer, now = new Date(), batch = 20): Promise<{ sent: number; failed: number }> {
  const claimed = await claimOutboxMessages(db, now, batch);
  let sent = 0;
  let failed = 0;
  await Promise.all(
    claimed.map(async (message) => {
      const stillOurs = and(eq(mailOutbox.id, message.id), eq(mailOutbox.status, 'sending'), eq(mailOutbox.claimedAt, now));
      try {
        await mailer.send({
          to: message.toAddress,
          subject: message.subject,
          html: message.html,
          text: message.text,
          headers: message.headers,
          attachments: await outboxAttachmentContents(db, message.attachments),
        });
        await db.update(mailOutbox).set({ status: 'sent', sentAt: new Date(), attempts: message.attempts + 1, lastError: null, claimedAt: null }).where(stillOurs);
        sent++;
      } catch (error) {
        const attempts = message.attempts + 1;
        const text = error instanceof Error ? error.message : String(error);
        await db
          .update(mailOutbox)
          .set(attempts >= maxAttempts ? { status: 'failed', attempts, lastError: text, claimedAt: null } : { status: 'queued', attempts, lastError: text, claimedAt: null, nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)) })
          .where(stillOurs);
        failed++;
      }
    }),
  );
  return { sent, failed };
}

/**
 * Runs processOutbox every `intervalMs` until stopped; a full batch is followed at once by the
 * next, so a large distribution drains without waiting a tick per batch.
 */
export function startOutboxWorker(db: Database, mailer: Mailer, intervalMs: number, onError: (error: unknown) => void, batch = 20): () => Promise<void> {
  let stopped = false;
  let running: Promise<unknown> = Promise.resolve();
  const drain = async () => {
    while (!stopped) {
      const { sent, failed } = await processOutbox(db, mailer, new Date(), batch);
      if (sent + failed < batch) return;
    }
  };
  const timer = setInterval(() => {
    running = running.then(drain).catch(onError);
  }, intervalMs);
  return async () => {
    stopped = true;
    clearInterval(timer);
    await running;
  };
}

export interface OutboxItem {
  id: string;
  toAddress: string;
  subject: string;
  status: string;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string;
  sentAt: string | null;
  createdAt: string;
}

export async function listOutbox(db: Database): Promise<Result<{ messages: OutboxItem[] }, AppError>> {
  const rows = await db.select().from(mailOutbox).orderBy(desc(mailOutbox.createdAt)).limit(500);
  return ok({
    messages: rows.map((r) => ({ id: r.id, toAddress: r.toAddress, subject: r.subject, status: r.status, attempts: r.attempts, lastError: r.lastError, nextAttemptAt: r.nextAttemptAt.toISOString(), sentAt: r.sentAt?.toISOString() ?? null, createdAt: r.createdAt.toISOString() })),
  });
}

/** Puts a failed message back in the queue for the next worker pass. */
export async function resendOutboxMessage(db: Database, messageId: string): Promise<Result<{ id: string; status: string }, AppError>> {
  const [row] = await db.update(mailOutbox).set({ status: 'queued', attempts: 0, nextAttemptAt: new Date(), claimedAt: null }).where(and(eq(mailOutbox.id, messageId), eq(mailOutbox.status, 'failed'))).returning();
  if (!row) return err(appError('CONFLICT', 'Only a failed message can be resent; this one is queued, sending, sent or gone.'));
  return ok({ id: row.id, status: row.status });
}
