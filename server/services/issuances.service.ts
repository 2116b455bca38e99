import { and, count, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { Feature, FeatureCollection } from 'geojson';
import type { ArchiveQuery } from '../../shared/contracts/workflow';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database } from '../db/client';
import { auditEvents, issuances, outlookRevisions, outlooks, riskAreas } from '../db/schema';
import { findOffice } from './office.service';
import type { RiskArea } from '../../shared/contracts/outlooks';

export const publicCaution =
  'This outlook is planning guidance, not a warning. Follow warnings from the national weather service and instructions from your local emergency officials.';

type IssuanceRow = typeof issuances.$inferSelect;

export interface IssuanceView {
  id: string;
  number: string;
  day: number;
  state: IssuanceRow['state'];
  validFrom: string;
  validUntil: string;
  publishedAt: string;
  supersedesNumber: string | null;
  supersededByNumber: string | null;
  withdrawnReason: string | null;
  withdrawnAt: string | null;
  snapshot: Record<string, unknown>;
  caution: string;
}

async function numberOf(db: Database, id: string | null): Promise<string | null> {
  if (!id) return null;
  const [row] = await db.select({ number: issuances.number }).from(issuances).where(eq(issuances.id, id));
  return row?.number ?? null;
}

async function toView(db: Database, row: IssuanceRow): Promise<IssuanceView> {
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
    snapshot: row.snapshot,
    caution: publicCaution,
  };
}

/** The bulletin: the latest published (current) issuance for each of Days 1–3. */
export async function currentBulletin(db: Database): Promise<Result<{ issuances: IssuanceView[]; caution: string }, AppError>> {
  const rows = await db.select().from(issuances).where(eq(issuances.state, 'published')).orderBy(desc(issuances.publishedAt));
  const latest = new Map<number, IssuanceRow>();
  for (const row of rows) if (!latest.has(row.day)) latest.set(row.day, row);
  const views = await Promise.all([...latest.values()].sort((a, b) => a.day - b.day).map((r) => toView(db, r)));
  return ok({ issuances: views, caution: publicCaution });
}

/** The archive: every issuance (superseded and withdrawn included), newest first, searchable. */
export async function listArchive(db: Database, query: ArchiveQuery): Promise<Result<{ issuances: (Omit<IssuanceView, 'snapshot'> & { headline: string })[]; total: number; caution: string }, AppError>> {
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
  return ok({ issuances: views.map(({ snapshot: _snapshot, ...rest }) => ({ ...rest, headline: String(_snapshot.headline ?? '') })), total: total?.value ?? 0, caution: publicCaution });
}

export async function getIssuance(db: Database, number: string): Promise<Result<IssuanceView, AppError>> {
  const [row] = await db.select().from(issuances).where(eq(issuances.number, number));
  if (!row) return err(appError('NOT_FOUND', `There is no issuance ${number}.`));
  return ok(await toView(db, row));
}

/** An issuance's areas as RFC 7946 GeoJSON, carrying its number, valid times and the caution. */
export async function issuanceGeoJson(db: Database, number: string): Promise<Result<FeatureCollection & { properties: Record<string, unknown> }, AppError>> {
  const found = await getIssuance(db, number);
  if (!found.ok) return found;
  const view = found.value;
  const ladder = (view.snapshot.riskLadder as { key: string; label: string; colour: string }[] | undefined) ?? [];
  const areas = (view.snapshot.areas as RiskArea[] | undefined) ?? [];
  return ok({
    type: 'FeatureCollection',
    // RFC 7946 allows foreign members; these carry the identity of the issuance.
    properties: { issuance: view.number, state: view.state, day: view.day, validFrom: view.validFrom, validUntil: view.validUntil, caution: publicCaution },
    features: areas.map(
      (area): Feature => ({
        type: 'Feature',
        id: area.id,
        geometry: area.geometry,
        properties: {
          issuance: view.number,
          level: area.levelKey,
          levelLabel: ladder.find((l) => l.key === area.levelKey)?.label ?? area.levelKey,
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
export async function withdrawIssuance(db: Database, actor: Actor, number: string, reason: string): Promise<Result<IssuanceView, AppError>> {
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  const [row] = await db
    .update(issuances)
    .set({ state: 'withdrawn', withdrawnReason: reason, withdrawnAt: new Date(), withdrawnBy: actor.userId })
    .where(and(eq(issuances.number, number), eq(issuances.state, 'published')))
    .returning();
  if (!row) {
    const exists = await getIssuance(db, number);
    if (!exists.ok) return exists;
    return err(appError('CONFLICT', `Issuance ${number} is ${exists.value.state}; only a current (published) issuance can be withdrawn.`));
  }
  await db.insert(auditEvents).values({ officeId: office.id, issuanceId: row.id, outlookId: row.outlookId, actorId: actor.userId, action: 'withdraw', fromState: 'published', toState: 'withdrawn', comment: reason });
  return ok(await toView(db, row));
}

/** Starts an amendment: a new draft with the issuance's content; publishing it supersedes the issuance. */
export async function amendIssuance(db: Database, actor: Actor, number: string): Promise<Result<{ outlookId: string }, AppError>> {
  const found = await getIssuance(db, number);
  if (!found.ok) return found;
  const issuance = found.value;
  if (issuance.state !== 'published') return err(appError('CONFLICT', `Issuance ${number} is ${issuance.state}; amend the current issuance instead.`));
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  const s = issuance.snapshot as { headline?: string; discussion?: string; hazardNotes?: Record<string, string>; areas?: RiskArea[] };
  return db.transaction(async (tx) => {
    const [open] = await tx.select({ id: outlooks.id }).from(outlooks).where(and(eq(outlooks.amendsIssuanceId, issuance.id), sql`${outlooks.state} <> 'published'`));
    if (open) return ok({ outlookId: open.id });
    const [row] = await tx
      .insert(outlooks)
      .values({
        officeId: office.id,
        day: issuance.day,
        validFrom: new Date(Math.max(Date.now(), Date.parse(issuance.validFrom))),
        validUntil: new Date(issuance.validUntil),
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
    await tx.insert(outlookRevisions).values({ outlookId: row.id, revisionNumber: 1, snapshot: { amends: number, headline: s.headline, discussion: s.discussion, areas }, authorId: actor.userId });
    await tx.insert(auditEvents).values({ officeId: office.id, outlookId: row.id, issuanceId: issuance.id, actorId: actor.userId, action: 'amend', toState: 'draft', details: { amends: number } });
    return ok({ outlookId: row.id });
  });
}
