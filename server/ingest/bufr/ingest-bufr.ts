/**
 * Takes one BUFR file of radiosonde observations into the library: ecCodes' `bufr_dump` decodes
 * it in a child process (time and output limited), each subset becomes one observed sounding,
 * and the soundings service validates, analyses (worker pool) and stores each one, recognising
 * soundings it already holds. A damaged file is a failure with a reason, never an exception.
 */
import { stat } from 'node:fs/promises';
import path from 'node:path';
import type { Logger } from 'pino';
import { err, ok, type Result } from '../../../shared/result';
import type { Database } from '../../db/client';
import { receiveIntakeSoundings } from '../../services/soundings.service';
import { DEFAULT_READ_LIMITS, readRadiosondes, type ReadLimits } from './read-radiosondes';
import { runTool } from './run-tool';
import { toSoundingInput } from './to-sounding-input';

/** Largest BUFR file taken, bytes (a day of an office's radiosondes is well under 1 MB). */
export const MAX_BUFR_FILE_BYTES = 16_000_000;
/** Most bytes of decoded JSON read from the decoder. */
export const MAX_BUFR_DUMP_BYTES = 48_000_000;
/** Time limit of the decoder, ms. */
export const BUFR_DECODE_TIMEOUT_MS = 60_000;

export interface BufrIngestSummary {
  /** Soundings stored new. */
  soundingCount: number;
  /** Soundings that were already in the library. */
  duplicateCount: number;
  /** Soundings refused by validation, with their first reason. */
  rejected: { name: string; reason: string }[];
}

/**
 * Decode and store one BUFR file.
 * @param ctx - database and logger
 * @param input - the file; `onProgress(done, total)` after each sounding; `signal` stops the decoder
 * @returns counts of soundings made, or the reason the file could not be taken
 */
export async function ingestBufrFile(
  ctx: { db: Database; logger: Logger },
  input: { officeId?: string; filePath: string; onProgress?: (done: number, total: number) => void; signal?: AbortSignal; limits?: ReadLimits },
): Promise<Result<BufrIngestSummary, { reason: string }>> {
  const fileName = path.basename(input.filePath);
  const size = (await stat(input.filePath)).size;
  if (size > MAX_BUFR_FILE_BYTES) return err({ reason: `${fileName} is ${Math.round(size / 1_000_000)} MB; BUFR files up to ${MAX_BUFR_FILE_BYTES / 1_000_000} MB are taken. Split it and send the parts.` });
  const dumped = await runTool('bufr_dump', ['-js', input.filePath], { timeoutMs: BUFR_DECODE_TIMEOUT_MS, maxOutputBytes: MAX_BUFR_DUMP_BYTES, signal: input.signal });
  if (!dumped.ok) return err({ reason: dumped.error.reason.replaceAll(input.filePath, fileName) });
  let json: unknown;
  try {
    json = JSON.parse(dumped.value);
  } catch {
    return err({ reason: `${fileName} is not readable BUFR: the decoder's output was cut short (the file is probably truncated or damaged).` });
  }
  const read = readRadiosondes(json, input.limits ?? DEFAULT_READ_LIMITS);
  if (!read.ok) return err({ reason: `${fileName}: ${read.error}.` });
  const items = read.value.map((radiosonde, index) => ({
    name: `${fileName} #${index + 1}${radiosonde.station ? ` (${radiosonde.station})` : ''}`,
    task: { kind: 'structured' as const, input: toSoundingInput(radiosonde) },
  }));
  input.onProgress?.(0, items.length);
  const response = await receiveIntakeSoundings(ctx.db, items, input.onProgress);
  const rejected = response.results
    .filter((r) => r.status === 'rejected')
    .map((r) => ({ name: r.fileName, reason: r.issues.find((i) => i.severity === 'error')?.message ?? 'refused by validation' }));
  if (response.accepted + response.duplicates === 0) return err({ reason: `${fileName}: none of its ${items.length} soundings could be taken. First reason: ${rejected[0]?.reason ?? 'unknown'}` });
  ctx.logger.info({ fileName, accepted: response.accepted, duplicates: response.duplicates, rejected: response.rejected }, 'BUFR file taken in');
  return ok({ soundingCount: response.accepted, duplicateCount: response.duplicates, rejected });
}
