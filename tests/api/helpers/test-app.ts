import { randomUUID } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import pg from 'pg';
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

/** What the global setup left for test files to start from (nothing outside vitest's setup). */
function injected<K extends 'testTemplatePath' | 'testTemplateDatabase'>(key: K): string | undefined {
  try {
    return inject(key) || undefined;
  } catch {
    return undefined;
  }
}

/**
 * The PostgreSQL server the API suite runs against for its second pass (`TEST_POSTGRES_URL`, a
 * connection string to a throw-away cluster's maintenance database, set by
 * tests/ensure-postgres.sh); undefined for the usual PGlite pass.
 */
export function testPostgresUrl(): string | undefined {
  return process.env.TEST_POSTGRES_URL || undefined;
}

/**
 * Creates a fresh database on the test PostgreSQL server, as a copy of `template` when given
 * (CREATE DATABASE … TEMPLATE copies files, so a migrated and seeded database costs well under a
 * second), and returns its connection string.
 */
export async function createPostgresDatabase(template?: string): Promise<string> {
  const adminUrl = testPostgresUrl();
  if (!adminUrl) throw new Error('TEST_POSTGRES_URL is not set');
  const name = `stormdraft_${randomUUID().replaceAll('-', '')}`;
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`create database ${name}${template ? ` template ${pg.escapeIdentifier(template)}` : ''}`);
  } finally {
    await client.end();
  }
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return url.toString();
}

/**
 * Starts the real app (real database, real better-auth, real SMTP catcher), seeded with the demo
 * office. An in-memory PGlite starts from the template the global setup made, when there is one.
 * With TEST_POSTGRES_URL set, an app without its own `dataDir` or `databaseUrl` gets a fresh
 * database of its own on that PostgreSQL server instead (a copy of the seeded template).
 */
export async function startTestApp(overrides: Partial<Config> = {}, clientMode: ClientMode = 'none', options: { useTemplate?: boolean } = {}): Promise<Stormdraft> {
  let config = testConfig(overrides);
  const useTemplate = (options.useTemplate ?? true) && config.seedDemo;
  if (testPostgresUrl() && config.dataDir === undefined && config.databaseUrl === undefined) {
    const template = useTemplate ? injected('testTemplateDatabase') : undefined;
    config = { ...config, databaseUrl: await createPostgresDatabase(template) };
  }
  const template = useTemplate && config.dataDir === undefined && config.databaseUrl === undefined ? injected('testTemplatePath') : undefined;
  const loadDataDir = template && existsSync(template) ? new Blob([readFileSync(template)]) : undefined;
  return startStormdraft(config, { clientMode, logger: pino({ level: 'silent' }), ...(loadDataDir ? { loadDataDir } : {}) });
}

export const demoEmail = (role: Role) => `${role}@demo.stormdraft.test`;

/** A supertest agent that keeps cookies and always sends Origin (better-auth refuses cookie POSTs without it). */
export function agentFor(app: Stormdraft['app'], origin = testOrigin): TestAgent {
  return request.agent(app).set('Origin', origin);
}

/** Signs a demo account in over HTTP and returns the agent holding its session cookie. */
export async function signedInAgent(app: Stormdraft['app'], role: Role, password = demoPassword, origin = testOrigin): Promise<TestAgent> {
  const agent = agentFor(app, origin);
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
