/**
 * The intake that runs on its own: a watched folder (chokidar) whose files are taken in one at a
 * time and moved to done/ or failed/, and a timer that pulls the configured HTTP(S) sources when
 * they are due. Started with the app, stopped with it.
 */
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { watch, type FSWatcher } from 'chokidar';
import { eq, inArray } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Config } from '../../config';
import type { Database } from '../../db/client';
import { intakeFiles, intakeSources } from '../../db/schema';
import { DEFAULT_MAX_INTAKE_BYTES, processIntakeFile } from './process-file';
import { pullSource, type PullLimits, type PullSummary } from './pull-sources';

/** The folder's display name in the intake list. */
export const FOLDER_SOURCE_NAME = 'intake folder';

/** Default limits of a pull: 10 minutes and the intake's file size limit. */
export const DEFAULT_PULL_LIMITS: PullLimits = { timeoutMs: 10 * 60_000, maxBytes: DEFAULT_MAX_INTAKE_BYTES };

export interface IntakeRuntime {
  folder: string;
  /** Queue a pull of one source now; resolves when it has been taken in. */
  pullNow(sourceId: string): Promise<PullSummary | null>;
  /** Resolves when every queued file and pull is finished (tests). */
  idle(): Promise<void>;
  /** Number of files and pulls waiting or running. */
  pending(): number;
  stop(): Promise<void>;
}

const runtimes = new WeakMap<Database, IntakeRuntime>();

/** The running intake of this app's database, if it was started. */
export function intakeRuntimeOf(db: Database): IntakeRuntime | undefined {
  return runtimes.get(db);
}

interface IntakeDeps {
  config: Config;
  db: Database;
  logger: Logger;
}

/**
 * Creates the folder with done/ and failed/, watches it, and starts the pull timer.
 * Files already in the folder are taken in at start. Records left "processing" by a stopped
 * server are marked failed, so their files (still in the folder) are taken in again.
 */
export async function startIntake(deps: IntakeDeps, folder: string): Promise<IntakeRuntime> {
  const { db, logger, config } = deps;
  const done = path.join(folder, 'done');
  const failed = path.join(folder, 'failed');
  const work = path.join(folder, '.pulling');
  await Promise.all([mkdir(done, { recursive: true }), mkdir(failed, { recursive: true }), mkdir(work, { recursive: true })]);
  await db
    .update(intakeFiles)
    .set({ state: 'failed', failure: 'The server stopped while this file was being taken in; a file still in the folder is taken in again.', finishedAt: new Date() })
    .where(inArray(intakeFiles.state, ['received', 'processing']));

  const controller = new AbortController();
  const maxBytes = config.intakeMaxBytes ?? DEFAULT_MAX_INTAKE_BYTES;
  const processOptions = { maxBytes, folders: { done, failed }, signal: controller.signal };
  const ctx = { db, logger, env: config.env };
  let chain: Promise<unknown> = Promise.resolve();
  let waiting = 0;
  let stopped = false;
  const queued = new Set<string>();

  function enqueue<T>(job: () => Promise<T>): Promise<T | null> {
    waiting++;
    const next = chain.then(async () => {
      try {
        if (stopped) return null;
        return await job();
      } catch (error) {
        logger.error({ err: error }, 'intake job failed');
        return null;
      } finally {
        waiting--;
      }
    });
    chain = next;
    return next;
  }

  const takeFile = (filePath: string) => {
    if (queued.has(filePath)) return;
    queued.add(filePath);
    void enqueue(async () => {
      queued.delete(filePath);
      return processIntakeFile(ctx, filePath, { origin: 'folder', sourceName: FOLDER_SOURCE_NAME }, processOptions);
    });
  };

  const watcher: FSWatcher = watch(folder, {
    depth: 0,
    ignoreInitial: false,
    ignored: (candidate: string) => {
      const relative = path.relative(folder, candidate);
      if (relative === '') return false;
      const first = relative.split(path.sep)[0] ?? '';
      return first.startsWith('.') || first === 'done' || first === 'failed';
    },
    awaitWriteFinish: { stabilityThreshold: config.intakeSettleMs ?? 1000, pollInterval: 100 },
  });
  watcher.on('add', takeFile);
  watcher.on('error', (error) => logger.error({ err: error }, 'intake folder watcher'));
  await new Promise<void>((resolve) => watcher.once('ready', () => resolve()));

  const limits = { ...DEFAULT_PULL_LIMITS, maxBytes };
  const pull = (source: typeof intakeSources.$inferSelect) => enqueue(() => pullSource(ctx, source, new Date(), { workFolder: work, limits, process: processOptions }));
  const pollMs = config.intakePollMs ?? 60_000;
  const timer =
    pollMs > 0
      ? setInterval(() => {
          void (async () => {
            const sources = await db.select().from(intakeSources).where(eq(intakeSources.enabled, true));
            const now = Date.now();
            for (const source of sources) {
              const due = !source.lastPolledAt || now - source.lastPolledAt.getTime() >= source.intervalMinutes * 60_000;
              if (due && !stopped) await pull(source);
            }
          })().catch((error: unknown) => logger.error({ err: error }, 'intake pull timer'));
        }, pollMs)
      : undefined;
  timer?.unref();

  const runtime: IntakeRuntime = {
    folder,
    async pullNow(sourceId) {
      const [source] = await db.select().from(intakeSources).where(eq(intakeSources.id, sourceId));
      if (!source) return null;
      return pull(source);
    },
    idle: async () => {
      while (waiting > 0) await chain;
    },
    pending: () => waiting,
    async stop() {
      if (stopped) return;
      stopped = true;
      if (timer) clearInterval(timer);
      controller.abort();
      await watcher.close();
      await chain.catch(() => undefined);
      runtimes.delete(db);
    },
  };
  runtimes.set(db, runtime);
  logger.info({ folder }, 'intake folder watched');
  return runtime;
}
