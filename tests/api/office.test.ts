import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { offices } from '../../server/db/schema';
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

describe('support-check guidance (issue 14) and the four-eyes setting', () => {
  const base = async () => {
    const current = (await admin.get('/api/office')).body;
    return { name: current.name, region: current.region, timeZone: current.timeZone, riskLadder: current.riskLadder, version: current.version };
  };
  const invalidPaths = async (guidance: unknown) => {
    const res = await admin.put('/api/office').send({ ...(await base()), guidance });
    expect(res.status).toBe(400);
    return res.body.error.issues.map((i: { path: string }) => i.path);
  };

  it('When the demo office is read, then it carries the invented default rules per level and per hazard', async () => {
    const { guidance } = (await admin.get('/api/office')).body;
    expect(guidance.levels.level3.rules).toContainEqual({ figure: 'mlCin', bound: 'min', value: -100 });
    expect(guidance.hazards.flood.ordinary.rules).toContainEqual({ figure: 'corfidiUpwindMs', bound: 'max', value: 8 });
  });

  it('When an admin sets rules with a maximum, a share and a count, and relaxes four-eyes, then all are stored and read back', async () => {
    const current = (await admin.get('/api/office')).body;
    const level3 = { rules: [{ figure: 'mlCape', bound: 'min', value: 1800 }, { figure: 'mlCin', bound: 'min', value: -75 }], minimumSharePercent: 60, minimumCount: 4 };
    const tornado = { significant: { rules: [{ figure: 'mlLclHeightM', bound: 'max', value: 900 }], minimumSharePercent: null, minimumCount: 3 } };
    const guidance = { levels: { ...current.guidance.levels, level3 }, hazards: { tornado } };
    const res = await admin.put('/api/office').send({ ...(await base()), guidance, allowSelfApproval: true });
    expect(res.status).toBe(200);
    const read = (await admin.get('/api/office')).body;
    expect(read.guidance.levels.level3).toEqual(level3);
    expect(read.guidance.hazards).toEqual({ tornado });
    expect(read.allowSelfApproval).toBe(true);
  });

  it('When a rule value is not a number, a figure is unknown or a bound is odd, then 400 names each field', async () => {
    const paths = await invalidPaths({
      levels: { level1: { rules: [{ figure: 'mlCape', bound: 'min', value: 'lots' }] } },
      hazards: { hail: { ordinary: { rules: [{ figure: 'hailSize', bound: 'min', value: 2 }, { figure: 'dcape', bound: 'around', value: 2 }] } } },
    });
    expect(paths).toEqual(expect.arrayContaining(['guidance.levels.level1.rules.0.value', 'guidance.hazards.hail.ordinary.rules.0.figure', 'guidance.hazards.hail.ordinary.rules.1.bound']));
  });

  it('When a maximum is below the minimum of the same figure, or the share or count is out of range, then 400 names the field', async () => {
    const paths = await invalidPaths({
      levels: { level2: { rules: [{ figure: 'mlCape', bound: 'min', value: 500 }, { figure: 'mlCape', bound: 'max', value: 100 }], minimumSharePercent: 150, minimumCount: 0 } },
    });
    expect(paths).toEqual(expect.arrayContaining(['guidance.levels.level2.rules.1.value', 'guidance.levels.level2.minimumSharePercent', 'guidance.levels.level2.minimumCount']));
  });

  it('When guidance names a level not on the ladder or a hazard that does not exist, then 400 names it', async () => {
    const stray = await admin.put('/api/office').send({ ...(await base()), guidance: { levels: { level9: { rules: [] } } } });
    expect(stray.status).toBe(400);
    expect(stray.body.error.issues[0].path).toBe('guidance.levels.level9');
    const hurricane = await admin.put('/api/office').send({ ...(await base()), guidance: { levels: {}, hazards: { hurricane: { ordinary: { rules: [] } } } } });
    expect(hurricane.status).toBe(400);
    expect(hurricane.body.error.issues[0]).toEqual({ path: 'guidance.hazards', message: expect.stringMatching(/hurricane/) });
  });

  it('When a forecaster or a lead sends guidance, then 403 and nothing changes', async () => {
    const before = (await admin.get('/api/office')).body;
    for (const role of ['forecaster', 'lead'] as const) {
      const agent = await signedInAgent(sd.app, role);
      const res = await agent.put('/api/office').send({ ...(await base()), guidance: { levels: {}, hazards: {} } });
      expect(res.status).toBe(403);
    }
    expect((await admin.get('/api/office')).body.guidance).toEqual(before.guidance);
  });

  it('When an office row holds only the thresholds stored before issue 14, then they are read as minimum rules', async () => {
    await sd.ctx.db.update(offices).set({ supportGuidance: null, guidanceThresholds: { level2: { mlCape: 1200, bulkShear0to6kmMs: 18 } } });
    const { guidance } = (await admin.get('/api/office')).body;
    expect(guidance.levels.level2.rules).toEqual([
      { figure: 'mlCape', bound: 'min', value: 1200 },
      { figure: 'bulkShear0to6kmMs', bound: 'min', value: 18 },
    ]);
    expect(Object.keys(guidance.hazards)).toEqual(['tornado', 'hail', 'wind', 'flood']);
  });
});
