import { inflateSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { XMLParser } from 'fast-xml-parser';
import type TestAgent from 'supertest/lib/agent';
import type request from 'superagent';
import type { Stormdraft } from '../../server/start';
import { signedInAgent, startTestApp, agentFor } from './helpers/test-app';
import { booleanClockwise } from '@turf/turf';

/** supertest parser that keeps the raw body (images are not parsed as text). */
function asBuffer(response: request.Response, callback: (error: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  const stream = response as unknown as NodeJS.ReadableStream;
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => callback(null, Buffer.concat(chunks)));
}

let sd: Stormdraft;
let number: string;
let anonymous: TestAgent;

beforeAll(async () => {
  sd = await startTestApp();
  const forecaster = await signedInAgent(sd.app, 'forecaster');
  const lead = await signedInAgent(sd.app, 'lead');
  anonymous = agentFor(sd.app);
  const created = (await forecaster.post('/api/outlooks').send({ day: 1, issuanceTime: '2027-04-18T15:00:00Z', headline: 'Hail & wind <today>' })).body;
  // A clockwise exterior ring with a (counterclockwise) hole: the export must rewind both.
  const clockwiseWithHole = {
    type: 'Polygon',
    coordinates: [
      [[-94, 37], [-94, 39], [-92, 39], [-92, 37], [-94, 37]],
      [[-93.5, 37.5], [-92.5, 37.5], [-92.5, 38.5], [-93.5, 38.5], [-93.5, 37.5]],
    ],
  };
  const saved = await forecaster.put(`/api/outlooks/${created.id}`).send({
    version: created.version, headline: 'Hail & wind <today>', discussion: 'Text', hazardNotes: {}, validFrom: created.validFrom, validUntil: created.validUntil,
    areas: [
      { levelKey: 'level1', hazards: [], geometry: { type: 'Polygon', coordinates: [[[-95, 36], [-91, 36], [-91, 40], [-95, 40], [-95, 36]]] } },
      { levelKey: 'level2', hazards: [{ hazard: 'hail', significant: true }], geometry: clockwiseWithHole },
    ],
  });
  const post = (agent: TestAgent, action: string, version: number) => agent.post(`/api/outlooks/${created.id}/${action}`).send({ version });
  let v = saved.body.version;
  v = (await post(forecaster, 'submit', v)).body.version;
  v = (await post(lead, 'approve', v)).body.version;
  number = (await post(lead, 'publish', v)).body.issuanceNumber;
});
afterAll(async () => {
  await sd?.close();
});

describe('GeoJSON export (RFC 7946)', () => {
  it('When an issuance is downloaded as GeoJSON, then it follows the RFC: closed rings, lon/lat order, counterclockwise exteriors, clockwise holes', async () => {
    const res = await anonymous.get(`/api/public/issuances/${number}/geojson`);
    expect(res.headers['content-type']).toMatch(/application\/geo\+json/);
    const doc = JSON.parse(res.text);
    expect(doc.type).toBe('FeatureCollection');
    for (const f of doc.features) {
      expect(f.type).toBe('Feature');
      expect(['Polygon', 'MultiPolygon']).toContain(f.geometry.type);
      const polygons = f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates;
      for (const rings of polygons) {
        rings.forEach((ring: number[][], i: number) => {
          expect(ring.length).toBeGreaterThanOrEqual(4); // RFC 7946 §3.1.6
          expect(ring[0]).toEqual(ring[ring.length - 1]);
          for (const [lon, lat] of ring) {
            expect(Math.abs(lon ?? 999)).toBeLessThanOrEqual(180);
            expect(Math.abs(lat ?? 999)).toBeLessThanOrEqual(90);
          }
          expect(booleanClockwise(ring)).toBe(i !== 0);
        });
      }
    }
    expect(doc.properties.caution).toMatch(/planning guidance/);
  });
});

describe('KML 2.2 export', () => {
  it('When an issuance is downloaded as KML, then it parses as XML with the KML namespace, a Document, styles and one Placemark per area', async () => {
    const res = await anonymous.get(`/api/public/issuances/${number}/kml`);
    expect(res.status).toBe(200);
    const xml = new XMLParser({ ignoreAttributes: false }).parse(res.text);
    expect(xml.kml['@_xmlns']).toBe('http://www.opengis.net/kml/2.2');
    const doc = xml.kml.Document;
    expect(doc.name).toContain(number);
    expect(doc.description).toMatch(/planning guidance/);
    const placemarks = Array.isArray(doc.Placemark) ? doc.Placemark : [doc.Placemark];
    expect(placemarks).toHaveLength(2);
    const hail = placemarks.find((p: { styleUrl: string }) => p.styleUrl === '#level-level2');
    expect(hail.Polygon.outerBoundaryIs.LinearRing.coordinates).toMatch(/^-?\d/);
    expect(hail.Polygon.innerBoundaryIs.LinearRing.coordinates).toBeDefined();
    expect(hail.description).toMatch(/Large hail \(significant\)/);
  });
});

describe('Atom feed (RFC 4287)', () => {
  it('When the feed is read, then it is an Atom feed with id, title, updated and an entry linking to the issuance page', async () => {
    const res = await anonymous.get('/api/public/feed.atom');
    expect(res.headers['content-type']).toMatch(/application\/atom\+xml/);
    const xml = new XMLParser({ ignoreAttributes: false }).parse(res.text);
    expect(xml.feed['@_xmlns']).toBe('http://www.w3.org/2005/Atom');
    for (const required of ['id', 'title', 'updated']) expect(xml.feed[required]).toBeDefined();
    const entries = Array.isArray(xml.feed.entry) ? xml.feed.entry : [xml.feed.entry];
    const entry = entries.find((e: { id: string }) => String(e.id).endsWith(`/issuances/${number}`));
    expect(entry).toBeDefined();
    for (const required of ['id', 'title', 'updated']) expect(entry[required]).toBeDefined();
    expect(String(entry.title['#text'] ?? entry.title)).toContain('Hail & wind <today>');
  });
});

describe('map image', () => {
  it('When the SVG is requested, then it names the issuance, labels each level and carries the caution', async () => {
    const res = await anonymous.get(`/api/public/issuances/${number}/map.svg`).buffer(true).parse(asBuffer);
    expect(res.headers['content-type']).toMatch(/image\/svg\+xml/);
    const svg = (res.body as Buffer).toString('utf8');
    expect(svg).toContain(number);
    expect(svg).toContain('Level 2 · Scattered');
    expect(svg).toContain('planning guidance');
  });

  it('When the PNG is requested, then it decodes: signature, IHDR size and inflated pixel data agree', async () => {
    const res = await anonymous.get(`/api/public/issuances/${number}/map.png`).buffer(true).parse(asBuffer);
    const png = res.body as Buffer;
    expect(png.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a'); // PNG signature (ISO/IEC 15948)
    let offset = 8;
    let width = 0;
    let height = 0;
    let bitDepth = 0;
    let colourType = 0;
    const idat: Buffer[] = [];
    while (offset < png.length) {
      const length = png.readUInt32BE(offset);
      const type = png.subarray(offset + 4, offset + 8).toString('ascii');
      const data = png.subarray(offset + 8, offset + 8 + length);
      if (type === 'IHDR') {
        width = data.readUInt32BE(0);
        height = data.readUInt32BE(4);
        bitDepth = data[8] ?? 0;
        colourType = data[9] ?? 0;
      }
      if (type === 'IDAT') idat.push(data);
      offset += 12 + length;
    }
    expect(width).toBe(900);
    expect(bitDepth).toBe(8);
    const channels = colourType === 6 ? 4 : colourType === 2 ? 3 : 0;
    expect(channels).toBeGreaterThan(0);
    // Each scanline is one filter byte plus width × channels bytes.
    expect(inflateSync(Buffer.concat(idat)).length).toBe(height * (1 + width * channels));
    if (process.env.STORMDRAFT_KEEP_PNG) (await import('node:fs')).writeFileSync(process.env.STORMDRAFT_KEEP_PNG, png);
  });
});
