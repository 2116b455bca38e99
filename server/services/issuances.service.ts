import { and, count, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import { withRfc7946Winding } from '../../shared/geometry/winding';
import type { Feature, FeatureCollection } from 'geojson';
import type { ArchiveQuery } from '../../shared/contracts/workflow';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database, DatabaseOrTransaction } from '../db/client';
import { auditEvents, issuances, outlookRevisions, outlooks, riskAreas } from '../db/schema';
import type { Config } from '../config';
import { queueWithdrawalNotices } from './distribution.service';
import { findOffice } from './office.service';
import type { RiskArea } from '../../shared/contracts/outlooks';
import type { Region, RiskLevel } from '../../shared/contracts/office';
import { buildAtomFeed } from '../exports/atom';
import { buildKml } from '../exports/kml';
import { renderMapPng, renderMapSvg } from '../exports/map-image';

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

export async function getIssuance(db: DatabaseOrTransaction, number: string): Promise<Result<IssuanceView, AppError>> {
  const [row] = await db.select().from(issuances).where(eq(issuances.number, number));
  if (!row) return err(appError('NOT_FOUND', `There is no issuance ${number}.`));
  return ok(await toView(db, row));
}

/** An issuance's areas as RFC 7946 GeoJSON, carrying its number, valid times and the caution. */
export async function issuanceGeoJson(db: Database, number: string): Promise<Result<FeatureCollection & { properties: Record<string, unknown> }, AppError>> {
  const found = await getIssuance(db, number);
  if (!found.ok) return found;
  const view = found.value;
  // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- the snapshot is written by publish from these types; issue 12 item 2 gives it a schema of its own.
  const ladder = (view.snapshot.riskLadder as { key: string; label: string; colour: string }[] | undefined) ?? [];
  // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- the snapshot is written by publish from these types; issue 12 item 2 gives it a schema of its own.
  const areas = (view.snapshot.areas as RiskArea[] | undefined) ?? [];
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
    const s = row.snapshot as { headline?: string; discussion?: string; areas?: RiskArea[] };
    await queueWithdrawalNotices(tx, config, office, { id: row.id, number: row.number, day: row.day, validFrom: row.validFrom.toISOString(), validUntil: row.validUntil.toISOString(), supersedesId: row.supersedesId, headline: s.headline ?? '', discussion: s.discussion ?? '', areas: s.areas ?? [] }, reason);
    return ok(await toView(tx, row));
  });
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

interface SnapshotParts {
  riskLadder: RiskLevel[];
  areas: RiskArea[];
  headline: string;
  office: { name: string; timeZone: string; region: Region };
}

function snapshotParts(view: IssuanceView): SnapshotParts {
  const s = view.snapshot as Partial<SnapshotParts>;
  return { riskLadder: s.riskLadder ?? [], areas: s.areas ?? [], headline: s.headline ?? '', office: s.office ?? { name: 'Stormdraft', timeZone: 'UTC', region: { west: -125, south: 24, east: -66, north: 50 } } };
}

export async function issuanceKml(db: Database, number: string): Promise<Result<string, AppError>> {
  const found = await getIssuance(db, number);
  if (!found.ok) return found;
  const v = found.value;
  const s = snapshotParts(v);
  return ok(buildKml({ number: v.number, state: v.state, day: v.day, validFrom: v.validFrom, validUntil: v.validUntil, headline: s.headline, officeName: s.office.name, ladder: s.riskLadder, areas: s.areas, caution: publicCaution }));
}

/** The issuance's map for people and e-mail: SVG or PNG, with its number, valid time and the caution. */
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
  return ok(format === 'svg' ? renderMapSvg(input) : renderMapPng(input));
}

export async function atomFeed(db: Database, publicUrl: string): Promise<Result<string, AppError>> {
  const office = await findOffice(db);
  const rows = await db.select().from(issuances).orderBy(desc(issuances.publishedAt)).limit(50);
  return ok(
    buildAtomFeed({
      officeName: office?.name ?? 'Stormdraft',
      publicUrl,
      caution: publicCaution,
      updated: rows[0]?.publishedAt ?? new Date(0),
      entries: rows.map((r) => ({ number: r.number, day: r.day, state: r.state, headline: String(r.snapshot.headline ?? ''), validFrom: r.validFrom.toISOString(), validUntil: r.validUntil.toISOString(), publishedAt: r.publishedAt.toISOString() })),
    }),
  );
}
