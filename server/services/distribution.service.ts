import { hasExpired } from '../../shared/issuances/in-force';
import { and, eq, inArray, isNull } from 'drizzle-orm';
import type { AreaGeometry, HazardKind, RiskArea } from '../../shared/contracts/outlooks';
import { hazardLabels } from '../../shared/contracts/outlooks';
import type { RiskLevel } from '../../shared/contracts/office';
import { decideNotice, matchAreas, type NoticeKind } from '../../shared/distribution/match';
import { unionOf } from '../../shared/geometry/area-checks';
import type { Config } from '../config';
import type { Transaction } from '../db/client';
import { areasOfInterest, mailOutbox, notifications, subscriptions } from '../db/schema';
import { renderMapPng } from '../exports/map-image';
import { renderTemplate } from '../mail/render-template';
import { unsubscribeToken } from './subscriptions.service';

export interface IssuanceForNotice {
  id: string;
  number: string;
  day: number;
  validFrom: string;
  validUntil: string;
  supersedesId: string | null;
  headline: string;
  discussion: string;
  areas: RiskArea[];
}

export interface OfficeForNotice {
  id: string;
  name: string;
  timeZone: string;
  region: { west: number; south: number; east: number; north: number };
  riskLadder: RiskLevel[];
}

const titles: Record<NoticeKind | 'withdrawn', (level: string) => string> = {
  alert: (level) => `Your area is at ${level}`,
  lowered: (level) => `Risk lowered for your area: now ${level}`,
  cleared: () => 'Your area is no longer at risk in the amended outlook',
  withdrawn: () => 'An outlook that reached your area was withdrawn',
};

function formatPeriod(validFrom: string, validUntil: string, timeZone: string) {
  const local = new Intl.DateTimeFormat('en-US', { timeZone, weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit', timeZoneName: 'short' });
  const utc = (iso: string) => `${iso.slice(0, 16).replace('T', ' ')} UTC`;
  return { validLocal: `${local.format(new Date(validFrom))} to ${local.format(new Date(validUntil))}`, validUtc: `${utc(validFrom)} to ${utc(validUntil)}` };
}

/** The first paragraph of the discussion as plain text, at most 400 characters. */
export function discussionExcerpt(markdown: string): string {
  const paragraph = markdown.split(/\n\s*\n/).map((p) => p.replace(/^#+\s.*$/gm, '').replace(/[*_`>#-]/g, '').trim()).find((p) => p.length > 0) ?? '';
  return paragraph.length > 400 ? `${paragraph.slice(0, 397)}…` : paragraph;
}

/**
 * Queues one message per subscriber (per address) whose areas an issuance reaches at or above
 * their alert threshold, and "lowered" / "no longer at risk" notices when an amendment takes an
 * earlier alert back. Runs inside the publish transaction, so messages exist exactly when the
 * issuance does; unique keys make it idempotent.
 */
export async function queueIssuanceNotices(tx: Transaction, config: Config, office: OfficeForNotice, issuance: IssuanceForNotice): Promise<number> {
  // An issuance whose valid period has already ended (published late, or the demo's past day) alerts nobody.
  if (hasExpired(issuance, new Date())) return 0;
  const subs = await tx
    .select()
    .from(subscriptions)
    .where(and(eq(subscriptions.officeId, office.id), eq(subscriptions.paused, false), isNull(subscriptions.unsubscribedAt)));
  if (subs.length === 0) return 0;
  const aoi = await tx.select().from(areasOfInterest).where(inArray(areasOfInterest.subscriptionId, subs.map((s) => s.id)));
  const earlier = issuance.supersedesId
    ? await tx.select().from(notifications).where(and(eq(notifications.issuanceId, issuance.supersedesId), eq(notifications.kind, 'alert')))
    : [];
  const ladderKeys = office.riskLadder.map((l) => l.key);
  let queued = 0;
  for (const sub of subs) {
    if (!sub.days.includes(issuance.day)) continue;
    const areas = aoi.filter((a) => a.subscriptionId === sub.id);
    if (areas.length === 0) continue;
    const geometries = areas.map((a) => a.geometry as AreaGeometry);
    const match = matchAreas(geometries, issuance.areas, ladderKeys, sub.hazards as HazardKind[]);
    const earlierLevel = earlier.find((n) => n.subscriptionId === sub.id)?.highestLevelKey ?? null;
    const kind = decideNotice(ladderKeys, sub.alertThreshold, match.highestLevelKey, earlierLevel);
    if (!kind) continue;
    const [notification] = await tx
      .insert(notifications)
      .values({ issuanceId: issuance.id, subscriptionId: sub.id, kind, highestLevelKey: match.highestLevelKey })
      .onConflictDoNothing()
      .returning({ id: notifications.id });
    if (!notification) continue; // already notified for this issuance
    const levelLabel = office.riskLadder.find((l) => l.key === match.highestLevelKey)?.label ?? 'no severe-storm risk';
    queued += await queueMessages(tx, config, office, issuance, sub, areas.map((a) => a.name).join(', '), unionOf(geometries), kind, levelLabel, match.hazards);
  }
  return queued;
}

/** Tells each subscriber who was alerted by an issuance that it has been withdrawn. */
export async function queueWithdrawalNotices(tx: Transaction, config: Config, office: OfficeForNotice, issuance: IssuanceForNotice, reason: string): Promise<number> {
  const alerted = await tx.select().from(notifications).where(and(eq(notifications.issuanceId, issuance.id), eq(notifications.kind, 'alert')));
  let queued = 0;
  for (const n of alerted) {
    const [sub] = await tx.select().from(subscriptions).where(and(eq(subscriptions.id, n.subscriptionId), isNull(subscriptions.unsubscribedAt)));
    if (!sub) continue;
    const areas = await tx.select().from(areasOfInterest).where(eq(areasOfInterest.subscriptionId, sub.id));
    const levelLabel = office.riskLadder.find((l) => l.key === n.highestLevelKey)?.label ?? '';
    queued += await queueMessages(tx, config, office, { ...issuance, discussion: `Withdrawn: ${reason}` }, sub, areas.map((a) => a.name).join(', '), null, 'withdrawn', levelLabel, []);
  }
  return queued;
}

async function queueMessages(
  tx: Transaction,
  config: Config,
  office: OfficeForNotice,
  issuance: IssuanceForNotice,
  sub: typeof subscriptions.$inferSelect,
  areaNames: string,
  highlight: AreaGeometry | null,
  kind: NoticeKind | 'withdrawn',
  levelLabel: string,
  hazards: HazardKind[],
): Promise<number> {
  const issuanceUrl = `${config.publicUrl}/issuances/${issuance.number}`;
  const unsubscribeUrl = `${config.publicUrl}/api/unsubscribe?token=${encodeURIComponent(unsubscribeToken(config.authSecret, sub.id))}`;
  const title = titles[kind](levelLabel);
  const mapCid = `map-${issuance.number}@stormdraft`;
  const withMap = kind !== 'withdrawn';
  const rendered = renderTemplate('outlook-alert', {
    officeName: office.name,
    subjectLine: `${title} · Day ${issuance.day} outlook ${issuance.number}`,
    title,
    intro:
      kind === 'withdrawn'
        ? `${office.name} has withdrawn outlook ${issuance.number}. ${issuance.discussion}`
        : kind === 'alert'
          ? `${office.name} has published a Day ${issuance.day} outlook that reaches your areas at or above the level you chose.`
          : `${office.name} has amended its Day ${issuance.day} outlook; the risk for your areas went down.`,
    day: issuance.day,
    number: issuance.number,
    areaNames,
    levelLabel: levelLabel || '—',
    hazards: hazards.map((h) => hazardLabels[h]).join(', '),
    ...formatPeriod(issuance.validFrom, issuance.validUntil, office.timeZone),
    headline: kind === 'withdrawn' ? '' : issuance.headline,
    excerpt: kind === 'withdrawn' ? '' : discussionExcerpt(issuance.discussion),
    issuanceUrl,
    settingsUrl: `${config.publicUrl}/alerts`,
    unsubscribeUrl,
    mapCid: withMap ? mapCid : '',
  });
  const attachments = withMap
    ? [
        {
          filename: `outlook-${issuance.number}.png`,
          cid: mapCid,
          contentType: 'image/png',
          contentBase64: renderMapPng({
            title: `${office.name} · Day ${issuance.day} outlook ${issuance.number}`,
            subtitle: 'Your areas are outlined in orange',
            region: office.region,
            ladder: office.riskLadder,
            areas: issuance.areas,
            caution: 'Planning guidance, not a warning. Follow official warnings and local emergency officials.',
            ...(highlight ? { highlight } : {}),
            width: 600,
          }).toString('base64'),
        },
      ]
    : [];
  const headers = { 'List-Unsubscribe': `<${unsubscribeUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' };
  if (sub.emails.length === 0) return 0;
  // One message per subscriber and issuance, addressed to all of their addresses.
  const inserted = await tx
    .insert(mailOutbox)
    .values({ dedupeKey: `${kind}:${issuance.id}:${sub.id}`, toAddress: sub.emails.join(', '), subject: rendered.subject, html: rendered.html, text: rendered.text, headers, attachments })
    .onConflictDoNothing({ target: mailOutbox.dedupeKey })
    .returning({ id: mailOutbox.id });
  return inserted.length;
}
