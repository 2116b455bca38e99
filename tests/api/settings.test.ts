import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { officeSettingsSchema } from '../../shared/contracts/office';
import { caughtMail } from '../../server/db/schema';
import type { Stormdraft } from '../../server/start';
import { agentFor, startTestApp, waitFor } from './helpers/test-app';

/**
 * Issue 12 item 6: configuration in one validated module. The tile URL has one name (TILE_URL)
 * for the client and the server, and the mail From address is a setting (MAIL_FROM).
 */
const tileUrl = 'https://tiles.example.org/{z}/{x}/{y}.png';
const mailFrom = 'Meridian Valley Outlooks <outlooks@meridian.test>';
let sd: Stormdraft;

beforeAll(async () => {
  sd = await startTestApp({ tileUrl, tileAttribution: '© Example tiles', mailFrom });
});
afterAll(async () => {
  await sd?.close();
});

describe('configured settings reach the client and the mail', () => {
  it('When TILE_URL is set, then the office settings every page reads carry it as the base map', async () => {
    const res = await agentFor(sd.app).get('/api/office');
    expect(res.status).toBe(200);
    expect(officeSettingsSchema.parse(res.body).baseMap).toEqual({ tileUrl, attribution: '© Example tiles' });
  });

  it('When TILE_URL is set, then the content security policy allows images from the tile host', async () => {
    const res = await agentFor(sd.app).get('/api/health');
    expect(res.headers['content-security-policy']).toContain('https://tiles.example.org');
  });

  it('When MAIL_FROM is set, then mail leaves with that sender', async () => {
    const email = 'from-check@county.test';
    const signup = await agentFor(sd.app).post('/api/auth/sign-up/email').send({ name: 'From Check', email, password: 'long-enough-pass' });
    expect(signup.status).toBe(200);
    const message = await waitFor(async () => {
      const [row] = await sd.ctx.db.select().from(caughtMail).where(eq(caughtMail.toAddress, email));
      return row;
    }, 'the confirmation mail');
    expect(message.fromAddress).toContain('outlooks@meridian.test');
  });
});
