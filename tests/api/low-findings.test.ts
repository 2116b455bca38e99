import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { XMLParser } from 'fast-xml-parser';
import type { Stormdraft } from '../../server/start';
import { buildAtomFeed } from '../../server/exports/atom';
import viteConfig from '../../vite.config';
import { signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
let forecaster: TestAgent;
beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
});
afterAll(async () => {
  await sd?.close();
});

describe('issue 11 item 12: Atom titles are text, not HTML', () => {
  it('When a headline holds markup, then the feed carries it as escaped text in a type="text" title', () => {
    const headline = '<img src=x onerror=alert(1)> ]]> hail';
    const xml = buildAtomFeed({ officeName: 'Test office', publicUrl: 'http://localhost', caution: 'planning guidance', updated: new Date('2027-04-18T12:00:00Z'), entries: [{ number: '2027-0001', day: 1, state: 'published', headline, validFrom: 'a', validUntil: 'b', publishedAt: '2027-04-18T12:00:00Z' }] });
    expect(xml).not.toContain('type="html"');
    expect(xml).not.toContain('<img');
    const parsed = new XMLParser({ ignoreAttributes: false }).parse(xml);
    expect(parsed.feed.entry.title['@_type']).toBe('text');
    expect(String(parsed.feed.entry.title['#text'])).toContain(headline);
  });
});

describe('issue 11 item 12: GeoJSON positions with altitude', () => {
  it('When an imported polygon has [lon, lat, altitude] positions (valid RFC 7946), then it is accepted and the altitude dropped', async () => {
    const ring = [[-94, 37, 250], [-92, 37, 260], [-92, 39, 270], [-94, 39, 255], [-94, 37, 250]];
    const res = await forecaster.post('/api/outlooks/area-imports').send({ geojson: { type: 'FeatureCollection', features: [{ type: 'Feature', properties: { level: 'level1' }, geometry: { type: 'Polygon', coordinates: [ring] } }] } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.areas[0].geometry.coordinates[0][0]).toEqual([-94, 37]);
  });
});

describe('issue 11 item 12: private answers are not cached', () => {
  it('When a signed-in API answer is sent, then it says Cache-Control: no-store', async () => {
    expect((await forecaster.get('/api/me')).headers['cache-control']).toBe('no-store');
    expect((await forecaster.get('/api/outlooks')).headers['cache-control']).toBe('no-store');
    expect((await forecaster.get('/api/auth/get-session')).headers['cache-control']).toMatch(/no-store/);
  });

  it('When a private route is refused (401), then that answer is not cached either', async () => {
    expect((await request(sd.app).get('/api/me')).headers['cache-control']).toBe('no-store');
  });
});

describe('issue 11 item 12: no source maps in production', () => {
  it('When the client is built, then no source maps are produced', () => {
    expect(viteConfig.build?.sourcemap ?? false).toBe(false);
  });
});
