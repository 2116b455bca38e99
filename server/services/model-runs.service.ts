/**
 * Model runs as data: list them with their counts and size, delete one, keep the last N runs
 * per model (older ones deleted in the background, a slice at a time so requests keep being
 * answered), and read a grid sounding back with its analysis.
 */
import { and, asc, desc, eq, getTableColumns, inArray, sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { ModelRunRetention, ModelRunSummary } from '../../shared/contracts/model-runs';
import { modelRunStateSchema } from '../../shared/contracts/model-runs';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import { emptyKeyFigures, keyFigureKeys, type SoundingAnalysis, type SoundingLevel } from '../../shared/sounding';
import type { SoundingKeyFigures } from '../../shared/contracts/soundings';
import type { Database, DatabaseOrTransaction } from '../db/client';
import { gridSoundings, modelRunSettings, modelRuns } from '../db/schema';
import { levelsFromBytes, unpackLevels } from '../ingest/grib/build-soundings';
import { runSoundingTask } from '../workers/sounding-pool';
import { findOffice } from './office.service';

/** Runs kept per model when the office has not said. */
export const DEFAULT_RUNS_KEPT_PER_MODEL = 4;
/** Grid soundings deleted per statement when a run goes (so no single statement holds the database long). */
const DELETE_SLICE = 2000;

type RunRow = typeof modelRuns.$inferSelect;

/** A run row as the runs API shows it. */
export function toModelRunSummary(row: RunRow): ModelRunSummary {
  const state = modelRunStateSchema.safeParse(row.state);
  return {
    id: row.id,
    model: row.model,
    cycleTime: row.cycleTime.toISOString(),
    forecastHour: row.forecastHour,
    validTime: row.validTime.toISOString(),
    gridKind: row.gridKind,
    nx: row.nx,
    ny: row.ny,
    levelCount: row.levelCount,
    soundingCount: row.soundingCount,
    storedBytes: row.storedBytes,
    bytesPerSounding: row.soundingCount > 0 ? Math.round(row.storedBytes / row.soundingCount) : null,
    state: state.success ? state.data : 'failed',
    failure: row.failure,
    createdAt: row.createdAt.toISOString(),
  };
}

/** The office's runs, newest valid time first (optionally of one model). */
export async function listModelRuns(db: DatabaseOrTransaction, query: { model?: string | undefined }): Promise<Result<ModelRunSummary[], AppError>> {
  const office = await findOffice(db);
  if (!office) return ok([]);
  const rows = await db
    .select()
    .from(modelRuns)
    .where(and(eq(modelRuns.officeId, office.id), query.model ? eq(modelRuns.model, query.model) : undefined))
    .orderBy(desc(modelRuns.validTime), asc(modelRuns.model), desc(modelRuns.cycleTime))
    .limit(1000);
  return ok(rows.map(toModelRunSummary));
}

/** Delete a run's grid soundings a slice at a time (the run row stays). */
export async function deleteRunSoundings(db: Database, runId: string): Promise<void> {
  for (;;) {
    const slice = db.select({ pointIndex: gridSoundings.pointIndex }).from(gridSoundings).where(eq(gridSoundings.runId, runId)).limit(DELETE_SLICE);
    const deleted = await db.delete(gridSoundings).where(and(eq(gridSoundings.runId, runId), inArray(gridSoundings.pointIndex, slice))).returning({ pointIndex: gridSoundings.pointIndex });
    if (deleted.length < DELETE_SLICE) break;
    await new Promise((resolve) => setImmediate(resolve));
  }
}

/** Delete a run's grid soundings a slice at a time, then the run. */
async function deleteRunInSlices(db: Database, runId: string): Promise<void> {
  await deleteRunSoundings(db, runId);
  await db.delete(modelRuns).where(eq(modelRuns.id, runId));
}

/** Delete one run and its grid soundings. */
export async function deleteModelRun(db: Database, runId: string): Promise<Result<{ id: string }, AppError>> {
  const office = await findOffice(db);
  const [row] = office ? await db.select({ id: modelRuns.id }).from(modelRuns).where(and(eq(modelRuns.id, runId), eq(modelRuns.officeId, office.id))) : [];
  if (!row) return err(appError('NOT_FOUND', 'That model run does not exist (it may have been deleted already).'));
  await deleteRunInSlices(db, runId);
  return ok({ id: runId });
}

/** How many runs per model the office keeps. */
export async function getRunRetention(db: DatabaseOrTransaction, officeId?: string): Promise<Result<ModelRunRetention, AppError>> {
  const id = officeId ?? (await findOffice(db))?.id;
  if (!id) return err(appError('NOT_FOUND', 'No office is set up yet. Start the app once to create it.'));
  const [row] = await db.select().from(modelRunSettings).where(eq(modelRunSettings.officeId, id));
  return ok({ runsKeptPerModel: row?.runsKeptPerModel ?? DEFAULT_RUNS_KEPT_PER_MODEL });
}

/** Change how many runs per model are kept; older runs are deleted in the background. */
export async function setRunRetention(db: Database, logger: Logger, input: ModelRunRetention): Promise<Result<ModelRunRetention, AppError>> {
  const office = await findOffice(db);
  if (!office) return err(appError('NOT_FOUND', 'No office is set up yet. Start the app once to create it.'));
  await db
    .insert(modelRunSettings)
    .values({ officeId: office.id, runsKeptPerModel: input.runsKeptPerModel })
    .onConflictDoUpdate({ target: modelRunSettings.officeId, set: { runsKeptPerModel: input.runsKeptPerModel, updatedAt: new Date() } });
  scheduleRunRetention(db, logger, office.id);
  return ok({ runsKeptPerModel: input.runsKeptPerModel });
}

/**
 * Delete every run beyond the newest N per model (newest cycle first, then latest forecast hour).
 * @returns the ids of the runs deleted
 */
export async function applyRunRetention(db: Database, officeId: string): Promise<string[]> {
  const kept = await getRunRetention(db, officeId);
  const keep = kept.ok ? kept.value.runsKeptPerModel : DEFAULT_RUNS_KEPT_PER_MODEL;
  const ranked = db
    .select({
      id: modelRuns.id,
      rank: sql<number>`row_number() over (partition by ${modelRuns.model} order by ${modelRuns.cycleTime} desc, ${modelRuns.forecastHour} desc)`.as('rank'),
    })
    .from(modelRuns)
    .where(and(eq(modelRuns.officeId, officeId), inArray(modelRuns.state, ['ready', 'failed'])))
    .as('ranked');
  const old = await db.select({ id: ranked.id }).from(ranked).where(sql`${ranked.rank} > ${keep}`);
  for (const { id } of old) await deleteRunInSlices(db, id);
  return old.map((row) => row.id);
}

let retentionQueue: Promise<void> = Promise.resolve();

/** Apply retention in the background, one pass after another; errors are logged, never thrown. */
export function scheduleRunRetention(db: Database, logger: Logger, officeId: string): void {
  retentionQueue = retentionQueue.then(async () => {
    try {
      const deleted = await applyRunRetention(db, officeId);
      if (deleted.length > 0) logger.info({ deleted: deleted.length }, 'older model runs deleted (retention)');
    } catch (error) {
      logger.error({ err: error }, 'model run retention failed');
    }
  });
}

/** Resolves when the background retention passes scheduled so far have finished (tests, shutdown). */
export function runRetentionIdle(): Promise<void> {
  return retentionQueue;
}

/** A grid sounding's row in a run's list: where it is and its key figures. */
export interface GridSoundingSummary {
  id: string;
  runId: string;
  pointIndex: number;
  latitude: number;
  longitude: number;
  elevationM: number | null;
  keyFigures: SoundingKeyFigures;
}

type GridRow = Omit<typeof gridSoundings.$inferSelect, 'levels'>;

function figuresOf(row: GridRow): SoundingKeyFigures {
  const figures: SoundingKeyFigures = { ...emptyKeyFigures(), flagCount: row.flagCount };
  for (const key of keyFigureKeys) figures[key] = row[key];
  return figures;
}

function summaryOf(row: GridRow): GridSoundingSummary {
  return { id: `${row.runId}:${row.pointIndex}`, runId: row.runId, pointIndex: row.pointIndex, latitude: row.latitude, longitude: row.longitude, elevationM: row.elevationM, keyFigures: figuresOf(row) };
}

/** One page of a run's grid soundings, in point order. */
export async function listGridSoundings(db: DatabaseOrTransaction, runId: string, page: { offset: number; limit: number }): Promise<Result<{ total: number; items: GridSoundingSummary[] }, AppError>> {
  const [run] = await db.select({ soundingCount: modelRuns.soundingCount }).from(modelRuns).where(eq(modelRuns.id, runId));
  if (!run) return err(appError('NOT_FOUND', 'That model run does not exist (it may have been deleted already).'));
  const { levels: _levels, ...columns } = getTableColumns(gridSoundings);
  const rows = await db.select(columns).from(gridSoundings).where(eq(gridSoundings.runId, runId)).orderBy(asc(gridSoundings.pointIndex)).offset(page.offset).limit(page.limit);
  return ok({ total: run.soundingCount, items: rows.map(summaryOf) });
}

/** A grid sounding with its levels and a fresh analysis (made in the worker pool). */
export interface GridSoundingDetail extends GridSoundingSummary {
  model: string;
  cycleTime: string;
  forecastHour: number;
  validTime: string;
  levels: SoundingLevel[];
  analysis: SoundingAnalysis | null;
}

/** Read one grid sounding (`${runId}:${pointIndex}`), unpack its levels and analyse them in the pool. */
export async function getGridSounding(db: DatabaseOrTransaction, id: string): Promise<Result<GridSoundingDetail, AppError>> {
  const [runId = '', point = ''] = id.split(':');
  const [row] = await db
    .select({ sounding: gridSoundings, model: modelRuns.model, cycleTime: modelRuns.cycleTime, forecastHour: modelRuns.forecastHour, validTime: modelRuns.validTime })
    .from(gridSoundings)
    .innerJoin(modelRuns, eq(modelRuns.id, gridSoundings.runId))
    .where(and(eq(gridSoundings.runId, runId), eq(gridSoundings.pointIndex, Number(point))));
  if (!row) return err(appError('NOT_FOUND', 'That grid sounding does not exist (its run may have been deleted).'));
  const levels = unpackLevels(levelsFromBytes(row.sounding.levels));
  const validTime = row.validTime.toISOString();
  const answer = await runSoundingTask({
    kind: 'structured',
    input: { metadata: { station: `G${row.sounding.pointIndex}`.slice(0, 15), name: `${row.model} grid point`, latitude: row.sounding.latitude, longitude: row.sounding.longitude, validTime, source: 'model' }, levels },
  });
  return ok({
    ...summaryOf(row.sounding),
    model: row.model,
    cycleTime: row.cycleTime.toISOString(),
    forecastHour: row.forecastHour,
    validTime,
    levels,
    analysis: answer.ok ? answer.analysis : null,
  });
}
