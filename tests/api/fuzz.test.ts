import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { apiRoutes } from '../../server/routes';
import type { RouteDefinition } from '../../server/routes/route-definition';
import { signedInAgent, startTestApp, testOrigin } from './helpers/test-app';

/**
 * Issue 11 item 7: fast-check sends malformed and hostile input to every public and staff JSON
 * route (path parameters, query strings and bodies built from the field names the contracts
 * use, filled with values the database or the code might choke on) and asserts that no answer
 * is a 5xx. The number of runs is bounded so the file finishes in well under a minute; a
 * failure prints the seed and the request so it can be replayed.
 */

let sd: Stormdraft;
const agents = new Map<string, TestAgent>();
const realIds: string[] = [];
beforeAll(async () => {
  sd = await startTestApp();
  for (const role of ['admin', 'lead', 'forecaster', 'subscriber'] as const) agents.set(role, await signedInAgent(sd.app, role));
  const lead = agents.get('lead');
  if (!lead) throw new Error('no lead agent');
  const draft = await lead.post('/api/outlooks').send({ day: 1, headline: 'Fuzz target' });
  realIds.push(draft.body.id);
  const soundings = await lead.get('/api/soundings');
  const firstSounding: unknown = soundings.body.soundings?.[0]?.id;
  if (typeof firstSounding === 'string') realIds.push(firstSounding);
  const archive = await request(sd.app).get('/api/public/issuances');
  const firstIssuance: unknown = archive.body.issuances?.[0]?.number;
  if (typeof firstIssuance === 'string') realIds.push(firstIssuance);
});
afterAll(async () => {
  await sd?.close();
});

/** Field names the API contracts use; bodies and queries are built from these. */
const fieldNames = [
  'version', 'headline', 'discussion', 'hazardNotes', 'validFrom', 'validUntil', 'areas', 'day', 'issuanceTime', 'q', 'date', 'page', 'pageSize',
  'state', 'reason', 'comment', 'body', 'riskAreaId', 'units', 'emails', 'alertThreshold', 'hazards', 'days', 'paused', 'kind', 'fipsCode', 'geometry',
  'name', 'email', 'password', 'role', 'disabled', 'geojson', 'region', 'timeZone', 'riskLadder', 'guidance', 'allowSelfApproval', 'source',
  'token', 'soundings', 'stationId', 'validTime', 'levels', 'surface', 'id', 'levelKey', 'label', 'coordinates', 'type', 'significant', 'hazard',
];

const nastyString = fc.oneof(
  fc.constantFrom('', '\u0000', 'a\u0000b', '2027-13-45', '0000-01-01', '10000-01-01', '2027-02-30', '0000-01-01T00:00:00Z', '+275760-09-13T00:00:00Z', '2027-04-18T12:00:00Z', '9999-12-31T23:59:59Z', 'NaN', '-1', '1e308', '%00', '../../etc/passwd', "'; drop table users; --", '\uD800', '\uFFFF', 'Polygon', 'level1', 'hail', 'admin', '00000000-0000-4000-8000-000000000000', '2027-0001'),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 20 }),
  fc.constant('x'.repeat(25_000)),
);
const nastyNumber = fc.oneof(fc.constantFrom(0, -1, 1, 2, 3, 2 ** 31 - 1, 2 ** 31, 2 ** 53, -(2 ** 63), 1e308, -1e308, 0.5, Number.MAX_SAFE_INTEGER, 5e-324), fc.integer(), fc.double({ noNaN: true, noDefaultInfinity: true }));
const leaf = fc.oneof(nastyString, nastyNumber, fc.boolean(), fc.constant(null));
const position = fc.tuple(fc.oneof(nastyNumber, fc.double({ min: -180, max: 180, noNaN: true })), fc.oneof(nastyNumber, fc.double({ min: -90, max: 90, noNaN: true })));
const geometry = fc.record({ type: fc.constantFrom('Polygon', 'MultiPolygon', 'Point', 'FeatureCollection'), coordinates: fc.oneof(fc.array(fc.array(position, { maxLength: 8 }), { maxLength: 3 }), fc.array(position, { maxLength: 5 }), leaf) });

const { value: anyValue } = fc.letrec<{ value: unknown }>((tie) => ({
  value: fc.oneof({ depthSize: 'small', withCrossShrink: true }, leaf, geometry, fc.array(tie('value'), { maxLength: 4 }), fc.dictionary(fc.constantFrom(...fieldNames), tie('value'), { maxKeys: 6 })),
}));
const body = fc.oneof(fc.dictionary(fc.constantFrom(...fieldNames), anyValue, { maxKeys: 10 }), anyValue);
const query = fc.dictionary(fc.constantFrom(...fieldNames), fc.oneof(nastyString, nastyNumber.map(String)), { maxKeys: 4 });
const pathValue = fc.oneof(fc.constantFrom('00000000-0000-4000-8000-000000000000', 'not-an-id', '%00', '%E0%A4%A', '2027-0001', '9999-9999', '..', '%2e%2e'), fc.string({ minLength: 1, maxLength: 30 }).map(encodeURIComponent), fc.constant('realId'));

const square = [[[-94, 37], [-92, 37], [-92, 39], [-94, 39], [-94, 37]]];
/** Valid bodies for the main write routes; the fuzzer replaces one field at a time to get past the first check. */
const validBodies: Record<string, Record<string, unknown>> = {
  'post /api/outlooks': { day: 1, issuanceTime: '2027-04-18T15:00:00Z', headline: 'Fuzz' },
  'put /api/outlooks/:outlookId': { version: 1, headline: 'Fuzz', discussion: 'text', hazardNotes: { hail: 'note' }, validFrom: '2027-04-18T15:00:00Z', validUntil: '2027-04-19T12:00:00Z', areas: [{ levelKey: 'level1', hazards: [{ hazard: 'hail', significant: false }], geometry: { type: 'Polygon', coordinates: square }, label: 'A' }] },
  'post /api/outlooks/area-imports': { geojson: { type: 'FeatureCollection', features: [{ type: 'Feature', properties: { level: 'level1' }, geometry: { type: 'Polygon', coordinates: square } }] } },
  'put /api/subscriptions/me': { version: 1, alertThreshold: 'level1', hazards: ['hail'], days: [1], emails: ['em@county.test'], paused: false },
  'post /api/areas-of-interest': { kind: 'drawn', name: 'Area', geometry: { type: 'Polygon', coordinates: square } },
  'put /api/me/preferences': { units: { temperature: 'C', height: 'm', speed: 'kt' } },
  'post /api/users': { name: 'Fuzz', email: 'fuzz@office.test', password: 'gravel-orchard-lantern-42', role: 'forecaster' },
  'post /api/outlooks/:outlookId/comments': { body: 'A comment', riskAreaId: '00000000-0000-4000-8000-000000000000' },
  'post /api/outlooks/:outlookId/submit': { version: 1, comment: 'ok' },
  'post /api/issuances/:issuanceNumber/withdraw': { reason: 'Fuzzing reason' },
};

/** JSON routes (uploads take multipart and are fuzzed through their own tests). */
const fuzzedRoutes = apiRoutes.filter((r) => r.path !== '/api/soundings/uploads');

function agentFor(routeDefinition: RouteDefinition): TestAgent | undefined {
  const rule = routeDefinition.access;
  if (rule.kind === 'public') return undefined;
  if (rule.kind === 'signed-in') return agents.get('subscriber');
  const role = (['lead', 'admin', 'forecaster', 'subscriber'] as const).find((r) => rule.roles.includes(r));
  return role ? agents.get(role) : undefined;
}

describe('issue 11 item 7: no 5xx from any input', () => {
  it('When the public and staff JSON routes get hostile paths, queries and bodies, then none answers 5xx', async () => {
    const sample = fc.record({
      routeIndex: fc.nat({ max: fuzzedRoutes.length - 1 }),
      params: fc.array(pathValue, { minLength: 3, maxLength: 3 }),
      realIdIndex: fc.nat({ max: 10 }),
      query,
      body,
      mutation: fc.option(fc.tuple(fc.constantFrom(...fieldNames), anyValue), { nil: undefined }),
    });
    await fc.assert(
      fc.asyncProperty(sample, async ({ routeIndex, params, realIdIndex, query: q, body: randomBody, mutation }) => {
        const definition = fuzzedRoutes[routeIndex];
        if (!definition) return;
        const template = validBodies[`${definition.method} ${definition.path}`];
        // Half the time a valid body with one field replaced, so deeper checks are reached too.
        const b: unknown = template && mutation ? { ...template, [mutation[0]]: mutation[1] } : randomBody;
        let i = 0;
        const path = definition.path.replace(/:[A-Za-z]+/g, () => {
          const value = params[i++] ?? 'x';
          return value === 'realId' ? encodeURIComponent(realIds[realIdIndex % Math.max(realIds.length, 1)] ?? 'x') : value;
        });
        const search = new URLSearchParams(Object.entries(q)).toString();
        const url = search ? `${path}?${search}` : path;
        const agent = agentFor(definition);
        const base = agent ?? request(sd.app);
        let call = base[definition.method](url).set('Origin', testOrigin);
        if (definition.method !== 'get') call = call.set('Content-Type', 'application/json').send(JSON.stringify(b));
        const res = await call;
        expect(res.status, `${definition.method.toUpperCase()} ${url} ${JSON.stringify(b).slice(0, 300)} → ${res.status} ${String(res.text ?? '').slice(0, 200)}`).toBeLessThan(500);
      }),
      { numRuns: 800, endOnFailure: true },
    );
  }, 120_000);
});
