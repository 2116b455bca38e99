import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
let admin: TestAgent;
beforeAll(async () => {
  sd = await startTestApp();
  admin = await signedInAgent(sd.app, 'admin');
});
afterAll(async () => {
  await sd?.close();
});

describe('GET /api/office', () => {
  it('When the demo office is seeded, then it has the default risk ladder from the product brief', async () => {
    const res = await admin.get('/api/office');
    expect(res.status).toBe(200);
    expect(res.body.name).toBe('Meridian Valley Weather Office');
    expect(res.body.timeZone).toBe('America/Chicago');
    expect(res.body.riskLadder.map((l: { key: string }) => l.key)).toEqual(['thunder', 'level1', 'level2', 'level3', 'level4', 'level5']);
    expect(res.body.riskLadder[5].colour).toBe('#3b0a45');
  });
});

describe('PUT /api/office', () => {
  it('When an admin renames a level and saves with the current version, then the ladder is stored and the version moves on', async () => {
    const current = (await admin.get('/api/office')).body;
    const riskLadder = current.riskLadder.map((l: { key: string; label: string }) => (l.key === 'level1' ? { ...l, label: 'Level 1 · A few' } : l));
    const res = await admin.put('/api/office').send({ name: current.name, region: current.region, timeZone: current.timeZone, riskLadder, version: current.version });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(current.version + 1);
    expect((await admin.get('/api/office')).body.riskLadder[1].label).toBe('Level 1 · A few');
  });

  it('When two admins save from the same version, then the second gets 409 and the first save stays', async () => {
    const current = (await admin.get('/api/office')).body;
    const base = { region: current.region, timeZone: current.timeZone, riskLadder: current.riskLadder, version: current.version };
    const first = await admin.put('/api/office').send({ ...base, name: 'First Save Office' });
    expect(first.status).toBe(200);
    const second = await admin.put('/api/office').send({ ...base, name: 'Second Save Office' });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('CONFLICT');
    expect((await admin.get('/api/office')).body.name).toBe('First Save Office');
  });

  it('When the payload is bad, then 400 names each field', async () => {
    const current = (await admin.get('/api/office')).body;
    const res = await admin.put('/api/office').send({
      name: 'X',
      region: { west: -90, south: 40, east: -95, north: 41 },
      timeZone: 'Mars/Olympus',
      riskLadder: [
        { key: 'thunder', label: 'T', colour: 'blue' },
        { key: 'thunder', label: 'U', colour: '#000000' },
      ],
      version: current.version,
    });
    expect(res.status).toBe(400);
    const paths = res.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['name', 'region.east', 'timeZone', 'riskLadder.0.colour', 'riskLadder.1.key']));
  });

  it('When the body is not JSON, then 400 says so', async () => {
    const res = await admin.put('/api/office').set('content-type', 'application/json').send('{not json');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/not valid JSON/);
  });
});

describe('guidance thresholds and the four-eyes setting', () => {
  it('When an admin sets thresholds and relaxes four-eyes, then both are stored and read back', async () => {
    const current = (await admin.get('/api/office')).body;
    expect(current.guidanceThresholds.level3.mlCape).toBeGreaterThan(0);
    const guidanceThresholds = { ...current.guidanceThresholds, level3: { mlCape: 1800, srh0to1km: 120 } };
    const res = await admin.put('/api/office').send({ name: current.name, region: current.region, timeZone: current.timeZone, riskLadder: current.riskLadder, guidanceThresholds, allowSelfApproval: true, version: current.version });
    expect(res.status).toBe(200);
    expect(res.body.guidanceThresholds.level3).toEqual({ mlCape: 1800, srh0to1km: 120 });
    expect(res.body.allowSelfApproval).toBe(true);
  });

  it('When a threshold is negative or names a level not on the ladder, then 400 names it', async () => {
    const current = (await admin.get('/api/office')).body;
    const base = { name: current.name, region: current.region, timeZone: current.timeZone, riskLadder: current.riskLadder, version: current.version };
    const negative = await admin.put('/api/office').send({ ...base, guidanceThresholds: { level1: { mlCape: -5 } } });
    expect(negative.status).toBe(400);
    expect(negative.body.error.issues[0].path).toBe('guidanceThresholds.level1.mlCape');
    const stray = await admin.put('/api/office').send({ ...base, guidanceThresholds: { level9: { mlCape: 5 } } });
    expect(stray.status).toBe(400);
    expect(stray.body.error.issues[0].path).toBe('guidanceThresholds.level9');
  });
});
