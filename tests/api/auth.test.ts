import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, asc, eq } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { caughtMail, users } from '../../server/db/schema';
import { agentFor, demoEmail, signedInAgent, startTestApp, testOrigin, waitFor } from './helpers/test-app';

let sd: Stormdraft;
beforeAll(async () => {
  sd = await startTestApp();
});
afterAll(async () => {
  await sd?.close();
});

describe('POST /api/auth/sign-up/email', () => {
  it('When someone registers, then they must confirm their address by e-mail, and the link signs them in as a subscriber', async () => {
    const email = 'riley@county.test';
    const agent = agentFor(sd.app);
    const res = await agent.post('/api/auth/sign-up/email').send({ name: 'Riley Manager', email, password: 'long-enough-pass', callbackURL: '/alerts' });
    expect(res.status).toBe(200);
    expect((await agent.get('/api/me')).status, 'no session before confirmation').toBe(401);
    const early = await agentFor(sd.app).post('/api/auth/sign-in/email').send({ email, password: 'long-enough-pass' });
    expect(early.status).toBe(403);
    expect(early.body.code).toBe('EMAIL_NOT_VERIFIED');

    const message = await waitFor(async () => {
      // The first one, sent at sign-up (the refused sign-in sends another without the callback).
      const [row] = await sd.ctx.db.select().from(caughtMail).where(eq(caughtMail.toAddress, email)).orderBy(asc(caughtMail.receivedAt));
      return row;
    }, 'the confirmation mail');
    expect(message.subject).toBe('Confirm your address for Stormdraft alerts');
    const link = new URL(message.text?.match(/https?:\/\/\S+/)?.[0] ?? '');
    const confirmed = await agent.get(link.pathname + link.search);
    expect(confirmed.status).toBe(302);
    expect(new URL(confirmed.headers.location ?? '', testOrigin).pathname).toBe('/alerts');
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('subscriber');
  });

  it('When a registration tries to choose its role, then it is refused', async () => {
    const res = await agentFor(sd.app)
      .post('/api/auth/sign-up/email')
      .send({ name: 'Sneaky', email: 'sneaky@county.test', password: 'long-enough-pass', role: 'admin' });
    expect(res.status).toBe(400);
  });

  it('When the password is shorter than 10 characters, then it is refused', async () => {
    const res = await agentFor(sd.app).post('/api/auth/sign-up/email').send({ name: 'Short', email: 'short@county.test', password: 'short' });
    expect(res.status).toBe(400);
  });
});

describe('sign-in and sign-out', () => {
  it.each(['admin', 'lead', 'forecaster', 'subscriber'] as const)('When the demo %s signs in, then /api/me shows that role', async (role) => {
    const agent = await signedInAgent(sd.app, role);
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ email: demoEmail(role), role });
  });

  it('When the password is wrong, then sign-in fails with 401', async () => {
    const res = await agentFor(sd.app).post('/api/auth/sign-in/email').send({ email: demoEmail('lead'), password: 'not-the-password' });
    expect(res.status).toBe(401);
  });

  it('When a user signs out, then the session no longer works', async () => {
    const agent = await signedInAgent(sd.app, 'forecaster');
    expect((await agent.get('/api/me')).status).toBe(200);
    const out = await agent.post('/api/auth/sign-out').send({});
    expect(out.status).toBe(200);
    expect((await agent.get('/api/me')).status).toBe(401);
  });
});

describe('password reset by e-mail', () => {
  it('When a reset is requested, then the mail arrives in the catcher and its link sets a new password', async () => {
    const email = 'reset-me@county.test';
    const signup = await agentFor(sd.app).post('/api/auth/sign-up/email').send({ name: 'Reset Me', email, password: 'first-password-1' });
    expect(signup.status).toBe(200);
    await sd.ctx.db.update(users).set({ emailVerified: true }).where(eq(users.email, email));

    const ask = await agentFor(sd.app).post('/api/auth/request-password-reset').send({ email, redirectTo: '/reset-password' });
    expect(ask.status).toBe(200);

    const message = await waitFor(async () => {
      const [row] = await sd.ctx.db.select().from(caughtMail).where(and(eq(caughtMail.toAddress, email), eq(caughtMail.subject, 'Reset your Stormdraft password')));
      return row;
    }, 'the reset mail');
    expect(message.subject).toBe('Reset your Stormdraft password');
    expect(message.html).toContain('planning guidance');
    const link = message.text?.match(/https?:\/\/\S+/)?.[0];
    expect(link, 'the plain-text mail carries the reset link').toBeDefined();

    // Following the link redirects to the client's reset page with the token.
    const follow = await agentFor(sd.app).get(new URL(link ?? '').pathname + new URL(link ?? '').search);
    expect(follow.status).toBe(302);
    const redirect = new URL(follow.headers.location ?? '', testOrigin);
    expect(redirect.pathname).toBe('/reset-password');
    const token = redirect.searchParams.get('token');
    expect(token).toBeTruthy();

    const reset = await agentFor(sd.app).post('/api/auth/reset-password').send({ token, newPassword: 'second-password-2' });
    expect(reset.status).toBe(200);

    const oldPassword = await agentFor(sd.app).post('/api/auth/sign-in/email').send({ email, password: 'first-password-1' });
    expect(oldPassword.status).toBe(401);
    const newPassword = await agentFor(sd.app).post('/api/auth/sign-in/email').send({ email, password: 'second-password-2' });
    expect(newPassword.status).toBe(200);
  });

  it('When a reset token is used twice, then the second use is refused', async () => {
    const email = 'twice@county.test';
    await agentFor(sd.app).post('/api/auth/sign-up/email').send({ name: 'Twice', email, password: 'first-password-1' });
    await agentFor(sd.app).post('/api/auth/request-password-reset').send({ email, redirectTo: '/reset-password' });
    const message = await waitFor(async () => {
      const [row] = await sd.ctx.db.select().from(caughtMail).where(and(eq(caughtMail.toAddress, email), eq(caughtMail.subject, 'Reset your Stormdraft password')));
      return row;
    }, 'the reset mail');
    const token = message.text?.match(/reset-password\/([A-Za-z0-9_-]+)/)?.[1];
    expect(token).toBeTruthy();
    expect((await agentFor(sd.app).post('/api/auth/reset-password').send({ token, newPassword: 'second-password-2' })).status).toBe(200);
    expect((await agentFor(sd.app).post('/api/auth/reset-password').send({ token, newPassword: 'third-password-3' })).status).toBe(400);
  });
});
