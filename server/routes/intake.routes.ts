import { z } from 'zod';
import { idParamSchema } from '../../shared/contracts/common';
import { createIntakeSourceInputSchema, updateIntakeSourceInputSchema } from '../../shared/contracts/intake';
import { intakeManagerRoles, intakeViewerRoles } from '../../shared/workflow/roles';
import { access } from '../auth/require-role';
import { createIntakeSource, deleteIntakeSource, getIntakeStatus, listIntakeFiles, listIntakeSources, pullIntakeSourceNow, updateIntakeSource } from '../ingest/intake/intake.service';
import { parseInput, sendResult } from '../middleware/error-handler';
import { route } from './route-definition';

const viewers = access.roles(...intakeViewerRoles);
const managers = access.roles(...intakeManagerRoles);
const sourceParamsSchema = z.object({ sourceId: idParamSchema });

/** The intake page: files taken in (forecasters and admins) and scheduled pull sources (admins). */
export const intakeRoutes = [
  route({ method: 'get', path: '/api/intake/status', access: viewers, handler: async (ctx, _req, res) => sendResult(res, await getIntakeStatus(ctx.db, ctx.config)) }),
  route({ method: 'get', path: '/api/intake-files', access: viewers, handler: async (ctx, _req, res) => sendResult(res, await listIntakeFiles(ctx.db)) }),
  route({ method: 'get', path: '/api/intake-sources', access: managers, handler: async (ctx, _req, res) => sendResult(res, await listIntakeSources(ctx.db)) }),
  route({
    method: 'post',
    path: '/api/intake-sources',
    access: managers,
    handler: async (ctx, req, res) => {
      const input = parseInput(createIntakeSourceInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await createIntakeSource(ctx.db, ctx.config, input.value), 201);
    },
  }),
  route({
    method: 'patch',
    path: '/api/intake-sources/:sourceId',
    access: managers,
    handler: async (ctx, req, res) => {
      const params = parseInput(sourceParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const input = parseInput(updateIntakeSourceInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await updateIntakeSource(ctx.db, params.value.sourceId, input.value));
    },
  }),
  route({
    method: 'delete',
    path: '/api/intake-sources/:sourceId',
    access: managers,
    handler: async (ctx, req, res) => {
      const params = parseInput(sourceParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await deleteIntakeSource(ctx.db, params.value.sourceId));
    },
  }),
  route({
    method: 'post',
    path: '/api/intake-sources/:sourceId/pull',
    access: managers,
    handler: async (ctx, req, res) => {
      const params = parseInput(sourceParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await pullIntakeSourceNow(ctx.db, params.value.sourceId));
    },
  }),
];
