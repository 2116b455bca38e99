import { isDeepStrictEqual } from 'node:util';
import { and, asc, desc, eq, gt, gte, inArray, lt, max, ne, sql } from 'drizzle-orm';
import { withRfc7946Winding } from '../../shared/geometry/winding';
import type { Feature, FeatureCollection } from 'geojson';
import { areaGeometrySchema, boundedAreaGeometrySchema, hazardFlagSchema, revisionSnapshotSchema, type CreateOutlookInput, type Outlook, type OutlookListQuery, type AreaImportResult, type OutlookEvidence, type OutlookList, type OutlookRevision, type OutlookSummary, type RevisionList, type RevisionSnapshot, type RiskArea, type RiskAreaInput, type SaveOutlookInput } from '../../shared/contracts/outlooks';
import { isEditableState } from '../../shared/workflow/transitions';
import { outlookStatePhrases } from '../../shared/workflow/states';
import type { EvidenceSounding } from '../../shared/evidence/evidence';
import { issuanceSnapshotSchema } from '../../shared/contracts/issuances';
import type { RiskLadder, SupportGuidance } from '../../shared/contracts/office';
import { MAX_VERTICES_PER_AREA } from '../../shared/geometry/limits';
import { validPeriod } from '../../shared/time/valid-period';
import { appError, type AppError, type FieldIssue } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database, DatabaseOrTransaction } from '../db/client';
import { auditEvents, issuances, outlookRevisions, outlooks, riskAreas, soundings, users } from '../db/schema';
import { findOffice, officeGuidance } from './office.service';
import { keyFigures } from './soundings.service';
import type { EvidenceCandidates } from '../../shared/contracts/evidence-candidates';
import { MAX_LIVE_EVIDENCE_CANDIDATES, toEvidenceCandidate } from '../../shared/evidence/evidence-candidates';
import { keyFigureKeys } from '../../shared/sounding/key-figures';
import { runGeometryTask } from '../workers/geometry-pool';
import { evidenceRunsOf, gridEvidenceOf, runFigures } from './grid-evidence.service';
import { materializedSoundings } from '../workers/grid-evidence-report';

type OutlookRow = typeof outlooks.$inferSelect;
type AreaRow = typeof riskAreas.$inferSelect;

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

/**
 * Everyone who edited the content of the version under review: the authors of every revision
 * written since the outlook was last approved or returned (all revisions when it never was).
 * The four-eyes rule keeps each of them from approving that version.
 */
export async function reviewEditorIds(db: DatabaseOrTransaction, outlookId: string): Promise<string[]> {
  const [lastReview] = await db
    .select({ at: max(auditEvents.createdAt) })
    .from(auditEvents)
    .where(and(eq(auditEvents.outlookId, outlookId), inArray(auditEvents.action, ['approve', 'return'])));
  const since = lastReview?.at ?? null;
  const rows = await db
    .selectDistinct({ authorId: outlookRevisions.authorId })
    .from(outlookRevisions)
    .where(since ? and(eq(outlookRevisions.outlookId, outlookId), gt(outlookRevisions.createdAt, since)) : eq(outlookRevisions.outlookId, outlookId));
  return rows.flatMap((r) => (r.authorId ? [r.authorId] : []));
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
    reviewEditorIds: await reviewEditorIds(db, outlookId),
  };
}

const notFound = () => appError('NOT_FOUND', 'There is no outlook with that id.');

/** Drafts, reviews and published drafts, newest valid time first, filtered by state, day and local date. */
export async function listOutlooks(db: Database, query: OutlookListQuery): Promise<Result<OutlookList, AppError>> {
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

function snapshotOf(outlook: Outlook): RevisionSnapshot {
  const { headline, discussion, hazardNotes, validFrom, validUntil, areas, day, state } = outlook;
  return { day, state, headline, discussion, hazardNotes, validFrom, validUntil, areas };
}

/**
 * Writes revision `revisionNumber` of an outlook from its stored content: the one way a
 * revision is made (creating, saving and starting an amendment), so every revision carries the
 * whole document, valid period included.
 */
export async function writeRevision(tx: DatabaseOrTransaction, outlookId: string, revisionNumber: number, authorId: string, extra: Pick<RevisionSnapshot, 'amends'> = {}): Promise<Outlook> {
  const outlook = await loadOutlook(tx, outlookId);
  if (!outlook) throw new Error('outlook vanished while writing a revision');
  const snapshot: RevisionSnapshot = { ...snapshotOf(outlook), ...extra };
  await tx.insert(outlookRevisions).values({ outlookId, revisionNumber, snapshot, authorId });
  return outlook;
}

/** Whether a save would change the content (a save that changes nothing writes no revision). */
function changesContent(current: Outlook, input: SaveOutlookInput): boolean {
  const before = {
    headline: current.headline,
    discussion: current.discussion,
    hazardNotes: current.hazardNotes,
    validFrom: Date.parse(current.validFrom),
    validUntil: Date.parse(current.validUntil),
    areas: current.areas.map((a) => ({ id: a.id, levelKey: a.levelKey, hazards: a.hazards, geometry: a.geometry, label: a.label })),
  };
  const after = {
    headline: input.headline,
    discussion: input.discussion,
    hazardNotes: input.hazardNotes,
    validFrom: Date.parse(input.validFrom),
    validUntil: Date.parse(input.validUntil),
    areas: input.areas.map((a) => ({ id: a.id, levelKey: a.levelKey, hazards: a.hazards, geometry: a.geometry, label: a.label })),
  };
  return !isDeepStrictEqual(before, after);
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
    await writeRevision(tx, row.id, 1, actor.userId);
    await tx.insert(auditEvents).values({ officeId: office.id, outlookId: row.id, actorId: actor.userId, action: 'create', toState: 'draft' });
    const outlook = await loadOutlook(tx, row.id);
    if (!outlook) throw new Error('outlook vanished after insert');
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

/** Risk-area ids in a save that belong to another outlook (an id names one area of one outlook). */
async function foreignAreaIdIssues(db: Database, outlookId: string, areas: RiskAreaInput[]): Promise<FieldIssue[]> {
  const ids = areas.flatMap((area) => (area.id ? [area.id] : []));
  if (!ids.length) return [];
  const taken = await db.select({ id: riskAreas.id }).from(riskAreas).where(and(inArray(riskAreas.id, ids), ne(riskAreas.outlookId, outlookId)));
  const takenIds = new Set(taken.map((row) => row.id));
  return areas.flatMap((area, index) => (area.id && takenIds.has(area.id) ? [{ path: `areas.${index}.id`, message: 'This risk-area id belongs to another outlook. Leave the id out to create a new area.' }] : []));
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
  const foreign = await foreignAreaIdIssues(db, outlookId, input.areas);
  if (foreign.length) return err(appError('VALIDATION_FAILED', foreign[0]?.message, { issues: foreign }));
  return db.transaction(async (tx) => {
    const current = await loadOutlook(tx, outlookId);
    if (!current) return err(notFound());
    if (!isEditableState(current.state)) {
      return err(appError('CONFLICT', `This outlook is ${outlookStatePhrases[current.state]} and cannot be edited. ${current.state === 'published' ? 'Start an amendment instead.' : 'Ask a lead to return it first.'}`));
    }
    if (current.version === input.version && !changesContent(current, input)) return ok(current);
    const [updated] = await tx
      .update(outlooks)
      .set({
        headline: input.headline,
        discussion: input.discussion,
        hazardNotes: input.hazardNotes,
        validFrom: new Date(input.validFrom),
        validUntil: new Date(input.validUntil),
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
    await writeRevision(tx, outlookId, updated.version, actor.userId);
    await tx.insert(auditEvents).values({
      officeId: office.id,
      outlookId,
      actorId: actor.userId,
      action: 'save',
      fromState: current.state,
      toState: current.state,
      details: { version: updated.version, areas: input.areas.length },
    });
    const outlook = await loadOutlook(tx, outlookId);
    if (!outlook) throw new Error('outlook vanished during save');
    return ok(outlook);
  });
}

export async function listRevisions(db: Database, outlookId: string): Promise<Result<RevisionList, AppError>> {
  const rows = await db
    .select({ id: outlookRevisions.id, revisionNumber: outlookRevisions.revisionNumber, authorId: outlookRevisions.authorId, authorName: users.name, createdAt: outlookRevisions.createdAt })
    .from(outlookRevisions)
    .leftJoin(users, eq(users.id, outlookRevisions.authorId))
    .where(eq(outlookRevisions.outlookId, outlookId))
    .orderBy(desc(outlookRevisions.revisionNumber));
  if (rows.length === 0) return err(notFound());
  return ok({ revisions: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) });
}

/**
 * Revisions written before every revision carried the whole document (an amendment's first
 * revision lacked its valid period, state and hazard notes): completed from the outlook row.
 */
async function completeLegacySnapshot(db: Database, outlookId: string, stored: unknown): Promise<RevisionSnapshot> {
  const parsed = revisionSnapshotSchema.safeParse(stored);
  if (parsed.success) return parsed.data;
  const [row] = await db.select().from(outlooks).where(eq(outlooks.id, outlookId));
  if (!row) throw new Error('revision without its outlook');
  const partial = typeof stored === 'object' && stored !== null ? stored : {};
  return revisionSnapshotSchema.parse({ day: row.day, state: 'draft', headline: '', discussion: '', hazardNotes: {}, validFrom: row.validFrom.toISOString(), validUntil: row.validUntil.toISOString(), areas: [], ...partial });
}

export async function getRevision(db: Database, revisionId: string): Promise<Result<OutlookRevision, AppError>> {
  const [row] = await db
    .select({ revision: outlookRevisions, authorName: users.name })
    .from(outlookRevisions)
    .leftJoin(users, eq(users.id, outlookRevisions.authorId))
    .where(eq(outlookRevisions.id, revisionId));
  if (!row) return err(appError('NOT_FOUND', 'That revision does not exist.'));
  const r = row.revision;
  const snapshot = await completeLegacySnapshot(db, r.outlookId, r.snapshot);
  return ok({ id: r.id, outlookId: r.outlookId, revisionNumber: r.revisionNumber, snapshot, authorName: row.authorName, createdAt: r.createdAt.toISOString() });
}

export type { AreaEvidenceReport } from '../workers/evidence-report';

/** Loads soundings valid in a period as evidence points (key figures from the cached analysis). */
export async function evidenceSoundings(db: DatabaseOrTransaction, validFrom: Date, validUntil: Date): Promise<EvidenceSounding[]> {
  const rows = await db
    .select({ id: soundings.id, stationId: soundings.stationId, latitude: soundings.latitude, longitude: soundings.longitude, validTime: soundings.validTime, source: soundings.source, modifiedFromId: soundings.modifiedFromId, analysis: soundings.analysis })
    .from(soundings)
    .where(and(gte(soundings.validTime, validFrom), sql`${soundings.validTime} <= ${validUntil}`));
  // A sounding without station, position or valid time stays out of evidence until an author fills them in.
  return rows.flatMap((r) => (r.latitude === null || r.longitude === null || r.validTime === null || r.stationId === '' ? [] : [{
    id: r.id,
    stationId: r.stationId,
    latitude: r.latitude,
    longitude: r.longitude,
    validTime: r.validTime.toISOString(),
    source: r.source,
    modified: r.modifiedFromId !== null,
    figures: keyFigures(r.analysis),
  }]));
}

/**
 * The guidance (and ladder) an outlook was checked against when it was last published, from its
 * issuance snapshot; undefined while it was never published, or published before issue 14.
 */
async function publishedGuidance(db: DatabaseOrTransaction, outlookId: string): Promise<{ guidance: SupportGuidance; riskLadder: RiskLadder } | undefined> {
  const [row] = await db.select({ snapshot: issuances.snapshot }).from(issuances).where(eq(issuances.outlookId, outlookId)).orderBy(desc(issuances.publishedAt)).limit(1);
  if (!row) return undefined;
  const snapshot = issuanceSnapshotSchema.safeParse(row.snapshot);
  if (!snapshot.success || !snapshot.data.guidance) return undefined;
  return { guidance: snapshot.data.guidance, riskLadder: snapshot.data.riskLadder };
}

/** The evidence panel of every area of an outlook (see buildEvidenceReport), computed in the worker pool. */
export async function getOutlookEvidence(db: Database, outlookId: string, source?: 'observed' | 'model'): Promise<Result<OutlookEvidence, AppError>> {
  const outlook = await loadOutlook(db, outlookId);
  if (!outlook) return err(notFound());
  const office = await requireOffice(db);
  const candidates = await evidenceSoundings(db, new Date(outlook.validFrom), new Date(outlook.validUntil));
  // Only an outlook that can no longer change has an issuance of its own (an amendment is a new outlook).
  const published = outlook.state === 'published' ? await publishedGuidance(db, outlookId) : undefined;
  const guidance = published?.guidance ?? officeGuidance(office);
  const ladder = published?.riskLadder ?? office.riskLadder;
  // Grid soundings of the runs feeding this outlook travel packed (grid-evidence.service.ts).
  const grid = source === 'observed' ? { runs: [], packed: [], soundingCount: 0 } : await gridEvidenceOf(db, outlook);
  // Geometry checks and point-in-area tests run in the worker pool, off the event loop.
  const report = await runGeometryTask({ kind: 'grid-evidence-report', input: { outlook, candidates, ladder, guidance, region: office.region, source, runs: grid.packed } });
  if (!report.ok) return report;
  const { areas, sourcesByArea } = report.value;
  const soundingCount = candidates.filter((s) => !s.modified && (!source || s.source === source)).length + grid.soundingCount;
  return ok({ areas, soundingCount, runs: grid.runs, sourcesByArea });
}

/**
 * The soundings the evidence report reads for the outlook's saved period, compactly, for the
 * workspace's live preview (see shared/evidence/evidence-candidates.ts). Modified soundings stay
 * out, as in the report; above MAX_LIVE_EVIDENCE_CANDIDATES none are sent (`truncated`).
 */
export async function getEvidenceCandidates(db: Database, outlookId: string): Promise<Result<EvidenceCandidates, AppError>> {
  const [row] = await db.select({ validFrom: outlooks.validFrom, validUntil: outlooks.validUntil }).from(outlooks).where(eq(outlooks.id, outlookId));
  if (!row) return err(notFound());
  const uploaded = (await evidenceSoundings(db, row.validFrom, row.validUntil)).filter((s) => !s.modified);
  // The grid soundings of the runs feeding the outlook count in the preview as in the report.
  const { runs } = await evidenceRunsOf(db, { id: outlookId, validFrom: row.validFrom.toISOString(), validUntil: row.validUntil.toISOString() });
  const figures = await runFigures(db, runs);
  const gridCount = figures.reduce((sum, f) => sum + f.count, 0);
  const truncated = uploaded.length + gridCount > MAX_LIVE_EVIDENCE_CANDIDATES;
  const candidates = truncated ? [] : [...uploaded, ...figures.flatMap((f) => materializedSoundings(f))];
  return ok({
    validFrom: row.validFrom.toISOString(),
    validUntil: row.validUntil.toISOString(),
    figureKeys: [...keyFigureKeys],
    truncated,
    limit: MAX_LIVE_EVIDENCE_CANDIDATES,
    soundings: truncated ? [] : candidates.map(toEvidenceCandidate),
  });
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
 * The geometry with each position cut to [longitude, latitude]. RFC 7946 §3.1.1 allows an
 * altitude (third element) in a position; risk areas are flat, so it is dropped on import.
 */
function withoutAltitude(geometry: unknown): unknown {
  if (typeof geometry !== 'object' || geometry === null || !('type' in geometry) || !('coordinates' in geometry)) return geometry;
  const depth = geometry.type === 'Polygon' ? 2 : geometry.type === 'MultiPolygon' ? 3 : undefined;
  if (depth === undefined) return geometry;
  const strip = (value: unknown, level: number): unknown => {
    if (!Array.isArray(value)) return value;
    if (level === 0) return value.length > 2 && value.every((n) => typeof n === 'number') ? value.slice(0, 2) : value;
    return value.map((child) => strip(child, level - 1));
  };
  return { ...geometry, coordinates: strip(geometry.coordinates, depth) };
}

/**
 * Reads risk areas from an uploaded GeoJSON document (FeatureCollection, Feature or bare
 * geometry). Each feature needs a Polygon or MultiPolygon and a `level` property that names a
 * ladder key or label; problems are reported per feature. Nothing is saved: the author adds
 * the areas to the draft, which autosaves.
 */
export async function importAreasGeoJson(db: Database, document: unknown): Promise<Result<AreaImportResult, AppError>> {
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
    const geometry = boundedAreaGeometrySchema(MAX_VERTICES_PER_AREA, 'This feature').safeParse(withoutAltitude(feature.geometry));
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
