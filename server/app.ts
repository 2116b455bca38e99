import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { rateLimit } from 'express-rate-limit';
import { toNodeHandler } from 'better-auth/node';
import { appError } from '../shared/errors';
import { appOrigins } from './auth/auth';
import { DatabaseRateLimitStore } from './auth/database-rate-limit-store';
import { requireAccess } from './auth/require-role';
import type { AppContext } from './context';
import { errorHandler, sendError } from './middleware/error-handler';
import { authEndpointAllowlist, crossSiteGuard, jsonOnlyGuard, noStore, nullCharacterGuard, refuseSourceMaps } from './middleware/request-guards';
import { requestLogger } from './middleware/request-logger';
import { apiRoutes } from './routes';

export type ClientMode = 'vite-dev' | 'dist' | 'none';

const distDir = path.resolve(import.meta.dirname, '../dist');

/**
 * Builds the Express app: security headers, request logs, better-auth (before the JSON body
 * parser, as its docs require), every API route behind the one access middleware, then the client.
 */
export async function createApp(ctx: AppContext, clientMode: ClientMode): Promise<Express> {
  const app = express();
  app.disable('x-powered-by');
  // X-Forwarded-For is believed only from the proxies named in TRUST_PROXY (none by default).
  app.set('trust proxy', ctx.config.trustProxy ?? false);
  app.use(requestLogger(ctx.logger));
  app.use(
    helmet({
      // Vite's dev server injects inline scripts; the built client needs none.
      contentSecurityPolicy:
        clientMode === 'vite-dev'
          ? false
          : {
              directives: {
                'img-src': ["'self'", 'data:', 'blob:', ...(ctx.config.tileUrl ? [new URL(ctx.config.tileUrl.replace(/[{}]/g, '')).origin] : [])],
                'style-src': ["'self'", "'unsafe-inline'"],
                'frame-src': ["'self'"],
                'upgrade-insecure-requests': ctx.config.env === 'production' ? [] : null,
              },
            },
    }),
  );

  const authLimiter = rateLimit({
    windowMs: 60_000,
    limit: ctx.config.authRateLimitPerMinute,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Counted in the database so that several instances agree.
    store: new DatabaseRateLimitStore(ctx.db),
    // Ignoring X-Forwarded-For unless TRUST_PROXY names the proxy is intended, not a misconfiguration.
    validate: { xForwardedForHeader: false },
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'RATE_LIMITED', message: 'Too many sign-in attempts. Wait a minute and try again.' } });
    },
  });
  // State-changing requests must come from the app's own pages (see crossSiteGuard).
  app.use('/api', crossSiteGuard(appOrigins(ctx.config)));
  app.all('/api/auth/*splat', noStore, authEndpointAllowlist, jsonOnlyGuard, authLimiter, toNodeHandler(ctx.auth));

  app.use(express.json({ limit: '5mb' }));
  for (const definition of apiRoutes) {
    // Routes with their own body parser (uploads, one-click unsubscribe) choose their content types.
    const bodyGuard = definition.before ? [] : [jsonOnlyGuard];
    const cacheGuard = definition.access.kind === 'public' ? [] : [noStore];
    app[definition.method](definition.path, ...bodyGuard, nullCharacterGuard, ...cacheGuard, requireAccess(ctx, definition.access), ...(definition.before ?? []), async (req, res) => {
      await definition.handler(ctx, req, res);
    });
  }
  app.use('/api', (_req, res) => sendError(res, appError('NOT_FOUND', 'There is no such API route.')));

  if (clientMode === 'vite-dev') {
    const { createServer } = await import('vite');
    const vite = await createServer({ server: { middlewareMode: true }, appType: 'spa' });
    app.use(vite.middlewares);
  } else if (clientMode === 'dist' && existsSync(distDir)) {
    // Source maps are not built (vite.config.ts); should one be left in dist/, it is not served.
    app.use(refuseSourceMaps);
    app.use(express.static(distDir, { index: false, maxAge: '1h' }));
    // '/{*splat}' also matches '/' itself (Express 5 path syntax).
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(distDir, 'index.html')));
  }

  app.use(errorHandler);
  return app;
}
