import { existsSync, readFileSync } from 'node:fs';
import { pino } from 'pino';
import { inject } from 'vitest';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { defaultMailFrom, developmentAuthSecret, type Config } from '../../../server/config';
import { startStormdraft, type Stormdraft } from '../../../server/start';
import type { ClientMode } from '../../../server/app';
import { demoPassword } from '../../../server/services/seed.service';
import type { Role } from '../../../shared/contracts/common';

export const testOrigin = 'http://localhost:3999';

/** Configuration for an in-process app on a fresh in-memory PGlite with the local mail catcher. */
export function testConfig(overrides: Partial<Config> = {}): Config {
  return {
    env: 'test',
    port: 3999,
    dataDir: undefined,
    databaseUrl: undefined,
    smtpUrl: undefined,
    authSecret: developmentAuthSecret,
    publicUrl: testOrigin,
    logLevel: 'silent',
    authRateLimitPerMinute: 10_000,
    viteDev: false,
    seedDemo: true,
    // Tests drive the outbox themselves (processOutbox) so sending is deterministic.
    outboxIntervalMs: 0,
    mailFrom: defaultMailFrom,
    tileUrl: undefined,
    tileAttribution: undefined,
    ...overrides,
  };
}

/** Where the global setup left a migrated, seeded database for test files to copy (none outside vitest's setup). */
function templatePath(): string | undefined {
  try {
    return inject('testTemplatePath');
  } catch {
    return undefined;
  }
}

/**
 * Starts the real app (real PGlite, real better-auth, real SMTP catcher), seeded with the demo
 * office. An in-memory database starts from the template the global setup made, when there is one.
 */
export async function startTestApp(overrides: Partial<Config> = {}, clientMode: ClientMode = 'none', options: { useTemplate?: boolean } = {}): Promise<Stormdraft> {
  const config = testConfig(overrides);
  const template = (options.useTemplate ?? true) && config.dataDir === undefined && config.seedDemo ? templatePath() : undefined;
  const loadDataDir = template && existsSync(template) ? new Blob([readFileSync(template)]) : undefined;
  return startStormdraft(config, { clientMode, logger: pino({ level: 'silent' }), ...(loadDataDir ? { loadDataDir } : {}) });
}

export const demoEmail = (role: Role) => `${role}@demo.stormdraft.test`;

/** A supertest agent that keeps cookies and always sends Origin (better-auth refuses cookie POSTs without it). */
export function agentFor(app: Stormdraft['app']): TestAgent {
  return request.agent(app).set('Origin', testOrigin);
}

/** Signs a demo account in over HTTP and returns the agent holding its session cookie. */
export async function signedInAgent(app: Stormdraft['app'], role: Role, password = demoPassword): Promise<TestAgent> {
  const agent = agentFor(app);
  const res = await agent.post('/api/auth/sign-in/email').send({ email: demoEmail(role), password });
  if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** Waits until the catcher has stored a message matching `predicate` (SMTP delivery is asynchronous). */
export async function waitFor<T>(probe: () => Promise<T | undefined>, what: string, attempts = 50): Promise<T> {
  for (let i = 0; i < attempts; i++) {
    const value = await probe();
    if (value !== undefined) return value;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`timed out waiting for ${what}`);
}
