import { webhookManagerRoles } from '../../shared/workflow/roles';
import { z } from 'zod';
import { idParamSchema } from '../../shared/contracts/common';
import { createWebhookEndpointInputSchema } from '../../shared/contracts/webhooks';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { deleteWebhookEndpoint, listWebhookDeliveries, listWebhookEndpoints, registerWebhookEndpoint, retryWebhookDelivery } from '../services/webhooks.service';
import { route } from './route-definition';

const endpointParamsSchema = z.object({ endpointId: idParamSchema });
const deliveryParamsSchema = z.object({ deliveryId: idParamSchema });
const managers = access.roles(...webhookManagerRoles);

/** Webhook endpoints: subscribers manage their own; admins manage endpoints for agencies and see all. */
export const webhooksRoutes = [
  route({
    method: 'get',
    path: '/api/webhook-endpoints',
    access: managers,
    handler: async (ctx, _req, res) => sendResult(res, await listWebhookEndpoints(ctx.db, actorOf(res))),
  }),
  route({
    method: 'post',
    path: '/api/webhook-endpoints',
    access: managers,
    handler: async (ctx, req, res) => {
      const input = parseInput(createWebhookEndpointInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await registerWebhookEndpoint(ctx.db, ctx.config, actorOf(res), input.value), 201);
    },
  }),
  route({
    method: 'delete',
    path: '/api/webhook-endpoints/:endpointId',
    access: managers,
    handler: async (ctx, req, res) => {
      const params = parseInput(endpointParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await deleteWebhookEndpoint(ctx.db, actorOf(res), params.value.endpointId));
    },
  }),
  route({
    method: 'get',
    path: '/api/webhook-endpoints/:endpointId/deliveries',
    access: managers,
    handler: async (ctx, req, res) => {
      const params = parseInput(endpointParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await listWebhookDeliveries(ctx.db, actorOf(res), params.value.endpointId));
    },
  }),
  route({
    method: 'post',
    path: '/api/webhook-deliveries/:deliveryId/retry',
    access: managers,
    handler: async (ctx, req, res) => {
      const params = parseInput(deliveryParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await retryWebhookDelivery(ctx.db, actorOf(res), params.value.deliveryId));
    },
  }),
];
