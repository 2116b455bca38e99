import { z } from 'zod';
import { idParamSchema } from '../../shared/contracts/common';
import { commentInputSchema, transitionInputSchema, workflowActions } from '../../shared/contracts/workflow';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { addComment, listAudit, listComments } from '../services/review.service';
import { transitionOutlook } from '../services/workflow.service';
import { route } from './route-definition';
import { authoringRoles, officeReaderRoles } from '../../shared/workflow/roles';
import { transitions } from '../../shared/workflow/transitions';

const outlookParamsSchema = z.object({ outlookId: idParamSchema });
const officeReaders = access.roles(...officeReaderRoles);

/** POST /api/outlooks/:outlookId/{submit,return,approve,publish}: one route per transition of the table. */
const transitionRoutes = workflowActions.map((action) =>
  route({
    method: 'post',
    path: `/api/outlooks/:outlookId/${action}`,
    access: access.roles(...transitions[action].roles),
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const input = parseInput(transitionInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await transitionOutlook(ctx.db, ctx.config, actorOf(res), params.value.outlookId, action, input.value));
    },
  }),
);

export const workflowRoutes = [
  ...transitionRoutes,
  route({
    method: 'get',
    path: '/api/outlooks/:outlookId/comments',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await listComments(ctx.db, params.value.outlookId));
    },
  }),
  route({
    method: 'post',
    path: '/api/outlooks/:outlookId/comments',
    access: access.roles(...authoringRoles),
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const input = parseInput(commentInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await addComment(ctx.db, actorOf(res), params.value.outlookId, input.value), 201);
    },
  }),
  route({
    method: 'get',
    path: '/api/outlooks/:outlookId/audit',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await listAudit(ctx.db, params.value.outlookId));
    },
  }),
];
