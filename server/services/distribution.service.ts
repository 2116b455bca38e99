import { issuanceSnapshotSchema } from '../../shared/contracts/issuances';
import { and, asc, eq, gt, inArray, isNull, lt, or, sql } from 'drizzle-orm';
import { hasExpired } from '../../shared/issuances/in-force';
import type { AreaGeometry, HazardKind, RiskArea } from '../../shared/contracts/outlooks';
import { hazardLabels } from '../../shared/contracts/outlooks';
import type { RiskLevel } from '../../shared/contracts/office';
import type { NoticeKind } from '../../shared/distribution/match';
import { markdownExcerpt } from '../../shared/text/markdown-excerpt';
import type { Config } from '../config';
import type { Database, Transaction } from '../db/client';
import { areasOfInterest, distributionJobs, issuances, mailOutbox, notifications, offices, subscriptions, type OutboxAttachment } from '../db/schema';
import type { MapImageInput } from '../exports/map-image';
import { renderTemplate } from '../mail/render-template';
import { runGeometryTask } from '../workers/geometry-pool';
import { cachedIssuanceImage } from './issuance-images.service';
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


/** Subscribers matched per worker task and per transaction (bounds each pause of the event loop and the database). */
export const distributionPageSize = 250;
/** A job left "running" this long by a stopped instance is taken up again. */
export const distributionLeaseMs = 5 * 60_000;
/** After this many failed attempts a job is marked failed (its error is kept). */
export const maxDistributionAttempts = 5;

const kicks = new Set<() => void>();

/**
 * Records, inside the publish transaction, that an issuance must be distributed. Nothing else
 * happens in that transaction: matching, map images and mail are made afterwards by the
 * distribution worker, so publishing stays fast however many people subscribe.
 */
export async function enqueueDistribution(tx: Transaction, issuanceId: string): Promise<void> {
  await tx.insert(distributionJobs).values({ issuanceId }).onConflictDoNothing();
}

/** Tells running distribution workers that a job was committed (they also poll). */
export function notifyDistributionQueued(): void {
  for (const kick of kicks) kick();
}

type JobRow = typeof distributionJobs.$inferSelect;

/** Claims the oldest due job: queued, or running with an expired lease (its worker stopped). */
async function claimJob(db: Database, now: Date): Promise<JobRow | undefined> {
  const expired = new Date(now.getTime() - distributionLeaseMs);
  const due = or(eq(distributionJobs.status, 'queued'), and(eq(distributionJobs.status, 'running'), lt(distributionJobs.claimedAt, expired)));
  const [candidate] = await db.select({ id: distributionJobs.id }).from(distributionJobs).where(due).orderBy(asc(distributionJobs.createdAt)).limit(1);
  if (!candidate) return undefined;
  const [claimed] = await db
    .update(distributionJobs)
    .set({ status: 'running', claimedAt: now, attempts: sql`${distributionJobs.attempts} + 1` })
    .where(and(eq(distributionJobs.id, candidate.id), due))
    .returning();
  return claimed;
}

/**
 * Runs due distribution jobs one after another until none is left; returns how many jobs ran
 * and how many messages they queued. A failed job goes back to the queue (or is marked failed
 * after the last attempt); running it again never queues a message twice.
 */
export async function processDistributionJobs(db: Database, config: Config, now = () => new Date()): Promise<{ jobs: number; queued: number }> {
  let jobs = 0;
  let queued = 0;
  for (let job = await claimJob(db, now()); job; job = await claimJob(db, now())) {
    jobs++;
    try {
      const count = await distributeIssuance(db, config, job);
      queued += count;
      await db.update(distributionJobs).set({ status: 'done', finishedAt: new Date(), queued: count, lastError: null }).where(eq(distributionJobs.id, job.id));
    } catch (error) {
      const text = error instanceof Error ? error.message : String(error);
      await db
        .update(distributionJobs)
        .set({ status: job.attempts >= maxDistributionAttempts ? 'failed' : 'queued', lastError: text })
        .where(eq(distributionJobs.id, job.id));
      if (job.attempts >= maxDistributionAttempts) continue;
      throw error;
    }
  }
  return { jobs, queued };
}

/** Runs processDistributionJobs when kicked after a publish and every `intervalMs`, until stopped. */
export function startDistributionWorker(db: Database, config: Config, intervalMs: number, onError: (error: unknown) => void): () => Promise<void> {
  let running: Promise<unknown> = Promise.resolve();
  let pending = false;
  const run = () => {
    if (pending) return;
    pending = true;
    running = running
      .then(() => {
        pending = false;
        return processDistributionJobs(db, config);
      })
      .catch(onError);
  };
  const timer = setInterval(run, intervalMs);
  kicks.add(run);
  run();
  return async () => {
    clearInterval(timer);
    kicks.delete(run);
    await running;
  };
}

/** The snapshot fields distribution needs from an issuance row. */
function issuanceForNotice(row: typeof issuances.$inferSelect): IssuanceForNotice {
  const s = issuanceSnapshotSchema.parse(row.snapshot);
  return { id: row.id, number: row.number, day: row.day, validFrom: row.validFrom.toISOString(), validUntil: row.validUntil.toISOString(), supersedesId: row.supersedesId, headline: s.headline, discussion: s.discussion, areas: s.areas.map((a, i) => ({ ...a, sortOrder: a.sortOrder ?? i })) };
}

/**
 * One issuance's distribution, a page of subscribers at a time: the worker pool decides who
 * hears what and which alert map each needs; each distinct map is drawn once (cached); then one
 * short transaction per page writes the notifications and their messages together, skipping
 * subscribers already notified. Mail leaves through the outbox.
 */
async function distributeIssuance(db: Database, config: Config, job: JobRow): Promise<number> {
  const [row] = await db.select().from(issuances).where(eq(issuances.id, job.issuanceId));
  if (!row) throw new Error(`distribution job ${job.id}: issuance ${job.issuanceId} is missing`);
  const [officeRow] = await db.select().from(offices).where(eq(offices.id, row.officeId));
  if (!officeRow) throw new Error(`distribution job ${job.id}: office is missing`);
  const office: OfficeForNotice = { id: officeRow.id, name: officeRow.name, timeZone: officeRow.timeZone, region: officeRow.region, riskLadder: officeRow.riskLadder };
  const issuance = issuanceForNotice(row);
  // An issuance whose valid period had already ended (published late, or the demo's past day) alerts nobody.
  if (hasExpired(issuance, new Date())) return 0;
  const ladderKeys = office.riskLadder.map((l) => l.key);
  let queued = 0;
  let after = '00000000-0000-0000-0000-000000000000';
  for (;;) {
    const page = await db
      .select()
      .from(subscriptions)
      .where(and(eq(subscriptions.officeId, office.id), eq(subscriptions.paused, false), isNull(subscriptions.unsubscribedAt), gt(subscriptions.id, after)))
      .orderBy(asc(subscriptions.id))
      .limit(distributionPageSize);
    const last = page[page.length - 1];
    if (!last) break;
    after = last.id;
    await db.update(distributionJobs).set({ claimedAt: new Date() }).where(eq(distributionJobs.id, job.id));
    const subs = page.filter((sub) => sub.days.includes(issuance.day) && sub.emails.length > 0);
    if (subs.length === 0) continue;
    const ids = subs.map((sub) => sub.id);
    const aoi = await db.select().from(areasOfInterest).where(inArray(areasOfInterest.subscriptionId, ids));
    const earlier = issuance.supersedesId
      ? await db
          .select({ subscriptionId: notifications.subscriptionId, highestLevelKey: notifications.highestLevelKey })
          .from(notifications)
          .where(and(eq(notifications.issuanceId, issuance.supersedesId), eq(notifications.kind, 'alert'), inArray(notifications.subscriptionId, ids)))
      : [];
    const earlierLevel = new Map(earlier.map((n) => [n.subscriptionId, n.highestLevelKey]));
    const areasBySub = new Map<string, typeof aoi>();
    for (const a of aoi) areasBySub.set(a.subscriptionId, [...(areasBySub.get(a.subscriptionId) ?? []), a]);
    const matched = await runGeometryTask({
      kind: 'match-subscribers',
      input: {
        riskAreas: issuance.areas,
        ladderKeys,
        subscribers: subs.map((sub) => ({
          subscriptionId: sub.id,
          geometries: (areasBySub.get(sub.id) ?? []).map((a) => a.geometry as AreaGeometry),
          hazards: sub.hazards as HazardKind[],
          alertThreshold: sub.alertThreshold,
          earlierLevelKey: earlierLevel.get(sub.id) ?? null,
        })),
      },
    });
    if (!matched.ok) throw new Error(`matching failed: ${matched.error.message}`);
    if (matched.value.notices.length === 0) continue;
    const imageIds = new Map<string, string>();
    for (const [variant, highlight] of Object.entries(matched.value.highlights)) {
      const image = await cachedIssuanceImage(db, issuance.id, variant, 'png', () => alertMapInput(office, issuance, highlight));
      if (!image.ok) throw new Error(`alert map failed: ${image.error.message}`);
      imageIds.set(variant, image.value.id);
    }
    const subById = new Map(subs.map((sub) => [sub.id, sub]));
    const messages = matched.value.notices.flatMap((notice) => {
      const sub = subById.get(notice.subscriptionId);
      if (!sub) return [];
      const levelLabel = office.riskLadder.find((l) => l.key === notice.highestLevelKey)?.label ?? 'no severe-storm risk';
      const areaNames = (areasBySub.get(sub.id) ?? []).map((a) => a.name).join(', ');
      return [{ notice, message: buildMessage(config, office, issuance, sub, areaNames, notice.kind, levelLabel, notice.hazards, imageIds.get(notice.imageVariant) ?? null) }];
    });
    queued += await db.transaction(async (tx) => {
      const fresh = await tx
        .insert(notifications)
        .values(messages.map(({ notice }) => ({ issuanceId: issuance.id, subscriptionId: notice.subscriptionId, kind: notice.kind, highestLevelKey: notice.highestLevelKey })))
        .onConflictDoNothing()
        .returning({ subscriptionId: notifications.subscriptionId });
      const freshIds = new Set(fresh.map((n) => n.subscriptionId));
      const values = messages.filter(({ notice }) => freshIds.has(notice.subscriptionId)).map(({ message }) => message);
      if (values.length === 0) return 0;
      const inserted = await tx.insert(mailOutbox).values(values).onConflictDoNothing({ target: mailOutbox.dedupeKey }).returning({ id: mailOutbox.id });
      return inserted.length;
    });
  }
  return queued;
}

function alertMapInput(office: OfficeForNotice, issuance: IssuanceForNotice, highlight: AreaGeometry | null): MapImageInput {
  return {
    title: `${office.name} · Day ${issuance.day} outlook ${issuance.number}`,
    subtitle: 'Your areas are outlined in orange',
    region: office.region,
    ladder: office.riskLadder,
    areas: issuance.areas,
    caution: 'Planning guidance, not a warning. Follow official warnings and local emergency officials.',
    ...(highlight ? { highlight } : {}),
    width: 600,
  };
}

/**
 * Tells each subscriber who was alerted by an issuance that it has been withdrawn (no map).
 * Runs in the withdraw transaction with a fixed number of queries, however many were alerted.
 */
export async function queueWithdrawalNotices(tx: Transaction, config: Config, office: OfficeForNotice, issuance: IssuanceForNotice, reason: string): Promise<number> {
  const alerted = await tx.select().from(notifications).where(and(eq(notifications.issuanceId, issuance.id), eq(notifications.kind, 'alert')));
  if (alerted.length === 0) return 0;
  const ids = alerted.map((n) => n.subscriptionId);
  const subs = await tx.select().from(subscriptions).where(and(inArray(subscriptions.id, ids), isNull(subscriptions.unsubscribedAt)));
  const aoi = await tx.select({ subscriptionId: areasOfInterest.subscriptionId, name: areasOfInterest.name }).from(areasOfInterest).where(inArray(areasOfInterest.subscriptionId, ids));
  const levelBySub = new Map(alerted.map((n) => [n.subscriptionId, n.highestLevelKey]));
  const namesBySub = new Map<string, string[]>();
  for (const a of aoi) namesBySub.set(a.subscriptionId, [...(namesBySub.get(a.subscriptionId) ?? []), a.name]);
  const notice = { ...issuance, discussion: `Withdrawn: ${reason}` };
  const values = subs
    .filter((sub) => sub.emails.length > 0)
    .map((sub) => {
      const levelLabel = office.riskLadder.find((l) => l.key === levelBySub.get(sub.id))?.label ?? '';
      const areaNames = (namesBySub.get(sub.id) ?? []).join(', ');
      return buildMessage(config, office, notice, sub, areaNames, 'withdrawn', levelLabel, [], null);
    });
  let queued = 0;
  for (let start = 0; start < values.length; start += distributionPageSize) {
    const inserted = await tx.insert(mailOutbox).values(values.slice(start, start + distributionPageSize)).onConflictDoNothing({ target: mailOutbox.dedupeKey }).returning({ id: mailOutbox.id });
    queued += inserted.length;
  }
  return queued;
}

/** One message per subscriber and issuance, addressed to all of their addresses; the alert map is a cached image. */
function buildMessage(
  config: Config,
  office: OfficeForNotice,
  issuance: IssuanceForNotice,
  sub: typeof subscriptions.$inferSelect,
  areaNames: string,
  kind: NoticeKind | 'withdrawn',
  levelLabel: string,
  hazards: HazardKind[],
  mapImageId: string | null,
): typeof mailOutbox.$inferInsert {
  const issuanceUrl = `${config.publicUrl}/issuances/${issuance.number}`;
  const unsubscribeUrl = `${config.publicUrl}/api/unsubscribe?token=${encodeURIComponent(unsubscribeToken(config.authSecret, sub.id))}`;
  const title = titles[kind](levelLabel);
  const mapCid = `map-${issuance.number}@stormdraft`;
  const withMap = kind !== 'withdrawn' && mapImageId !== null;
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
    excerpt: kind === 'withdrawn' ? '' : markdownExcerpt(issuance.discussion),
    issuanceUrl,
    settingsUrl: `${config.publicUrl}/alerts`,
    unsubscribeUrl,
    mapCid: withMap ? mapCid : '',
  });
  const attachments: OutboxAttachment[] = withMap && mapImageId ? [{ filename: `outlook-${issuance.number}.png`, cid: mapCid, contentType: 'image/png', contentBase64: '', issuanceImageId: mapImageId }] : [];
  const headers = { 'List-Unsubscribe': `<${unsubscribeUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' };
  return { dedupeKey: `${kind}:${issuance.id}:${sub.id}`, toAddress: sub.emails.join(', '), subject: rendered.subject, html: rendered.html, text: rendered.text, headers, attachments };
}
