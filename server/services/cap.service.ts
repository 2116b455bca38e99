import { desc, eq } from 'drizzle-orm';
import { isInForce } from '../../shared/issuances/in-force';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { DatabaseOrTransaction } from '../db/client';
import { issuances } from '../db/schema';
import { buildCapAlert, type CapMsgType, type CapReference } from '../exports/cap';
import { buildCapFeed } from '../exports/cap-feed';
import { findOffice } from './office.service';
import { getIssuance, type IssuanceView } from './issuances.service';
import { publicCaution } from '../../shared/workflow/caution';

/** The CAP `sender`: one per deployment, from the public address's host (no spaces or commas). */
export function capSender(publicUrl: string): string {
  return `stormdraft@${new URL(publicUrl).host}`;
}

export const capIdentifier = (number: string) => `stormdraft-${number}`;
export const capCancelIdentifier = (number: string) => `stormdraft-${number}-withdrawal`;
export const capUrl = (publicUrl: string, number: string) => `${publicUrl}/api/public/cap/${number}`;
export const capCancelUrl = (publicUrl: string, number: string) => `${publicUrl}/api/public/cap/${number}/withdrawal`;

function snapshotOf(view: IssuanceView) {
  const s = view.snapshot;
  return { ladder: s.riskLadder, areas: s.areas.map((a, i) => ({ ...a, sortOrder: a.sortOrder ?? i })), headline: s.headline, discussion: s.discussion, officeName: s.office.name };
}

function buildFor(view: IssuanceView, publicUrl: string, message: { msgType: CapMsgType; identifier: string; sent: Date; references: CapReference[]; note?: string }): string {
  const s = snapshotOf(view);
  return buildCapAlert({
    sender: capSender(publicUrl),
    ...message,
    officeName: s.officeName,
    number: view.number,
    day: view.day,
    validFrom: new Date(view.validFrom),
    validUntil: new Date(view.validUntil),
    headline: s.headline,
    discussion: s.discussion,
    ladder: s.ladder,
    areas: s.areas,
    caution: publicCaution,
    web: `${publicUrl}/issuances/${view.number}`,
  });
}

/**
 * The CAP message of an issuance: an Alert, or an Update referring to the message of the
 * issuance it superseded (an amendment). Its content never changes once published.
 */
export async function capMessage(db: DatabaseOrTransaction, publicUrl: string, number: string): Promise<Result<string, AppError>> {
  const found = await getIssuance(db, number);
  if (!found.ok) return found;
  const view = found.value;
  const references: CapReference[] = [];
  if (view.supersedesNumber) {
    const previous = await getIssuance(db, view.supersedesNumber);
    if (previous.ok) references.push({ sender: capSender(publicUrl), identifier: capIdentifier(previous.value.number), sent: new Date(previous.value.publishedAt) });
  }
  return ok(buildFor(view, publicUrl, { msgType: references.length ? 'Update' : 'Alert', identifier: capIdentifier(view.number), sent: new Date(view.publishedAt), references }));
}

/** The Cancel message sent when an issuance was withdrawn; it refers to the issuance's own message. */
export async function capWithdrawal(db: DatabaseOrTransaction, publicUrl: string, number: string): Promise<Result<string, AppError>> {
  const found = await getIssuance(db, number);
  if (!found.ok) return found;
  const view = found.value;
  if (view.state !== 'withdrawn' || !view.withdrawnAt) return err(appError('NOT_FOUND', `Issuance ${number} was not withdrawn, so it has no CAP Cancel message.`));
  return ok(
    buildFor(view, publicUrl, {
      msgType: 'Cancel',
      identifier: capCancelIdentifier(view.number),
      sent: new Date(view.withdrawnAt),
      references: [{ sender: capSender(publicUrl), identifier: capIdentifier(view.number), sent: new Date(view.publishedAt) }],
      note: `Withdrawn: ${view.withdrawnReason ?? 'no reason given'}`,
    }),
  );
}

/** The Atom index of CAP messages for the issuances in force at `now` (the shared in-force rule). */
export async function capFeed(db: DatabaseOrTransaction, publicUrl: string, now: Date): Promise<Result<string, AppError>> {
  const office = await findOffice(db);
  const rows = await db.select().from(issuances).where(eq(issuances.state, 'published')).orderBy(desc(issuances.publishedAt));
  const current = rows.filter((row) => isInForce(row, now));
  return ok(
    buildCapFeed({
      officeName: office?.name ?? 'Stormdraft',
      feedUrl: `${publicUrl}/api/public/cap`,
      pageUrl: `${publicUrl}/bulletin`,
      caution: publicCaution,
      updated: current[0]?.publishedAt ?? now,
      entries: current.map((row) => ({
        identifier: capIdentifier(row.number),
        title: `Day ${row.day} outlook ${row.number}: ${String(row.snapshot.headline ?? '') || 'no headline'}`,
        capUrl: capUrl(publicUrl, row.number),
        pageUrl: `${publicUrl}/issuances/${row.number}`,
        sent: row.publishedAt,
        validUntil: row.validUntil,
      })),
    }),
  );
}
