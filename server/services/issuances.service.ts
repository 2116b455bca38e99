import { and, count, desc, eq, gt, ilike, inArray, ne, or, sql, type SQL } from 'drizzle-orm';
import { inForceByDay, type DayEnding } from '../../shared/issuances/in-force';
import { withRfc7946Winding } from '../../shared/geometry/winding';
import type { Feature, FeatureCollection } from 'geojson';
import type { ArchiveQuery } from '../../shared/contracts/workflow';
import { appError, type AppError } from '../../shared/errors';
import { isInForce } from '../../shared/issuances/in-force';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import { isUniqueViolation, type Database, type DatabaseOrTransaction } from '../db/client';
import { auditEvents, issuances, outlooks, riskAreas } from '../db/schema';
import type { Config } from '../config';
import { queueWithdrawalNotices } from './distribution.service';
import { findOffice } from './office.service';
import { writeRevision } from './outlooks.service';
import { publicCaution } from '../../shared/workflow/caution';
import { levelLabel } from '../../shared/workflow/levels';
import { issuanceSnapshotSchema, type AmendmentResult, type Archive, type Bulletin, type BulletinDay, type Issuance, type IssuanceSnapshot } from '../../shared/contracts/issuances';
import { queueWebhookEvents } from './webhooks.service';
import type { RiskArea } from '../../shared/contracts/outlooks';
import type { Region, RiskLevel } from '../../shared/contracts/office';
import { buildAtomFeed } from '../exports/atom';
import { buildKml } from '../exports/kml';
import { cachedIssuanceImage, imageBytes } from './issuance-images.service';


type IssuanceRow = typeof issuances.$inferSelect;

export type IssuanceView = Issuance;

/** The frozen snapshot, read through its schema (older snapshots get their defaults). */
function snapshotOfRow(row: IssuanceRow): IssuanceSnapshot {
  return issuanceSnapshotSchema.parse(row.snapshot);
}

async function numberOf(db: DatabaseOrTransaction, id: string | null): Promise<string | null> {
  if (!id) return null;
  const [row] = await db.select({ number: issuances.number }).from(issuances).where(eq(issuances.id, id));
  return row?.number ?? null;
}

async function toView(db: DatabaseOrTransaction, row: IssuanceRow): Promise<IssuanceView> {
  return {
    id: row.id,
    number: row.number,
    day: row.day,
    state: row.state,
    validFrom: row.validFrom.toISOString(),
    validUntil: row.validUntil.toISOString(),
    publishedAt: row.publishedAt.toISOString(),
    supersedesNumber: await numberOf(db, row.supersedesId),
    supersededByNumber: await numberOf(db, row.supersededById),
    withdrawnReason: row.withdrawnReason,
    withdrawnAt: row.withdrawnAt?.toISOString() ?? null,
    snapshot: snapshotOfRow(row),
    caution: publicCaution,
  };
}

/**
 * Issuances that may still be in force or need a withdrawal notice at `now`: published or
 * withdrawn, and whose valid period has not ended. The in-force rule itself is applied by
 * `inForceByDay`; this only narrows what is read from the database.
 */
async function bulletinCandidates(db: Database, now: Date): Promise<IssuanceRow[]> {
  return db
    .select()
    .from(issuances)
    .where(and(inArray(issuances.state, ['published', 'withdrawn']), gt(issuances.validUntil, now)))
    .orderBy(issuances.day, desc(issuances.publishedAt));
}

/** Per day, the last moment an issuance stopped being in force (expired or withdrawn) at or before `now`. */
async function dayEndings(db: Database, now: Date): Promise<DayEnding[]> {
  const endedAt = sql<Date>`case when ${issuances.state} = 'withdrawn' then least(${issuances.withdrawnAt}, ${issuances.validUntil}) else ${issuances.validUntil} end`;
  const rows = await db
    .select({ day: issuances.day, endedAt: sql<string>`max(${endedAt})` })
    .from(issuances)
    .where(and(inArray(issuances.state, ['published', 'withdrawn']), sql`${endedAt} <= ${now.toISOString()}::timestamptz`))
    .groupBy(issuances.day);
  return rows.map((r) => ({ day: r.day, endedAt: new Date(r.endedAt) }));
}

/**
 * The bulletin: per outlook day, the issuance in force at `now` (amendments replace what they
 * supersede; withdrawn ones come as a notice), or since when none has been in force.
 */
export async function currentBulletin(db: Database, now = new Date()): Promise<Result<Bulletin, AppError>> {
  const [candidates, endings] = await Promise.all([bulletinCandidates(db, now), dayEndings(db, now)]);
  const days = inForceByDay(candidates, endings, now);
  const shown = days.flatMap((d) => (d.status === 'in_force' ? [d.issuance] : []));
  const views = await Promise.all(shown.map((r) => toView(db, r)));
  return ok({
    issuances: views,
    days: days.map(
      (d): BulletinDay => ({
        day: d.day,
        status: d.status,
        issuanceNumber: d.status === 'in_force' ? d.issuance.number : null,
        since: d.status === 'none_in_force' ? (d.since?.toISOString() ?? null) : null,
        withdrawn: d.withdrawn
          ? { number: d.withdrawn.number, reason: d.withdrawn.withdrawnReason, withdrawnAt: d.withdrawn.withdrawnAt?.toISOString() ?? null, validUntil: d.withdrawn.validUntil.toISOString() }
          : null,
      }),
    ),
    asOf: now.toISOString(),
    caution: publicCaution,
  });
}

/** The archive: every issuance (superseded and withdrawn included), newest first, searchable. */
export async function listArchive(db: Database, query: ArchiveQuery): Promise<Result<Archive, AppError>> {
  const filters: SQL[] = [];
  if (query.q) {
    const text = or(ilike(issuances.number, `%${query.q}%`), sql`${issuances.snapshot}->>'headline' ilike ${`%${query.q}%`}`, sql`${issuances.snapshot}->>'discussion' ilike ${`%${query.q}%`}`);
    if (text) filters.push(text);
  }
  if (query.date) {
    const start = new Date(`${query.date}T00:00:00Z`);
    filters.push(sql`${issuances.validUntil} >= ${start}`, sql`${issuances.validFrom} < ${new Date(start.getTime() + 86_400_000)}`);
  }
  const where = filters.length ? and(...filters) : undefined;
  const rows = await db.select().from(issuances).where(where).orderBy(desc(issuances.publishedAt)).limit(query.pageSize).offset((query.page - 1) * query.pageSize);
  const [total] = await db.select({ value: count() }).from(issuances).where(where);
  const views = await Promise.all(rows.map((r) => toView(db, r)));
  return ok({ issuances: views.map(({ snapshot, ...rest }) => ({ ...rest, headline: snapshot.headline })), total: total?.value ?? 0, caution: publicCaution });
}

export async function getIssuance(db: DatabaseOrTransaction, number: string): Promise<Result<IssuanceView, AppError>> {
  const [row] = await db.select().from(issuances).where(eq(issuances.number, number));
  if (!row) return err(appError('NOT_FOUND', `There is no issuance ${number}.`));
  return ok(await toView(db, row));
}

/** An issuance's areas as RFC 7946 GeoJSON, carrying its number, valid times and the caution. */
export async function issuanceGeoJson(db: DatabaseOrTransaction, number: string): Promise<Result<FeatureCollection & { properties: Record<string, unknown> }, AppError>> {
  const found = await getIssuance(db, number);
  if (!found.ok) return found;
  const view = found.value;
  const ladder = view.snapshot.riskLadder;
  const areas = view.snapshot.areas;
  return ok({
    type: 'FeatureCollection',
    // RFC 7946 allows foreign members; these carry the identity of the issuance.
    properties: { issuance: view.number, state: view.state, day: view.day, validFrom: view.validFrom, validUntil: view.validUntil, caution: publicCaution },
    features: areas.map(
      (area): Feature => ({
        type: 'Feature',
        id: area.id,
        // RFC 7946 §3.1.6: exterior rings counterclockwise, holes clockwise.
        geometry: withRfc7946Winding(area.geometry),
        properties: {
          issuance: view.number,
          level: area.levelKey,
          levelLabel: levelLabel(ladder, area.levelKey),
          colour: ladder.find((l) => l.key === area.levelKey)?.colour ?? null,
          hazards: area.hazards,
          validFrom: view.validFrom,
          validUntil: view.validUntil,
        },
      }),
    ),
  });
}

/** Withdraws a published issuance with a reason shown to the public (lead). */
export async function withdrawIssuance(db: Database, config: Config, actor: Actor, number: string, reason: string): Promise<Result<IssuanceView, AppError>> {
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  // Withdrawal and its notices to alerted subscribers commit together.
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(issuances)
      .set({ state: 'withdrawn', withdrawnReason: reason, withdrawnAt: new Date(), withdrawnBy: actor.userId })
      .where(and(eq(issuances.number, number), eq(issuances.state, 'published')))
      .returning();
    if (!row) {
      // Inside the transaction, read through tx: PGlite has one connection.
      const exists = await getIssuance(tx, number);
      if (!exists.ok) return exists;
      return err(appError('CONFLICT', `Issuance ${number} is ${exists.value.state}; only a current (published) issuance can be withdrawn.`));
    }
    await tx.insert(auditEvents).values({ officeId: office.id, issuanceId: row.id, outlookId: row.outlookId, actorId: actor.userId, action: 'withdraw', fromState: 'published', toState: 'withdrawn', comment: reason });
    const s = snapshotOfRow(row);
    await queueWithdrawalNotices(tx, config, office, { id: row.id, number: row.number, day: row.day, validFrom: row.validFrom.toISOString(), validUntil: row.validUntil.toISOString(), supersedesId: row.supersedesId, headline: s.headline, discussion: s.discussion, areas: s.areas.map((a, i) => ({ ...a, sortOrder: a.sortOrder ?? i })) }, reason);
    await queueWebhookEvents(tx, config, 'issuance.withdrawn', row.id);
    return ok(await toView(tx, row));
  });
}

/**
 * Starts an amendment: a new draft with the issuance's content; publishing it supersedes the
 * issuance. Only an issuance in force can be amended, and it has at most one open amendment:
 * the issuance row is locked while the draft is made, so simultaneous requests queue and the
 * later ones get a 409 naming the open draft (the partial unique index on
 * `outlooks.amends_issuance_id` is the last line of defence).
 */
export async function amendIssuance(db: Database, actor: Actor, number: string): Promise<Result<AmendmentResult, AppError>> {
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  try {
    return await db.transaction(async (tx) => {
      const [issuance] = await tx.select().from(issuances).where(eq(issuances.number, number)).for('update');
      if (!issuance) return err(appError('NOT_FOUND', `There is no issuance ${number}.`));
      if (!isInForce(issuance, new Date())) {
        const why = issuance.state === 'published' ? 'its valid period has ended' : `it is ${issuance.state}`;
        return err(appError('CONFLICT', `Issuance ${number} is not in force (${why}); only an issuance in force can be amended. Amend the current issuance instead.`, { details: { rule: 'AMENDED_ISSUANCE_NOT_IN_FORCE', issuanceState: issuance.state } }));
      }
      const [open] = await tx.select({ id: outlooks.id }).from(outlooks).where(and(eq(outlooks.amendsIssuanceId, issuance.id), ne(outlooks.state, 'published')));
      if (open) return err(openAmendmentConflict(number, open.id));
      const s = issuanceSnapshotSchema.parse(issuance.snapshot);
      const [row] = await tx
        .insert(outlooks)
        .values({
          officeId: office.id,
          day: issuance.day,
          validFrom: new Date(Math.max(Date.now(), issuance.validFrom.getTime())),
          validUntil: issuance.validUntil,
          headline: s.headline ?? '',
          discussion: s.discussion ?? '',
          hazardNotes: s.hazardNotes ?? {},
          amendsIssuanceId: issuance.id,
          createdBy: actor.userId,
          lastEditedBy: actor.userId,
          version: 1,
        })
        .returning();
      if (!row) throw new Error('amendment insert returned no row');
      const areas = s.areas ?? [];
      if (areas.length) await tx.insert(riskAreas).values(areas.map((a, i) => ({ outlookId: row.id, levelKey: a.levelKey, hazards: a.hazards, geometry: a.geometry, label: a.label, sortOrder: i })));
      // The first revision carries the whole document, valid period included (#12 item 3).
      await writeRevision(tx, row.id, 1, actor.userId, { amends: number });
      await tx.insert(auditEvents).values({ officeId: office.id, outlookId: row.id, issuanceId: issuance.id, actorId: actor.userId, action: 'amend', toState: 'draft', details: { amends: number } });
      return ok({ outlookId: row.id });
    });
  } catch (error) {
    if (!isUniqueViolation(error, 'outlooks_open_amendment_idx')) throw error;
    const [open] = await db.select({ id: outlooks.id }).from(outlooks).innerJoin(issuances, eq(issuances.id, outlooks.amendsIssuanceId)).where(and(eq(issuances.number, number), ne(outlooks.state, 'published')));
    return err(openAmendmentConflict(number, open?.id ?? null));
  }
}

function openAmendmentConflict(number: string, outlookId: string | null): AppError {
  return appError('CONFLICT', `Issuance ${number} already has an open amendment; continue that draft instead of starting another (one open amendment per issuance).`, {
    details: { rule: 'ONE_OPEN_AMENDMENT', outlookId },
  });
}

interface SnapshotParts {
  riskLadder: RiskLevel[];
  areas: RiskArea[];
  headline: string;
  office: { name: string; timeZone: string; region: Region };
}

/** What the map and KML exports need from a snapshot (a region for snapshots written without one). */
function snapshotParts(view: IssuanceView): SnapshotParts {
  const s = view.snapshot;
  return {
    riskLadder: s.riskLadder,
    areas: s.areas.map((a, i) => ({ ...a, sortOrder: a.sortOrder ?? i })),
    headline: s.headline,
    office: { name: s.office.name, timeZone: s.office.timeZone, region: s.office.region ?? { west: -125, south: 24, east: -66, north: 50 } },
  };
}

export async function issuanceKml(db: Database, number: string): Promise<Result<string, AppError>> {
  const found = await getIssuance(db, number);
  if (!found.ok) return found;
  const v = found.value;
  const s = snapshotParts(v);
  return ok(buildKml({ number: v.number, state: v.state, day: v.day, validFrom: v.validFrom, validUntil: v.validUntil, headline: s.headline, officeName: s.office.name, ladder: s.riskLadder, areas: s.areas, caution: publicCaution }));
}

/** The issuance's map for people: SVG or PNG, with its number, valid time, state and the caution. */
export async function issuanceMap(db: Database, number: string, format: 'svg' | 'png'): Promise<Result<string | Buffer, AppError>> {
  const found = await getIssuance(db, number);
  if (!found.ok) return found;
  const v = found.value;
  const s = snapshotParts(v);
  const stateNote = v.state === 'published' ? '' : ` · ${v.state.toUpperCase()}`;
  const input = {
    title: `${s.office.name} · Day ${v.day} outlook ${v.number}${stateNote}`,
    subtitle: `Valid ${v.validFrom.slice(0, 16).replace('T', ' ')} to ${v.validUntil.slice(0, 16).replace('T', ' ')} UTC`,
    region: s.office.region,
    ladder: s.riskLadder,
    areas: s.areas,
    caution: publicCaution,
  };
  // Rendered once per state and format in the worker pool, then served from the cache.
  const image = await cachedIssuanceImage(db, v.id, `public:${v.state}`, format, () => input);
  if (!image.ok) return image;
  return ok(format === 'svg' ? image.value.content : imageBytes(image.value));
}

/**
 * The Atom feed of what is current at `now`, by the bulletin's rule: each issuance in force, and
 * a notice for each withdrawn one whose period has not ended. An expired issuance drops out.
 */
export async function atomFeed(db: Database, publicUrl: string, now = new Date()): Promise<Result<string, AppError>> {
  const office = await findOffice(db);
  const [candidates, endings] = await Promise.all([bulletinCandidates(db, now), dayEndings(db, now)]);
  const days = inForceByDay(candidates, endings, now);
  const rows = days.flatMap((d) => [...(d.status === 'in_force' ? [d.issuance] : []), ...(d.withdrawn ? [d.withdrawn] : [])]);
  const changedAt = (r: IssuanceRow) => Math.max(r.publishedAt.getTime(), r.withdrawnAt?.getTime() ?? 0);
  const lastEnding = Math.max(0, ...endings.map((e) => new Date(e.endedAt).getTime()));
  return ok(
    buildAtomFeed({
      officeName: office?.name ?? 'Stormdraft',
      publicUrl,
      caution: publicCaution,
      updated: new Date(Math.max(lastEnding, ...rows.map(changedAt))),
      entries: rows.map((r) => ({
        number: r.number,
        day: r.day,
        state: r.state,
        headline: r.snapshot.headline,
        validFrom: r.validFrom.toISOString(),
        validUntil: r.validUntil.toISOString(),
        publishedAt: new Date(changedAt(r)).toISOString(),
        ...(r.state === 'withdrawn' ? { notice: `Withdrawn: ${r.withdrawnReason ?? 'no reason given'}. This outlook is no longer in force.` } : {}),
      })),
    }),
  );
}
