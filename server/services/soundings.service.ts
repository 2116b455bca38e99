import { and, asc, count, desc, eq, gte, ilike, isNotNull, isNull, lte, or, sql, type SQL } from 'drizzle-orm';
import {
  analyzeSounding,
  ENGINE_VERSION,
  parseSoundingCsv,
  validateSounding,
  type ParsedSounding,
  type SoundingAnalysis,
  type SoundingIssue,
  type SoundingLevel,
} from '../../shared/sounding';
import type {
  SaveModifiedSoundingInput,
  SoundingKeyFigures,
  SoundingList,
  SoundingListQuery,
  SoundingSummary,
  UploadResponse,
  UploadResult,
} from '../../shared/contracts/soundings';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database } from '../db/client';
import { soundings, users } from '../db/schema';
import { findOffice } from './office.service';

type SoundingRow = typeof soundings.$inferSelect;

/** The figures the library, map and evidence panel show, read from a full analysis. */
export function keyFigures(analysis: SoundingAnalysis | null): SoundingKeyFigures {
  if (!analysis) {
    return { mlCape: null, muCape: null, mlCin: null, mlLclHeightM: null, precipitableWaterMm: null, bulkShear0to6kmMs: null, srh0to1km: null, stp: null, scp: null, surfaceDewpointC: null, surfaceMixingRatioGkg: null };
  }
  return {
    mlCape: analysis.mixedLayer.cape,
    muCape: analysis.mostUnstable.cape,
    mlCin: analysis.mixedLayer.cin,
    mlLclHeightM: analysis.mixedLayer.lclHeight,
    precipitableWaterMm: analysis.precipitableWater,
    bulkShear0to6kmMs: analysis.bulkShear0to6km,
    srh0to1km: analysis.srh0to1km,
    stp: analysis.composites.significantTornado,
    scp: analysis.composites.supercellComposite,
    surfaceDewpointC: analysis.environment.surfaceDewpointC,
    surfaceMixingRatioGkg: analysis.environment.surfaceMixingRatio, // already g/kg
  };
}

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
    validTime: row.validTime.toISOString(),
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

/** Stores one validated sounding with its analysis; one insert, so a file is all or nothing. */
async function storeSounding(db: Database, office: string, actor: Actor | null, parsed: ParsedSounding, fileName: string | null, extra: Partial<typeof soundings.$inferInsert> = {}) {
  const analysis = analyzeSounding(parsed.levels);
  const [row] = await db
    .insert(soundings)
    .values({
      officeId: office,
      stationId: parsed.metadata.station,
      stationName: parsed.metadata.name,
      latitude: parsed.metadata.latitude,
      longitude: parsed.metadata.longitude,
      elevationM: parsed.metadata.elevationM,
      validTime: new Date(parsed.metadata.validTime),
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

function resultFor(fileName: string, outcome: Result<ParsedSounding, SoundingIssue[]>, soundingId: string | null): UploadResult {
  if (!outcome.ok) return { fileName, status: 'rejected', soundingId: null, issues: outcome.error };
  return { fileName, status: outcome.value.warnings.length ? 'accepted-with-warnings' : 'accepted', soundingId, issues: outcome.value.warnings };
}

function summarise(results: UploadResult[]): UploadResponse {
  const rejected = results.filter((r) => r.status === 'rejected').length;
  return { results, accepted: results.length - rejected, rejected };
}

/**
 * Takes a batch of exchange-CSV files. Each file is parsed and validated on its own: a rejected
 * file stores nothing and never stops the others; an accepted file is stored whole.
 */
export async function uploadSoundingFiles(db: Database, actor: Actor, files: { name: string; content: Buffer }[]): Promise<Result<UploadResponse, AppError>> {
  if (files.length === 0) return err(appError('VALIDATION_FAILED', 'Choose at least one CSV file to upload.', { issues: [{ path: 'files', message: 'No files were sent.' }] }));
  const office = await officeId(db);
  const results: UploadResult[] = [];
  for (const file of files) {
    const text = file.content.toString('utf8');
    const parsed = parseSoundingCsv(text, file.name);
    const id = parsed.ok ? await storeSounding(db, office, actor, parsed.value, file.name) : null;
    results.push(resultFor(file.name, parsed, id));
  }
  return ok(summarise(results));
}

/** The JSON API for model pipelines: the same validation as the CSV upload, per sounding. */
export async function createSoundings(db: Database, actor: Actor, inputs: unknown[]): Promise<Result<UploadResponse, AppError>> {
  const office = await officeId(db);
  const results: UploadResult[] = [];
  for (const [index, input] of inputs.entries()) {
    const parsed = validateSounding(input);
    const name = parsed.ok ? `${parsed.value.metadata.station} ${parsed.value.metadata.validTime}` : `soundings[${index}]`;
    const id = parsed.ok ? await storeSounding(db, office, actor, parsed.value, null) : null;
    results.push(resultFor(name, parsed, id));
  }
  return ok(summarise(results));
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
    analysis = analyzeSounding(levels);
    await db.update(soundings).set({ analysis: analysis, engineVersion: ENGINE_VERSION }).where(eq(soundings.id, row.id));
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
  const validated = validateSounding({
    metadata: { station: original.stationId, name: original.stationName, latitude: original.latitude, longitude: original.longitude, elevationM: original.elevationM, validTime: original.validTime.toISOString(), source: original.source },
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
    .select({ id: soundings.id, levels: soundings.levels })
    .from(soundings)
    .where(or(isNull(soundings.engineVersion), sql`${soundings.engineVersion} <> ${ENGINE_VERSION}`))
    .limit(limit);
  for (const row of stale) {
    const analysis = analyzeSounding(row.levels);
    await db.update(soundings).set({ analysis: analysis, engineVersion: ENGINE_VERSION }).where(eq(soundings.id, row.id));
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

