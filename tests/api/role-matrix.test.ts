import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { apiRoutes } from '../../server/routes';
import type { Stormdraft } from '../../server/start';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';

type Caller = 'anonymous' | 'subscriber' | 'forecaster' | 'lead' | 'admin';
const callers: Caller[] = ['anonymous', 'subscriber', 'forecaster', 'lead', 'admin'];

interface MatrixRow {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** The route as declared; `:params` are filled from `sample`. */
  route: string;
  url: string;
  body?: unknown;
  expect: Record<Caller, number>;
}

const missingId = '00000000-0000-4000-8000-000000000000';
const staffOnly = (allowed: number): Record<Caller, number> => ({ anonymous: 401, subscriber: 403, forecaster: 403, lead: 403, admin: allowed });
const anyone = (status: number): Record<Caller, number> => ({ anonymous: status, subscriber: status, forecaster: status, lead: status, admin: status });
const readers = (status: number): Record<Caller, number> => ({ anonymous: 401, subscriber: 403, forecaster: status, lead: status, admin: status });
const authors = (status: number): Record<Caller, number> => ({ anonymous: 401, subscriber: 403, forecaster: status, lead: status, admin: 403 });
const leadOnly = (status: number): Record<Caller, number> => ({ anonymous: 401, subscriber: 403, forecaster: 403, lead: status, admin: 403 });
const subscriberOnly = (status: number): Record<Caller, number> => ({ anonymous: 401, subscriber: status, forecaster: 403, lead: 403, admin: 403 });
const webhookManagers = (status: number): Record<Caller, number> => ({ anonymous: 401, subscriber: status, forecaster: 403, lead: 403, admin: status });
const signedIn = (status: number): Record<Caller, number> => ({ anonymous: 401, subscriber: status, forecaster: status, lead: status, admin: status });

/**
 * Every API route × every caller → the expected status. Bodies are deliberately empty or
 * invalid, so an allowed caller gets 400 (validation) and nothing is changed by the matrix.
 * New routes must be added here: the first test fails until they are.
 */
const matrix: MatrixRow[] = [
  { method: 'get', route: '/api/health', url: '/api/health', expect: anyone(200) },
  { method: 'get', route: '/api/me', url: '/api/me', expect: signedIn(200) },
  { method: 'put', route: '/api/me/preferences', url: '/api/me/preferences', body: {}, expect: signedIn(400) },
  { method: 'get', route: '/api/office', url: '/api/office', expect: anyone(200) },
  { method: 'put', route: '/api/office', url: '/api/office', body: {}, expect: staffOnly(400) },
  { method: 'get', route: '/api/users', url: '/api/users', expect: staffOnly(200) },
  { method: 'post', route: '/api/users', url: '/api/users', body: {}, expect: staffOnly(400) },
  { method: 'patch', route: '/api/users/:userId', url: `/api/users/${missingId}`, body: {}, expect: staffOnly(400) },
  { method: 'get', route: '/api/mail-messages', url: '/api/mail-messages', expect: staffOnly(200) },
  { method: 'get', route: '/api/mail-messages/:messageId', url: `/api/mail-messages/${missingId}`, expect: staffOnly(404) },
  { method: 'get', route: '/api/soundings', url: '/api/soundings', expect: readers(200) },
  { method: 'post', route: '/api/soundings', url: '/api/soundings', body: {}, expect: authors(400) },
  { method: 'post', route: '/api/soundings/batch', url: '/api/soundings/batch', body: {}, expect: authors(400) },
  { method: 'post', route: '/api/soundings/uploads', url: '/api/soundings/uploads', expect: authors(400) },
  { method: 'get', route: '/api/soundings/:soundingId', url: `/api/soundings/${missingId}`, expect: readers(404) },
  { method: 'delete', route: '/api/soundings/:soundingId', url: `/api/soundings/${missingId}`, expect: authors(404) },
  { method: 'patch', route: '/api/soundings/:soundingId/metadata', url: `/api/soundings/${missingId}/metadata`, body: {}, expect: authors(400) },
  { method: 'post', route: '/api/soundings/:soundingId/modified', url: `/api/soundings/${missingId}/modified`, body: {}, expect: authors(400) },
  { method: 'get', route: '/api/outlooks', url: '/api/outlooks', expect: readers(200) },
  { method: 'post', route: '/api/outlooks', url: '/api/outlooks', body: {}, expect: authors(400) },
  { method: 'post', route: '/api/outlooks/area-imports', url: '/api/outlooks/area-imports', body: {}, expect: authors(400) },
  { method: 'get', route: '/api/outlooks/:outlookId', url: `/api/outlooks/${missingId}`, expect: readers(404) },
  { method: 'put', route: '/api/outlooks/:outlookId', url: `/api/outlooks/${missingId}`, body: {}, expect: authors(400) },
  { method: 'get', route: '/api/outlooks/:outlookId/evidence', url: `/api/outlooks/${missingId}/evidence`, expect: readers(404) },
  { method: 'get', route: '/api/outlooks/:outlookId/evidence-candidates', url: `/api/outlooks/${missingId}/evidence-candidates`, expect: readers(404) },
  { method: 'get', route: '/api/outlooks/:outlookId/geojson', url: `/api/outlooks/${missingId}/geojson`, expect: readers(404) },
  { method: 'get', route: '/api/outlooks/:outlookId/revisions', url: `/api/outlooks/${missingId}/revisions`, expect: readers(404) },
  { method: 'get', route: '/api/outlook-revisions/:revisionId', url: `/api/outlook-revisions/${missingId}`, expect: readers(404) },
  { method: 'post', route: '/api/outlooks/:outlookId/submit', url: `/api/outlooks/${missingId}/submit`, body: {}, expect: authors(400) },
  { method: 'post', route: '/api/outlooks/:outlookId/return', url: `/api/outlooks/${missingId}/return`, body: {}, expect: leadOnly(400) },
  { method: 'post', route: '/api/outlooks/:outlookId/approve', url: `/api/outlooks/${missingId}/approve`, body: {}, expect: leadOnly(400) },
  { method: 'post', route: '/api/outlooks/:outlookId/publish', url: `/api/outlooks/${missingId}/publish`, body: {}, expect: leadOnly(400) },
  { method: 'get', route: '/api/outlooks/:outlookId/comments', url: `/api/outlooks/${missingId}/comments`, expect: readers(404) },
  { method: 'post', route: '/api/outlooks/:outlookId/comments', url: `/api/outlooks/${missingId}/comments`, body: {}, expect: authors(400) },
  { method: 'get', route: '/api/outlooks/:outlookId/audit', url: `/api/outlooks/${missingId}/audit`, expect: readers(404) },
  { method: 'get', route: '/api/public/bulletin', url: '/api/public/bulletin', expect: anyone(200) },
  { method: 'get', route: '/api/public/issuances', url: '/api/public/issuances', expect: anyone(200) },
  { method: 'get', route: '/api/public/issuances/:issuanceNumber', url: '/api/public/issuances/1999-0001', expect: anyone(404) },
  { method: 'get', route: '/api/public/issuances/:issuanceNumber/geojson', url: '/api/public/issuances/1999-0001/geojson', expect: anyone(404) },
  { method: 'get', route: '/api/public/issuances/:issuanceNumber/kml', url: '/api/public/issuances/1999-0001/kml', expect: anyone(404) },
  { method: 'get', route: '/api/public/issuances/:issuanceNumber/map.svg', url: '/api/public/issuances/1999-0001/map.svg', expect: anyone(404) },
  { method: 'get', route: '/api/public/issuances/:issuanceNumber/map.png', url: '/api/public/issuances/1999-0001/map.png', expect: anyone(404) },
  { method: 'get', route: '/api/public/feed.atom', url: '/api/public/feed.atom', expect: anyone(200) },
  { method: 'post', route: '/api/issuances/:issuanceNumber/withdraw', url: '/api/issuances/1999-0001/withdraw', body: {}, expect: leadOnly(400) },
  { method: 'post', route: '/api/issuances/:issuanceNumber/amend', url: '/api/issuances/1999-0001/amend', body: {}, expect: authors(404) },
  { method: 'get', route: '/api/subscriptions/me', url: '/api/subscriptions/me', expect: subscriberOnly(200) },
  { method: 'put', route: '/api/subscriptions/me', url: '/api/subscriptions/me', body: {}, expect: subscriberOnly(400) },
  { method: 'post', route: '/api/areas-of-interest', url: '/api/areas-of-interest', body: {}, expect: subscriberOnly(400) },
  { method: 'delete', route: '/api/areas-of-interest/:areaId', url: `/api/areas-of-interest/${missingId}`, expect: subscriberOnly(404) },
  { method: 'get', route: '/api/places', url: '/api/places?q=Boone', expect: signedIn(200) },
  { method: 'get', route: '/api/subscriptions', url: '/api/subscriptions', expect: { anonymous: 401, subscriber: 403, forecaster: 403, lead: 200, admin: 200 } },
  { method: 'get', route: '/api/unsubscribe', url: '/api/unsubscribe?token=not-a-real-token', expect: anyone(200) },
  { method: 'post', route: '/api/unsubscribe', url: '/api/unsubscribe?token=not-a-real-token', body: {}, expect: anyone(400) },
  { method: 'get', route: '/api/email-confirmations', url: '/api/email-confirmations?token=not-a-real-token-at-all', expect: anyone(200) },
  { method: 'post', route: '/api/email-confirmations', url: '/api/email-confirmations?token=not-a-real-token-at-all', body: {}, expect: anyone(400) },
  { method: 'get', route: '/api/mail-outbox', url: '/api/mail-outbox', expect: staffOnly(200) },
  { method: 'get', route: '/api/webhook-endpoints', url: '/api/webhook-endpoints', expect: webhookManagers(200) },
  { method: 'post', route: '/api/webhook-endpoints', url: '/api/webhook-endpoints', body: {}, expect: webhookManagers(400) },
  { method: 'delete', route: '/api/webhook-endpoints/:endpointId', url: `/api/webhook-endpoints/${missingId}`, expect: webhookManagers(404) },
  { method: 'get', route: '/api/webhook-endpoints/:endpointId/deliveries', url: `/api/webhook-endpoints/${missingId}/deliveries`, expect: webhookManagers(404) },
  { method: 'post', route: '/api/webhook-deliveries/:deliveryId/retry', url: `/api/webhook-deliveries/${missingId}/retry`, body: {}, expect: webhookManagers(404) },
  { method: 'get', route: '/api/ogc', url: '/api/ogc', expect: anyone(200) },
  { method: 'get', route: '/api/ogc/api', url: '/api/ogc/api', expect: anyone(200) },
  { method: 'get', route: '/api/ogc/conformance', url: '/api/ogc/conformance', expect: anyone(200) },
  { method: 'get', route: '/api/ogc/collections', url: '/api/ogc/collections', expect: anyone(200) },
  { method: 'get', route: '/api/ogc/collections/:collectionId', url: '/api/ogc/collections/none', expect: anyone(404) },
  { method: 'get', route: '/api/ogc/collections/:collectionId/items', url: '/api/ogc/collections/risk-areas/items', expect: anyone(200) },
  { method: 'get', route: '/api/ogc/collections/:collectionId/items/:featureId', url: '/api/ogc/collections/issuances/items/1999-0001', expect: anyone(404) },
  { method: 'get', route: '/api/public/cap', url: '/api/public/cap', expect: anyone(200) },
  { method: 'get', route: '/api/public/cap/:issuanceNumber', url: '/api/public/cap/1999-0001', expect: anyone(404) },
  { method: 'get', route: '/api/public/cap/:issuanceNumber/withdrawal', url: '/api/public/cap/1999-0001/withdrawal', expect: anyone(404) },
  { method: 'post', route: '/api/storm-reports', url: '/api/storm-reports', body: {}, expect: readers(400) },
  { method: 'post', route: '/api/storm-reports/uploads', url: '/api/storm-reports/uploads', expect: readers(400) },
  { method: 'get', route: '/api/storm-reports', url: '/api/storm-reports', expect: readers(200) },
  { method: 'get', route: '/api/public/issuances/:issuanceNumber/verification', url: '/api/public/issuances/1999-0001/verification', expect: anyone(404) },
  { method: 'get', route: '/api/verification', url: '/api/verification', expect: readers(200) },
  { method: 'get', route: '/api/verification/export.csv', url: '/api/verification/export.csv', expect: readers(200) },
  { method: 'get', route: '/api/model-runs', url: '/api/model-runs', expect: readers(200) },
  { method: 'get', route: '/api/model-runs/retention', url: '/api/model-runs/retention', expect: readers(200) },
  { method: 'put', route: '/api/model-runs/retention', url: '/api/model-runs/retention', body: {}, expect: staffOnly(400) },
  { method: 'delete', route: '/api/model-runs/:runId', url: `/api/model-runs/${missingId}`, expect: { anonymous: 401, subscriber: 403, forecaster: 403, lead: 404, admin: 404 } },
  { method: 'get', route: '/api/model-runs/:runId/soundings', url: `/api/model-runs/${missingId}/soundings`, expect: readers(404) },
  { method: 'get', route: '/api/grid-soundings/:gridSoundingId', url: `/api/grid-soundings/${missingId}:0`, expect: readers(404) },
  { method: 'get', route: '/api/intake/status', url: '/api/intake/status', expect: readers(200) },
  { method: 'get', route: '/api/intake-files', url: '/api/intake-files', expect: readers(200) },
  { method: 'get', route: '/api/intake-sources', url: '/api/intake-sources', expect: staffOnly(200) },
  { method: 'post', route: '/api/intake-sources', url: '/api/intake-sources', body: {}, expect: staffOnly(400) },
  { method: 'patch', route: '/api/intake-sources/:sourceId', url: `/api/intake-sources/${missingId}`, body: {}, expect: staffOnly(400) },
  { method: 'delete', route: '/api/intake-sources/:sourceId', url: `/api/intake-sources/${missingId}`, expect: staffOnly(404) },
  { method: 'post', route: '/api/intake-sources/:sourceId/pull', url: `/api/intake-sources/${missingId}/pull`, body: {}, expect: staffOnly(404) },
  { method: 'get', route: '/api/model-fields', url: '/api/model-fields', expect: readers(200) },
  { method: 'get', route: '/api/model-runs/:runId/field', url: `/api/model-runs/${missingId}/field?figure=mlCape`, expect: readers(404) },
  { method: 'get', route: '/api/outlooks/:outlookId/evidence-runs', url: `/api/outlooks/${missingId}/evidence-runs`, expect: readers(404) },
  { method: 'patch', route: '/api/outlooks/:outlookId/evidence-runs', url: `/api/outlooks/${missingId}/evidence-runs`, body: {}, expect: authors(400) },
  { method: 'post', route: '/api/mail-outbox/:messageId/resend', url: `/api/mail-outbox/${missingId}/resend`, body: {}, expect: staffOnly(409) },
];

let sd: Stormdraft;
const agents = {} as Record<Caller, TestAgent>;

beforeAll(async () => {
  sd = await startTestApp();
  agents.anonymous = agentFor(sd.app);
  for (const role of ['subscriber', 'forecaster', 'lead', 'admin'] as const) agents[role] = await signedInAgent(sd.app, role);
});
afterAll(async () => {
  await sd?.close();
});

describe('role matrix', () => {
  it('When a route is declared in server/routes, then the matrix lists it (and nothing else)', () => {
    const declared = apiRoutes.map((r) => `${r.method.toUpperCase()} ${r.path}`).sort();
    const listed = matrix.map((r) => `${r.method.toUpperCase()} ${r.route}`).sort();
    expect(listed).toEqual(declared);
  });

  const cases = matrix.flatMap((row) => callers.map((caller) => ({ row, caller })));
  it.each(cases.map((c) => [`${c.row.method.toUpperCase()} ${c.row.route}`, c.caller, c.row.expect[c.caller], c] as const))(
    'When %s is called by %s, then the status is %i',
    async (_name, caller, expected, { row }) => {
      let req = agents[caller][row.method](row.url);
      if (row.body !== undefined) req = req.send(row.body as object);
      const res = await req;
      expect(res.status, JSON.stringify(res.body)).toBe(expected);
    },
  );
});
