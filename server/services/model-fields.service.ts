import { desc, eq } from 'drizzle-orm';
import type { FieldRunList, ModelField } from '../../shared/contracts/model-fields';
import { fieldDefinitions } from '../../shared/model-fields/field-bands';
import type { FieldContours, GridField } from '../../shared/model-fields/contour-field';
import type { KeyFigureKey } from '../../shared/sounding/key-figures';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Database } from '../db/client';
import { modelRuns } from '../db/schema';
import { runGeometryTask } from '../workers/geometry-pool';
import { runFigures, toRunSummary, type RunFigures } from './grid-evidence.service';

/** Ready runs listed for the map's field picker, newest valid time first. */
export const MAX_FIELD_RUNS_LISTED = 100;
/** Contoured fields kept in memory (a ready run never changes; a deleted run's entries are dropped on read). */
const MAX_CACHED_FIELDS = 32;

const fieldCache = new Map<string, { contours: FieldContours; valuedPoints: number }>();

/** GET /api/model-fields: the ready runs whose fields can be drawn. */
export async function listFieldRuns(db: Database): Promise<Result<FieldRunList, AppError>> {
  const rows = await db.select().from(modelRuns).where(eq(modelRuns.state, 'ready')).orderBy(desc(modelRuns.validTime), desc(modelRuns.cycleTime)).limit(MAX_FIELD_RUNS_LISTED);
  return ok({ runs: rows.map(toRunSummary) });
}

/** The run's grid (nx × ny, point row × nx + column) with one figure's values; NaN where the grid has no sounding. */
export function gridFieldOf(figures: RunFigures, figure: KeyFigureKey): { field: GridField; valuedPoints: number } {
  const { nx, ny } = figures.run;
  const size = nx * ny;
  const values = new Float32Array(size).fill(NaN);
  const latitude = new Float64Array(size).fill(NaN);
  const longitude = new Float64Array(size).fill(NaN);
  const column = figures.figures[figure];
  let valuedPoints = 0;
  for (let i = 0; i < figures.count; i++) {
    const point = figures.pointIndex[i] ?? -1;
    if (point < 0 || point >= size) continue;
    const value = column[i] ?? NaN;
    values[point] = value;
    latitude[point] = figures.latitude[i] ?? NaN;
    longitude[point] = figures.longitude[i] ?? NaN;
    if (!Number.isNaN(value)) valuedPoints++;
  }
  return { field: { nx, ny, values, latitude, longitude }, valuedPoints };
}

/**
 * Filled contour bands of one key figure of a run, for the map. The bands are traced in the
 * geometry worker pool (d3-contour over the grid) and kept in memory per run and figure.
 */
export async function getModelField(db: Database, runId: string, figure: KeyFigureKey): Promise<Result<ModelField, AppError>> {
  const [row] = await db.select().from(modelRuns).where(eq(modelRuns.id, runId));
  if (!row) {
    for (const key of fieldCache.keys()) if (key.startsWith(`${runId}/`)) fieldCache.delete(key);
    return err(appError('NOT_FOUND', 'That model run does not exist (it may have been deleted).'));
  }
  if (row.state !== 'ready') return err(appError('CONFLICT', `This model run is not ready yet (it is ${row.state}); its fields can be drawn once it is analysed.`));
  const run = toRunSummary(row);
  const definition = fieldDefinitions[figure];
  const key = `${runId}/${figure}`;
  let cached = fieldCache.get(key);
  if (!cached) {
    const [figures] = await runFigures(db, [run]);
    if (!figures) throw new Error('runFigures returned no run');
    const { field, valuedPoints } = gridFieldOf(figures, figure);
    const contours = await runGeometryTask({ kind: 'field-contours', input: { field, figure } });
    if (!contours.ok) return contours;
    cached = { contours: contours.value, valuedPoints };
    fieldCache.set(key, cached);
    while (fieldCache.size > MAX_CACHED_FIELDS) {
      const oldest = fieldCache.keys().next().value;
      if (oldest === undefined) break;
      fieldCache.delete(oldest);
    }
  }
  return ok({
    run,
    figure,
    label: definition.label,
    unit: definition.unit,
    quantity: definition.quantity,
    sense: definition.sense,
    bands: cached.contours.bands,
    valuedPoints: cached.valuedPoints,
    stride: cached.contours.stride,
    features: cached.contours.features,
  });
}
