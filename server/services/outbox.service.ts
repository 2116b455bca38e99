import { and, asc, desc, eq, lte } from 'drizzle-orm';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Database } from '../db/client';
import { mailOutbox } from '../db/schema';
import type { Mailer } from '../mail/send-mail';
import { outboxAttachmentContents } from './issuance-images.service';

/** After this many failed attempts a message is marked failed (an admin can resend it). */
export const maxAttempts = 6;
/** Backoff before attempt n+1: 30 s × 2^(n−1) (30 s, 1 min, 2 min, …). */
export const retryDelayMs = (attempts: number) => 30_000 * 2 ** Math.max(0, attempts - 1);

/** Messages left "sending" by a crash go back to the queue at start-up (nothing is lost). */
export async function recoverOutbox(db: Database): Promise<void> {
  await db.update(mailOutbox).set({ status: 'queued' }).where(eq(mailOutbox.status, 'sending'));
}

/**
 * Sends due messages: each is claimed (queued → sending) before sending, so two workers never
 * send the same row; success marks it sent, failure schedules a retry with backoff or, after
 * the last attempt, marks it failed with the error.
 */
export async function processOutbox(db: Database, mailer: Mailer, now = new Date(), batch = 20): Promise<{ sent: number; failed: number }> {
  const due = await db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(and(eq(mailOutbox.status, 'queued'), lte(mailOutbox.nextAttemptAt, now)))
    .orderBy(asc(mailOutbox.createdAt))
    .limit(batch);
  let sent = 0;
  let failed = 0;
  for (const { id } of due) {
    const [message] = await db
      .update(mailOutbox)
      .set({ status: 'sending' })
      .where(and(eq(mailOutbox.id, id), eq(mailOutbox.status, 'queued')))
      .returning();
    if (!message) continue;
    try {
      await mailer.send({
        to: message.toAddress,
        subject: message.subject,
        html: message.html,
        text: message.text,
        headers: message.headers,
        attachments: await outboxAttachmentContents(db, message.attachments),
      });
      await db.update(mailOutbox).set({ status: 'sent', sentAt: new Date(), attempts: message.attempts + 1, lastError: null }).where(eq(mailOutbox.id, id));
      sent++;
    } catch (error) {
      const attempts = message.attempts + 1;
      const text = error instanceof Error ? error.message : String(error);
      await db
        .update(mailOutbox)
        .set(attempts >= maxAttempts ? { status: 'failed', attempts, lastError: text } : { status: 'queued', attempts, lastError: text, nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)) })
        .where(eq(mailOutbox.id, id));
      failed++;
    }
  }
  return { sent, failed };
}

/** Runs processOutbox every `intervalMs` until stopped. */
export function startOutboxWorker(db: Database, mailer: Mailer, intervalMs: number, onError: (error: unknown) => void): () => Promise<void> {
  let running: Promise<unknown> = Promise.resolve();
  const timer = setInterval(() => {
    running = running.then(() => processOutbox(db, mailer)).catch(onError);
  }, intervalMs);
  return async () => {
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
  const [row] = await db.update(mailOutbox).set({ status: 'queued', attempts: 0, nextAttemptAt: new Date() }).where(and(eq(mailOutbox.id, messageId), eq(mailOutbox.status, 'failed'))).returning();
  if (!row) return err(appError('CONFLICT', 'Only a failed message can be resent; this one is queued, sending, sent or gone.'));
  return ok({ id: row.id, status: row.status });
}
