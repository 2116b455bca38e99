import { createHash } from 'node:crypto';
import { and, asc, count, desc, eq, gte, ilike, isNotNull, isNull, lte, or, sql, type SQL } from 'drizzle-orm';
import {
  analyzeSounding,
  ENGINE_VERSION,
  keyFiguresFromAnalysis,
  validateSounding,
  type ParsedSounding,
  type SoundingAnalysis,
  type SoundingIssue,
  type SoundingLevel,
} from '../../shared/sounding';
import type {
  SaveModifiedSoundingInput,
  SoundingList,
  SoundingListQuery,
  SoundingSummary,
  UpdateSoundingMetadataInput,
  UploadResponse,
  UploadResult,
} from '../../shared/contracts/soundings';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database, DatabaseOrTransaction } from '../db/client';
import { soundings, users } from '../db/schema';
import { runSoundingTask, SOUNDING_TASK_BUDGET_MS } from '../workers/sounding-pool';
import type { SoundingTask } from '../workers/sounding-analysis.worker';
import { findOffice } from './office.service';

type SoundingRow = typeof soundings.$inferSelect;

/** The figures the library, map and evidence panel show, read from a full analysis. */
export const keyFigures = keyFiguresFromAnalysis;

function storedAnalysis(row: SoundingRow): SoundingAnalysis | null {
  return row.analysis && row.engineVersion === ENGINE_VERSION ? row.analysis : null;
}

function toSummary(row: SoundingRow, uploaderName: string | null): SoundingSummary {
  return {
    id: row.id,
    stationId: row.stationId,
    stationName: row.stationName,
    latitude: row.latitude,
    longitude: row.longitude,
    elevationM: row.elevationM,
    validTime: row.validTime ? row.validTime.toISOString() : null,
    source: row.source,
    modifiedFromId: row.modifiedFromId,
    modificationName: row.modificationName,
    uploadedBy: row.uploadedBy,
    uploadedByName: uploaderName,
    createdAt: row.createdAt.toISOString(),
    figures: keyFigures(storedAnalysis(row)),
  };
}

async function officeId(db: Database): Promise<string> {
  const office = await findOffice(db);
  if (!office) throw new Error('no office row: ensureOffice() runs at start-up');
  return office.id;
}

/** The metadata a sounding still needs before it counts as evidence. */
export function missingForEvidence(metadata: Pick<ParsedSounding['metadata'], 'station' | 'latitude' | 'longitude' | 'validTime'>): UploadResult['missingForEvidence'] {
  const missing: UploadResult['missingForEvidence'] = [];
  if (metadata.station === '') missing.push('station');
  if (metadata.latitude === null) missing.push('latitude');
  if (metadata.longitude === null) missing.push('longitude');
  if (metadata.validTime === null) missing.push('validTime');
  return missing;
}

/** SHA-256 of a sounding's parsed metadata and levels: identical content, identical hash. */
export function soundingContentHash(parsed: ParsedSounding): string {
  return createHash('sha256').update(JSON.stringify({ metadata: parsed.metadata, levels: parsed.levels })).digest('hex');
}

/** The analysis's quality flags as warnings of an upload result. */
function flagIssues(analysis: SoundingAnalysis): SoundingIssue[] {
  return analysis.flags.map((flag) => ({ severity: 'warning', code: flag.code, message: flag.message }));
}

/** Stores one validated sounding with its analysis in one insert (all or nothing). */
async function storeSounding(db: DatabaseOrTransaction, office: string, actor: Actor | null, parsed: ParsedSounding, fileName: string | null, extra: Partial<typeof soundings.$inferInsert> = {}, analysis = analyzeSounding(parsed.levels, { latitude: parsed.metadata.latitude })) {
  const [row] = await db
    .insert(soundings)
    .values({
      officeId: office,
      stationId: parsed.metadata.station,
      stationName: parsed.metadata.name,
      latitude: parsed.metadata.latitude,
      longitude: parsed.metadata.longitude,
      elevationM: parsed.metadata.elevationM,
      validTime: parsed.metadata.validTime === null ? null : new Date(parsed.metadata.validTime),
      source: parsed.metadata.source,
      fileName,
      levels: parsed.levels,
      warnings: parsed.warnings,
      analysis: analysis,
      engineVersion: ENGINE_VERSION,
      uploadedBy: actor?.userId ?? null,
      ...extra,
    })
    .returning({ id: soundings.id });
  if (!row) throw new Error('insert returned no row');
  return row.id;
}

function summarise(results: UploadResult[]): UploadResponse {
  const rejected = results.filter((r) => r.status === 'rejected').length;
  const duplicates = results.filter((r) => r.status === 'duplicate').length;
  return { results, accepted: results.length - rejected - duplicates, duplicates, rejected };
}

const rejected = (fileName: string, issues: SoundingIssue[]): UploadResult => ({ fileName, status: 'rejected', soundingId: null, issues, missingForEvidence: [] });

/**
 * One sounding of a batch, on its own: analysed in the worker pool within the time budget,
 * then stored in its own transaction, or recognised as a duplicate of stored content. Any
 * failure becomes this file's rejected result; it never touches the other files.
 */
async function receiveOne(db: Database, office: string, actor: Actor | null, name: string, task: SoundingTask, budgetMs: number): Promise<UploadResult> {
  const outcome = await runSoundingTask(task, budgetMs);
  if (!outcome.ok) {
    if ('timedOut' in outcome) {
      return rejected(name, [{ severity: 'error', code: 'ANALYSIS_TIME_EXCEEDED', message: `${name}: the analysis took longer than ${budgetMs} ms, the limit per file. Thin the levels and upload again.` }]);
    }
    return rejected(name, outcome.issues);
  }
  const { parsed, analysis } = outcome;
  const fileName = task.kind === 'csv' ? task.fileName : null;
  const label = task.kind === 'csv' ? name : parsed.metadata.station && parsed.metadata.validTime ? `${parsed.metadata.station} ${parsed.metadata.validTime}` : name;
  const hash = soundingContentHash(parsed);
  const issues = [...parsed.warnings, ...flagIssues(analysis)];
  const missing = missingForEvidence(parsed.metadata);
  for (const field of missing) {
    issues.push({ severity: 'warning', code: 'NOT_YET_EVIDENCE', message: `${label}: no ${field === 'validTime' ? 'valid time' : field}; the sounding is kept in the library but stays out of evidence until an author fills it in.`, column: field });
  }
  const existing = async (): Promise<string | null> => {
    const [row] = await db.select({ id: soundings.id }).from(soundings).where(and(eq(soundings.officeId, office), eq(soundings.contentHash, hash), isNull(soundings.modifiedFromId)));
    return row?.id ?? null;
  };
  const duplicate = (id: string): UploadResult => ({
    fileName: label,
    status: 'duplicate',
    soundingId: id,
    issues: [{ severity: 'warning', code: 'DUPLICATE_SOUNDING', message: `${label}: the same sounding (same station, valid time and levels) is already in the library; nothing new was stored.` }],
    missingForEvidence: missing,
  });
  const already = await existing();
  if (already) return duplicate(already);
  try {
    const id = await db.transaction((tx) => storeSounding(tx, office, actor, parsed, fileName, { contentHash: hash }, analysis));
    return { fileName: label, status: issues.length ? 'accepted-with-warnings' : 'accepted', soundingId: id, issues, missingForEvidence: missing };
  } catch {
    // A concurrent upload of the same content won the unique index: report the duplicate.
    const raced = await existing();
    if (raced) return duplicate(raced);
    return rejected(label, [{ severity: 'error', code: 'NOT_STORED', message: `${label}: the sounding could not be stored (the database refused a value; check the metadata lines for unusual characters). Nothing of this file was kept; the other files are not affected.` }]);
  }
}

/**
 * Takes a batch of exchange-CSV files. Each file is parsed and analysed in the worker pool and
 * stored in its own transaction: a rejected file stores nothing and never stops the others; a
 * re-sent file is a duplicate, so a batch can be retried safely.
 */
export async function uploadSoundingFiles(db: Database, actor: Actor, files: { name: string; content: Buffer }[], budgetMs = SOUNDING_TASK_BUDGET_MS): Promise<Result<UploadResponse, AppError>> {
  if (files.length === 0) return err(appError('VALIDATION_FAILED', 'Choose at least one CSV file to upload.', { issues: [{ path: 'files', message: 'No files were sent.' }] }));
  const office = await officeId(db);
  const results: UploadResult[] = [];
  for (const file of files) {
    results.push(await receiveOne(db, office, actor, file.name, { kind: 'csv', fileName: file.name, text: file.content.toString('utf8') }, budgetMs));
  }
  return ok(summarise(results));
}

/** The JSON API for model pipelines: the same validation as the CSV upload, per sounding. */
export async function createSoundings(db: Database, actor: Actor, inputs: unknown[]): Promise<Result<UploadResponse, AppError>> {
  const office = await officeId(db);
  const results: UploadResult[] = [];
  for (const [index, input] of inputs.entries()) {
    results.push(await receiveOne(db, office, actor, `soundings[${index}]`, { kind: 'structured', input }, SOUNDING_TASK_BUDGET_MS));
  }
  return ok(summarise(results));
}

/**
 * Intake (files from the intake folder or a scheduled pull, no person involved): each decoded
 * sounding is validated and analysed in the worker pool and stored on its own, or recognised as a
 * duplicate of stored content, exactly as an upload. `onEach` reports progress after each one.
 */
export async function receiveIntakeSoundings(db: Database, items: { name: string; task: SoundingTask }[], onEach?: (done: number, total: number) => void): Promise<UploadResponse> {
  const office = await officeId(db);
  const results: UploadResult[] = [];
  for (const item of items) {
    results.push(await receiveOne(db, office, null, item.name, item.task, SOUNDING_TASK_BUDGET_MS));
    onEach?.(results.length, items.length);
  }
  return summarise(results);
}

const figureColumn = (path: string[]): SQL => sql.raw(`(analysis #>> '{${path.join(',')}}')::double precision`);
const sortColumns: Record<SoundingListQuery['sort'], SQL | typeof soundings.validTime | typeof soundings.stationId | typeof soundings.source | typeof soundings.createdAt> = {
  validTime: soundings.validTime,
  stationId: soundings.stationId,
  source: soundings.source,
  createdAt: soundings.createdAt,
  mlCape: figureColumn(['mixedLayer', 'cape']),
  muCape: figureColumn(['mostUnstable', 'cape']),
  mlCin: figureColumn(['mixedLayer', 'cin']),
  mlLclHeightM: figureColumn(['mixedLayer', 'lclHeight']),
  precipitableWaterMm: figureColumn(['precipitableWater']),
  bulkShear0to6kmMs: figureColumn(['bulkShear0to6km']),
  srh0to1km: figureColumn(['srh0to1km']),
  stp: figureColumn(['composites', 'significantTornado']),
};

/** One page of the library, filtered and sorted on the server (thousands of rows). */
export async function listSoundings(db: Database, query: SoundingListQuery): Promise<Result<SoundingList, AppError>> {
  await refreshStaleAnalyses(db, 500);
  const filters: SQL[] = [];
  if (query.source) filters.push(eq(soundings.source, query.source));
  if (query.station) {
    const station = or(ilike(soundings.stationId, `${query.station}%`), ilike(soundings.stationName, `%${query.station}%`));
    if (station) filters.push(station);
  }
  if (query.validFrom) filters.push(gte(soundings.validTime, new Date(query.validFrom)));
  if (query.validTo) filters.push(lte(soundings.validTime, new Date(query.validTo)));
  if (query.modified === 'exclude') filters.push(isNull(soundings.modifiedFromId));
  if (query.modified === 'only') filters.push(isNotNull(soundings.modifiedFromId));
  const where = filters.length ? and(...filters) : undefined;
  const column = sortColumns[query.sort];
  const direction = query.order === 'asc' ? asc(column) : sql`${column} desc nulls last`;
  const [rows, [total]] = await Promise.all([
    db
      .select({ sounding: soundings, uploaderName: users.name })
      .from(soundings)
      .leftJoin(users, eq(users.id, soundings.uploadedBy))
      .where(where)
      .orderBy(direction, desc(soundings.createdAt))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    db.select({ value: count() }).from(soundings).where(where),
  ]);
  return ok({ soundings: rows.map((r) => toSummary(r.sounding, r.uploaderName)), total: total?.value ?? 0, page: query.page, pageSize: query.pageSize });
}

export interface SoundingDetail extends SoundingSummary {
  levels: SoundingLevel[];
  warnings: SoundingIssue[];
  analysis: SoundingAnalysis;
  engineVersion: string;
  modificationNote: string | null;
}

export async function getSounding(db: Database, soundingId: string): Promise<Result<SoundingDetail, AppError>> {
  const [found] = await db.select({ sounding: soundings, uploaderName: users.name }).from(soundings).leftJoin(users, eq(users.id, soundings.uploadedBy)).where(eq(soundings.id, soundingId));
  if (!found) return err(appError('NOT_FOUND', 'There is no sounding with that id. It may have been deleted.'));
  const row = found.sounding;
  const levels = row.levels;
  let analysis = storedAnalysis(row);
  if (!analysis) {
    analysis = analyzeSounding(levels, { latitude: row.latitude });
    await db.update(soundings).set({ analysis, engineVersion: ENGINE_VERSION }).where(eq(soundings.id, row.id));
  }
  return ok({
    ...toSummary({ ...row, analysis: analysis, engineVersion: ENGINE_VERSION }, found.uploaderName),
    levels,
    warnings: row.warnings,
    analysis,
    engineVersion: ENGINE_VERSION,
    modificationNote: row.modificationNote,
  });
}

/** Deletes a sounding (and the what-if soundings made from it): its uploader, a lead or an admin. */
export async function deleteSounding(db: Database, actor: Actor, soundingId: string): Promise<Result<{ deleted: number }, AppError>> {
  const [row] = await db.select({ id: soundings.id, uploadedBy: soundings.uploadedBy }).from(soundings).where(eq(soundings.id, soundingId));
  if (!row) return err(appError('NOT_FOUND', 'There is no sounding with that id. It may have been deleted already.'));
  if (actor.role === 'forecaster' && row.uploadedBy !== actor.userId) {
    return err(appError('FORBIDDEN', 'Only the forecaster who uploaded this sounding, or a lead, can delete it.'));
  }
  const deleted = await db
    .delete(soundings)
    .where(or(eq(soundings.id, soundingId), eq(soundings.modifiedFromId, soundingId)))
    .returning({ id: soundings.id });
  return ok({ deleted: deleted.length });
}

/**
 * Saves a what-if sounding: the original's levels with a new surface temperature and/or
 * dewpoint, validated and analysed again, stored apart and linked to the original.
 */
export async function saveModifiedSounding(db: Database, actor: Actor, soundingId: string, input: SaveModifiedSoundingInput): Promise<Result<SoundingSummary, AppError>> {
  const [original] = await db.select().from(soundings).where(eq(soundings.id, soundingId));
  if (!original) return err(appError('NOT_FOUND', 'The original sounding no longer exists.'));
  const levels = original.levels.map((level) => ({ ...level }));
  const surface = levels[0];
  if (!surface) throw new Error(`stored sounding ${soundingId} has no levels`);
  if (input.surfaceTemperatureC !== undefined) surface.temperatureC = input.surfaceTemperatureC;
  if (input.surfaceDewpointC !== undefined) surface.dewpointC = input.surfaceDewpointC;
  if (surface.dewpointC !== null && surface.dewpointC > surface.temperatureC) {
    const message = `The surface dewpoint (${surface.dewpointC} °C) cannot be above the surface temperature (${surface.temperatureC} °C). Lower the dewpoint or raise the temperature.`;
    return err(appError('VALIDATION_FAILED', message, { issues: [{ path: 'surfaceDewpointC', message }] }));
  }
  const validated = validateSounding({
    metadata: { station: original.stationId, name: original.stationName, latitude: original.latitude, longitude: original.longitude, elevationM: original.elevationM, validTime: original.validTime?.toISOString() ?? null, source: original.source },
    levels,
  });
  if (!validated.ok) {
    const issues = validated.error.map((i) => ({ path: i.column ?? 'levels', message: i.message }));
    return err(appError('VALIDATION_FAILED', issues[0]?.message ?? 'The modified sounding is not valid.', { issues }));
  }
  const id = await storeSounding(db, original.officeId, actor, validated.value, original.fileName, {
    modifiedFromId: original.modifiedFromId ?? original.id,
    modificationName: input.name,
    modificationNote: [input.note, input.parcelStartPressureHpa !== undefined ? `Parcel lifted from ${input.parcelStartPressureHpa} hPa.` : ''].filter(Boolean).join(' ') || null,
  });
  const [row] = await db.select().from(soundings).where(eq(soundings.id, id));
  if (!row) throw new Error('modified sounding vanished after insert');
  return ok(toSummary(row, actor.name));
}

/** Re-analyses up to `limit` soundings whose cached analysis was made by another engine version. */
export async function refreshStaleAnalyses(db: Database, limit: number): Promise<number> {
  const stale = await db
    .select({ id: soundings.id, levels: soundings.levels, latitude: soundings.latitude })
    .from(soundings)
    .where(or(isNull(soundings.engineVersion), sql`${soundings.engineVersion} <> ${ENGINE_VERSION}`))
    .limit(limit);
  for (const row of stale) {
    const analysis = analyzeSounding(row.levels, { latitude: row.latitude });
    await db.update(soundings).set({ analysis, engineVersion: ENGINE_VERSION }).where(eq(soundings.id, row.id));
  }
  return stale.length;
}

/** Loads the invented demo soundings once (idempotent: skipped when any sounding exists). */
export async function seedSoundings(db: Database, inputs: unknown[]): Promise<number> {
  const [existing] = await db.select({ value: count() }).from(soundings);
  if ((existing?.value ?? 0) > 0) return 0;
  const office = await officeId(db);
  let stored = 0;
  for (const input of inputs) {
    const parsed = validateSounding(input);
    if (!parsed.ok) throw new Error(`demo sounding rejected: ${parsed.error.map((i) => i.message).join('; ')}`);
    await storeSounding(db, office, null, parsed.value, 'demo-generator');
    stored++;
  }
  return stored;
}


/**
 * Fills in or corrects a sounding's metadata from the library (station, position, valid time,
 * source), so a sounding uploaded without them can count as evidence. Its uploader or a lead
 * may do it; the analysis is redone (the hemisphere decides the deviant storm motion).
 */
export async function updateSoundingMetadata(db: Database, actor: Actor, soundingId: string, input: UpdateSoundingMetadataInput): Promise<Result<SoundingSummary, AppError>> {
  const [row] = await db.select().from(soundings).where(eq(soundings.id, soundingId));
  if (!row) return err(appError('NOT_FOUND', 'There is no sounding with that id. It may have been deleted.'));
  if (actor.role !== 'lead' && row.uploadedBy !== actor.userId) {
    return err(appError('FORBIDDEN', 'Only the forecaster who uploaded this sounding, or a lead, can change its details.'));
  }
  const analysis = analyzeSounding(row.levels, { latitude: input.latitude });
  const [updated] = await db
    .update(soundings)
    .set({
      stationId: input.station,
      stationName: input.name,
      latitude: input.latitude,
      longitude: input.longitude,
      elevationM: input.elevationM ?? row.elevationM,
      validTime: new Date(input.validTime),
      source: input.source,
      analysis,
      engineVersion: ENGINE_VERSION,
    })
    .where(eq(soundings.id, soundingId))
    .returning();
  if (!updated) return err(appError('NOT_FOUND', 'The sounding was deleted while you edited it.'));
  return ok(toSummary(updated, null));
}
