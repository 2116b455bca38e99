import { ApiError, type ApiErrorCode } from '../../../lib/api-client';

/** The error shape better-auth's client returns (`{ data, error }`), as far as we rely on it. */
export interface BetterAuthError {
  code?: string | undefined;
  message?: string | undefined;
  status: number;
}

/** Messages for the better-auth codes people actually meet, in our own words. */
const messagesByCode: Record<string, string> = {
  INVALID_EMAIL_OR_PASSWORD: 'That e-mail and password do not match an account. Check both, or reset your password.',
  INVALID_EMAIL: 'Enter a valid e-mail address.',
  INVALID_PASSWORD: 'That password is not right. Try again, or reset your password.',
  USER_ALREADY_EXISTS: 'An account with this e-mail already exists. Sign in, or reset your password.',
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: 'An account with this e-mail already exists. Sign in, or reset your password.',
  PASSWORD_TOO_SHORT: 'Use at least 10 characters for the password.',
  PASSWORD_TOO_LONG: 'Keep the password under 128 characters.',
  BANNED_USER: 'This account is disabled. Ask your office administrator to enable it again.',
  INVALID_TOKEN: 'This reset link is invalid or has expired. Ask for a new link below.',
  EMAIL_NOT_VERIFIED: 'Confirm your e-mail address first: we have sent you a new link.',
};

function codeForStatus(status: number): ApiErrorCode {
  if (status === 0) return 'NETWORK_ERROR';
  if (status === 400 || status === 422) return 'VALIDATION_FAILED';
  if (status === 401) return 'UNAUTHENTICATED';
  if (status === 403) return 'FORBIDDEN';
  if (status === 409) return 'ALREADY_EXISTS';
  return 'INTERNAL';
}

/** Turns a better-auth client error into our `ApiError`, with a message a person can act on. */
export function apiErrorFromAuth(error: BetterAuthError): ApiError {
  const known = error.code ? messagesByCode[error.code] : undefined;
  let message = known;
  if (message === undefined) {
    if (error.status === 429) message = 'Too many attempts. Wait a minute, then try again.';
    else if (error.status === 0) message = 'We could not reach the Stormdraft server. Check your connection and try again.';
    else if (error.status >= 500) message = 'Something went wrong on our side. Please try again.';
    else message = error.message && error.message.length > 0 ? error.message : 'That did not work. Please try again.';
  }
  return new ApiError({ status: error.status, code: codeForStatus(error.status), message, details: error.code ? { authCode: error.code } : undefined });
}

/** The better-auth code behind a failed auth call, when there was one. */
export function authCodeOf(error: unknown): string | undefined {
  if (!(error instanceof ApiError)) return undefined;
  const code = error.details?.authCode;
  return typeof code === 'string' ? code : undefined;
}
