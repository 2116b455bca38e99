import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
let forecaster: TestAgent;
let anonymous: TestAgent;

beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
  anonymous = agentFor(sd.app);
});
afterAll(async () => {
  await sd?.close();
});

interface EvidenceArea {
  areaId: string;
  evidence: { count: number };
  support: { result: string; reasons: string[] };
  checks: { code: string }[];
}

describe('the demo day (issue 14 item 6)', () => {
  it('When the demo draft is read, then its six hand-drawn areas pass the geometry checks and the support check gives a mix of results with reasons', async () => {
    const list = await forecaster.get('/api/outlooks').query({ state: 'draft' });
    const demo = list.body.outlooks.find((o: { headline: string }) => o.headline.startsWith('Scattered severe storms'));
    expect(demo, 'the demo draft').toBeTruthy();
    const detail = await forecaster.get(`/api/outlooks/${demo.id}`);
    expect(detail.body.areas).toHaveLength(6);
    const res = await forecaster.get(`/api/outlooks/${demo.id}/evidence`);
    expect(res.status).toBe(200);
    const areas = res.body.areas as EvidenceArea[];
    expect(areas.flatMap((a) => a.checks)).toEqual([]);
    for (const area of areas) {
      expect(area.evidence.count).toBeGreaterThan(0);
      expect(area.support.reasons.length).toBeGreaterThan(0);
    }
    const results = areas.map((a) => a.support.result);
    expect(new Set(results).size, results.join(', ')).toBeGreaterThanOrEqual(3);
  });

  it('When the past demo issuances are scored, then the higher the level the larger its share of reports, and some reports fall outside every area', async () => {
    const archive = await anonymous.get('/api/public/issuances');
    const past = (archive.body.issuances as { number: string; validUntil: string }[]).filter((i) => Date.parse(i.validUntil) < Date.now());
    expect(past.length).toBeGreaterThanOrEqual(2);
    for (const issuance of past) {
      const res = await anonymous.get(`/api/public/issuances/${issuance.number}/verification`);
      expect(res.body.status).toBe('scored');
      const level = (key: string) => res.body.result.levels.find((l: { levelKey: string }) => l.levelKey === key) as { table: { misses: number }; scores: { successRatio: number } };
      // The higher the level, the larger the share of its area where reports fell.
      const ratios = ['thunder', 'level1', 'level2', 'level3'].map((key) => level(key).scores.successRatio);
      expect(ratios, ratios.join(' < ')).toEqual([...ratios].sort((a, b) => a - b));
      expect(new Set(ratios).size).toBe(4);
      expect(level('level3').scores.successRatio).toBeGreaterThan(0.5);
      // A few reports fell outside every area: honest misses.
      expect(level('thunder').table.misses).toBeGreaterThan(0);
    }
  });
});
