import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { agentFor, signedInAgent, startTestApp, testPostgresUrl } from './helpers/test-app';

const dir = mkdtempSync(path.join(tmpdir(), 'stormdraft-persist-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// PGlite-specific: skipped in the PostgreSQL pass, where it would only repeat the PGlite run.
describe.skipIf(testPostgresUrl())('PGlite on disk', () => {
  it('When the app restarts on the same DATA_DIR, then accounts and settings are still there and the seed does not duplicate them', async () => {
    const dataDir = path.join(dir, 'nested', 'data');
    const first = await startTestApp({ dataDir });
    const admin = await signedInAgent(first.app, 'admin');
    expect((await admin.post('/api/users').send({ name: 'Kept', email: 'kept@office.test', password: 'long-enough-1', role: 'lead' })).status).toBe(201);
    const countBefore = (await admin.get('/api/users')).body.users.length;
    await first.close();

    const second = await startTestApp({ dataDir });
    try {
      const health = await agentFor(second.app).get('/api/health');
      expect(health.body).toEqual({ status: 'ok', database: 'ok' });
      const kept = await agentFor(second.app).post('/api/auth/sign-in/email').send({ email: 'kept@office.test', password: 'long-enough-1' });
      expect(kept.status).toBe(200);
      const admin2 = await signedInAgent(second.app, 'admin');
      expect((await admin2.get('/api/users')).body.users.length).toBe(countBefore);
    } finally {
      await second.close();
    }
  });
});

describe('production start-up', () => {
  it('When NODE_ENV=production keeps the development auth secret, then configuration is refused', async () => {
    const { loadConfig } = await import('../../server/config');
    expect(() => loadConfig({ NODE_ENV: 'production' }, [])).toThrow(/BETTER_AUTH_SECRET/);
  });
});
