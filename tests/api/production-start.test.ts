import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailCatcher, type MailCatcher } from '../../server/mail/mail-catcher';
import { demoPassword } from '../../server/services/seed.service';
import { testPostgresUrl } from './helpers/test-app';

/*
 * The production start-up, as an operator runs it: the real entry point (server/index.ts, which
 * is what `npm start` runs after building the client) in its own process, configured only
 * through the environment with NODE_ENV=production. Nothing here passes an option to the app:
 * whether demo accounts exist must follow from NODE_ENV alone.
 *
 * The server needs no dist/ for its API: it serves the built client when dist/ exists (after
 * `vite build`, which the README's test command runs first) and the API either way, so this
 * test passes with or without a build.
 */

const root = path.resolve(import.meta.dirname, '../..');
const productionSecret = 'a-production-secret-for-this-test-only-0123456789';

/** A TCP port nobody listens on right now (the kernel picks it; we release it for the app). */
async function freePort(): Promise<number> {
  const probe = createServer();
  await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', () => resolve()));
  const address = probe.address();
  await new Promise<void>((resolve) => probe.close(() => resolve()));
  if (typeof address !== 'object' || address === null) throw new Error('no port');
  return address.port;
}

let dataDir: string | undefined;
let catcher: MailCatcher | undefined;
let child: ChildProcess | undefined;
let exited: Promise<number | null>;
let baseUrl: string;
let output = '';

/** Polls /api/health until it answers 200; fails early (with the app's output) if the process ends. */
async function waitForHealth(timeoutMs: number): Promise<void> {
  let ended = false;
  void exited.then(() => (ended = true));
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (ended) throw new Error(`The production server stopped during start-up:\n${output}`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      if (res.status === 200) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`The production server did not answer /api/health within ${timeoutMs} ms:\n${output}`);
}

// Its own PGlite on disk: skipped in the PostgreSQL pass, where it would only repeat the PGlite run.
describe.skipIf(testPostgresUrl())('production start-up (NODE_ENV=production, real server process)', () => {
  beforeAll(async () => {
    dataDir = mkdtempSync(path.join(tmpdir(), 'stormdraft-production-'));
    catcher = await startMailCatcher(async () => {});
    const port = await freePort();
    baseUrl = `http://127.0.0.1:${port}`;
    child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      cwd: root,
      // Only what an operator would set (plus PATH and HOME for Node itself); no test variables leak in.
      env: {
        PATH: process.env.PATH,
        HOME: process.env.HOME,
        NODE_ENV: 'production',
        PORT: String(port),
        DATA_DIR: dataDir,
        BETTER_AUTH_SECRET: productionSecret,
        PUBLIC_URL: baseUrl,
        SMTP_URL: catcher.url,
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const started = child;
    started.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    started.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    exited = new Promise((resolve) => started.once('exit', (code) => resolve(code)));
    await waitForHealth(120_000);
  });

  afterAll(async () => {
    if (child && child.exitCode === null && child.signalCode === null) {
      child.kill('SIGKILL');
      await exited;
    }
    await catcher?.close();
    if (dataDir) rmSync(dataDir, { recursive: true, force: true });
  });

  it('When the app runs in production, then signing in with a demo account fails', async () => {
    const res = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl },
      body: JSON.stringify({ email: 'forecaster@demo.stormdraft.test', password: demoPassword }),
    });
    expect(res.status).toBe(401);
    expect(res.headers.get('set-cookie')).toBeNull();
  });

  it('When the app runs in production, then there are no (demo) issuances in the public archive', async () => {
    const res = await fetch(`${baseUrl}/api/public/issuances`);
    expect(res.status).toBe(200);
    const body = (await res.json()) as { issuances: unknown[]; total: number };
    expect(body.issuances).toEqual([]);
    expect(body.total).toBe(0);
  });

  it('When the production process receives SIGTERM, then it shuts down cleanly (exit status 0)', async () => {
    expect(child?.kill('SIGTERM')).toBe(true);
    expect(await exited).toBe(0);
  });
});
