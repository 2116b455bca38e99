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

/** The central handler: malformed JSON is a 400; anything else is a programmer error → logged, generic 500. */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction): void {
  const status = typeof err === 'object' && err !== null && 'status' in err ? Number((err as { status: unknown }).status) : 500;
  if (status === 400 && err instanceof SyntaxError) {
    return sendError(res, appError('VALIDATION_FAILED', 'The request body is not valid JSON.'));
  }
  if (status === 413) return sendError(res, appError('PAYLOAD_TOO_LARGE'));
  req.log?.error({ err }, 'unhandled error');
  if (!res.headersSent) sendError(res, appError('INTERNAL'));
}
