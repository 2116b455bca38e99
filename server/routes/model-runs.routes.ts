import { z } from 'zod';
import { idParamSchema } from '../../shared/contracts/common';
import { gridSoundingIdSchema, gridSoundingListQuerySchema, modelRunListQuerySchema, modelRunRetentionSchema } from '../../shared/contracts/model-runs';
import { adminRoles, officeReaderRoles, subscriberOverseerRoles } from '../../shared/workflow/roles';
import { access } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { deleteModelRun, getGridSounding, getRunRetention, listGridSoundings, listModelRuns, setRunRetention } from '../services/model-runs.service';
import { route } from './route-definition';

const runParamsSchema = z.object({ runId: idParamSchema });
const gridSoundingParamsSchema = z.object({ gridSoundingId: gridSoundingIdSchema });
const readers = access.roles(...officeReaderRoles);
/** Deleting a run removes evidence for everyone: lead forecasters and administrators. */
const runManagers = access.roles(...subscriberOverseerRoles);

export const modelRunsRoutes = [
  route({
    method: 'get',
    path: '/api/model-runs',
    access: readers,
    handler: async (ctx, req, res) => {
      const query = parseInput(modelRunListQuerySchema, req.query, 'filters');
      if (!query.ok) return sendResult(res, query);
      sendResult(res, await listModelRuns(ctx.db, query.value));
    },
  }),
  route({
    method: 'get',
    path: '/api/model-runs/retention',
    access: readers,
    handler: async (ctx, _req, res) => {
      sendResult(res, await getRunRetention(ctx.db));
    },
  }),
  route({
    method: 'put',
    path: '/api/model-runs/retention',
    access: access.roles(...adminRoles),
    handler: async (ctx, req, res) => {
      const body = parseInput(modelRunRetentionSchema, req.body);
      if (!body.ok) return sendResult(res, body);
      sendResult(res, await setRunRetention(ctx.db, ctx.logger, body.value));
    },
  }),
  route({
    method: 'delete',
    path: '/api/model-runs/:runId',
    access: runManagers,
    handler: async (ctx, req, res) => {
      const params = parseInput(runParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await deleteModelRun(ctx.db, params.value.runId));
    },
  }),
  route({
    method: 'get',
    path: '/api/model-runs/:runId/soundings',
    access: readers,
    handler: async (ctx, req, res) => {
      const params = parseInput(runParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const query = parseInput(gridSoundingListQuerySchema, req.query, 'filters');
      if (!query.ok) return sendResult(res, query);
      sendResult(res, await listGridSoundings(ctx.db, params.value.runId, query.value));
    },
  }),
  route({
    method: 'get',
    path: '/api/grid-soundings/:gridSoundingId',
    access: readers,
    handler: async (ctx, req, res) => {
      const params = parseInput(gridSoundingParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await getGridSounding(ctx.db, params.value.gridSoundingId));
    },
  }),
];
