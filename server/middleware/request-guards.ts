import type { NextFunction, Request, Response } from 'express';
import { appError } from '../../shared/errors';
import { sendError } from './error-handler';

const stateChangingMethods = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

function originOf(value: string): string | null {
  try {
    return new URL(value).origin;
  } catch {
    return null;
  }
}

/**
 * Cross-site request defence for every state-changing API request: the Origin header (or, when a
 * browser sent none, the Referer) must be one of the app's own origins. A request with neither
 * is allowed only when it carries no cookie, i.e. no session a foreign page could borrow
 * (scripts, and mail providers' one-click unsubscribe, send neither).
 */
export function crossSiteGuard(allowedOrigins: readonly string[]) {
  const allowed = new Set(allowedOrigins.map((o) => originOf(o) ?? o));
  return (req: Request, res: Response, next: NextFunction) => {
    if (!stateChangingMethods.has(req.method)) return next();
    const origin = req.get('origin');
    const referer = req.get('referer');
    const claimed = origin !== undefined ? originOf(origin) : referer !== undefined ? originOf(referer) : undefined;
    if (claimed === undefined) {
      if (req.get('cookie') === undefined) return next();
      return sendError(res, appError('CROSS_SITE_REQUEST', 'This request came without an Origin header. Send it from the Stormdraft app itself.'));
    }
    if (claimed === null || !allowed.has(claimed)) {
      return sendError(res, appError('CROSS_SITE_REQUEST', `Requests from ${origin !== undefined ? 'origin' : 'referer'} ${claimed ?? '(not a URL)'} are not accepted; use the Stormdraft app at ${[...allowed][0] ?? 'its own address'}.`));
    }
    next();
  };
}

function hasBody(req: Request): boolean {
  const length = req.get('content-length');
  return req.get('transfer-encoding') !== undefined || (length !== undefined && length !== '0');
}

/**
 * JSON routes accept only JSON bodies: form encodings and text/plain (the content types a
 * foreign page can post without asking the browser first) get 415. Routes that parse their own
 * body (uploads, one-click unsubscribe) are not wrapped with this guard.
 */
export function jsonOnlyGuard(req: Request, res: Response, next: NextFunction) {
  if (!stateChangingMethods.has(req.method) || !hasBody(req)) return next();
  if (req.is(['application/json', 'application/*+json'])) return next();
  const type = req.get('content-type') ?? '(none)';
  return sendError(res, appError('UNSUPPORTED_MEDIA_TYPE', `This route takes a JSON body (Content-Type: application/json), not ${type.split(';')[0]}.`, { issues: [{ path: 'content-type', message: 'Send application/json.' }] }));
}

/**
 * Finds the first string (or object key) containing U+0000 in a parsed body or query, walking
 * without recursion so a deeply nested body cannot overflow the stack. Returns its dotted path.
 */
export function findNullCharacter(value: unknown, rootPath = ''): string | null {
  const stack: { value: unknown; path: string }[] = [{ value, path: rootPath }];
  let visited = 0;
  while (stack.length > 0) {
    const item = stack.pop();
    if (!item) break;
    if (++visited > 1_000_000) return null;
    if (typeof item.value === 'string') {
      if (item.value.includes('\u0000')) return item.path || '(body)';
    } else if (Array.isArray(item.value)) {
      item.value.forEach((child, index) => stack.push({ value: child, path: item.path ? `${item.path}.${index}` : String(index) }));
    } else if (item.value !== null && typeof item.value === 'object') {
      for (const [key, child] of Object.entries(item.value)) {
        const path = item.path ? `${item.path}.${key}` : key;
        if (key.includes('\u0000')) return path;
        stack.push({ value: child, path });
      }
    }
  }
  return null;
}

/** Refuses (400, naming the field) any body, query or path value containing U+0000, which no text field may hold. */
export function nullCharacterGuard(req: Request, res: Response, next: NextFunction) {
  const parts: [string, unknown][] = [
    ['body', req.body],
    ['query', req.query],
    ['address', req.params],
  ];
  for (const [part, value] of parts) {
    const path = findNullCharacter(value);
    if (path !== null) {
      return sendError(res, appError('VALIDATION_FAILED', `Check the ${part}. ${path}: Text may not contain the NUL character (U+0000).`, { issues: [{ path, message: 'Text may not contain the NUL character (U+0000).' }] }));
    }
  }
  next();
}

/** Answers that depend on who is signed in must not be kept by browsers or shared caches. */
export function noStore(_req: Request, res: Response, next: NextFunction) {
  res.set('Cache-Control', 'no-store');
  next();
}

/**
 * better-auth endpoints the product uses; everything else under /api/auth (the admin plugin's
 * impersonation, set-role, set-password, remove-user…, update-user, change-email…) answers 404.
 * User management goes through /api/users and its rules.
 */
const allowedAuthEndpoints: readonly { method: string; path: RegExp }[] = [
  { method: 'POST', path: /^\/api\/auth\/sign-in\/email$/ },
  { method: 'POST', path: /^\/api\/auth\/sign-up\/email$/ },
  { method: 'POST', path: /^\/api\/auth\/sign-out$/ },
  { method: 'GET', path: /^\/api\/auth\/get-session$/ },
  { method: 'POST', path: /^\/api\/auth\/request-password-reset$/ },
  { method: 'POST', path: /^\/api\/auth\/reset-password$/ },
  { method: 'GET', path: /^\/api\/auth\/reset-password\/[^/]+$/ },
  { method: 'GET', path: /^\/api\/auth\/verify-email$/ },
  { method: 'POST', path: /^\/api\/auth\/send-verification-email$/ },
];

export function authEndpointAllowlist(req: Request, res: Response, next: NextFunction) {
  const path = req.originalUrl.split('?')[0] ?? '';
  const method = req.method === 'HEAD' ? 'GET' : req.method;
  if (allowedAuthEndpoints.some((e) => e.method === method && e.path.test(path))) return next();
  return sendError(res, appError('NOT_FOUND', 'There is no such API route.'));
}

/** Source maps are never served: they would publish the client's source. */
export function refuseSourceMaps(req: Request, res: Response, next: NextFunction) {
  if (req.path.endsWith('.map')) {
    res.status(404).type('text').send('Not found');
    return;
  }
  next();
}
