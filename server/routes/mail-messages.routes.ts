import { z } from 'zod';
import { idParamSchema } from '../../shared/contracts/common';
import { access } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { getCaughtMail, listCaughtMail } from '../services/mail.service';
import { adminRoles } from '../../shared/workflow/roles';
import { route } from './route-definition';

const messageParamsSchema = z.object({ messageId: idParamSchema });

export const mailMessagesRoutes = [
  route({
    method: 'get',
    path: '/api/mail-messages',
    access: access.roles(...adminRoles),
    handler: async (ctx, _req, res) => sendResult(res, await listCaughtMail(ctx.db)),
  }),
  route({
    method: 'get',
    path: '/api/mail-messages/:messageId',
    access: access.roles(...adminRoles),
    handler: async (ctx, req, res) => {
      const params = parseInput(messageParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await getCaughtMail(ctx.db, params.value.messageId));
    },
  }),
];
