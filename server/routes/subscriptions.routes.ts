import express from 'express';
import { z } from 'zod';
import { idParamSchema } from '../../shared/contracts/common';
import { areaOfInterestInputSchema, placeQuerySchema, subscriptionSettingsInputSchema } from '../../shared/contracts/subscriptions';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendResult } from '../middleware/error-handler';
import { listOutbox, resendOutboxMessage } from '../services/outbox.service';
import { addAreaOfInterest, confirmSubscriptionEmail, findPlaces, getMySubscription, listSubscribers, removeAreaOfInterest, saveMySubscription, unsubscribe } from '../services/subscriptions.service';
import { route } from './route-definition';
import { adminRoles, subscriberOverseerRoles, subscriberRoles } from '../../shared/workflow/roles';
import { escapeHtml } from '../../shared/text/escape-html';
import { publicCaution } from '../../shared/workflow/caution';

const areaParamsSchema = z.object({ areaId: idParamSchema });
const messageParamsSchema = z.object({ messageId: idParamSchema });
const tokenQuerySchema = z.object({ token: z.string().min(10, { message: 'The unsubscribe link is incomplete.' }).max(200) });
const confirmationQuerySchema = z.object({ token: z.string().min(20, { message: 'The confirmation link is incomplete.' }).max(200) });
const subscriber = access.roles(...subscriberRoles);

const page = (title: string, body: string) =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(title)}</title></head><body style="font-family:system-ui,sans-serif;max-width:36rem;margin:3rem auto;padding:0 1rem;color:#1f2a44"><h1 style="font-size:1.4rem">${escapeHtml(title)}</h1>${body}</body></html>`;

export const subscriptionsRoutes = [
  route({
    method: 'get',
    path: '/api/subscriptions/me',
    access: subscriber,
    handler: async (ctx, _req, res) => sendResult(res, await getMySubscription(ctx.db, actorOf(res))),
  }),
  route({
    method: 'put',
    path: '/api/subscriptions/me',
    access: subscriber,
    handler: async (ctx, req, res) => {
      const input = parseInput(subscriptionSettingsInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await saveMySubscription(ctx.db, actorOf(res), input.value, { publicUrl: ctx.config.publicUrl }));
    },
  }),
  route({
    method: 'post',
    path: '/api/areas-of-interest',
    access: subscriber,
    handler: async (ctx, req, res) => {
      const input = parseInput(areaOfInterestInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await addAreaOfInterest(ctx.db, actorOf(res), input.value), 201);
    },
  }),
  route({
    method: 'delete',
    path: '/api/areas-of-interest/:areaId',
    access: subscriber,
    handler: async (ctx, req, res) => {
      const params = parseInput(areaParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await removeAreaOfInterest(ctx.db, actorOf(res), params.value.areaId));
    },
  }),
  route({
    method: 'get',
    path: '/api/places',
    access: access.signedIn,
    handler: (_ctx, req, res) => {
      const query = parseInput(placeQuerySchema, req.query, 'search');
      if (!query.ok) return sendResult(res, query);
      sendResult(res, findPlaces(query.value.q, query.value.kind));
    },
  }),
  route({
    method: 'get',
    path: '/api/subscriptions',
    access: access.roles(...subscriberOverseerRoles),
    handler: async (ctx, _req, res) => sendResult(res, await listSubscribers(ctx.db)),
  }),
  route({
    method: 'get',
    path: '/api/unsubscribe',
    access: access.public,
    handler: (_ctx, req, res) => {
      const query = tokenQuerySchema.safeParse(req.query);
      if (!query.success) return void res.status(400).type('html').send(page('This link is incomplete', '<p>Open your alert settings to stop the e-mails.</p>'));
      res
        .type('html')
        .send(
          page(
            'Stop outlook e-mails?',
            `<p>You will no longer receive outlook e-mails for these areas. You can subscribe again from your alert settings.</p><form method="post" action="/api/unsubscribe?token=${encodeURIComponent(query.data.token)}"><button type="submit" style="padding:.6rem 1rem">Unsubscribe</button></form>`,
          ),
        );
    },
  }),
  route({
    method: 'post',
    path: '/api/unsubscribe',
    access: access.public,
    // RFC 8058 one-click posts application/x-www-form-urlencoded "List-Unsubscribe=One-Click".
    before: [express.urlencoded({ extended: false, limit: '2kb' })],
    handler: async (ctx, req, res) => {
      const query = parseInput(tokenQuerySchema, req.query, 'link');
      if (!query.ok) return sendResult(res, query);
      const result = await unsubscribe(ctx.db, ctx.config.authSecret, query.value.token);
      if (req.is('application/json') || !req.accepts('html')) return sendResult(res, result);
      res.status(result.ok ? 200 : 400).type('html').send(result.ok ? page('You are unsubscribed', '<p>No more outlook e-mails will be sent to you for these areas.</p>') : page('This link did not work', `<p>${escapeHtml(result.error.message)}</p>`));
    },
  }),
  route({
    method: 'get',
    path: '/api/email-confirmations',
    access: access.public,
    // A page with a button, not a change on GET: mail scanners open links on their own.
    handler: (_ctx, req, res) => {
      const query = confirmationQuerySchema.safeParse(req.query);
      if (!query.success) return void res.status(400).type('html').send(page('This link is incomplete', '<p>Open the whole link from the confirmation e-mail.</p>'));
      res
        .type('html')
        .send(
          page(
            'Receive outlook alerts at this address?',
            `<p>Confirm to receive a subscriber's severe-thunderstorm outlook alerts at this address. ${escapeHtml(publicCaution)}</p><form method="post" action="/api/email-confirmations?token=${encodeURIComponent(query.data.token)}"><button type="submit" style="padding:.6rem 1rem">Confirm this address</button></form>`,
          ),
        );
    },
  }),
  route({
    method: 'post',
    path: '/api/email-confirmations',
    access: access.public,
    before: [express.urlencoded({ extended: false, limit: '2kb' })],
    handler: async (ctx, req, res) => {
      const query = parseInput(confirmationQuerySchema, req.query, 'link');
      if (!query.ok) return sendResult(res, query);
      const result = await confirmSubscriptionEmail(ctx.db, query.value.token);
      if (req.is('application/json') || !req.accepts('html')) return sendResult(res, result);
      res
        .status(result.ok ? 200 : 400)
        .type('html')
        .send(result.ok ? page('Address confirmed', `<p>${escapeHtml(result.value.email)} will now receive the subscriber's outlook alerts.</p>`) : page('This link did not work', `<p>${escapeHtml(result.error.message)}</p>`));
    },
  }),
  route({
    method: 'get',
    path: '/api/mail-outbox',
    access: access.roles(...adminRoles),
    handler: async (ctx, _req, res) => sendResult(res, await listOutbox(ctx.db)),
  }),
  route({
    method: 'post',
    path: '/api/mail-outbox/:messageId/resend',
    access: access.roles(...adminRoles),
    handler: async (ctx, req, res) => {
      const params = parseInput(messageParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await resendOutboxMessage(ctx.db, params.value.messageId));
    },
  }),
];
