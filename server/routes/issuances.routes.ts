import { z } from 'zod';
import { archiveQuerySchema, issuanceNumberSchema, withdrawInputSchema } from '../../shared/contracts/workflow';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { amendIssuance, atomFeed, currentBulletin, getIssuance, issuanceGeoJson, issuanceKml, issuanceMap, listArchive, withdrawIssuance } from '../services/issuances.service';
import { sendError } from '../middleware/error-handler';
import { route } from './route-definition';
import { authoringRoles, reviewingRoles } from '../../shared/workflow/roles';

const numberParamsSchema = z.object({ issuanceNumber: issuanceNumberSchema });

export const issuancesRoutes = [
  route({
    method: 'get',
    path: '/api/public/bulletin',
    access: access.public,
    handler: async (ctx, _req, res) => sendResult(res, await currentBulletin(ctx.db)),
  }),
  route({
    method: 'get',
    path: '/api/public/issuances',
    access: access.public,
    handler: async (ctx, req, res) => {
      const query = parseInput(archiveQuerySchema, req.query, 'search');
      if (!query.ok) return sendResult(res, query);
      sendResult(res, await listArchive(ctx.db, query.value));
    },
  }),
  route({
    method: 'get',
    path: '/api/public/issuances/:issuanceNumber',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await getIssuance(ctx.db, params.value.issuanceNumber));
    },
  }),
  route({
    method: 'get',
    path: '/api/public/issuances/:issuanceNumber/geojson',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const result = await issuanceGeoJson(ctx.db, params.value.issuanceNumber);
      if (result.ok) res.type('application/geo+json').attachment(`stormdraft-${params.value.issuanceNumber}.geojson`);
      sendResult(res, result);
    },
  }),
  route({
    method: 'get',
    path: '/api/public/issuances/:issuanceNumber/kml',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const result = await issuanceKml(ctx.db, params.value.issuanceNumber);
      if (!result.ok) return sendError(res, result.error);
      res.type('application/vnd.google-earth.kml+xml').attachment(`stormdraft-${params.value.issuanceNumber}.kml`).send(result.value);
    },
  }),
  route({
    method: 'get',
    path: '/api/public/issuances/:issuanceNumber/map.svg',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const result = await issuanceMap(ctx.db, params.value.issuanceNumber, 'svg');
      if (!result.ok) {
        if (result.error.code === 'SERVICE_UNAVAILABLE') res.set('Retry-After', '60');
        return sendError(res, result.error);
      }
      res.type('image/svg+xml').send(result.value);
    },
  }),
  route({
    method: 'get',
    path: '/api/public/issuances/:issuanceNumber/map.png',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const result = await issuanceMap(ctx.db, params.value.issuanceNumber, 'png');
      if (!result.ok) {
        if (result.error.code === 'SERVICE_UNAVAILABLE') res.set('Retry-After', '60');
        return sendError(res, result.error);
      }
      res.type('image/png').send(result.value);
    },
  }),
  route({
    method: 'get',
    path: '/api/public/feed.atom',
    access: access.public,
    handler: async (ctx, _req, res) => {
      const result = await atomFeed(ctx.db, ctx.config.publicUrl);
      if (!result.ok) return sendError(res, result.error);
      res.type('application/atom+xml').send(result.value);
    },
  }),
  route({
    method: 'post',
    path: '/api/issuances/:issuanceNumber/withdraw',
    access: access.roles(...reviewingRoles),
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const input = parseInput(withdrawInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await withdrawIssuance(ctx.db, ctx.config, actorOf(res), params.value.issuanceNumber, input.value.reason));
    },
  }),
  route({
    method: 'post',
    path: '/api/issuances/:issuanceNumber/amend',
    access: access.roles(...authoringRoles),
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await amendIssuance(ctx.db, actorOf(res), params.value.issuanceNumber), 201);
    },
  }),
];
