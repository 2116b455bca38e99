import { z } from 'zod';
import { idParamSchema } from '../../shared/contracts/common';
import { fieldQuerySchema, updateEvidenceRunsInputSchema } from '../../shared/contracts/model-fields';
import { isFieldFigure } from '../../shared/model-fields/field-bands';
import { appError } from '../../shared/errors';
import { err } from '../../shared/result';
import { authoringRoles, officeReaderRoles } from '../../shared/workflow/roles';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { getEvidenceRunSelection, updateEvidenceRuns } from '../services/grid-evidence.service';
import { getModelField, listFieldRuns } from '../services/model-fields.service';
import { route } from './route-definition';

const runParamsSchema = z.object({ runId: idParamSchema });
const outlookParamsSchema = z.object({ outlookId: idParamSchema });
const officeReaders = access.roles(...officeReaderRoles);
const authors = access.roles(...authoringRoles);

/** Model fields drawn on the maps, and which runs feed an outlook's evidence. */
export const modelFieldsRoutes = [
  route({
    method: 'get',
    path: '/api/model-fields',
    access: officeReaders,
    handler: async (ctx, _req, res) => {
      sendResult(res, await listFieldRuns(ctx.db));
    },
  }),
  route({
    method: 'get',
    path: '/api/model-runs/:runId/field',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(runParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const query = parseInput(fieldQuerySchema, req.query, 'filters');
      if (!query.ok) return sendResult(res, query);
      const figure = query.value.figure;
      if (!isFieldFigure(figure)) return sendResult(res, err(appError('VALIDATION_FAILED', `Unknown figure "${figure}".`)));
      sendResult(res, await getModelField(ctx.db, params.value.runId, figure));
    },
  }),
  route({
    method: 'get',
    path: '/api/outlooks/:outlookId/evidence-runs',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await getEvidenceRunSelection(ctx.db, params.value.outlookId));
    },
  }),
  route({
    method: 'patch',
    path: '/api/outlooks/:outlookId/evidence-runs',
    access: authors,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const input = parseInput(updateEvidenceRunsInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await updateEvidenceRuns(ctx.db, actorOf(res), params.value.outlookId, input.value));
    },
  }),
];
