import { access } from '../auth/require-role';
import { route } from './route-definition';

export const healthRoutes = [
  route({
    method: 'get',
    path: '/api/health',
    access: access.public,
    handler: async (ctx, _req, res) => {
      try {
        await ctx.ping();
        res.json({ status: 'ok', database: 'ok' });
      } catch (error) {
        ctx.logger.error({ err: error }, 'health check: database did not answer');
        res.status(503).json({ status: 'degraded', database: 'unreachable' });
      }
    },
  }),
];
