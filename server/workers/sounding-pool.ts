/**
 * The worker pool that parses and analyses uploaded soundings (piscina), so no file, however
 * dense or odd, blocks the event loop; each file gets a time budget and a clear error past it.
 */
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import type { SoundingTask, SoundingTaskResult } from './sounding-analysis.worker';

/** Time budget of one file, ms (parse and analysis take under 50 ms for 5,000 levels). */
export const SOUNDING_TASK_BUDGET_MS = 5000;

let pool: Piscina<SoundingTask, SoundingTaskResult> | undefined;

/** Node options for the workers: TypeScript through tsx, as in the main process. */
function workerExecArgv(): string[] {
  const argv = process.execArgv.filter((arg) => !arg.startsWith('--inspect'));
  return argv.some((arg) => arg.includes('tsx')) ? argv : [...argv, '--import', 'tsx'];
}

function soundingPool(): Piscina<SoundingTask, SoundingTaskResult> {
  pool ??= new Piscina<SoundingTask, SoundingTaskResult>({
    filename: new URL('./sounding-analysis.worker.ts', import.meta.url).href,
    minThreads: 0,
    maxThreads: Math.max(1, Math.min(4, availableParallelism() - 1)),
    idleTimeout: 30_000,
    execArgv: workerExecArgv(),
  });
  return pool;
}

/** Outcome of one task: the worker's answer, or the budget ran out. */
export type PooledSoundingResult = SoundingTaskResult | { ok: false; timedOut: true };

/**
 * Run one sounding task in the pool within a time budget.
 * @param task - file or structured sounding
 * @param budgetMs - time budget, ms; past it the worker is stopped and the result says so
 */
export async function runSoundingTask(task: SoundingTask, budgetMs = SOUNDING_TASK_BUDGET_MS): Promise<PooledSoundingResult> {
  try {
    return await soundingPool().run(task, { signal: AbortSignal.timeout(budgetMs) });
  } catch (error) {
    if (error instanceof Error && (error.name === 'AbortError' || error.name === 'TimeoutError')) return { ok: false, timedOut: true };
    throw error;
  }
}

/**
 * Run a task of another worker file in the same pool (piscina takes a file per task), so
 * batch work such as GRIB intake shares the threads with uploads instead of adding more.
 * @param filename - URL of the worker module (its default export is the task)
 * @param signal - stops the task when aborted
 */
export function runInSoundingPool<Task, Answer>(filename: string, task: Task, signal?: AbortSignal): Promise<Answer> {
  // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- piscina types a pool by its default file's task; a task of another file has that file's own types.
  return (soundingPool() as unknown as Piscina<Task, Answer>).run(task, { filename, signal });
}

/** Threads of the pool (callers keep at most this many batch tasks queued, so uploads are not starved). */
export function soundingPoolThreads(): number {
  return soundingPool().options.maxThreads;
}

/** Stop the pool's threads (tests and shutdown). */
export async function closeSoundingPool(): Promise<void> {
  const current = pool;
  pool = undefined;
  if (current) await current.destroy();
}
