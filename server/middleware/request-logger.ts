import type { IncomingMessage, ServerResponse } from 'node:http';
import { pino, type DestinationStream, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';

export const redactedText = '[redacted]';

/** Query parameters whose values let someone in or act for someone (reset, verify, unsubscribe links). */
const secretQueryParameters = new Set(['token', 'code', 'password', 'newpassword', 'secret', 'key', 'signature', 'sig', 'state', 'otp']);

/** Path segments that are themselves a token: better-auth's reset link `/api/auth/reset-password/<token>`. */
const tokenInPath = /(\/reset-password\/|\/verify-email\/|\/unsubscribe\/|\/magic-link\/)[^/?#]+/gi;

/**
 * A request URL fit for a log line: token path segments and the values of secret-bearing query
 * parameters are replaced with "[redacted]"; the rest (path, harmless parameters) stays readable.
 */
export function sanitizeUrl(url: string): string {
  const hashIndex = url.indexOf('#');
  const withoutHash = hashIndex === -1 ? url : url.slice(0, hashIndex);
  const queryIndex = withoutHash.indexOf('?');
  const pathPart = (queryIndex === -1 ? withoutHash : withoutHash.slice(0, queryIndex)).replace(tokenInPath, `$1${redactedText}`);
  if (queryIndex === -1) return pathPart;
  const query = withoutHash
    .slice(queryIndex + 1)
    .split('&')
    .map((pair) => {
      const equals = pair.indexOf('=');
      const rawName = equals === -1 ? pair : pair.slice(0, equals);
      let name = rawName;
      try {
        name = decodeURIComponent(rawName.replace(/\+/g, ' '));
      } catch {
        // A malformed escape: judge the raw name.
      }
      const secret = secretQueryParameters.has(name.toLowerCase()) || /token|password|secret/i.test(name);
      return secret && equals !== -1 ? `${rawName}=${redactedText}` : pair;
    })
    .join('&');
  // callbackURL and redirect parameters may carry a URL with a token of its own.
  return `${pathPart}?${query.replace(/(token|password|secret)(%3D|=)[^&]*/gi, `$1$2${redactedText}`)}`;
}

/**
 * Paths pino removes from every log object, whichever code logs it: request and response headers
 * that carry credentials, and any field named like a password or token.
 */
export const redactPaths = [
  'req.headers.cookie',
  'req.headers.authorization',
  'req.headers["proxy-authorization"]',
  'res.headers["set-cookie"]',
  'headers.cookie',
  'headers.authorization',
  'headers["set-cookie"]',
  'password',
  'newPassword',
  'currentPassword',
  'token',
  '*.password',
  '*.newPassword',
  '*.currentPassword',
  '*.token',
  '*.cookie',
  '*.authorization',
  '*["set-cookie"]',
];

/**
 * The app's logger: JSON lines at `level`, with credentials removed (see `redactPaths`).
 * `destination` defaults to standard output; tests pass a stream to read what was logged.
 */
export function createLogger(level: string, destination?: DestinationStream): Logger {
  const options = { level, redact: { paths: redactPaths, censor: redactedText } };
  return destination ? pino(options, destination) : pino(options);
}

/**
 * One log line per API request: method, sanitised URL, status and time. Headers are not logged
 * at all (cookies, set-cookie and authorization carry sessions), whatever logger is passed in.
 */
export function requestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
    serializers: {
      req: (req: IncomingMessage & { id?: unknown; originalUrl?: string }) => ({ id: req.id, method: req.method, url: sanitizeUrl(req.originalUrl ?? req.url ?? '') }),
      res: (res: ServerResponse & { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
    wrapSerializers: false,
  });
}
