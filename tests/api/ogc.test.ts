import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { agentFor, signedInAgent, startTestApp, testOrigin } from './helpers/test-app';
import { amendAndPublish, areaAround, publishOutlook } from './open-standards-helpers';

/**
 * OGC API – Features – Part 1: Core (OGC 17-069r4), tests of the conformance classes the API
 * claims: Core and GeoJSON. Requirement names (/req/core/…) are the standard's.
 */

let sd: Stormdraft;
let anonymous: TestAgent;
let current: string;
let superseded: string;
let withdrawn: string;
let expired: string;
const root = '/api/ogc';
const core = 'http://www.opengis.net/spec/ogcapi-features-1/1.0/conf/core';
const geojsonClass = 'http://www.opengis.net/spec/ogcapi-features-1/1.0/conf/geojson';

interface Link {
  href: string;
  rel: string;
  type: string;
}
const path = (href: string) => {
  const url = new URL(href);
  expect(url.origin).toBe(testOrigin);
  return url.pathname + url.search;
};
const linkOf = (links: Link[], rel: string) => links.find((l) => l.rel === rel);

beforeAll(async () => {
  sd = await startTestApp();
  anonymous = agentFor(sd.app);
  const forecaster = await signedInAgent(sd.app, 'forecaster');
  const lead = await signedInAgent(sd.app, 'lead');
  const now = new Date().toISOString();
  superseded = await publishOutlook(forecaster, lead, { day: 2, issuanceTime: now, headline: 'First take', areas: [{ levelKey: 'level1', geometry: areaAround(-100, 30) }] });
  // The amendment: five areas, two far east (around -85) and three west (around -97).
  current = await amendAndPublish(
    forecaster,
    lead,
    superseded,
    [
      { levelKey: 'level1', geometry: areaAround(-97, 38, 2) },
      { levelKey: 'level2', geometry: areaAround(-97, 38, 1) },
      { levelKey: 'level3', geometry: areaAround(-97, 38, 0.4), hazards: [{ hazard: 'tornado', significant: true }] },
      { levelKey: 'thunder', geometry: areaAround(-85, 35, 1) },
      { levelKey: 'level1', geometry: areaAround(-85, 35, 0.5) },
    ],
    'Storms west and east',
  );
  withdrawn = await publishOutlook(forecaster, lead, { day: 3, issuanceTime: now, headline: 'Withdrawn one', areas: [{ levelKey: 'level2', geometry: areaAround(-90, 40) }] });
  expect((await lead.post(`/api/issuances/${withdrawn}/withdraw`).send({ reason: 'Not needed.' })).status).toBe(200);
  expired = await publishOutlook(forecaster, lead, { day: 1, issuanceTime: '2020-05-01T15:00:00Z', headline: 'Long past', areas: [{ levelKey: 'level4', geometry: areaAround(-97, 38) }] });
});
afterAll(async () => {
  await sd?.close();
});

async function allItems(collection: string, query = ''): Promise<{ ids: string[]; pages: number; matched: number[] }> {
  let next: string | undefined = `${root}/collections/${collection}/items?limit=2${query}`;
  const ids: string[] = [];
  const matched: number[] = [];
  let pages = 0;
  while (next && pages < 50) {
    const res = await anonymous.get(next);
    expect(res.status).toBe(200);
    const body = JSON.parse(res.text);
    expect(body.numberReturned).toBe(body.features.length);
    expect(body.features.length).toBeLessThanOrEqual(2);
    matched.push(body.numberMatched);
    ids.push(...body.features.map((f: { id: string }) => f.id));
    const link = linkOf(body.links, 'next');
    next = link ? path(link.href) : undefined;
    pages++;
  }
  return { ids, pages, matched };
}

describe('landing page and conformance (/req/core/root-success, /req/core/conformance-success)', () => {
  it('When the landing page is read, then it links the API definition, the conformance declaration and the collections with rel and type, and carries the caution', async () => {
    const res = await anonymous.get(root);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.body.caution).toMatch(/planning guidance, not a warning/);
    const links: Link[] = res.body.links;
    expect(linkOf(links, 'self')?.type).toBe('application/json');
    expect(linkOf(links, 'conformance')?.type).toBe('application/json');
    expect(linkOf(links, 'data')?.type).toBe('application/json');
    const definition = linkOf(links, 'service-desc');
    expect(definition?.type).toMatch(/openapi/);
    const api = await anonymous.get(path(definition?.href ?? ''));
    expect(api.status).toBe(200);
    expect(JSON.parse(api.text).openapi).toMatch(/^3\.0/);
    expect((await anonymous.get(path(linkOf(links, 'data')?.href ?? ''))).status).toBe(200);
  });

  it('When the conformance declaration is read, then it claims exactly Core and GeoJSON', async () => {
    const res = await anonymous.get(`${root}/conformance`);
    expect(res.status).toBe(200);
    expect([...res.body.conformsTo].sort()).toEqual([core, geojsonClass]);
  });
});

describe('collections (/req/core/fc-md-success, /req/core/sfc-md-success)', () => {
  it('When the collections are listed, then each has an id, an items link typed application/geo+json and an extent in CRS84; each matches its own page', async () => {
    const res = await anonymous.get(`${root}/collections`);
    expect(res.status).toBe(200);
    expect(linkOf(res.body.links, 'self')).toBeTruthy();
    const ids = res.body.collections.map((c: { id: string }) => c.id);
    expect(ids).toEqual(['risk-areas', 'issuances']);
    for (const collection of res.body.collections) {
      const items = linkOf(collection.links, 'items');
      expect(items?.type).toBe('application/geo+json');
      expect(collection.extent.spatial.bbox[0]).toHaveLength(4);
      expect(collection.extent.spatial.crs).toBe('http://www.opengis.net/def/crs/OGC/1.3/CRS84');
      expect(collection.description).toMatch(/planning guidance/);
      const single = await anonymous.get(`${root}/collections/${collection.id}`);
      expect(single.status).toBe(200);
      expect(single.body).toEqual(collection);
    }
  });
  it('When an unknown collection is asked for, then 404', async () => {
    expect((await anonymous.get(`${root}/collections/storm-reports`)).status).toBe(404);
    expect((await anonymous.get(`${root}/collections/storm-reports/items`)).status).toBe(404);
  });
});

describe('items (/req/core/fc-response, /req/geojson/content)', () => {
  it('When current risk areas are read, then the answer is a GeoJSON FeatureCollection of the in-force issuance only (not superseded, withdrawn or expired), with the caution', async () => {
    const res = await anonymous.get(`${root}/collections/risk-areas/items`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/geo\+json/);
    const body = JSON.parse(res.text);
    expect(body.type).toBe('FeatureCollection');
    expect(body.caution).toMatch(/planning guidance/);
    expect(Date.parse(body.timeStamp)).not.toBeNaN();
    const issuancesSeen = new Set(body.features.map((f: { properties: { issuance: string } }) => f.properties.issuance));
    expect(issuancesSeen.has(current)).toBe(true);
    for (const gone of [superseded, withdrawn, expired]) expect(issuancesSeen.has(gone)).toBe(false);
    const mine = body.features.filter((f: { properties: { issuance: string } }) => f.properties.issuance === current);
    expect(mine).toHaveLength(5);
    for (const feature of mine) {
      expect(feature.type).toBe('Feature');
      expect(['Polygon', 'MultiPolygon']).toContain(feature.geometry.type);
      expect(feature.properties.caution).toMatch(/planning guidance/);
    }
  });

  it('When limit is small, then each page holds at most limit features and following next links returns every feature once (/req/core/fc-limit-response-1, /req/core/fc-next-1)', async () => {
    const whole = JSON.parse((await anonymous.get(`${root}/collections/risk-areas/items?limit=1000`)).text);
    const paged = await allItems('risk-areas');
    expect(paged.ids).toHaveLength(whole.numberMatched);
    expect(new Set(paged.ids).size).toBe(paged.ids.length);
    expect(paged.pages).toBe(Math.ceil(whole.numberMatched / 2));
    expect(new Set(paged.matched)).toEqual(new Set([whole.numberMatched]));
  });

  it('When limit exceeds the maximum, then the server serves the maximum instead of failing; when it is zero or not a number, then 400', async () => {
    expect((await anonymous.get(`${root}/collections/issuances/items?limit=999999`)).status).toBe(200);
    const zero = await anonymous.get(`${root}/collections/issuances/items?limit=0`);
    expect(zero.status).toBe(400);
    expect(zero.body.error.message).toMatch(/limit/);
    expect((await anonymous.get(`${root}/collections/issuances/items?limit=ten`)).status).toBe(400);
  });

  it('When bbox covers only the eastern areas, then only features intersecting it are returned (/req/core/fc-bbox-response)', async () => {
    const res = await anonymous.get(`${root}/collections/risk-areas/items?bbox=-87,33,-83,37`);
    const body = JSON.parse(res.text);
    const mine = body.features.filter((f: { properties: { issuance: string } }) => f.properties.issuance === current);
    expect(mine.map((f: { properties: { level: string } }) => f.properties.level).sort()).toEqual(['level1', 'thunder']);
    const self = linkOf(body.links, 'self');
    expect(decodeURIComponent(self?.href ?? '')).toContain('bbox=-87,33,-83,37');
  });

  it('When bbox is malformed, then 400 names the rule (/req/core/query-param-invalid)', async () => {
    for (const bbox of ['1,2,3', '-87,37,-83,33', 'a,b,c,d', '-200,0,0,10']) {
      const res = await anonymous.get(`${root}/collections/risk-areas/items`).query({ bbox });
      expect(res.status, bbox).toBe(400);
      expect(res.body.error.message).toMatch(/bbox/);
    }
  });

  it('When datetime selects a time, then issuances whose valid period meets it are returned (/req/core/fc-time-response)', async () => {
    const inPast = await allItems('issuances', '&datetime=2020-05-01T18:00:00Z');
    expect(inPast.ids).toContain(expired);
    expect(inPast.ids).not.toContain(current);
    const open = await allItems('issuances', `&datetime=${encodeURIComponent('2021-01-01T00:00:00Z/..')}`);
    expect(open.ids).toContain(current);
    expect(open.ids).toContain(withdrawn);
    expect(open.ids).not.toContain(expired);
    const closed = await allItems('issuances', `&datetime=${encodeURIComponent('../2020-12-31T00:00:00Z')}`);
    expect(closed.ids).toContain(expired);
    expect(closed.ids).not.toContain(current);
  });

  it('When datetime is malformed, then 400', async () => {
    for (const datetime of ['yesterday', '2027-04-18', '../..', '2027-04-19T00:00:00Z/2027-04-18T00:00:00Z']) {
      const res = await anonymous.get(`${root}/collections/issuances/items`).query({ datetime });
      expect(res.status, datetime).toBe(400);
      expect(res.body.error.message).toMatch(/datetime/);
    }
  });

  it('When a query parameter is not in the API definition, then 400 (/req/core/query-param-unknown)', async () => {
    const res = await anonymous.get(`${root}/collections/risk-areas/items?filter=level3`);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/filter/);
    expect((await anonymous.get(`${root}/conformance?f=html`)).status).toBe(400);
    // f=json (sent by some clients) is declared and served.
    expect((await anonymous.get(`${root}/conformance?f=json`)).status).toBe(200);
    expect((await anonymous.get(`${root}/collections/risk-areas/items?f=json&limit=1`)).status).toBe(200);
  });

  it('When the issuances collection is read, then each issuance is one feature with its state and in-force flag', async () => {
    const res = JSON.parse((await anonymous.get(`${root}/collections/issuances/items?limit=1000`)).text);
    const byId = new Map(res.features.map((f: { id: string; properties: Record<string, unknown> }) => [f.id, f.properties]));
    expect(byId.get(current)).toMatchObject({ state: 'published', inForce: true, supersedes: superseded, highestLevel: 'level3' });
    expect(byId.get(superseded)).toMatchObject({ state: 'superseded', inForce: false, supersededBy: current });
    expect(byId.get(withdrawn)).toMatchObject({ state: 'withdrawn', inForce: false });
    expect(byId.get(expired)).toMatchObject({ state: 'published', inForce: false });
  });
});

describe('single features (/req/core/f-success, /req/core/f-links)', () => {
  it('When one feature is read, then it is GeoJSON with self and collection links', async () => {
    const res = await anonymous.get(`${root}/collections/risk-areas/items/${current}-3`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/geo\+json/);
    const body = JSON.parse(res.text);
    expect(body).toMatchObject({ type: 'Feature', id: `${current}-3`, properties: { level: 'level3', significantHazards: 'tornado' } });
    expect(path(linkOf(body.links, 'self')?.href ?? '')).toBe(`${root}/collections/risk-areas/items/${current}-3`);
    expect(linkOf(body.links, 'collection')?.type).toBe('application/json');
  });
  it('When a feature is gone from the current areas or unknown, then 404', async () => {
    expect((await anonymous.get(`${root}/collections/risk-areas/items/${expired}-1`)).status).toBe(404);
    expect((await anonymous.get(`${root}/collections/issuances/items/1999-0001`)).status).toBe(404);
    expect((await anonymous.get(`${root}/collections/issuances/items/${expired}`)).status).toBe(200);
  });
});
