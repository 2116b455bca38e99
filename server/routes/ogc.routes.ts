import type { Request } from 'express';
import { ogcCollectionParamsSchema, ogcFeatureParamsSchema, ogcItemsQuerySchema, ogcNoQuerySchema } from '../../shared/contracts/ogc';
import { access } from '../auth/require-role';
import { parseInput, sendError, sendResult } from '../middleware/error-handler';
import { publicCaution } from '../../shared/workflow/caution';
import { conformance, getCollection, getItem, landingPage, listCollections, listItems, officeName, openApiMediaType } from '../services/ogc.service';
import { ogcOpenApi } from './ogc-openapi';
import { route } from './route-definition';

const geojson = 'application/geo+json';

/** Query values as plain strings (repeated parameters are refused by the schema, not here). */
function rawQuery(req: Request): Record<string, string> {
  return Object.fromEntries(Object.entries(req.query).filter((entry): entry is [string, string] => typeof entry[1] === 'string'));
}

/** OGC API – Features Part 1 (Core + GeoJSON), read-only and public, under /api/ogc. */
export const ogcRoutes = [
  route({
    method: 'get',
    path: '/api/ogc',
    access: access.public,
    handler: async (ctx, req, res) => {
      const query = parseInput(ogcNoQuerySchema, req.query, 'query');
      if (!query.ok) return sendResult(res, query);
      res.json(landingPage(ctx.config.publicUrl, await officeName(ctx.db)));
    },
  }),
  route({
    method: 'get',
    path: '/api/ogc/api',
    access: access.public,
    handler: (ctx, req, res) => {
      const query = parseInput(ogcNoQuerySchema, req.query, 'query');
      if (!query.ok) return sendResult(res, query);
      res.type(openApiMediaType).send(JSON.stringify(ogcOpenApi(ctx.config.publicUrl, publicCaution)));
    },
  }),
  route({
    method: 'get',
    path: '/api/ogc/conformance',
    access: access.public,
    handler: (_ctx, req, res) => {
      const query = parseInput(ogcNoQuerySchema, req.query, 'query');
      if (!query.ok) return sendResult(res, query);
      res.json(conformance());
    },
  }),
  route({
    method: 'get',
    path: '/api/ogc/collections',
    access: access.public,
    handler: async (ctx, req, res) => {
      const query = parseInput(ogcNoQuerySchema, req.query, 'query');
      if (!query.ok) return sendResult(res, query);
      res.json(await listCollections(ctx.db, ctx.config.publicUrl, new Date()));
    },
  }),
  route({
    method: 'get',
    path: '/api/ogc/collections/:collectionId',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(ogcCollectionParamsSchema, req.params, 'address');
      if (!params.ok) return sendError(res, { ...params.error, code: 'NOT_FOUND' });
      const query = parseInput(ogcNoQuerySchema, req.query, 'query');
      if (!query.ok) return sendResult(res, query);
      res.json(await getCollection(ctx.db, ctx.config.publicUrl, params.value.collectionId, new Date()));
    },
  }),
  route({
    method: 'get',
    path: '/api/ogc/collections/:collectionId/items',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(ogcCollectionParamsSchema, req.params, 'address');
      if (!params.ok) return sendError(res, { ...params.error, code: 'NOT_FOUND' });
      const query = parseInput(ogcItemsQuerySchema, req.query, 'query');
      if (!query.ok) return sendResult(res, query);
      const page = await listItems(ctx.db, ctx.config.publicUrl, params.value.collectionId, query.value, rawQuery(req), new Date());
      res.type(geojson).send(JSON.stringify(page));
    },
  }),
  route({
    method: 'get',
    path: '/api/ogc/collections/:collectionId/items/:featureId',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(ogcFeatureParamsSchema, req.params, 'address');
      if (!params.ok) return sendError(res, { ...params.error, code: 'NOT_FOUND' });
      const query = parseInput(ogcNoQuerySchema, req.query, 'query');
      if (!query.ok) return sendResult(res, query);
      const result = await getItem(ctx.db, ctx.config.publicUrl, params.value.collectionId, params.value.featureId, new Date());
      if (!result.ok) return sendError(res, result.error);
      res.type(geojson).send(JSON.stringify(result.value));
    },
  }),
];
