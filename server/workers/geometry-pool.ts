import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { GeometryEnvelope, GeometryTask, GeometryTaskResults } from './geometry-tasks';

const entry = fileURLToPath(new URL('./geometry-entry.mjs', import.meta.url));

/** Attempts per task: a worker that dies (e.g. a native renderer crash) is replaced and the task tried again. */
export const geometryTaskAttempts = 3;

let pool: Piscina<GeometryEnvelope, unknown> | undefined;
let drillsLeft = 0;

/**
 * The one pool of geometry workers for this process, started on first use. One thread per core
 * but one (at least one), so the event loop keeps a core for requests. Idle workers do not
 * keep the process alive.
 */
function geometryPool(): Piscina<GeometryEnvelope, unknown> {
  pool ??= new Piscina<GeometryEnvelope, unknown>({
    filename: entry,
    minThreads: 1,
    maxThreads: Math.max(1, availableParallelism() - 1),
    idleTimeout: 60_000,
    // Workers register TypeScript support themselves (geometry-entry.mjs); inherit no loaders.
    execArgv: [],
  });
  return pool;
}

/**
 * Runs a task off the event loop. A failed attempt (the worker died or threw) is retried in a
 * fresh worker; after the last attempt the caller gets SERVICE_UNAVAILABLE, never a crash.
 */
export async function runGeometryTask<K extends GeometryTask['kind']>(task: Extract<GeometryTask, { kind: K }>): Promise<Result<GeometryTaskResults[K], AppError>> {
  let lastError: unknown;
  for (let attempt = 1; attempt <= geometryTaskAttempts; attempt++) {
    const envelope: GeometryEnvelope = drillsLeft > 0 ? { ...task, drill: 'exit' } : task;
    if (drillsLeft > 0) drillsLeft--;
    try {
      // Our own worker returns the result type of the task kind it was given (geometry-tasks.ts).
      // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- piscina's run() is untyped; the worker maps each task kind to its result type.
      return ok((await geometryPool().run(envelope)) as GeometryTaskResults[K]);
    } catch (error) {
      lastError = error;
    }
  }
  return err(
    appError('SERVICE_UNAVAILABLE', 'The server could not finish this geometry work just now. Try again in a minute.', {
      details: { task: task.kind, reason: lastError instanceof Error ? lastError.message : String(lastError) },
    }),
  );
}

/** Test-only: the next `count` task attempts make their worker exit before working, as a crash would. */
export function crashNextGeometryAttempts(count: number): void {
  drillsLeft = count;
}

/** Stops the workers (graceful shutdown); a later task starts a new pool. */
export async function closeGeometryPool(): Promise<void> {
  const closing = pool;
  pool = undefined;
  await closing?.destroy();
}
