import type { NextFunction, Request, Response } from 'express';
import type {} from 'pino-http';
import { z } from 'zod';
import { appError, errorCodes, type AppError, type ApiErrorBody, type FieldIssue } from '../../shared/errors';
import type { Result } from '../../shared/result';

/** Sends an operational error with the status from the shared code table. */
export function sendError(res: Response, error: AppError): void {
  const body: ApiErrorBody = { error };
  res.status(errorCodes[error.code].status).json(body);
}

/** Maps a service Result to HTTP: success → `status` with the value, failure → its error status. */
export function sendResult<T>(res: Response, result: Result<T, AppError>, status = 200): void {
  if (result.ok) {
    if (status === 204) res.status(204).end();
    else res.status(status).json(result.value);
  } else sendError(res, result.error);
}

/** Turns zod issues into field issues with dotted paths. */
export function fieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.map(String).join('.') || '(body)', message: issue.message }));
}

/** Parses a request part with a shared schema; a failure is a VALIDATION_FAILED AppError. */
export function parseInput<S extends z.ZodType>(schema: S, value: unknown, part = 'body'): Result<z.infer<S>, AppError> {
  const parsed = schema.safeParse(value);
  if (parsed.success) return { ok: true, value: parsed.data };
  const issues = fieldIssues(parsed.error);
  const first = issues[0];
  const summary = first ? `${first.path}: ${first.message}` : 'The request is not valid.';
  return { ok: false, error: appError('VALIDATION_FAILED', `Check the ${part}. ${summary}`, { issues }) };
}

/** Where a JSON parse error happened, as "line L, column C", from the parser's message and the text. */
export function jsonErrorLocation(message: string, text: string | undefined): string | null {
  const lineColumn = /line (\d+) column (\d+)/.exec(message);
  if (lineColumn) return `line ${lineColumn[1]}, column ${lineColumn[2]}`;
  const position = /at position (\d+)/.exec(message);
  let offset = position ? Number(position[1]) : undefined;
  if (offset === undefined && /Unexpected end of JSON input/.test(message) && text !== undefined) offset = text.length;
  if (offset === undefined || text === undefined) return null;
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  const column = offset - before.lastIndexOf('\n');
  return `line ${line}, column ${column}`;
}

/** Messages of busboy (multer's parser) when a multipart body is cut short or malformed. */
const brokenMultipart = /^(Unexpected end of form|Unexpected end of file|Malformed part header|Multipart: Boundary not found|Malformed urlencoded form|Missing Content-Type|Unsupported content type)/i;

function statusOf(err: unknown): number {
  if (typeof err !== 'object' || err === null) return 500;
  const value = 'status' in err ? err.status : 'statusCode' in err ? err.statusCode : undefined;
  return typeof value === 'number' && Number.isInteger(value) ? value : 500;
}

/**
 * The central handler. Bad requests the parsers catch (malformed JSON, a broken multipart
 * upload, an address that does not decode) are 4xx naming the part; anything else is a
 * programmer error → logged, generic 500.
 */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction): void {
  const status = statusOf(err);
  if (status === 400 && err instanceof SyntaxError) {
    const text = 'body' in err && typeof err.body === 'string' ? err.body : undefined;
    const where = jsonErrorLocation(err.message, text);
    return sendError(res, appError('VALIDATION_FAILED', `The request body is not valid JSON${where ? ` (at ${where})` : ''}. Check the JSON and send it again.`, { issues: [{ path: '(body)', message: where ? `Not valid JSON at ${where}.` : 'Not valid JSON.' }] }));
  }
  if (status === 413) return sendError(res, appError('PAYLOAD_TOO_LARGE'));
  if (status === 415) return sendError(res, appError('UNSUPPORTED_MEDIA_TYPE', 'The request body uses an encoding or character set the server does not read. Send UTF-8 JSON.'));
  if (err instanceof Error && err.name === 'MulterError') {
    const field = 'field' in err && typeof err.field === 'string' ? err.field : 'files';
    const code = 'code' in err ? String(err.code) : '';
    if (code === 'LIMIT_FILE_SIZE') return sendError(res, appError('PAYLOAD_TOO_LARGE', `A file in "${field}" is larger than allowed.`, { issues: [{ path: field, message: 'File too large.' }] }));
    return sendError(res, appError('VALIDATION_FAILED', `The upload is not valid (${err.message}). Check the "${field}" field.`, { issues: [{ path: field, message: err.message }] }));
  }
  if (err instanceof Error && brokenMultipart.test(err.message)) {
    return sendError(res, appError('VALIDATION_FAILED', 'The upload is broken or incomplete (the multipart body ended early or is malformed). Choose the files and send them again.', { issues: [{ path: 'files', message: 'The multipart body is broken or incomplete.' }] }));
  }
  if (status === 404) return sendError(res, appError('NOT_FOUND'));
  if (status >= 400 && status < 500) {
    return sendError(res, appError('VALIDATION_FAILED', 'The request could not be read: check its address and body.', { issues: [{ path: '(request)', message: 'The request could not be read.' }] }));
  }
  req.log?.error({ err }, 'unhandled error');
  if (!res.headersSent) sendError(res, appError('INTERNAL'));
}
