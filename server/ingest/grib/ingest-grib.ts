/**
 * GRIB2 intake: one model file becomes one or more model runs (one per cycle and forecast hour)
 * of grid soundings inside the office region. Decoding is ecCodes' (child processes), analysis
 * runs in the worker pool, and storage is compact (figures in columns, levels packed). Every
 * expected failure (missing tools, damaged file, no point in the region…) is a Result with a
 * reason in words; nothing here throws to the caller.
 */
import { stat } from 'node:fs/promises';
import { and, eq, sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import { z } from 'zod';
import { keyFigureKeys } from '../../../shared/sounding';
import { err, ok, type Result } from '../../../shared/result';
import type { Database } from '../../db/client';
import { gridSoundings, modelRuns, offices } from '../../db/schema';
import { deleteRunSoundings, scheduleRunRetention } from '../../services/model-runs.service';
import { runInSoundingPool, soundingPoolThreads } from '../../workers/sounding-pool';
import { eccodesStatus } from '../eccodes';
import { buildGridSoundings, geopotentialToHeight, levelBytes, type IsobaricFields, type RunFields, type SurfaceFields } from './build-soundings';
import { gribLimits, listGribMessages, streamGribValues, type GribMessage } from './decode-grib';
import type { GridAnalysisResult, GridAnalysisTask } from './grid-analysis.worker';
import { selectGridPoints, type GridSelection } from './grid-selection';

/** Tuning of one intake (defaults suit the 2-core machine). */
export interface GribIngestConfig {
  /** Soundings per worker task. */
  batchSize?: number;
  /** Rows per database insert. */
  insertRows?: number;
}

/** What intake needs from the app (an AppContext fits). */
export interface GribIngestContext {
  db: Database;
  logger: Logger;
  /** The app's configuration (not read yet; accepted so an AppContext can be passed as it is). */
  config?: object;
  gribTuning?: GribIngestConfig;
}

export interface GribIngestInput {
  officeId: string;
  filePath: string;
  /** Model name shown in the library (default: the file's originating centre). */
  model?: string;
  /** Keep points about this far apart, km (default: every point). */
  thinningKm?: number;
  onProgress?: (done: number, total: number) => void;
  signal?: AbortSignal;
}

export interface GribIngestSummary {
  runIds: string[];
  soundingCount: number;
  storedBytes: number;
}

const WORKER_FILE = new URL('./grid-analysis.worker.ts', import.meta.url).href;
const inputSchema = z.object({
  officeId: z.string().uuid({ message: 'officeId must be an office id (UUID).' }),
  filePath: z.string().min(1, { message: 'filePath is required.' }),
  model: z.string().trim().min(1, { message: 'The model name must not be empty.' }).max(64, { message: 'Keep the model name under 64 characters.' }).optional(),
  thinningKm: z.number().min(0).max(500, { message: 'thinningKm must be between 0 and 500 km.' }).optional(),
});

/** Where a message's values go. */
type FieldTarget = { runKey: string; kind: 'isobaric'; pressureHpa: number; field: keyof IsobaricFields; geopotential: boolean } | { runKey: string; kind: 'surface'; field: keyof SurfaceFields; geopotential: boolean };

const isobaricFields: Record<string, keyof IsobaricFields> = { t: 'temperatureK', gh: 'heightM', z: 'heightM', r: 'relativeHumidityPct', q: 'specificHumidity', dpt: 'dewpointK', u: 'uMs', v: 'vMs' };
const surfaceFields: Record<string, keyof SurfaceFields> = { sp: 'pressurePa', orog: 'orographyM', '2t': 'temperature2mK', '2d': 'dewpoint2mK', '2r': 'relativeHumidity2mPct', '10u': 'u10mMs', '10v': 'v10mMs' };

/** The field a message feeds, or null when intake does not use it. */
function targetOf(message: GribMessage): FieldTarget | null {
  const runKey = `${message.cycleTime}|${message.forecastHour}`;
  const isobaric = message.typeOfLevel === 'isobaricInhPa' ? message.level : message.typeOfLevel === 'isobaricInPa' ? message.level / 100 : null;
  if (isobaric !== null) {
    const field = isobaricFields[message.shortName];
    return field ? { runKey, kind: 'isobaric', pressureHpa: isobaric, field, geopotential: message.shortName === 'z' } : null;
  }
  if (message.typeOfLevel === 'surface' && message.shortName === 'z') return { runKey, kind: 'surface', field: 'orographyM', geopotential: true };
  const field = surfaceFields[message.shortName];
  return field ? { runKey, kind: 'surface', field, geopotential: false } : null;
}

interface RunGroup {
  key: string;
  cycleTime: string;
  forecastHour: number;
  validTime: string;
  fields: RunFields;
}

/**
 * Take a GRIB2 file in: decode, build and analyse one sounding per grid point inside the office
 * region (levels below ground dropped, optionally thinned), store the runs. A run already stored
 * with the same model, cycle and forecast hour is replaced.
 * @returns the runs made and their size, or the reason nothing (more) was stored
 */
export async function ingestGribFile(ctx: GribIngestContext, input: GribIngestInput): Promise<Result<GribIngestSummary, { reason: string }>> {
  try {
    return await ingest(ctx, input);
  } catch (error) {
    ctx.logger.error({ err: error, filePath: input.filePath }, 'GRIB intake failed unexpectedly');
    return err({ reason: `Stormdraft failed while taking this GRIB file in (${error instanceof Error ? error.message : 'unknown error'}). Nothing more was stored.` });
  }
}

async function ingest(ctx: GribIngestContext, rawInput: GribIngestInput): Promise<Result<GribIngestSummary, { reason: string }>> {
  const parsed = inputSchema.safeParse(rawInput);
  if (!parsed.success) return err({ reason: parsed.error.issues.map((issue) => issue.message).join(' ') });
  const input = { ...rawInput, ...parsed.data };
  const { db, logger } = ctx;
  const status = await eccodesStatus();
  if (!status.available) return err({ reason: status.message });

  const [office] = await db.select({ id: offices.id, region: offices.region }).from(offices).where(eq(offices.id, input.officeId));
  if (!office) return err({ reason: 'No office has that id.' });

  const info = await stat(input.filePath).catch(() => null);
  if (!info?.isFile()) return err({ reason: 'The file could not be found or is not a regular file.' });
  if (info.size === 0) return err({ reason: 'The file is empty.' });
  if (info.size > gribLimits.maxFileBytes) return err({ reason: `The file is ${info.size} bytes; at most ${gribLimits.maxFileBytes} bytes are taken.` });

  const startedAt = performance.now();
  const listed = await listGribMessages(input.filePath, input.signal);
  if (!listed.ok) return listed;
  const messages = listed.value;
  const first = messages[0]!;
  if (first.gridType !== 'regular_ll' && first.gridType !== 'lambert') {
    return err({ reason: `The grid is ${first.gridType}; only regular latitude–longitude and Lambert conformal grids are taken.` });
  }
  if (messages.some((message) => message.gridHash !== first.gridHash || message.numberOfValues !== first.numberOfValues)) {
    return err({ reason: 'The messages are not all on the same grid; send one grid per file.' });
  }
  if (first.jPointsAreConsecutive) return err({ reason: 'The grid is stored column by column (j points consecutive), which intake does not take.' });

  const targets = messages.map(targetOf);
  const groups = new Map<string, RunGroup>();
  for (const [index, target] of targets.entries()) {
    if (!target || groups.has(target.runKey)) continue;
    const message = messages[index]!;
    groups.set(target.runKey, { key: target.runKey, cycleTime: message.cycleTime, forecastHour: message.forecastHour, validTime: message.validTime, fields: { pointCount: 0, isobaric: new Map(), surface: {} } });
  }
  if (groups.size === 0) return err({ reason: 'The file holds none of the fields intake reads (isobaric t, gh or z, r/q/dpt, u, v; surface sp, orog, 2t, 2d, 10u, 10v).' });

  // Decode: the first message's coordinates choose the points; each used message fills an array.
  let selection: GridSelection | null = null;
  const arrays: (Float32Array | null)[] = messages.map(() => null);
  const decoded = await streamGribValues(input.filePath, messages, {
    onCoordinates(latitudes, longitudes) {
      const chosen = selectGridPoints(latitudes, longitudes, first.ni, office.region, input.thinningKm);
      if (!chosen.ok) return chosen.error.reason;
      selection = chosen.value;
      for (const [index, target] of targets.entries()) if (target) arrays[index] = new Float32Array(chosen.value.pointIndex.length).fill(NaN);
      return null;
    },
    slotOf: (point) => (selection ? (selection.slotOfPoint[point]!) : -1),
    onValue(messageIndex, slot, value) {
      const array = arrays[messageIndex];
      if (array) array[slot] = value;
    },
  }, input.signal);
  if (!decoded.ok) return decoded;
  const chosen = selection as GridSelection | null;
  if (!chosen) return err({ reason: 'The file gave no grid coordinates.' });

  for (const [index, target] of targets.entries()) {
    const array = arrays[index];
    if (!target || !array) continue;
    const group = groups.get(target.runKey)!;
    group.fields.pointCount = array.length;
    const values = target.geopotential ? geopotentialToHeight(array) : array;
    if (target.kind === 'surface') group.fields.surface[target.field] = values;
    else {
      const level = group.fields.isobaric.get(target.pressureHpa) ?? {};
      level[target.field] = values;
      group.fields.isobaric.set(target.pressureHpa, level);
    }
  }

  const decodedMs = Math.round(performance.now() - startedAt);
  const model = input.model ?? first.centre;
  const runIds: string[] = [];
  let soundingCount = 0;
  let storedBytes = 0;
  const ordered = [...groups.values()].sort((a, b) => a.validTime.localeCompare(b.validTime));
  const builds = ordered.map((group) => ({ group, packed: buildGridSoundings(group.fields) }));
  const total = builds.reduce((sum, { packed }) => sum + packed.usable.reduce((n, u) => n + u, 0), 0);
  let done = 0;
  input.onProgress?.(0, total);
  for (const { group, packed } of builds) {
    const levelsPresent = [...group.fields.isobaric.values()].filter((level) => level.temperatureK && level.heightM).length;
    const humidityPresent = [...group.fields.isobaric.values()].some((level) => level.relativeHumidityPct ?? level.specificHumidity ?? level.dewpointK);
    const missing = levelsPresent < 5 ? 'temperature and geopotential height on at least 5 isobaric levels' : !humidityPresent ? 'a humidity field (dewpoint, relative or specific humidity) on isobaric levels' : null;
    if (missing) return err({ reason: `The run of ${group.cycleTime} +${group.forecastHour} h lacks ${missing}.` });

    // Replace a run stored before with the same model, cycle and forecast hour.
    await db.delete(modelRuns).where(and(eq(modelRuns.officeId, office.id), eq(modelRuns.model, model), eq(modelRuns.cycleTime, new Date(group.cycleTime)), eq(modelRuns.forecastHour, group.forecastHour)));
    const [run] = await db
      .insert(modelRuns)
      .values({
        officeId: office.id, model, cycleTime: new Date(group.cycleTime), forecastHour: group.forecastHour, validTime: new Date(group.validTime),
        gridKind: first.gridType, nx: chosen.nx, ny: chosen.ny, levelCount: group.fields.isobaric.size + (group.fields.surface.pressurePa ? 1 : 0), state: 'analysing',
      })
      .returning({ id: modelRuns.id });
    if (!run) return err({ reason: 'The run could not be recorded.' });
    const runId = run.id;
    runIds.push(runId);
    const stored = await analyseAndStore(ctx, runId, chosen, packed, input.signal, (count) => {
      done += count;
      input.onProgress?.(done, total);
    });
    if (!stored.ok) {
      // A part of a run is not evidence: its soundings go, the run stays as failed with the reason.
      await deleteRunSoundings(db, runId);
      await db.update(modelRuns).set({ state: 'failed', failure: stored.error.reason }).where(eq(modelRuns.id, runId));
      return stored;
    }
    const [size] = await db
      .select({ bytes: sql<string>`coalesce(sum(pg_column_size(${gridSoundings}.*)), 0)`, count: sql<number>`count(*)::int` })
      .from(gridSoundings)
      .where(eq(gridSoundings.runId, runId));
    const runBytes = Number(size?.bytes ?? 0);
    const runCount = Number(size?.count ?? 0);
    await db.update(modelRuns).set({ state: 'ready', soundingCount: runCount, storedBytes: runBytes }).where(eq(modelRuns.id, runId));
    soundingCount += runCount;
    storedBytes += runBytes;
    logger.info({ runId, model, cycleTime: group.cycleTime, forecastHour: group.forecastHour, soundings: runCount, storedBytes: runBytes, belowGroundDropped: packed.belowGroundDropped, decodedMs, totalMs: Math.round(performance.now() - startedAt) }, 'model run stored');
  }
  scheduleRunRetention(db, logger, office.id);
  return ok({ runIds, soundingCount, storedBytes });
}

/** Analyse the usable soundings in the pool (a few batches in flight) and insert them as they come back. */
async function analyseAndStore(
  ctx: GribIngestContext,
  runId: string,
  selection: GridSelection,
  packed: ReturnType<typeof buildGridSoundings>,
  signal: AbortSignal | undefined,
  progress: (count: number) => void,
): Promise<Result<void, { reason: string }>> {
  const batchSize = ctx.gribTuning?.batchSize ?? 1000;
  const insertRows = ctx.gribTuning?.insertRows ?? 200;
  const points: number[] = [];
  for (let slot = 0; slot < packed.usable.length; slot++) if (packed.usable[slot]) points.push(slot);
  const batches: number[][] = [];
  for (let i = 0; i < points.length; i += batchSize) batches.push(points.slice(i, i + batchSize));
  const keyCount = keyFigureKeys.length;

  const taskOf = (slots: number[]): GridAnalysisTask => {
    const starts = new Int32Array(slots.length + 1);
    let levelTotal = 0;
    for (const [i, slot] of slots.entries()) {
      starts[i] = levelTotal;
      levelTotal += (packed.starts[slot + 1]!) - (packed.starts[slot]!);
    }
    starts[slots.length] = levelTotal;
    const levels = new Float32Array(levelTotal * 6);
    for (const [i, slot] of slots.entries()) levels.set(packed.levels.subarray((packed.starts[slot]!) * 6, (packed.starts[slot + 1]!) * 6), (starts[i]!) * 6);
    return { levels, starts, latitudes: Float64Array.from(slots, (slot) => selection.latitude[slot]!) };
  };

  const store = async (slots: number[], answer: GridAnalysisResult) => {
    for (let from = 0; from < slots.length; from += insertRows) {
      const rows = slots.slice(from, from + insertRows).map((slot, offset) => {
        const i = from + offset;
        const figures: Record<string, number | null> = {};
        for (let key = 0; key < keyCount; key++) {
          const value = answer.figures[i * keyCount + key]!;
          figures[keyFigureKeys[key]!] = Number.isFinite(value) ? value : null;
        }
        const elevation = packed.elevationM[slot]!;
        return {
          runId,
          pointIndex: selection.pointIndex[slot]!,
          latitude: selection.latitude[slot]!,
          longitude: selection.longitude[slot]!,
          elevationM: Number.isFinite(elevation) ? elevation : null,
          levels: levelBytes(packed.levels, packed.starts[slot]!, packed.starts[slot + 1]!),
          flagCount: answer.flagCounts[i]!,
          ...figures,
        };
      });
      // PGlite runs on this thread: short statements with a turn of the event loop between
      // them let requests that arrived meanwhile queue their queries first.
      await new Promise((resolve) => setImmediate(resolve));
      await ctx.db.insert(gridSoundings).values(rows);
    }
    progress(slots.length);
  };

  // Keep at most threads + 1 batches in the pool so uploads queued meanwhile are not starved.
  const inFlightMax = soundingPoolThreads() + 1;
  let next = 0;
  let failure: string | null = null;
  let storing: Promise<void> = Promise.resolve();
  const worker = async () => {
    while (failure === null && next < batches.length) {
      if (signal?.aborted) {
        failure = 'The intake was cancelled.';
        break;
      }
      const slots = batches[next++]!;
      try {
        const answer = await runInSoundingPool<GridAnalysisTask, GridAnalysisResult>(WORKER_FILE, taskOf(slots), signal);
        // Inserts run one after another, in the order analyses finish.
        storing = storing.then(() => (failure === null ? store(slots, answer) : undefined));
        await storing;
      } catch (error) {
        failure ??= signal?.aborted ? 'The intake was cancelled.' : `Analysing the grid soundings failed: ${error instanceof Error ? error.message : 'unknown error'}.`;
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(inFlightMax, Math.max(1, batches.length)) }, worker));
  return failure === null ? ok(undefined) : err({ reason: failure });
}
