import { z } from 'zod';
import { errorCodes, type ErrorCode, type FieldIssue } from '../../shared/errors';

/**
 * The one way the client talks to `/api/*`: same-origin fetch with cookies, JSON in and out, the
 * response parsed with the shared zod schema so drift shows up as a clear error. Failures become
 * a typed `ApiError`; this module shows no toasts and performs no redirects — hooks decide.
 */

/** Codes the server sends plus two the client produces itself. */
export type ApiErrorCode = ErrorCode | 'NETWORK_ERROR' | 'UNEXPECTED_RESPONSE';

const knownCodes = Object.keys(errorCodes) as [ErrorCode, ...ErrorCode[]];

const apiErrorBodySchema = z.object({
  error: z.object({
    code: z.enum(knownCodes),
    message: z.string(),
    issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
    details: z.record(z.string(), z.unknown()).optional(),
  }),
});

export class ApiError extends Error {
  readonly status: number;
  readonly code: ApiErrorCode;
  readonly issues: FieldIssue[];
  readonly details: Record<string, unknown> | undefined;

  constructor(options: {
    status: number;
    code: ApiErrorCode;
    message: string;
    issues?: FieldIssue[];
    details?: Record<string, unknown>;
  }) {
    super(options.message);
    this.name = 'ApiError';
    this.status = options.status;
    this.code = options.code;
    this.issues = options.issues ?? [];
    this.details = options.details;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

const NETWORK_MESSAGE = 'We could not reach the Stormdraft server. Check your connection and try again.';
const UNEXPECTED_MESSAGE =
  'The server sent an answer this page does not understand. Reload the page; if it happens again, tell your administrator.';

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

interface RequestOptions<T> {
  method?: Method;
  body?: unknown;
  schema: z.ZodType<T>;
  signal?: AbortSignal;
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

export async function apiRequest<T>(path: string, options: RequestOptions<T>): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method: options.method ?? 'GET',
      credentials: 'include',
      headers,
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError({ status: 0, code: 'NETWORK_ERROR', message: NETWORK_MESSAGE });
  }

  const payload = await readJson(response);

  if (!response.ok) {
    const parsed = apiErrorBodySchema.safeParse(payload);
    if (parsed.success) {
      throw new ApiError({ status: response.status, ...parsed.data.error });
    }
    throw new ApiError({ status: response.status, code: 'UNEXPECTED_RESPONSE', message: UNEXPECTED_MESSAGE });
  }

  const parsed = options.schema.safeParse(payload);
  if (!parsed.success) {
    console.error(`Response from ${path} did not match its contract`, parsed.error.issues);
    throw new ApiError({ status: response.status, code: 'UNEXPECTED_RESPONSE', message: UNEXPECTED_MESSAGE });
  }
  return parsed.data;
}

export const apiClient = {
  get: <T>(path: string, schema: z.ZodType<T>, signal?: AbortSignal) => apiRequest(path, { schema, signal }),
  post: <T>(path: string, body: unknown, schema: z.ZodType<T>) => apiRequest(path, { method: 'POST', body, schema }),
  put: <T>(path: string, body: unknown, schema: z.ZodType<T>) => apiRequest(path, { method: 'PUT', body, schema }),
  patch: <T>(path: string, body: unknown, schema: z.ZodType<T>) => apiRequest(path, { method: 'PATCH', body, schema }),
};

/** Field issues keyed by dotted path, for showing messages beside the fields. */
export type FieldErrors = Record<string, string>;

export function fieldErrorsFrom(issues: readonly FieldIssue[]): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of issues) {
    if (errors[issue.path] === undefined) errors[issue.path] = issue.message;
  }
  return errors;
}

/** Turns a zod error (client-side check with the shared schema) into the server's issue shape. */
export function issuesFromZod(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.map(String).join('.'), message: issue.message }));
}
