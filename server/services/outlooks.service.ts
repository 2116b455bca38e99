import { and, asc, desc, eq, gte, lt, sql } from 'drizzle-orm';
import { withRfc7946Winding } from '../../shared/geometry/winding';
import type { Feature, FeatureCollection } from 'geojson';
import { areaGeometrySchema, hazardFlagSchema, type CreateOutlookInput, type Outlook, type OutlookListQuery, type OutlookSummary, type RevisionSummary, type RiskArea, type RiskAreaInput, type SaveOutlookInput } from '../../shared/contracts/outlooks';
import { areaEvidence, soundingsInPeriod, type AreaEvidence, type EvidenceSounding } from '../../shared/evidence/evidence';
import { checkSupport, defaultGuidanceThresholds, type GuidanceThresholds, type SupportCheck } from '../../shared/evidence/support-check';
import { checkAreas, type AreaCheck } from '../../shared/geometry/area-checks';
import { validPeriod } from '../../shared/time/valid-period';
import { appError, type AppError, type FieldIssue } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database, DatabaseOrTransaction } from '../db/client';
import { auditEvents, outlookRevisions, outlooks, riskAreas, soundings, users } from '../db/schema';
import { findOffice } from './office.service';
import { keyFigures } from './soundings.service';

type OutlookRow = typeof outlooks.$inferSelect;
type AreaRow = typeof riskAreas.$inferSelect;

/** States in which the author may still change the draft (editing an approved draft sends it back). */
const editableStates: OutlookRow['state'][] = ['draft', 'returned', 'approved'];

async function requireOffice(db: DatabaseOrTransaction) {
  const office = await findOffice(db);
  if (!office) throw new Error('no office row: ensureOffice() runs at start-up');
  return office;
}

function toArea(row: AreaRow): RiskArea {
  return { id: row.id, levelKey: row.levelKey, hazards: row.hazards, geometry: areaGeometrySchema.parse(row.geometry), label: row.label, sortOrder: row.sortOrder };
}

function highestLevel(areaLevels: string[], ladderKeys: string[]): string | null {
  let best = -1;
  for (const key of areaLevels) best = Math.max(best, ladderKeys.indexOf(key));
  return best >= 0 ? (ladderKeys[best] ?? null) : null;
}

function toSummary(row: OutlookRow, areas: AreaRow[], ladderKeys: string[], editorName: string | null): OutlookSummary {
  return {
    id: row.id,
    day: row.day,
    state: row.state,
    validFrom: row.validFrom.toISOString(),
    validUntil: row.validUntil.toISOString(),
    headline: row.headline,
    version: row.version,
    areaCount: areas.length,
    highestLevelKey: highestLevel(
      areas.map((a) => a.levelKey),
      ladderKeys,
    ),
    createdBy: row.createdBy,
    lastEditedBy: row.lastEditedBy,
    lastEditedByName: editorName,
    updatedAt: row.updatedAt.toISOString(),
  };
}

async function loadOutlook(db: DatabaseOrTransaction, outlookId: string): Promise<Outlook | null> {
  const [found] = await db.select({ outlook: outlooks, editor: users.name }).from(outlooks).leftJoin(users, eq(users.id, outlooks.lastEditedBy)).where(eq(outlooks.id, outlookId));
  if (!found) return null;
  const office = await requireOffice(db);
  const areas = await db.select().from(riskAreas).where(eq(riskAreas.outlookId, outlookId)).orderBy(asc(riskAreas.sortOrder));
  const row = found.outlook;
  return {
    ...toSummary(
      row,
      areas,
      office.riskLadder.map((l) => l.key),
      found.editor,
    ),
    discussion: row.discussion,
    hazardNotes: row.hazardNotes,
    areas: areas.map(toArea),
    amendsIssuanceId: row.amendsIssuanceId,
  };
}

const notFound = () => appError('NOT_FOUND', 'There is no outlook with that id.');

/** Drafts, reviews and published drafts, newest valid time first, filtered by state, day and local date. */
export async function listOutlooks(db: Database, query: OutlookListQuery): Promise<Result<{ outlooks: OutlookSummary[] }, AppError>> {
  const office = await requireOffice(db);
  const filters = [eq(outlooks.officeId, office.id)];
  if (query.state) filters.push(eq(outlooks.state, query.state));
  if (query.day) filters.push(eq(outlooks.day, query.day));
  if (query.date) {
    const start = new Date(`${query.date}T00:00:00Z`);
    filters.push(gte(outlooks.validUntil, start), lt(outlooks.validFrom, new Date(start.getTime() + 86_400_000)));
  }
  const rows = await db.select({ outlook: outlooks, editor: users.name }).from(outlooks).leftJoin(users, eq(users.id, outlooks.lastEditedBy)).where(and(...filters)).orderBy(desc(outlooks.validFrom), asc(outlooks.day)).limit(200);
  const areas = rows.length ? await db.select().from(riskAreas).where(sql`${riskAreas.outlookId} in ${rows.map((r) => r.outlook.id)}`) : [];
  const ladderKeys = office.riskLadder.map((l) => l.key);
  return ok({
    outlooks: rows.map((r) =>
      toSummary(
        r.outlook,
        areas.filter((a) => a.outlookId === r.outlook.id),
        ladderKeys,
        r.editor,
      ),
    ),
  });
}

function snapshotOf(outlook: Outlook): Record<string, unknown> {
  const { headline, discussion, hazardNotes, validFrom, validUntil, areas, day, state } = outlook;
  return { day, state, headline, discussion, hazardNotes, validFrom, validUntil, areas };
}

/** Starts a new draft for Day 1, 2 or 3 with its valid period from the office time zone. */
export async function createOutlook(db: Database, actor: Actor, input: CreateOutlookInput, now = new Date()): Promise<Result<Outlook, AppError>> {
  const office = await requireOffice(db);
  const period = validPeriod(input.day, input.issuanceTime ? new Date(input.issuanceTime) : now, office.timeZone);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(outlooks)
      .values({ officeId: office.id, day: input.day, headline: input.headline, validFrom: period.validFrom, validUntil: period.validUntil, createdBy: actor.userId, lastEditedBy: actor.userId, version: 1 })
      .returning();
    if (!row) throw new Error('outlook insert returned no row');
    const outlook = await loadOutlook(tx, row.id);
    if (!outlook) throw new Error('outlook vanished after insert');
    await tx.insert(outlookRevisions).values({ outlookId: row.id, revisionNumber: 1, snapshot: snapshotOf(outlook), authorId: actor.userId });
    await tx.insert(auditEvents).values({ officeId: office.id, outlookId: row.id, actorId: actor.userId, action: 'create', toState: 'draft' });
    return ok(outlook);
  });
}

export async function getOutlook(db: DatabaseOrTransaction, outlookId: string): Promise<Result<Outlook, AppError>> {
  const outlook = await loadOutlook(db, outlookId);
  return outlook ? ok(outlook) : err(notFound());
}

function ladderIssues(areas: RiskAreaInput[], ladderKeys: string[]): FieldIssue[] {
  return areas.flatMap((area, index) =>
    ladderKeys.includes(area.levelKey) ? [] : [{ path: `areas.${index}.levelKey`, message: `"${area.levelKey}" is not a level of the office's risk ladder (${ladderKeys.join(', ')}).` }],
  );
}

/**
 * Saves the whole draft when `input.version` is still current (optimistic concurrency): areas
 * are replaced, a revision is written and the save is audited, all in one transaction. A stale
 * version gets CONFLICT and nothing is overwritten.
 */
export async function saveOutlook(db: Database, actor: Actor, outlookId: string, input: SaveOutlookInput): Promise<Result<Outlook, AppError>> {
  const office = await requireOffice(db);
  const issues = ladderIssues(
    input.areas,
    office.riskLadder.map((l) => l.key),
  );
  if (issues.length) return err(appError('VALIDATION_FAILED', issues[0]?.message, { issues }));
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(outlooks).where(eq(outlooks.id, outlookId));
    if (!current) return err(notFound());
    if (!editableStates.includes(current.state)) {
      return err(appError('CONFLICT', `This outlook is ${current.state.replace('_', ' ')} and cannot be edited. ${current.state === 'in_review' ? 'Ask the reviewer to return it first.' : 'Start an amendment instead.'}`));
    }
    const nextState = current.state === 'approved' ? 'draft' : current.state;
    const [updated] = await tx
      .update(outlooks)
      .set({
        headline: input.headline,
        discussion: input.discussion,
        hazardNotes: input.hazardNotes,
        validFrom: new Date(input.validFrom),
        validUntil: new Date(input.validUntil),
        state: nextState,
        version: input.version + 1,
        lastEditedBy: actor.userId,
        updatedAt: new Date(),
      })
      .where(and(eq(outlooks.id, outlookId), eq(outlooks.version, input.version)))
      .returning();
    if (!updated) {
      return err(appError('CONFLICT', 'This outlook was changed by someone else since you opened it. Reload to see their changes, or keep yours.', { details: { currentVersion: current.version } }));
    }
    await tx.delete(riskAreas).where(eq(riskAreas.outlookId, outlookId));
    if (input.areas.length) {
      await tx.insert(riskAreas).values(
        input.areas.map((area, index) => ({
          ...(area.id ? { id: area.id } : {}),
          outlookId,
          levelKey: area.levelKey,
          hazards: area.hazards,
          geometry: area.geometry,
          label: area.label,
          sortOrder: index,
        })),
      );
    }
    const outlook = await loadOutlook(tx, outlookId);
    if (!outlook) throw new Error('outlook vanished during save');
    await tx.insert(outlookRevisions).values({ outlookId, revisionNumber: updated.version, snapshot: snapshotOf(outlook), authorId: actor.userId });
    await tx.insert(auditEvents).values({
      officeId: office.id,
      outlookId,
      actorId: actor.userId,
      action: 'save',
      fromState: current.state,
      toState: nextState,
      details: { version: updated.version, areas: input.areas.length },
    });
    return ok(outlook);
  });
}

export async function listRevisions(db: Database, outlookId: string): Promise<Result<{ revisions: RevisionSummary[] }, AppError>> {
  const rows = await db
    .select({ id: outlookRevisions.id, revisionNumber: outlookRevisions.revisionNumber, authorId: outlookRevisions.authorId, authorName: users.name, createdAt: outlookRevisions.createdAt })
    .from(outlookRevisions)
    .leftJoin(users, eq(users.id, outlookRevisions.authorId))
    .where(eq(outlookRevisions.outlookId, outlookId))
    .orderBy(desc(outlookRevisions.revisionNumber));
  if (rows.length === 0) return err(notFound());
  return ok({ revisions: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) });
}

export async function getRevision(db: Database, revisionId: string): Promise<Result<{ id: string; outlookId: string; revisionNumber: number; snapshot: Record<string, unknown>; authorName: string | null; createdAt: string }, AppError>> {
  const [row] = await db
    .select({ revision: outlookRevisions, authorName: users.name })
    .from(outlookRevisions)
    .leftJoin(users, eq(users.id, outlookRevisions.authorId))
    .where(eq(outlookRevisions.id, revisionId));
  if (!row) return err(appError('NOT_FOUND', 'That revision does not exist.'));
  const r = row.revision;
  return ok({ id: r.id, outlookId: r.outlookId, revisionNumber: r.revisionNumber, snapshot: r.snapshot, authorName: row.authorName, createdAt: r.createdAt.toISOString() });
}

export interface AreaEvidenceReport {
  areaId: string;
  levelKey: string;
  evidence: AreaEvidence;
  support: SupportCheck;
  checks: AreaCheck[];
}

/** Loads soundings valid in a period as evidence points (key figures from the cached analysis). */
export async function evidenceSoundings(db: DatabaseOrTransaction, validFrom: Date, validUntil: Date): Promise<EvidenceSounding[]> {
  const rows = await db
    .select({ id: soundings.id, stationId: soundings.stationId, latitude: soundings.latitude, longitude: soundings.longitude, validTime: soundings.validTime, source: soundings.source, modifiedFromId: soundings.modifiedFromId, analysis: soundings.analysis })
    .from(soundings)
    .where(and(gte(soundings.validTime, validFrom), sql`${soundings.validTime} <= ${validUntil}`));
  return rows.map((r) => ({
    id: r.id,
    stationId: r.stationId,
    latitude: r.latitude,
    longitude: r.longitude,
    validTime: r.validTime.toISOString(),
    source: r.source,
    modified: r.modifiedFromId !== null,
    figures: keyFigures(r.analysis),
  }));
}

/**
 * The evidence panel and support check of every area of an outlook, from the soundings valid in
 * its period (modified what-if soundings are left out: they are not observations or forecasts).
 */
export function buildEvidenceReport(outlook: Pick<Outlook, 'areas' | 'validFrom' | 'validUntil'>, candidates: EvidenceSounding[], ladder: { key: string; label: string; colour: string; meaning: string }[], guidance: GuidanceThresholds, region: { west: number; south: number; east: number; north: number }, source?: 'observed' | 'model'): AreaEvidenceReport[] {
  const pool = soundingsInPeriod(
    candidates.filter((s) => !s.modified),
    outlook.validFrom,
    outlook.validUntil,
    source,
  );
  const checks = checkAreas(
    outlook.areas,
    ladder.map((l) => l.key),
    region,
  );
  return outlook.areas.map((area) => {
    const evidence = areaEvidence(area.id, area.geometry, pool);
    return { areaId: area.id, levelKey: area.levelKey, evidence, support: checkSupport(evidence, area.levelKey, ladder, guidance), checks: checks[area.id] ?? [] };
  });
}

export async function getOutlookEvidence(db: Database, outlookId: string, source?: 'observed' | 'model'): Promise<Result<{ areas: AreaEvidenceReport[]; soundingCount: number }, AppError>> {
  const outlook = await loadOutlook(db, outlookId);
  if (!outlook) return err(notFound());
  const office = await requireOffice(db);
  const candidates = await evidenceSoundings(db, new Date(outlook.validFrom), new Date(outlook.validUntil));
  const guidance = Object.keys(office.guidanceThresholds).length ? office.guidanceThresholds : defaultGuidanceThresholds;
  const areas = buildEvidenceReport(outlook, candidates, office.riskLadder, guidance as GuidanceThresholds, office.region, source);
  return ok({ areas, soundingCount: candidates.filter((s) => !s.modified && (!source || s.source === source)).length });
}

/** The outlook's areas as an RFC 7946 FeatureCollection. */
export async function exportAreasGeoJson(db: Database, outlookId: string): Promise<Result<FeatureCollection, AppError>> {
  const outlook = await loadOutlook(db, outlookId);
  if (!outlook) return err(notFound());
  const office = await requireOffice(db);
  const labels = new Map(office.riskLadder.map((l) => [l.key, l.label]));
  return ok({
    type: 'FeatureCollection',
    features: outlook.areas.map(
      (area): Feature => ({
        type: 'Feature',
        id: area.id,
        // RFC 7946 §3.1.6: exterior rings counterclockwise, holes clockwise.
        geometry: withRfc7946Winding(area.geometry),
        properties: { level: area.levelKey, levelLabel: labels.get(area.levelKey) ?? area.levelKey, hazards: area.hazards, label: area.label, outlookDay: outlook.day, validFrom: outlook.validFrom, validUntil: outlook.validUntil },
      }),
    ),
  });
}

/**
 * Reads risk areas from an uploaded GeoJSON document (FeatureCollection, Feature or bare
 * geometry). Each feature needs a Polygon or MultiPolygon and a `level` property that names a
 * ladder key or label; problems are reported per feature. Nothing is saved: the author adds
 * the areas to the draft, which autosaves.
 */
export async function importAreasGeoJson(db: Database, document: unknown): Promise<Result<{ areas: RiskAreaInput[] }, AppError>> {
  const office = await requireOffice(db);
  const byKeyOrLabel = new Map<string, string>();
  for (const l of office.riskLadder) {
    byKeyOrLabel.set(l.key.toLowerCase(), l.key);
    byKeyOrLabel.set(l.label.toLowerCase(), l.key);
  }
  const features: unknown[] = (() => {
    if (typeof document !== 'object' || document === null) return [];
    const d = document as { type?: unknown; features?: unknown };
    if (d.type === 'FeatureCollection' && Array.isArray(d.features)) return d.features;
    if (d.type === 'Feature') return [document];
    if (d.type === 'Polygon' || d.type === 'MultiPolygon') return [{ type: 'Feature', geometry: document, properties: {} }];
    return [];
  })();
  if (features.length === 0) {
    return err(appError('VALIDATION_FAILED', 'The file is not GeoJSON with polygons: expected a FeatureCollection, a Feature or a Polygon/MultiPolygon geometry.', { issues: [{ path: 'geojson', message: 'No features found.' }] }));
  }
  const issues: FieldIssue[] = [];
  const areas: RiskAreaInput[] = [];
  features.forEach((raw, index) => {
    const feature = (typeof raw === 'object' && raw !== null ? raw : {}) as { geometry?: unknown; properties?: Record<string, unknown> | null };
    const geometry = areaGeometrySchema.safeParse(feature.geometry);
    if (!geometry.success) {
      issues.push({ path: `features.${index}.geometry`, message: `Feature ${index + 1}: ${geometry.error.issues[0]?.message ?? 'needs a Polygon or MultiPolygon geometry.'}` });
      return;
    }
    const properties = feature.properties ?? {};
    const levelValue = String(properties.level ?? properties.levelKey ?? '').toLowerCase();
    const levelKey = byKeyOrLabel.get(levelValue);
    if (!levelKey) {
      issues.push({ path: `features.${index}.properties.level`, message: `Feature ${index + 1}: level "${levelValue}" is not on the office's risk ladder (${office.riskLadder.map((l) => l.key).join(', ')}).` });
      return;
    }
    const hazards = Array.isArray(properties.hazards) ? properties.hazards.map((h) => hazardFlagSchema.safeParse(h)).filter((h) => h.success).map((h) => h.data) : [];
    areas.push({ levelKey, hazards, geometry: geometry.data, label: typeof properties.label === 'string' ? properties.label.slice(0, 80) : '' });
  });
  if (issues.length) return err(appError('VALIDATION_FAILED', issues[0]?.message, { issues }));
  return ok({ areas });
}
