import { z } from 'zod';
import { issuanceNumberSchema } from '../../shared/contracts/workflow';
import { access } from '../auth/require-role';
import { parseInput, sendError, sendResult } from '../middleware/error-handler';
import { capFeed, capMessage, capWithdrawal } from '../services/cap.service';
import { route } from './route-definition';

const numberParamsSchema = z.object({ issuanceNumber: issuanceNumberSchema });
/** Common practice for CAP over HTTP (the media type alert aggregators request). */
const capMediaType = 'application/cap+xml';

/** CAP 1.2: the Atom index of messages in force, each issuance's message and a withdrawal's Cancel. */
export const capRoutes = [
  route({
    method: 'get',
    path: '/api/public/cap',
    access: access.public,
    handler: async (ctx, _req, res) => {
      const result = await capFeed(ctx.db, ctx.config.publicUrl, new Date());
      if (!result.ok) return sendError(res, result.error);
      res.type('application/atom+xml').send(result.value);
    },
  }),
  route({
    method: 'get',
    path: '/api/public/cap/:issuanceNumber',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const result = await capMessage(ctx.db, ctx.config.publicUrl, params.value.issuanceNumber);
      if (!result.ok) return sendError(res, result.error);
      res.type(capMediaType).send(result.value);
    },
  }),
  route({
    method: 'get',
    path: '/api/public/cap/:issuanceNumber/withdrawal',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const result = await capWithdrawal(ctx.db, ctx.config.publicUrl, params.value.issuanceNumber);
      if (!result.ok) return sendError(res, result.error);
      res.type(capMediaType).send(result.value);
    },
  }),
];
