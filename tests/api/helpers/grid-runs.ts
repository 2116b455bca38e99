import type { Database } from '../../../server/db/client';
import { gridSoundings, modelRuns, offices } from '../../../server/db/schema';
import type { KeyFigureKey } from '../../../shared/sounding/key-figures';

export interface GridRunSpec {
  model: string;
  cycleTime: string;
  forecastHour: number;
  nx: number;
  ny: number;
  gridKind?: 'regular_ll' | 'lambert';
  state?: string;
  /** Position of grid point (column, row). */
  position: (column: number, row: number) => { latitude: number; longitude: number };
  /** Key figures of grid point (column, row); figures left out are null. */
  figures: (column: number, row: number) => Partial<Record<KeyFigureKey, number | null>>;
  /** Leave some points out, as a grid cropped to the region does. */
  skip?: (column: number, row: number) => boolean;
}

/** Writes a model run and its grid soundings straight into the tables (levels left empty). */
export async function insertGridRun(db: Database, spec: GridRunSpec): Promise<string> {
  const [office] = await db.select({ id: offices.id }).from(offices).limit(1);
  if (!office) throw new Error('no office');
  const cycle = new Date(spec.cycleTime);
  const rows: (typeof gridSoundings.$inferInsert)[] = [];
  const [run] = await db
    .insert(modelRuns)
    .values({
      officeId: office.id,
      model: spec.model,
      cycleTime: cycle,
      forecastHour: spec.forecastHour,
      validTime: new Date(cycle.getTime() + spec.forecastHour * 3_600_000),
      gridKind: spec.gridKind ?? 'regular_ll',
      nx: spec.nx,
      ny: spec.ny,
      levelCount: 0,
      state: spec.state ?? 'ready',
    })
    .returning({ id: modelRuns.id });
  if (!run) throw new Error('run not inserted');
  for (let row = 0; row < spec.ny; row++) {
    for (let column = 0; column < spec.nx; column++) {
      if (spec.skip?.(column, row)) continue;
      rows.push({ runId: run.id, pointIndex: row * spec.nx + column, ...spec.position(column, row), levels: new Uint8Array(0), ...spec.figures(column, row) });
    }
  }
  for (let i = 0; i < rows.length; i += 2000) await db.insert(gridSoundings).values(rows.slice(i, i + 2000));
  return run.id;
}
