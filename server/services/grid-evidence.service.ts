import { toModelRunSummary } from './model-runs.service';
import { and, asc, desc, eq, gte, inArray, lte } from 'drizzle-orm';
import { MAX_EVIDENCE_RUNS, type EvidenceRunSelection, type RunBrief, type UpdateEvidenceRunsInput } from '../../shared/contracts/model-fields';
import { keyFigureKeys, type KeyFigureKey } from '../../shared/sounding/key-figures';
import { isEditableState } from '../../shared/workflow/transitions';
import { appError, type AppError, type FieldIssue } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database, DatabaseOrTransaction } from '../db/client';
import { gridSoundings, modelRuns, outlookEvidenceRuns, outlooks } from '../db/schema';
import { packRunFigures, runFiguresFromRows, type PackedRunFigures, type RunFigures } from '../workers/grid-evidence-report';

export { evidenceSources, gridCandidates, runFiguresFromRows, type RunFigures } from '../workers/grid-evidence-report';

/**
 * Grid soundings as evidence. A run's key figures are read once (only the figure columns, never
 * the packed levels) into typed arrays with a spatial index over its points, and kept in memory:
 * a ready run never changes, so the cache only has to forget runs that are deleted. Evidence then
 * picks the points inside each area's bounding box through the index and makes evidence
 * soundings of those alone; the exact point-in-polygon test stays in the evidence report.
 */

/** Runs whose figures stay in memory (about 5 MB for a 40,000-point run). */
export const MAX_CACHED_RUNS = 8;

const cache = new Map<string, RunFigures>();

/** Drops a run's cached figures (call after deleting a run; reads also notice deleted runs). */
export function forgetRunFigures(runId: string): void {
  cache.delete(runId);
}

/** Test and bench hook: empties the cache. */
export function clearRunFiguresCache(): void {
  cache.clear();
}

type RunRow = typeof modelRuns.$inferSelect;

export function toRunSummary(row: RunRow): RunBrief {
  const { id, model, cycleTime, forecastHour, validTime, gridKind, nx, ny, soundingCount } = toModelRunSummary(row);
  return { id, model, cycleTime, forecastHour, validTime, gridKind, nx, ny, soundingCount };
}

/** The figure columns of grid_soundings, selected by name: the levels are never read here. */
// eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- built from keyFigureKeys, one column per key.
const figureColumns = Object.fromEntries(keyFigureKeys.map((key) => [key, gridSoundings[key]])) as { [K in KeyFigureKey]: (typeof gridSoundings)[K] };

/** Reads a run's figures into typed arrays and indexes its points. */
export async function readRunFigures(db: DatabaseOrTransaction, run: RunBrief): Promise<RunFigures> {
  const rows = await db
    .select({ pointIndex: gridSoundings.pointIndex, latitude: gridSoundings.latitude, longitude: gridSoundings.longitude, flagCount: gridSoundings.flagCount, ...figureColumns })
    .from(gridSoundings)
    .where(eq(gridSoundings.runId, run.id))
    .orderBy(asc(gridSoundings.pointIndex));
  return runFiguresFromRows(run, rows);
}

/**
 * The figures of the given ready runs, from the cache when it has them. Cached runs that are
 * gone from the database (deleted by retention or by hand) are dropped first.
 */
export async function runFigures(db: DatabaseOrTransaction, runs: readonly RunBrief[]): Promise<RunFigures[]> {
  const cachedIds = [...cache.keys()];
  if (cachedIds.length) {
    const alive = new Set((await db.select({ id: modelRuns.id }).from(modelRuns).where(inArray(modelRuns.id, cachedIds))).map((r) => r.id));
    for (const id of cachedIds) if (!alive.has(id)) cache.delete(id);
  }
  const result: RunFigures[] = [];
  for (const run of runs) {
    let figures = cache.get(run.id);
    if (figures) {
      cache.delete(run.id); // re-insert: most recently used last
    } else {
      figures = await readRunFigures(db, run);
    }
    cache.set(run.id, figures);
    result.push(figures);
  }
  while (cache.size > MAX_CACHED_RUNS) {
    const oldest = cache.keys().next().value;
    if (oldest === undefined) break;
    cache.delete(oldest);
  }
  return result;
}

// ——— Which runs feed an outlook's evidence ———

/** Ready runs valid within the period, newest cycle first (then by valid time); at most 50. */
async function runsValidIn(db: DatabaseOrTransaction, validFrom: Date, validUntil: Date): Promise<RunBrief[]> {
  const rows = await db
    .select()
    .from(modelRuns)
    .where(and(eq(modelRuns.state, 'ready'), gte(modelRuns.validTime, validFrom), lte(modelRuns.validTime, validUntil)))
    .orderBy(desc(modelRuns.cycleTime), asc(modelRuns.validTime), asc(modelRuns.model))
    .limit(50);
  return rows.map(toRunSummary);
}

interface OutlookPeriod {
  id: string;
  validFrom: string;
  validUntil: string;
}

/**
 * The runs feeding an outlook's evidence: the author's pick (runs since deleted or no longer
 * ready are skipped), or by default the ready runs valid in the outlook period, newest cycle
 * first, at most MAX_EVIDENCE_RUNS.
 */
export async function evidenceRunsOf(db: DatabaseOrTransaction, outlook: OutlookPeriod): Promise<{ mode: 'chosen' | 'default'; version: number; runs: RunBrief[]; available: RunBrief[] }> {
  const [stored] = await db.select().from(outlookEvidenceRuns).where(eq(outlookEvidenceRuns.outlookId, outlook.id));
  const available = await runsValidIn(db, new Date(outlook.validFrom), new Date(outlook.validUntil));
  const version = stored?.version ?? 0;
  if (stored && stored.runIds.length > 0) {
    const rows = await db.select().from(modelRuns).where(and(inArray(modelRuns.id, stored.runIds), eq(modelRuns.state, 'ready')));
    const byId = new Map(rows.map((r) => [r.id, toRunSummary(r)]));
    return { mode: 'chosen', version, runs: stored.runIds.flatMap((id) => byId.get(id) ?? []), available };
  }
  return { mode: 'default', version, runs: available.slice(0, MAX_EVIDENCE_RUNS), available };
}

/**
 * Grid evidence of an outlook: the feeding runs, their figures packed for the worker pool
 * (see grid-evidence-report.ts) and how many grid soundings are valid in the period.
 */
export async function gridEvidenceOf(db: DatabaseOrTransaction, outlook: OutlookPeriod): Promise<{ runs: RunBrief[]; packed: PackedRunFigures[]; soundingCount: number }> {
  const { runs } = await evidenceRunsOf(db, outlook);
  if (runs.length === 0) return { runs, packed: [], soundingCount: 0 };
  const figures = await runFigures(db, runs);
  const from = Date.parse(outlook.validFrom);
  const until = Date.parse(outlook.validUntil);
  const soundingCount = figures.reduce((sum, f) => {
    const t = Date.parse(f.run.validTime);
    return t >= from && t <= until ? sum + f.count : sum;
  }, 0);
  return { runs, packed: figures.map(packRunFigures), soundingCount };
}

const outlookNotFound = () => appError('NOT_FOUND', 'That outlook does not exist.');

async function outlookRow(db: DatabaseOrTransaction, outlookId: string) {
  const [row] = await db.select({ id: outlooks.id, state: outlooks.state, validFrom: outlooks.validFrom, validUntil: outlooks.validUntil }).from(outlooks).where(eq(outlooks.id, outlookId));
  return row ? { id: row.id, state: row.state, validFrom: row.validFrom.toISOString(), validUntil: row.validUntil.toISOString() } : null;
}

/** GET: the runs feeding the outlook's evidence now, and the runs that may be picked. */
export async function getEvidenceRunSelection(db: Database, outlookId: string): Promise<Result<EvidenceRunSelection, AppError>> {
  const outlook = await outlookRow(db, outlookId);
  if (!outlook) return err(outlookNotFound());
  const selection = await evidenceRunsOf(db, outlook);
  return ok({ outlookId, ...selection });
}

/**
 * PATCH: stores the author's pick (an empty list returns to the default). Like every outlook edit
 * it needs an editable outlook and the version the author loaded; a stale version is a conflict.
 * Each picked run must be ready and valid in the outlook period.
 */
export async function updateEvidenceRuns(db: Database, actor: Actor, outlookId: string, input: UpdateEvidenceRunsInput): Promise<Result<EvidenceRunSelection, AppError>> {
  const outlook = await outlookRow(db, outlookId);
  if (!outlook) return err(outlookNotFound());
  if (!isEditableState(outlook.state)) return err(appError('CONFLICT', 'This outlook can no longer be edited, so its evidence runs stay as they are.'));
  if (input.runIds.length) {
    const rows = await db.select().from(modelRuns).where(inArray(modelRuns.id, input.runIds));
    const byId = new Map(rows.map((r) => [r.id, r]));
    const from = Date.parse(outlook.validFrom);
    const until = Date.parse(outlook.validUntil);
    const issues: FieldIssue[] = input.runIds.flatMap((id, index): FieldIssue[] => {
      const row = byId.get(id);
      if (!row) return [{ path: `runIds.${index}`, message: `Run ${id} does not exist (it may have been deleted).` }];
      const name = `${row.model} ${row.cycleTime.toISOString().slice(0, 13)}Z +${row.forecastHour} h`;
      if (row.state !== 'ready') return [{ path: `runIds.${index}`, message: `Run ${name} is not ready yet (it is ${row.state}).` }];
      const t = row.validTime.getTime();
      if (t < from || t > until) return [{ path: `runIds.${index}`, message: `Run ${name} is valid at ${row.validTime.toISOString()}, outside the outlook period.` }];
      return [];
    });
    if (issues.length) return err(appError('VALIDATION_FAILED', issues[0]?.message, { issues }));
  }
  const conflict = () => err(appError('CONFLICT', 'The evidence runs of this outlook were changed by someone else since you opened it. Reload to see their pick.'));
  const values = { runIds: input.runIds, version: input.version + 1, updatedBy: actor.userId, updatedAt: new Date() };
  if (input.version === 0) {
    const inserted = await db.insert(outlookEvidenceRuns).values({ outlookId, ...values }).onConflictDoNothing().returning({ outlookId: outlookEvidenceRuns.outlookId });
    if (inserted.length === 0) return conflict();
  } else {
    const updated = await db
      .update(outlookEvidenceRuns)
      .set(values)
      .where(and(eq(outlookEvidenceRuns.outlookId, outlookId), eq(outlookEvidenceRuns.version, input.version)))
      .returning({ outlookId: outlookEvidenceRuns.outlookId });
    if (updated.length === 0) return conflict();
  }
  return getEvidenceRunSelection(db, outlookId);
}
