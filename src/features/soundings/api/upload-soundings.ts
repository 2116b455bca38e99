import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError } from '../../../lib/api-client';
import { errorCodes, type ErrorCode } from '../../../../shared/errors';
import { soundingLimits, uploadResponseSchema, type UploadResponse } from '../../../../shared/contracts/soundings';
import { soundingsKeys } from './soundings-keys';

const knownCodes = Object.keys(errorCodes) as [ErrorCode, ...ErrorCode[]];
const uploadErrorSchema = z.object({ error: z.object({ code: z.enum(knownCodes), message: z.string() }) });

const NETWORK_MESSAGE = 'We could not reach the Stormdraft server. Check your connection and upload again.';
const UNEXPECTED_MESSAGE = 'The server sent an answer this page does not understand. Reload the page and upload again.';

/**
 * `POST /api/soundings/uploads` as multipart (`files`). The shared api-client speaks JSON only,
 * so this fetcher sends the form itself and maps failures to the same `ApiError`.
 */
async function postUploadBatch(files: readonly File[]): Promise<UploadResponse> {
  const form = new FormData();
  for (const file of files) form.append('files', file, file.name);
  let response: Response;
  try {
    response = await fetch('/api/soundings/uploads', { method: 'POST', credentials: 'include', headers: { Accept: 'application/json' }, body: form });
  } catch {
    throw new ApiError({ status: 0, code: 'NETWORK_ERROR', message: NETWORK_MESSAGE });
  }
  let payload: unknown;
  try {
    payload = await response.json();
  } catch {
    payload = undefined;
  }
  if (!response.ok) {
    const parsed = uploadErrorSchema.safeParse(payload);
    if (parsed.success) throw new ApiError({ status: response.status, code: parsed.data.error.code, message: parsed.data.error.message });
    throw new ApiError({ status: response.status, code: 'UNEXPECTED_RESPONSE', message: UNEXPECTED_MESSAGE });
  }
  const parsed = uploadResponseSchema.safeParse(payload);
  if (!parsed.success) throw new ApiError({ status: response.status, code: 'UNEXPECTED_RESPONSE', message: UNEXPECTED_MESSAGE });
  return parsed.data;
}

/**
 * Uploads files in batches the server accepts (at most `maxFilesPerBatch` each) and joins the
 * answers into one result list, in the order the files were given.
 */
export async function uploadSoundingFiles(files: readonly File[]): Promise<UploadResponse> {
  const joined: UploadResponse = { results: [], accepted: 0, duplicates: 0, rejected: 0 };
  for (let start = 0; start < files.length; start += soundingLimits.maxFilesPerBatch) {
    const batch = await postUploadBatch(files.slice(start, start + soundingLimits.maxFilesPerBatch));
    joined.results.push(...batch.results);
    joined.accepted += batch.accepted;
    joined.rejected += batch.rejected;
    joined.duplicates += batch.duplicates;
  }
  return joined;
}

/** Uploads exchange-CSV files; the library and map refresh when the server has stored them. */
export function useUploadSoundings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadSoundingFiles,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: soundingsKeys.all }),
  });
}
