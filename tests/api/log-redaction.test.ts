import { Writable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { desc, eq } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { startStormdraft } from '../../server/start';
import { caughtMail, sessions, subscriptions } from '../../server/db/schema';
import { createLogger } from '../../server/middleware/request-logger';
import { unsubscribeToken } from '../../server/services/subscriptions.service';
import { demoPassword } from '../../server/services/seed.service';
import { agentFor, demoEmail, testConfig, waitFor } from './helpers/test-app';

/** Every line the app logged during this file, at info level, as the production logger writes it. */
const logLines: string[] = [];
const capture = new Writable({
  write(chunk: Buffer, _encoding, done) {
    logLines.push(chunk.toString('utf8'));
    done();
  },
});

let sd: Stormdraft;
beforeAll(async () => {
  const config = testConfig({ logLevel: 'info' });
  sd = await startStormdraft(config, { clientMode: 'none', logger: createLogger('info', capture) });
});
afterAll(async () => {
  await sd?.close();
});

describe('issue 11 item 3: secrets never reach the log', () => {
  it('When people sign in, browse, reset a password, confirm an address and unsubscribe, then no session token, reset token, unsubscribe token or password appears in the log', async () => {
    const secrets: string[] = [];

    // Sign in and use the session.
    const agent = agentFor(sd.app);
    const signIn = await agent.post('/api/auth/sign-in/email').send({ email: demoEmail('forecaster'), password: demoPassword });
    expect(signIn.status).toBe(200);
    const [session] = await sd.ctx.db.select().from(sessions).orderBy(desc(sessions.createdAt)).limit(1);
    if (!session) throw new Error('no session row after sign-in');
    secrets.push(session.token);
    const setCookie = String(signIn.headers['set-cookie'] ?? '');
    const cookieValue = /session_token=([^;]+)/.exec(setCookie)?.[1];
    if (!cookieValue) throw new Error('no session cookie in the sign-in answer');
    secrets.push(decodeURIComponent(cookieValue));
    expect((await agent.get('/api/me')).status).toBe(200);
    expect((await agent.get('/api/outlooks')).status).toBe(200);
    // A bearer-style header must not be logged either.
    await agentFor(sd.app).get('/api/me').set('Authorization', `Bearer ${session.token}`);

    // Password reset: the link carries a token in its path.
    const email = demoEmail('lead');
    expect((await agentFor(sd.app).post('/api/auth/request-password-reset').send({ email, redirectTo: '/reset-password' })).status).toBe(200);
    const mail = await waitFor(async () => {
      const [row] = await sd.ctx.db.select().from(caughtMail).where(eq(caughtMail.toAddress, email)).orderBy(desc(caughtMail.receivedAt)).limit(1);
      return row;
    }, 'the reset mail');
    const link = new URL(mail.text?.match(/https?:\/\/\S+/)?.[0] ?? '');
    const resetToken = link.pathname.split('/').pop() ?? '';
    expect(resetToken.length).toBeGreaterThan(10);
    secrets.push(resetToken);
    const callback = await agentFor(sd.app).get(link.pathname + link.search);
    expect(callback.status).toBe(302);
    const newPassword = 'a-quiet-harbour-at-dusk-17';
    secrets.push(newPassword, demoPassword);
    expect((await agentFor(sd.app).post('/api/auth/reset-password').send({ newPassword, token: resetToken })).status).toBe(200);

    // Registration and the address-confirmation link (token in the query).
    const registerPassword = 'lantern-over-the-river-9';
    secrets.push(registerPassword);
    const registrant = 'log-test@county.test';
    expect((await agentFor(sd.app).post('/api/auth/sign-up/email').send({ name: 'Log Test', email: registrant, password: registerPassword, callbackURL: '/alerts' })).status).toBe(200);
    const confirmation = await waitFor(async () => {
      const [row] = await sd.ctx.db.select().from(caughtMail).where(eq(caughtMail.toAddress, registrant)).limit(1);
      return row;
    }, 'the confirmation mail');
    const verifyLink = new URL(confirmation.text?.match(/https?:\/\/\S+/)?.[0] ?? '');
    const verifyToken = verifyLink.searchParams.get('token') ?? '';
    expect(verifyToken.length).toBeGreaterThan(10);
    secrets.push(verifyToken);
    expect((await agentFor(sd.app).get(verifyLink.pathname + verifyLink.search)).status).toBe(302);

    // Unsubscribe links (GET page and one-click POST) carry a signed token.
    const [subscription] = await sd.ctx.db.select({ id: subscriptions.id }).from(subscriptions).limit(1);
    if (!subscription) throw new Error('the demo office has no subscription');
    const token = unsubscribeToken(sd.ctx.config.authSecret, subscription.id);
    secrets.push(token.split('.')[1] ?? token);
    expect((await agentFor(sd.app).get(`/api/unsubscribe?token=${encodeURIComponent(token)}`)).status).toBe(200);
    expect((await agentFor(sd.app).post(`/api/unsubscribe?token=${encodeURIComponent(token)}`).type('form').send('List-Unsubscribe=One-Click')).status).toBe(200);

    const log = logLines.join('');
    // The log is really being written at info level, with the request lines in it.
    expect(log).toContain('/api/me');
    expect(log).toContain('/api/auth/reset-password/[redacted]');
    for (const secret of secrets) {
      expect(log.includes(secret), `the log contains a secret (${secret.slice(0, 4)}…)`).toBe(false);
      expect(log.includes(encodeURIComponent(secret)), `the log contains an encoded secret (${secret.slice(0, 4)}…)`).toBe(false);
    }
    expect(log).not.toMatch(/session_token=(?!\[redacted\])/);
  });
});
