import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Stormdraft } from '../../server/start';
import { demoPassword } from '../../server/services/seed.service';
import { demoEmail, signedInAgent, startTestApp, testOrigin } from './helpers/test-app';

let sd: Stormdraft;
let cookie: string;
beforeAll(async () => {
  sd = await startTestApp();
  const res = await request(sd.app).post('/api/auth/sign-in/email').set('Origin', testOrigin).send({ email: demoEmail('forecaster'), password: demoPassword });
  cookie = (res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
});
afterAll(async () => {
  await sd?.close();
});

const newOutlook = { day: 1, headline: 'Cross-site test' };

describe('issue 11 item 9: cross-site request defence', () => {
  it('When a signed-in request comes from a foreign Origin, then it is refused with 403 and nothing is created', async () => {
    const res = await request(sd.app).post('/api/outlooks').set('Cookie', cookie).set('Origin', 'https://evil.example').send(newOutlook);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('CROSS_SITE_REQUEST');
    const list = await request(sd.app).get('/api/outlooks').set('Cookie', cookie);
    expect(list.body.outlooks.some((o: { headline: string }) => o.headline === 'Cross-site test')).toBe(false);
  });

  it('When Origin is absent and the Referer is foreign, then it is refused', async () => {
    const res = await request(sd.app).post('/api/outlooks').set('Cookie', cookie).set('Referer', 'https://evil.example/page').send(newOutlook);
    expect(res.status).toBe(403);
  });

  it('When a cookie-bearing request has neither Origin nor Referer, then it is refused', async () => {
    const res = await request(sd.app).post('/api/outlooks').set('Cookie', cookie).send(newOutlook);
    expect(res.status).toBe(403);
  });

  it('When Origin is "null" (sandboxed frame), then it is refused', async () => {
    const res = await request(sd.app).put('/api/me/preferences').set('Cookie', cookie).set('Origin', 'null').send({ units: { temperature: 'F', height: 'ft', speed: 'mph' } });
    expect(res.status).toBe(403);
  });

  it("When the request comes from the app's own origin (or its own page as Referer), then it is accepted", async () => {
    expect((await request(sd.app).post('/api/outlooks').set('Cookie', cookie).set('Origin', testOrigin).send(newOutlook)).status).toBe(201);
    expect((await request(sd.app).post('/api/outlooks').set('Cookie', cookie).set('Referer', `${testOrigin}/outlooks`).send(newOutlook)).status).toBe(201);
  });

  it('When a foreign page posts a sign-in, then it is refused before better-auth runs', async () => {
    const res = await request(sd.app).post('/api/auth/sign-in/email').set('Origin', 'https://evil.example').send({ email: demoEmail('lead'), password: demoPassword });
    expect(res.status).toBe(403);
  });

  it.each([
    ['application/x-www-form-urlencoded', 'day=1&headline=x'],
    ['text/plain', '{"day":1,"headline":"x"}'],
    ['multipart/form-data; boundary=XYZ', '--XYZ\r\nContent-Disposition: form-data; name="day"\r\n\r\n1\r\n--XYZ--\r\n'],
  ])('When a JSON route receives %s, then it answers 415', async (type, body) => {
    const agent = await signedInAgent(sd.app, 'forecaster');
    const res = await agent.post('/api/outlooks').set('Content-Type', type).send(body);
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('UNSUPPORTED_MEDIA_TYPE');
  });

  it('When a form-encoded sign-in is posted, then it answers 415', async () => {
    const res = await request(sd.app).post('/api/auth/sign-in/email').set('Origin', testOrigin).type('form').send(`email=${encodeURIComponent(demoEmail('lead'))}&password=${demoPassword}`);
    expect(res.status).toBe(415);
  });

  it('When a sounding file is uploaded as multipart from the app, then the upload route still takes it', async () => {
    const agent = await signedInAgent(sd.app, 'forecaster');
    const res = await agent.post('/api/soundings/uploads').attach('files', Buffer.from('not a sounding'), 'bad.csv');
    expect(res.status).not.toBe(415);
    expect(res.status).toBeLessThan(500);
  });

  it('When a mail client posts a one-click unsubscribe (form-encoded, no Origin, no cookie), then it is not refused as cross-site', async () => {
    const res = await request(sd.app).post('/api/unsubscribe?token=not-a-token').type('form').send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(400);
    expect(res.text).not.toContain('CROSS_SITE_REQUEST');
  });
});
