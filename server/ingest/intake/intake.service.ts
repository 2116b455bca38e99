/**
 * Use cases of the intake page: the list of files and their outcome, whether ecCodes is there,
 * and the admin's scheduled pull sources. Credentials of a source never leave this module.
 */
import { and, desc, eq, inArray } from 'drizzle-orm';
import {
  intakeFileListLimit,
  type CreateIntakeSourceInput,
  type IntakeFile,
  type IntakeFileList,
  type IntakeSource,
  type IntakeStatus,
  type PullResult,
  type UpdateIntakeSourceInput,
} from '../../../shared/contracts/intake';
import { appError, type AppError } from '../../../shared/errors';
import { err, ok, type Result } from '../../../shared/result';
import type { Config } from '../../config';
import type { Database } from '../../db/client';
import { intakeFiles, intakeSources } from '../../db/schema';
import { findOffice } from '../../services/office.service';
import { ECCODES_INSTALL_HINT, eccodesStatus } from '../eccodes';
import { intakeRuntimeOf } from './intake-runtime';
import { pullUrlProblem } from './pull-sources';

type FileRow = typeof intakeFiles.$inferSelect;
type SourceRow = typeof intakeSources.$inferSelect;

const formats = ['grib2', 'bufr', 'csv', 'unknown'] as const;
const states = ['received', 'processing', 'done', 'failed', 'duplicate'] as const;
const pick = <T extends string>(list: readonly T[], value: string, fallback: T): T => list.find((item) => item === value) ?? fallback;

function toIntakeFile(row: FileRow): IntakeFile {
  return {
    id: row.id,
    origin: row.origin === 'pull' ? 'pull' : 'folder',
    sourceName: row.sourceName,
    fileName: row.fileName,
    sizeBytes: row.sizeBytes,
    format: pick(formats, row.format, 'unknown'),
    state: pick(states, row.state, 'failed'),
    progressDone: row.progressDone,
    progressTotal: row.progressTotal,
    soundingCount: row.soundingCount,
    duplicateSoundingCount: row.duplicateSoundingCount,
    runIds: row.runIds,
    notes: row.notes,
    failure: row.failure,
    receivedAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
    durationMs: row.startedAt && row.finishedAt ? row.finishedAt.getTime() - row.startedAt.getTime() : null,
  };
}

function toIntakeSource(row: SourceRow): IntakeSource {
  return {
    id: row.id,
    name: row.name,
    urlTemplate: row.urlTemplate,
    cycleHours: row.cycleHours,
    forecastHours: row.forecastHours,
    delayMinutes: row.delayMinutes,
    intervalMinutes: row.intervalMinutes,
    model: row.model,
    hasAuthorization: row.authorization !== null && row.authorization !== '',
    enabled: row.enabled,
    lastPolledAt: row.lastPolledAt?.toISOString() ?? null,
    lastError: row.lastError,
  };
}

async function officeIdOf(db: Database): Promise<string> {
  const office = await findOffice(db);
  if (!office) throw new Error('no office row: ensureOffice() runs at start-up');
  return office.id;
}

/** The latest files, newest first, and how many are still being taken in. */
export async function listIntakeFiles(db: Database): Promise<Result<IntakeFileList, AppError>> {
  const office = await officeIdOf(db);
  const rows = await db.select().from(intakeFiles).where(eq(intakeFiles.officeId, office)).orderBy(desc(intakeFiles.createdAt)).limit(intakeFileListLimit);
  const active = await db
    .select({ id: intakeFiles.id })
    .from(intakeFiles)
    .where(and(eq(intakeFiles.officeId, office), inArray(intakeFiles.state, ['received', 'processing'])));
  return ok({ files: rows.map(toIntakeFile), active: active.length });
}

/** Whether ecCodes is installed and whether the folder is watched. */
export async function getIntakeStatus(db: Database, config: Config): Promise<Result<IntakeStatus, AppError>> {
  const eccodes = await eccodesStatus();
  const runtime = intakeRuntimeOf(db);
  return ok({
    eccodes: { available: eccodes.available, version: eccodes.version, installHint: ECCODES_INSTALL_HINT },
    folder: { watching: runtime !== undefined, path: runtime?.folder ?? config.intakeDir ?? null },
  });
}

export async function listIntakeSources(db: Database): Promise<Result<{ sources: IntakeSource[] }, AppError>> {
  const office = await officeIdOf(db);
  const rows = await db.select().from(intakeSources).where(eq(intakeSources.officeId, office)).orderBy(intakeSources.name);
  return ok({ sources: rows.map(toIntakeSource) });
}

/** Adds a pull source; its address must pass the pull rules (https, public host in production). */
export async function createIntakeSource(db: Database, config: Config, input: CreateIntakeSourceInput): Promise<Result<IntakeSource, AppError>> {
  const problem = pullUrlProblem(input.urlTemplate, config.env);
  if (problem) return err(appError('VALIDATION_FAILED', problem, { issues: [{ path: 'urlTemplate', message: problem }] }));
  const office = await officeIdOf(db);
  const [existing] = await db.select({ id: intakeSources.id }).from(intakeSources).where(and(eq(intakeSources.officeId, office), eq(intakeSources.name, input.name)));
  if (existing) return err(appError('ALREADY_EXISTS', `A source named "${input.name}" already exists. Choose another name.`, { issues: [{ path: 'name', message: 'This name is taken.' }] }));
  const [row] = await db
    .insert(intakeSources)
    .values({
      officeId: office,
      name: input.name,
      urlTemplate: input.urlTemplate,
      cycleHours: input.cycleHours,
      forecastHours: input.forecastHours,
      delayMinutes: input.delayMinutes,
      intervalMinutes: input.intervalMinutes,
      model: input.model ?? null,
      authorization: input.authorization ?? null,
      enabled: input.enabled,
    })
    .returning();
  if (!row) throw new Error('insert returned no row');
  return ok(toIntakeSource(row));
}

export async function updateIntakeSource(db: Database, sourceId: string, input: UpdateIntakeSourceInput): Promise<Result<IntakeSource, AppError>> {
  const [row] = await db.update(intakeSources).set({ enabled: input.enabled }).where(eq(intakeSources.id, sourceId)).returning();
  if (!row) return err(appError('NOT_FOUND', 'There is no pull source with that id. It may have been deleted.'));
  return ok(toIntakeSource(row));
}

export async function deleteIntakeSource(db: Database, sourceId: string): Promise<Result<{ deleted: true }, AppError>> {
  const deleted = await db.delete(intakeSources).where(eq(intakeSources.id, sourceId)).returning({ id: intakeSources.id });
  if (deleted.length === 0) return err(appError('NOT_FOUND', 'There is no pull source with that id. It may have been deleted already.'));
  return ok({ deleted: true });
}

/** Pulls a source now (the files are taken in before this answers). */
export async function pullIntakeSourceNow(db: Database, sourceId: string): Promise<Result<PullResult, AppError>> {
  const [source] = await db.select({ id: intakeSources.id }).from(intakeSources).where(eq(intakeSources.id, sourceId));
  if (!source) return err(appError('NOT_FOUND', 'There is no pull source with that id. It may have been deleted.'));
  const runtime = intakeRuntimeOf(db);
  if (!runtime) return err(appError('SERVICE_UNAVAILABLE', 'The intake is not running on this server (no intake folder is configured; set INTAKE_DIR or DATA_DIR).'));
  const summary = await runtime.pullNow(sourceId);
  if (!summary) return err(appError('SERVICE_UNAVAILABLE', 'The intake is stopping; try again in a minute.'));
  return ok(summary);
}
