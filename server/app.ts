import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { rateLimit } from 'express-rate-limit';
import { pinoHttp } from 'pino-http';
import { toNodeHandler } from 'better-auth/node';
import { appError } from '../shared/errors';
import { requireAccess } from './auth/require-role';
import type { AppContext } from './context';
import { errorHandler, sendError } from './middleware/error-handler';
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
  app.set('trust proxy', 'loopback');
  app.use(pinoHttp({ logger: ctx.logger, autoLogging: { ignore: (req) => !req.url?.startsWith('/api') } }));
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
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'RATE_LIMITED', message: 'Too many sign-in attempts. Wait a minute and try again.' } });
    },
  });
  app.all('/api/auth/*splat', authLimiter, toNodeHandler(ctx.auth));

  app.use(express.json({ limit: '5mb' }));
  for (const definition of apiRoutes) {
    app[definition.method](definition.path, requireAccess(ctx, definition.access), ...(definition.before ?? []), async (req, res) => {
      await definition.handler(ctx, req, res);
    });
  }
  app.use('/api', (_req, res) => sendError(res, appError('NOT_FOUND', 'There is no such API route.')));

  if (clientMode === 'vite-dev') {
    const { createServer } = await import('vite');
    const vite = await createServer({ server: { middlewareMode: true }, appType: 'spa' });
    app.use(vite.middlewares);
  } else if (clientMode === 'dist' && existsSync(distDir)) {
    app.use(express.static(distDir, { index: false, maxAge: '1h' }));
    // '/{*splat}' also matches '/' itself (Express 5 path syntax).
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(distDir, 'index.html')));
  }

  app.use(errorHandler);
  return app;
}
