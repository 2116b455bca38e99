import { z } from 'zod';
import { idParamSchema } from '../../shared/contracts/common';
import { areaImportInputSchema, createOutlookInputSchema, evidenceQuerySchema, outlookListQuerySchema, saveOutlookInputSchema } from '../../shared/contracts/outlooks';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { createOutlook, exportAreasGeoJson, getOutlook, getEvidenceCandidates, getOutlookEvidence, getRevision, importAreasGeoJson, listOutlooks, listRevisions, saveOutlook } from '../services/outlooks.service';
import { route } from './route-definition';
import { authoringRoles, officeReaderRoles } from '../../shared/workflow/roles';

const outlookParamsSchema = z.object({ outlookId: idParamSchema });
const revisionParamsSchema = z.object({ revisionId: idParamSchema });
const officeReaders = access.roles(...officeReaderRoles);
const authors = access.roles(...authoringRoles);

export const outlooksRoutes = [
  route({
    method: 'get',
    path: '/api/outlooks',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const query = parseInput(outlookListQuerySchema, req.query, 'filters');
      if (!query.ok) return sendResult(res, query);
      sendResult(res, await listOutlooks(ctx.db, query.value));
    },
  }),
  route({
    method: 'post',
    path: '/api/outlooks',
    access: authors,
    handler: async (ctx, req, res) => {
      const input = parseInput(createOutlookInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await createOutlook(ctx.db, actorOf(res), input.value), 201);
    },
  }),
  route({
    method: 'post',
    path: '/api/outlooks/area-imports',
    access: authors,
    handler: async (ctx, req, res) => {
      const input = parseInput(areaImportInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await importAreasGeoJson(ctx.db, input.value.geojson));
    },
  }),
  route({
    method: 'get',
    path: '/api/outlooks/:outlookId',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await getOutlook(ctx.db, params.value.outlookId));
    },
  }),
  route({
    method: 'put',
    path: '/api/outlooks/:outlookId',
    access: authors,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const input = parseInput(saveOutlookInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await saveOutlook(ctx.db, actorOf(res), params.value.outlookId, input.value));
    },
  }),
  route({
    method: 'get',
    path: '/api/outlooks/:outlookId/evidence',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const query = parseInput(evidenceQuerySchema, req.query, 'filters');
      if (!query.ok) return sendResult(res, query);
      sendResult(res, await getOutlookEvidence(ctx.db, params.value.outlookId, query.value.source));
    },
  }),
  route({
    method: 'get',
    path: '/api/outlooks/:outlookId/evidence-candidates',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await getEvidenceCandidates(ctx.db, params.value.outlookId));
    },
  }),
  route({
    method: 'get',
    path: '/api/outlooks/:outlookId/geojson',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const result = await exportAreasGeoJson(ctx.db, params.value.outlookId);
      if (result.ok) res.type('application/geo+json').attachment(`outlook-${params.value.outlookId}.geojson`);
      sendResult(res, result);
    },
  }),
  route({
    method: 'get',
    path: '/api/outlooks/:outlookId/revisions',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(outlookParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await listRevisions(ctx.db, params.value.outlookId));
    },
  }),
  route({
    method: 'get',
    path: '/api/outlook-revisions/:revisionId',
    access: officeReaders,
    handler: async (ctx, req, res) => {
      const params = parseInput(revisionParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await getRevision(ctx.db, params.value.revisionId));
    },
  }),
];
