/**
 * Which ingester takes each recognised format. Every ingester reads one file and stores what it
 * holds, reporting progress; failures are data (a reason in words), never exceptions.
 */
import { readFile, stat } from 'node:fs/promises';
import path from 'node:path';
import type { Logger } from 'pino';
import { err, ok, type Result } from '../../../shared/result';
import { MAX_FILE_BYTES } from '../../../shared/sounding';
import type { Database } from '../../db/client';
import { receiveIntakeSoundings } from '../../services/soundings.service';
import { ingestBufrFile } from '../bufr/ingest-bufr';
import { ingestGribFile } from '../grib/ingest-grib';
import type { IntakeFormat } from './recognise-format';

export interface IngestContext {
  db: Database;
  logger: Logger;
}

export interface IngestInput {
  officeId: string;
  filePath: string;
  /** Model name for GRIB2 runs (a pull source may name it). */
  model?: string;
  onProgress?(done: number, total: number): void;
  signal?: AbortSignal;
}

export interface IngestOutcome {
  soundingCount: number;
  duplicateCount: number;
  runIds: string[];
  notes: string[];
}

export type Ingester = (ctx: IngestContext, input: IngestInput) => Promise<Result<IngestOutcome, { reason: string }>>;

/** Our exchange CSV: one sounding per file, through the same path as an upload. */
const ingestCsv: Ingester = async (ctx, input) => {
  const fileName = path.basename(input.filePath);
  const size = (await stat(input.filePath)).size;
  if (size > MAX_FILE_BYTES) return err({ reason: `${fileName} is larger than ${MAX_FILE_BYTES / 1024 / 1024} MB, the limit per sounding CSV.` });
  const text = await readFile(input.filePath, 'utf8');
  input.onProgress?.(0, 1);
  const response = await receiveIntakeSoundings(ctx.db, [{ name: fileName, task: { kind: 'csv', fileName, text } }], input.onProgress);
  const result = response.results[0];
  if (!result || result.status === 'rejected') {
    const first = result?.issues.find((issue) => issue.severity === 'error');
    return err({ reason: first?.message ?? `${fileName} could not be read as a sounding CSV.` });
  }
  const notes = result.missingForEvidence.length ? [`Kept out of evidence until given: ${result.missingForEvidence.join(', ')}.`] : [];
  return ok({ soundingCount: response.accepted, duplicateCount: response.duplicates, runIds: [], notes });
};

const ingestBufr: Ingester = async (ctx, input) => {
  const done = await ingestBufrFile(ctx, input);
  if (!done.ok) return done;
  const notes = done.value.rejected.map((r) => `${r.name}: ${r.reason}`);
  return ok({ soundingCount: done.value.soundingCount, duplicateCount: done.value.duplicateCount, runIds: [], notes });
};

/** GRIB2 model fields: one model run per forecast hour in the file, grid soundings stored packed. */
const ingestGrib: Ingester = async (ctx, input) => {
  const done = await ingestGribFile(ctx, input);
  if (!done.ok) return done;
  return ok({ soundingCount: done.value.soundingCount, duplicateCount: 0, runIds: done.value.runIds, notes: [`${done.value.storedBytes.toLocaleString('en-US')} bytes stored`] });
};

/** The ingester of each format the intake takes. */
export const ingesters: Record<Exclude<IntakeFormat, 'unknown'>, Ingester> = {
  grib2: ingestGrib,
  bufr: ingestBufr,
  csv: ingestCsv,
};
