/**
 * Takes one file into the intake: hashes it (SHA-256), recognises its format by content, records
 * it in `intake_files` once per content, runs the format's ingester with progress, records the
 * outcome and moves the file to done/ or failed/. Never throws for a bad file: the reason is
 * recorded instead.
 */
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { mkdir, open, rename, stat, unlink } from 'node:fs/promises';
import path from 'node:path';
import { and, eq, inArray } from 'drizzle-orm';
import { intakeFiles } from '../../db/schema';
import { findOffice } from '../../services/office.service';
import { ingesters, type IngestContext } from './ingesters';
import { megabytes } from './megabytes';
import { recogniseFormat, RECOGNISE_BYTES } from './recognise-format';

/** Where a file came from. */
export interface IntakeOrigin {
  origin: 'folder' | 'pull';
  sourceName: string;
  sourceId?: string | null;
  /** Address fetched (pulls), without credentials. */
  url?: string | null;
  model?: string | undefined;
}

export interface ProcessOptions {
  /** Largest file taken, bytes. */
  maxBytes: number;
  /** done/ and failed/ folders the file is moved to afterwards; none: the file stays. */
  folders?: { done: string; failed: string } | undefined;
  signal?: AbortSignal | undefined;
}

export type ProcessOutcome = { state: 'done' | 'failed' | 'duplicate'; id: string } | { state: 'skipped' };

/** Largest file the intake takes by default, bytes (a regional model run is far smaller). */
export const DEFAULT_MAX_INTAKE_BYTES = 512 * 1024 * 1024;

async function sha256File(filePath: string): Promise<string> {
  const hash = createHash('sha256');
  const stream = createReadStream(filePath);
  stream.on('data', (chunk) => hash.update(chunk));
  await new Promise<void>((resolve, reject) => {
    stream.once('end', resolve);
    stream.once('error', reject);
  });
  return hash.digest('hex');
}

async function readHead(filePath: string): Promise<Buffer> {
  const handle = await open(filePath, 'r');
  try {
    const buffer = Buffer.alloc(RECOGNISE_BYTES);
    const { bytesRead } = await handle.read(buffer, 0, RECOGNISE_BYTES, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

/** Moves `filePath` into `folder`, never over an existing file (adds -1, -2 … before the extension). */
export async function moveInto(filePath: string, folder: string): Promise<string> {
  await mkdir(folder, { recursive: true });
  const ext = path.extname(filePath);
  const base = path.basename(filePath, ext);
  for (let n = 0; n < 1000; n++) {
    const target = path.join(folder, n === 0 ? `${base}${ext}` : `${base}-${n}${ext}`);
    try {
      await stat(target);
    } catch {
      await rename(filePath, target);
      return target;
    }
  }
  // A thousand files of the same name: drop this copy rather than loop (its record remains).
  await unlink(filePath);
  return filePath;
}

/** Throttles progress writes to one every `everyMs` (the last one always goes through at the end). */
function progressWriter(ctx: IngestContext, id: string, everyMs = 500) {
  let last = 0;
  let pending: Promise<unknown> = Promise.resolve();
  return {
    report(done: number, total: number) {
      const now = Date.now();
      if (now - last < everyMs && done < total) return;
      last = now;
      pending = pending.then(() => ctx.db.update(intakeFiles).set({ progressDone: done, progressTotal: total }).where(eq(intakeFiles.id, id))).catch((error: unknown) => ctx.logger.warn({ err: error }, 'intake progress not recorded'));
    },
    settle: () => pending,
  };
}

/**
 * Process one file. Returns what became of it; `skipped` when the path is no longer a file.
 */
export async function processIntakeFile(ctx: IngestContext, filePath: string, origin: IntakeOrigin, options: ProcessOptions): Promise<ProcessOutcome> {
  let size: number;
  try {
    const info = await stat(filePath);
    if (!info.isFile()) return { state: 'skipped' };
    size = info.size;
  } catch {
    return { state: 'skipped' };
  }
  const office = await findOffice(ctx.db);
  if (!office) throw new Error('no office row: ensureOffice() runs at start-up');
  const fileName = path.basename(filePath);
  const base = { officeId: office.id, origin: origin.origin, sourceName: origin.sourceName, sourceId: origin.sourceId ?? null, url: origin.url ?? null, fileName, sizeBytes: size };
  const move = async (state: 'done' | 'failed') => {
    if (!options.folders) return;
    try {
      await moveInto(filePath, state === 'done' ? options.folders.done : options.folders.failed);
    } catch (error) {
      ctx.logger.warn({ err: error, fileName }, 'intake file could not be moved');
    }
  };
  const recordFailure = async (contentHash: string, format: string, reason: string) => {
    // Moved first: once the record says failed, the file is already in failed/.
    await move('failed');
    const [row] = await ctx.db.insert(intakeFiles).values({ ...base, contentHash, format, state: 'failed', failure: reason, startedAt: new Date(), finishedAt: new Date() }).returning({ id: intakeFiles.id });
    return { state: 'failed' as const, id: row?.id ?? '' };
  };

  if (size > options.maxBytes) {
    return recordFailure(`oversize:${size}:${fileName}`, 'unknown', `${fileName} is ${megabytes(size)}; the intake takes files up to ${megabytes(options.maxBytes)}.`);
  }
  if (size === 0) return recordFailure(`empty:${fileName}`, 'unknown', `${fileName} is empty.`);
  const contentHash = await sha256File(filePath);
  const recognised = recogniseFormat(await readHead(filePath));
  if (recognised.format === 'unknown') return recordFailure(contentHash, 'unknown', recognised.reason ?? 'The format was not recognised.');

  const live = async () => {
    const [row] = await ctx.db
      .select({ id: intakeFiles.id })
      .from(intakeFiles)
      .where(and(eq(intakeFiles.officeId, office.id), eq(intakeFiles.contentHash, contentHash), inArray(intakeFiles.state, ['received', 'processing', 'done'])));
    return row?.id ?? null;
  };
  const duplicate = async (of: string) => {
    await move('done');
    const [row] = await ctx.db
      .insert(intakeFiles)
      .values({ ...base, contentHash, format: recognised.format, state: 'duplicate', duplicateOfId: of, notes: ['The same content was taken in before; nothing new was stored.'], startedAt: new Date(), finishedAt: new Date() })
      .returning({ id: intakeFiles.id });
    return { state: 'duplicate' as const, id: row?.id ?? '' };
  };
  const earlier = await live();
  if (earlier) return duplicate(earlier);
  let id: string;
  try {
    const [row] = await ctx.db.insert(intakeFiles).values({ ...base, contentHash, format: recognised.format, state: 'processing', startedAt: new Date() }).returning({ id: intakeFiles.id });
    if (!row) throw new Error('insert returned no row');
    id = row.id;
  } catch (error) {
    // Another instance took the same content at the same moment (the unique index refused this one).
    const raced = await live();
    if (raced) return duplicate(raced);
    throw error;
  }

  const progress = progressWriter(ctx, id);
  let outcome: Awaited<ReturnType<(typeof ingesters)['csv']>>;
  try {
    outcome = await ingesters[recognised.format](ctx, { officeId: office.id, filePath, model: origin.model, onProgress: (done, total) => progress.report(done, total), signal: options.signal });
  } catch (error) {
    ctx.logger.error({ err: error, fileName }, 'intake ingester failed');
    outcome = { ok: false, error: { reason: `${fileName} could not be taken in because of an unexpected error on the server; the error is in the server log.` } };
  }
  await progress.settle();
  if (!outcome.ok && options.signal?.aborted) {
    // Stopped with the server: the file stays where it is and is taken in again at the next start.
    await ctx.db.update(intakeFiles).set({ state: 'failed', failure: 'The server stopped while this file was being taken in; it is taken in again at the next start.', finishedAt: new Date() }).where(eq(intakeFiles.id, id));
    return { state: 'failed', id };
  }
  if (!outcome.ok) {
    await move('failed');
    await ctx.db.update(intakeFiles).set({ state: 'failed', failure: outcome.error.reason, finishedAt: new Date() }).where(eq(intakeFiles.id, id));
    return { state: 'failed', id };
  }
  await move('done');
  const value = outcome.value;
  await ctx.db
    .update(intakeFiles)
    .set({ state: 'done', soundingCount: value.soundingCount, duplicateSoundingCount: value.duplicateCount, runIds: value.runIds, notes: value.notes, finishedAt: new Date() })
    .where(eq(intakeFiles.id, id));
  return { state: 'done', id };
}
