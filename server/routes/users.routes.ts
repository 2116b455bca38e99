import { z } from 'zod';
import { createUserInputSchema, updateUserInputSchema } from '../../shared/contracts/users';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { createUser, listUsers, updateUser } from '../services/users.service';
import { adminRoles } from '../../shared/workflow/roles';
import { route } from './route-definition';

const userParamsSchema = z.object({ userId: z.string().min(1, { message: 'A user id is required.' }) });

export const usersRoutes = [
  route({
    method: 'get',
    path: '/api/users',
    access: access.roles(...adminRoles),
    handler: async (ctx, _req, res) => sendResult(res, await listUsers(ctx.db)),
  }),
  route({
    method: 'post',
    path: '/api/users',
    access: access.roles(...adminRoles),
    handler: async (ctx, req, res) => {
      const input = parseInput(createUserInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await createUser(ctx.db, ctx.auth, input.value), 201);
    },
  }),
  route({
    method: 'patch',
    path: '/api/users/:userId',
    access: access.roles(...adminRoles),
    handler: async (ctx, req, res) => {
      const params = parseInput(userParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const input = parseInput(updateUserInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await updateUser(ctx.db, actorOf(res), params.value.userId, input.value));
    },
  }),
];
