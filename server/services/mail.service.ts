import { desc, eq } from 'drizzle-orm';
import type { CaughtMail, CaughtMailSummary } from '../../shared/contracts/mail';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Database } from '../db/client';
import { caughtMail } from '../db/schema';
import type { CaughtMessage } from '../mail/mail-catcher';
import { renderTemplate } from '../mail/render-template';
import type { Mailer } from '../mail/send-mail';
import { findOffice } from './office.service';

/** Stores a message received by the local catcher so an admin can read it in the app. */
export async function storeCaughtMail(db: Database, message: CaughtMessage): Promise<void> {
  await db.insert(caughtMail).values({
    fromAddress: message.from,
    toAddress: message.to,
    subject: message.subject,
    html: message.html,
    text: message.text,
    headers: message.headers,
  });
}

export async function listCaughtMail(db: Database): Promise<Result<{ messages: CaughtMailSummary[] }, AppError>> {
  const rows = await db.select().from(caughtMail).orderBy(desc(caughtMail.receivedAt)).limit(500);
  return ok({
    messages: rows.map((r) => ({ id: r.id, from: r.fromAddress, to: r.toAddress, subject: r.subject, receivedAt: r.receivedAt.toISOString() })),
  });
}

export async function getCaughtMail(db: Database, messageId: string): Promise<Result<CaughtMail, AppError>> {
  const [r] = await db.select().from(caughtMail).where(eq(caughtMail.id, messageId));
  if (!r) return err(appError('NOT_FOUND', 'That message is not in the mail catcher.'));
  return ok({ id: r.id, from: r.fromAddress, to: r.toAddress, subject: r.subject, receivedAt: r.receivedAt.toISOString(), html: r.html, text: r.text, headers: r.headers });
}

/** Sends the password-reset mail built from templates/reset-password.{html,txt}. */
export async function sendPasswordResetMail(db: Database, mailer: Mailer, input: { name: string; email: string; url: string }): Promise<void> {
  const office = await findOffice(db);
  const rendered = renderTemplate('reset-password', { ...input, officeName: office?.name ?? 'Stormdraft' });
  await mailer.send({ to: input.email, ...rendered });
}

/** Sends the address-confirmation mail built from templates/verify-email.{html,txt}. */
export async function sendVerificationMail(db: Database, mailer: Mailer, input: { name: string; email: string; url: string }): Promise<void> {
  const office = await findOffice(db);
  const rendered = renderTemplate('verify-email', { ...input, officeName: office?.name ?? 'Stormdraft' });
  await mailer.send({ to: input.email, ...rendered });
}
