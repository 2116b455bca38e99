import { createServer, type Server, type Socket } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { createApp } from '../../server/app';
import type { Stormdraft } from '../../server/start';
import { signInThrottles } from '../../server/db/schema';
import { demoPassword } from '../../server/services/seed.service';
import { agentFor, demoEmail, startTestApp, testOrigin } from './helpers/test-app';

let sd: Stormdraft;
beforeAll(async () => {
  // Trust the loopback proxy so each attempt can claim a different client address.
  sd = await startTestApp({ trustProxy: ['loopback'] });
});
afterAll(async () => {
  await sd?.close();
});

const signIn = (app: Stormdraft['app'], email: string, password: string, clientAddress: string) =>
  request(app).post('/api/auth/sign-in/email').set('Origin', testOrigin).set('X-Forwarded-For', clientAddress).send({ email, password });

/** Lets the current lock run out without waiting (the lock end is stored in the database). */
async function expireLock(email: string) {
  await sd.ctx.db.update(signInThrottles).set({ lockedUntil: new Date(Date.now() - 1000) }).where(eq(signInThrottles.email, email));
}

describe('issue 11 item 11: per-account sign-in throttling', () => {
  it('When an account has failed sign-ins from many addresses, then it is locked with a delay that grows, even for the right password', async () => {
    const email = demoEmail('forecaster');
    for (let i = 0; i < 5; i++) {
      expect((await signIn(sd.app, email, `wrong-guess-${i}`, `203.0.113.${i + 1}`)).status).toBe(401);
    }
    const locked = await signIn(sd.app, email, demoPassword, '198.51.100.7');
    expect(locked.status).toBe(429);
    expect(locked.body.code).toBe('ACCOUNT_LOCKED');
    const firstDelay = Number(locked.headers['retry-after']);
    expect(firstDelay).toBeGreaterThan(0);

    await expireLock(email);
    expect((await signIn(sd.app, email, 'wrong-again', '203.0.113.50')).status).toBe(401);
    const lockedAgain = await signIn(sd.app, email, demoPassword, '198.51.100.8');
    expect(lockedAgain.status).toBe(429);
    expect(Number(lockedAgain.headers['retry-after'])).toBeGreaterThan(firstDelay);

    await expireLock(email);
    expect((await signIn(sd.app, email, demoPassword, '198.51.100.9')).status).toBe(200);
    const rows = await sd.ctx.db.select().from(signInThrottles).where(eq(signInThrottles.email, email));
    expect(rows, 'a successful sign-in clears the failures').toHaveLength(0);
  });

  it('When another account is being guessed, then this account is not locked', async () => {
    const victim = demoEmail('admin');
    for (let i = 0; i < 6; i++) await signIn(sd.app, 'someone-else@county.test', `guess-${i}`, '203.0.113.77');
    expect((await signIn(sd.app, victim, demoPassword, '203.0.113.77')).status).toBe(200);
  });
});

describe('issue 11 item 11: addresses and rate-limit state', () => {
  it('When no proxy is trusted (the default), then X-Forwarded-For cannot dodge the per-address limit', async () => {
    const strict = await startTestApp({ authRateLimitPerMinute: 3 });
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) statuses.push((await signIn(strict.app, `nobody${i}@county.test`, 'whatever-it-is', `192.0.2.${i + 1}`)).status);
      expect(statuses.slice(0, 3)).toEqual([401, 401, 401]);
      expect(statuses.slice(3)).toEqual([429, 429]);
    } finally {
      await strict.close();
    }
  });

  it('When the loopback proxy is trusted (TRUST_PROXY=loopback), then each forwarded client address has its own count', async () => {
    const behindProxy = await startTestApp({ authRateLimitPerMinute: 3, trustProxy: ['loopback'] });
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) statuses.push((await signIn(behindProxy.app, `nobody${i}@county.test`, 'whatever-it-is', `192.0.2.${i + 1}`)).status);
      expect(statuses).toEqual([401, 401, 401, 401, 401]);
    } finally {
      await behindProxy.close();
    }
  });

  it('When two app instances share one database, then they share the per-address count', async () => {
    const first = await startTestApp({ authRateLimitPerMinute: 4 });
    try {
      const second = await createApp(first.ctx, 'none');
      const statuses: number[] = [];
      for (let i = 0; i < 3; i++) statuses.push((await signIn(first.app, `nobody${i}@county.test`, 'whatever-it-is', '192.0.2.1')).status);
      for (let i = 0; i < 2; i++) statuses.push((await signIn(second, `nobody${i}@county.test`, 'whatever-it-is', '192.0.2.1')).status);
      expect(statuses).toEqual([401, 401, 401, 401, 429]);
    } finally {
      await first.close();
    }
  });
});

describe('issue 11 item 11: password rule', () => {
  it.each(['password123', '1234567890', 'aaaaaaaaaaaa', 'qwertyuiop1', 'iloveyou12'])('When someone registers with "%s", then it is refused as too easy to guess', async (password) => {
    const res = await agentFor(sd.app).post('/api/auth/sign-up/email').send({ name: 'Weak', email: `weak-${password}@county.test`, password });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('PASSWORD_TOO_WEAK');
  });

  it('When someone registers with a long phrase, then it is accepted', async () => {
    const res = await agentFor(sd.app).post('/api/auth/sign-up/email').send({ name: 'Strong', email: 'strong@county.test', password: 'gravel-orchard-lantern-42' });
    expect(res.status).toBe(200);
  });

  it('When a reset sets a common password, then it is refused', async () => {
    const res = await agentFor(sd.app).post('/api/auth/reset-password').send({ newPassword: 'password1234', token: 'whatever-token' });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('PASSWORD_TOO_WEAK');
  });
});

describe('issue 11 item 11: password-reset answers do not reveal accounts', () => {
  let blackHole: Server;
  const sockets: Socket[] = [];
  let slowMail: Stormdraft;
  beforeAll(async () => {
    // An SMTP "server" that accepts connections and never says a word: sending would hang.
    blackHole = createServer((socket) => sockets.push(socket));
    await new Promise<void>((resolve) => blackHole.listen(0, '127.0.0.1', resolve));
    const address = blackHole.address();
    if (address === null || typeof address === 'string') throw new Error('no port');
    slowMail = await startTestApp({ smtpUrl: `smtp://127.0.0.1:${address.port}` });
  });
  afterAll(async () => {
    for (const socket of sockets) socket.destroy();
    await slowMail?.close();
    await new Promise((resolve) => blackHole.close(resolve));
  });

  it('When a reset is asked for an existing account while mail is slow, then the answer does not wait for the mail', async () => {
    const existing = await agentFor(slowMail.app).post('/api/auth/request-password-reset').timeout(5000).send({ email: demoEmail('lead'), redirectTo: '/reset-password' });
    const unknown = await agentFor(slowMail.app).post('/api/auth/request-password-reset').timeout(5000).send({ email: 'no-account@county.test', redirectTo: '/reset-password' });
    expect(existing.status).toBe(200);
    expect(unknown.status).toBe(200);
    expect(existing.body).toEqual(unknown.body);
  });
});
