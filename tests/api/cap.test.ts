import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { XMLParser } from 'fast-xml-parser';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';
import { checkCapMessage, parseCap, type CapElement } from './cap-rules';
import { amendAndPublish, areaAround, publishOutlook } from './open-standards-helpers';

let sd: Stormdraft;
let anonymous: TestAgent;
let first: string;
let amended: string;
let withdrawn: string;
let expired: string;

const child = (element: CapElement, name: string) => element.children.find((c) => c.name === name);
const children = (element: CapElement, name: string) => element.children.filter((c) => c.name === name);
const text = (element: CapElement, name: string) => child(element, name)?.text ?? '';
const now = () => new Date().toISOString();

beforeAll(async () => {
  sd = await startTestApp();
  anonymous = agentFor(sd.app);
  const forecaster = await signedInAgent(sd.app, 'forecaster');
  const lead = await signedInAgent(sd.app, 'lead');
  // Day 3 issued now is in force until the end of the day after tomorrow and begins more than an
  // hour from now whatever the hour (a Day 2 begins within the hour between 11 and 12 UTC).
  first = await publishOutlook(forecaster, lead, {
    day: 3, issuanceTime: now(), headline: 'Hail and wind in the western valleys',
    areas: [
      { levelKey: 'level1', geometry: areaAround(-94, 38, 2), hazards: [{ hazard: 'wind', significant: false }] },
      { levelKey: 'level3', geometry: areaAround(-94, 38, 0.8), hazards: [{ hazard: 'hail', significant: true }] },
    ],
  });
  amended = await amendAndPublish(forecaster, lead, first, [{ levelKey: 'level2', geometry: areaAround(-93, 38, 1.5) }], 'Storms shifted east');
  withdrawn = await publishOutlook(forecaster, lead, { day: 3, issuanceTime: now(), headline: 'Wrong day', areas: [{ levelKey: 'thunder', geometry: areaAround(-90, 36) }] });
  expect((await lead.post(`/api/issuances/${withdrawn}/withdraw`).send({ reason: 'Issued for the wrong day.' })).status).toBe(200);
  expired = await publishOutlook(forecaster, lead, { day: 1, issuanceTime: '2020-05-01T15:00:00Z', headline: 'Long past', areas: [{ levelKey: 'level1', geometry: areaAround(-95, 39) }] });
});
afterAll(async () => {
  await sd?.close();
});

describe('the CAP 1.2 rule check itself', () => {
  const valid = `<?xml version="1.0"?><alert xmlns="urn:oasis:names:tc:emergency:cap:1.2"><identifier>x-1</identifier><sender>a@b</sender><sent>2027-04-18T15:00:00-00:00</sent><status>Actual</status><msgType>Alert</msgType><scope>Public</scope>
    <info><category>Met</category><event>e</event><urgency>Future</urgency><severity>Minor</severity><certainty>Possible</certainty><area><areaDesc>a</areaDesc><polygon>38,-94 39,-94 39,-93 38,-94</polygon></area></info></alert>`;
  it('When a minimal valid message is checked, then no problem is found', () => {
    expect(checkCapMessage(valid)).toEqual([]);
  });
  it.each([
    ['a "Z" time', valid.replace('15:00:00-00:00', '15:00:00Z'), /sent.*numeric offset/],
    ['an open polygon', valid.replace('38,-94 39,-94 39,-93 38,-94', '38,-94 39,-94 39,-93 38,-93'), /first and last/],
    ['a three-pair polygon', valid.replace('38,-94 39,-94 39,-93 38,-94', '38,-94 39,-94 38,-94'), /at least 4/],
    ['a lon,lat polygon', valid.replace('38,-94 39,-94 39,-93 38,-94', '-94,138 -94,139 -93,139 -94,138'), /outside WGS 84/],
    ['an unknown urgency', valid.replace('<urgency>Future', '<urgency>Soon'), /urgency.*not one of/],
    ['a missing scope', valid.replace('<scope>Public</scope>', ''), /<scope> is required/],
    ['an info element out of order', valid.replace('<category>Met</category><event>e</event>', '<event>e</event><category>Met</category>'), /required|out of order/],
    ['an Update without references', valid.replace('<msgType>Alert', '<msgType>Update'), /references/],
    ['an identifier with a space', valid.replace('<identifier>x-1', '<identifier>x 1'), /identifier/],
  ])('When a message has %s, then the check reports it', (_what, xml, problem) => {
    expect(checkCapMessage(xml).join('\n')).toMatch(problem);
  });
});

describe('GET /api/public/cap/:issuanceNumber', () => {
  it('When an issuance is fetched as CAP, then it passes the CAP 1.2 rules as an Alert of category Met, one info per level (highest first), one area per risk area, the caution as instruction', async () => {
    const res = await anonymous.get(`/api/public/cap/${first}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/cap\+xml/);
    expect(checkCapMessage(res.text)).toEqual([]);
    const alert = parseCap(res.text);
    expect(text(alert, 'msgType')).toBe('Alert');
    expect(text(alert, 'identifier')).toBe(`stormdraft-${first}`);
    const infos = children(alert, 'info');
    expect(infos.map((i) => text(i, 'severity'))).toEqual(['Severe', 'Moderate']); // level3 then level1 (docs/cap.md table)
    for (const info of infos) {
      expect(text(info, 'category')).toBe('Met');
      expect(text(info, 'urgency')).toBe('Future'); // Day 3 begins more than an hour away
      expect(text(info, 'certainty')).toBe('Possible'); // Day 3 (docs/cap.md)
      expect(text(info, 'instruction')).toMatch(/planning guidance, not a warning/);
      expect(children(info, 'area')).toHaveLength(1);
    }
    // GeoJSON [lon, lat] becomes "lat,lon": the level 3 area starts at (-94.8, 37.36).
    const polygon = text(child(infos[0] as CapElement, 'area') as CapElement, 'polygon');
    expect(polygon.split(' ')[0]).toBe('37.36,-94.8');
    expect(text(infos[0] as CapElement, 'description')).toMatch(/Large hail \(significant\)/);
  });

  it('When an amendment is fetched as CAP, then it is an Update whose references name the message it replaces (sender,identifier,sent)', async () => {
    const original = parseCap((await anonymous.get(`/api/public/cap/${first}`)).text);
    const res = await anonymous.get(`/api/public/cap/${amended}`);
    expect(checkCapMessage(res.text)).toEqual([]);
    const alert = parseCap(res.text);
    expect(text(alert, 'msgType')).toBe('Update');
    expect(text(alert, 'references')).toBe(`${text(original, 'sender')},stormdraft-${first},${text(original, 'sent')}`);
  });

  it('When a withdrawn issuance is fetched, then its Cancel message references the original and carries the reason and the caution', async () => {
    const original = parseCap((await anonymous.get(`/api/public/cap/${withdrawn}`)).text);
    const res = await anonymous.get(`/api/public/cap/${withdrawn}/withdrawal`);
    expect(res.status).toBe(200);
    expect(checkCapMessage(res.text)).toEqual([]);
    const alert = parseCap(res.text);
    expect(text(alert, 'msgType')).toBe('Cancel');
    expect(text(alert, 'identifier')).not.toBe(text(original, 'identifier'));
    expect(text(alert, 'references')).toBe(`${text(original, 'sender')},${text(original, 'identifier')},${text(original, 'sent')}`);
    expect(text(alert, 'note')).toMatch(/wrong day/);
    expect(text(children(alert, 'info')[0] as CapElement, 'instruction')).toMatch(/planning guidance/);
  });

  it('When an issuance that was not withdrawn is asked for its Cancel, then the answer is 404', async () => {
    expect((await anonymous.get(`/api/public/cap/${amended}/withdrawal`)).status).toBe(404);
  });
  it('When the number is unknown, then 404; when it is malformed, then 400 naming the rule', async () => {
    expect((await anonymous.get('/api/public/cap/1999-0001')).status).toBe(404);
    const bad = await anonymous.get('/api/public/cap/not-a-number');
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/2027-0142/);
  });
});

describe('GET /api/public/cap (feed)', () => {
  it('When the feed is read, then it lists exactly the issuances in force (not superseded, withdrawn or expired), each linking to a valid CAP message, with the caution', async () => {
    const res = await anonymous.get('/api/public/cap');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/atom\+xml/);
    const feed = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', isArray: (name) => name === 'entry' || name === 'link' }).parse(res.text).feed;
    expect(feed.subtitle).toMatch(/planning guidance/);
    const links: string[] = (feed.entry ?? []).map((e: { link: { rel: string; href: string }[] }) => e.link.find((l) => l.rel === 'alternate')?.href ?? '');
    const numbers = links.map((href) => href.split('/').pop());
    expect(numbers).toContain(amended);
    expect(numbers).not.toContain(first);
    expect(numbers).not.toContain(withdrawn);
    expect(numbers).not.toContain(expired);
    for (const href of links) {
      const message = await anonymous.get(new URL(href).pathname);
      expect(checkCapMessage(message.text)).toEqual([]);
    }
  });
});
