import { preferencesSchema } from '../../shared/contracts/users';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { getMe, savePreferences } from '../services/users.service';
import { route } from './route-definition';

export const meRoutes = [
  route({
    method: 'get',
    path: '/api/me',
    access: access.signedIn,
    handler: async (ctx, _req, res) => sendResult(res, await getMe(ctx.db, actorOf(res))),
  }),
  route({
    method: 'put',
    path: '/api/me/preferences',
    access: access.signedIn,
    handler: async (ctx, req, res) => {
      const input = parseInput(preferencesSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await savePreferences(ctx.db, actorOf(res), input.value));
    },
  }),
];
