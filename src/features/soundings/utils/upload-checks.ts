import { soundingLimits } from '../../../../shared/contracts/soundings';

/** A file the browser refuses before sending, with the reason in words. */
export interface RefusedFile {
  fileName: string;
  message: string;
}

export interface UploadPlan<F> {
  /** Files to send, in the order given. */
  send: F[];
  /** Files not sent, each with what to do about it. */
  refused: RefusedFile[];
}

const megabytes = (bytes: number) => (bytes / (1024 * 1024)).toFixed(1);

/**
 * Checks chosen files against the server's limits before anything is sent: empty files and files
 * over 2 MB are refused one by one (the rest still go). The batch limit is not a refusal: the
 * upload sends the files in batches of at most `maxFilesPerBatch`.
 */
export function planUpload<F extends { name: string; size: number }>(files: readonly F[]): UploadPlan<F> {
  const plan: UploadPlan<F> = { send: [], refused: [] };
  for (const file of files) {
    if (file.size === 0) {
      plan.refused.push({ fileName: file.name, message: 'The file is empty. Export the sounding again and choose the new file.' });
    } else if (file.size > soundingLimits.maxFileBytes) {
      plan.refused.push({
        fileName: file.name,
        message: `The file is ${megabytes(file.size)} MB; the limit is ${megabytes(soundingLimits.maxFileBytes)} MB per sounding. Trim unneeded levels or split it, then upload again.`,
      });
    } else {
      plan.send.push(file);
    }
  }
  return plan;
}

/** How many server batches an upload of `fileCount` files takes. */
export function batchCount(fileCount: number): number {
  return Math.ceil(fileCount / soundingLimits.maxFilesPerBatch);
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/**
 * The server's issue messages start with the file name and place ("a.csv, line 12, column
 * temperature_C: …"); the result list already shows both, so that lead-in is dropped.
 */
export function issueMessageWithoutPlace(message: string, fileName: string): string {
  const leadIn = new RegExp(`^${escapeRegExp(fileName)}(, line \\d+)?(, column [^:]+)?: `);
  return message.replace(leadIn, '');
}

/** The same for stored warnings, where the original file name is no longer known. */
export function storedIssueMessage(message: string): string {
  return message.replace(/^[^:]*?\.csv(, line \d+)?(, column [^:]+)?: /i, '');
}
