import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { errorCodes, type ErrorCode } from '../../../../shared/errors';
import { ApiError } from '../../../lib/api-client';
import { verificationKeys } from './verification-keys';

const knownCodes = Object.keys(errorCodes) as [ErrorCode, ...ErrorCode[]];
const errorSchema = z.object({ code: z.enum(knownCodes), message: z.string(), issues: z.array(z.object({ path: z.string(), message: z.string() })).optional() });
const uploadAnswerSchema = z.object({
  files: z.array(
    z.union([
      z.object({ fileName: z.string(), ok: z.literal(true), stored: z.number(), merged: z.number(), rescored: z.array(z.string()) }),
      z.object({ fileName: z.string(), ok: z.literal(false), error: errorSchema }),
    ]),
  ),
});
export type ReportUploadAnswer = z.infer<typeof uploadAnswerSchema>;

const UNEXPECTED = 'The server sent an answer this page does not understand. Reload the page and upload again.';

/** `POST /api/storm-reports/uploads` as multipart: each file is checked and stored on its own. */
async function uploadReportFiles(files: readonly File[]): Promise<ReportUploadAnswer> {
  const form = new FormData();
  for (const file of files) form.append('files', file, file.name);
  let response: Response;
  try {
    response = await fetch('/api/storm-reports/uploads', { method: 'POST', credentials: 'include', headers: { Accept: 'application/json' }, body: form });
  } catch {
    throw new ApiError({ status: 0, code: 'NETWORK_ERROR', message: 'We could not reach the Stormdraft server. Check your connection and upload again.' });
  }
  const payload: unknown = await response.json().catch(() => undefined);
  if (!response.ok) {
    const parsed = z.object({ error: errorSchema }).safeParse(payload);
    throw new ApiError({ status: response.status, code: parsed.success ? parsed.data.error.code : 'UNEXPECTED_RESPONSE', message: parsed.success ? parsed.data.error.message : UNEXPECTED });
  }
  const parsed = uploadAnswerSchema.safeParse(payload);
  if (!parsed.success) throw new ApiError({ status: response.status, code: 'UNEXPECTED_RESPONSE', message: UNEXPECTED });
  return parsed.data;
}

/** Uploads storm-report files; the summary refreshes since late reports may re-score issuances. */
export function useUploadStormReports() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: uploadReportFiles, onSuccess: () => queryClient.invalidateQueries({ queryKey: verificationKeys.all }) });
}
