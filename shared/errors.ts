/**
 * Operational error codes shared by server and client, each with the HTTP status the server
 * answers with and a message written for the person using the product.
 */
export const errorCodes = {
  VALIDATION_FAILED: { status: 400, message: 'Some fields need attention.' },
  UNAUTHENTICATED: { status: 401, message: 'Please sign in to continue.' },
  FORBIDDEN: { status: 403, message: 'Your role does not allow this action.' },
  CROSS_SITE_REQUEST: { status: 403, message: 'This request did not come from the Stormdraft app. Open the app and try again there.' },
  NOT_FOUND: { status: 404, message: 'We could not find that.' },
  CONFLICT: { status: 409, message: 'This was changed by someone else since you opened it.' },
  ALREADY_EXISTS: { status: 409, message: 'That already exists.' },
  PAYLOAD_TOO_LARGE: { status: 413, message: 'The upload is larger than allowed.' },
  UNSUPPORTED_MEDIA_TYPE: { status: 415, message: 'Send the request body as JSON.' },
  RATE_LIMITED: { status: 429, message: 'Too many attempts. Wait a little and try again.' },
  SERVICE_UNAVAILABLE: { status: 503, message: 'This is busy or briefly unavailable. Try again in a minute.' },
  INTERNAL: { status: 500, message: 'Something went wrong on our side. Please try again.' },
} as const;

export type ErrorCode = keyof typeof errorCodes;

/** One field problem: `path` is the dotted field name, e.g. `riskLadder.2.colour`. */
export interface FieldIssue {
  path: string;
  message: string;
}

/** The JSON body of every error response. */
export interface ApiErrorBody {
  error: {
    code: ErrorCode;
    message: string;
    issues?: FieldIssue[];
    details?: Record<string, unknown>;
  };
}

/** An expected (operational) failure: a code from the table above, a user message, optional field issues. */
export interface AppError {
  code: ErrorCode;
  message: string;
  issues?: FieldIssue[];
  details?: Record<string, unknown>;
}

/** Builds an AppError; the message defaults to the code's user message. */
export function appError(code: ErrorCode, message?: string, extra: Pick<AppError, 'issues' | 'details'> = {}): AppError {
  return { code, message: message ?? errorCodes[code].message, ...extra };
}
