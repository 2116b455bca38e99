import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { evidenceCandidatesSchema } from '../../shared/contracts/evidence-candidates';
import { defaultRiskLadder, type SupportGuidance } from '../../shared/contracts/office';
import { outlookEvidenceSchema, outlookSchema } from '../../shared/contracts/outlooks';
import { areaReport, evidencePool } from '../../shared/evidence/area-report';
import { evidenceSoundingsFromCandidates } from '../../shared/evidence/evidence-candidates';
import type { Stormdraft } from '../../server/start';
import { signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
let forecaster: TestAgent;
beforeAll(async () => {
  sd = await startTestApp();
  forecaster = await signedInAgent(sd.app, 'forecaster');
});
afterAll(async () => {
  await sd?.close();
});

async function demoDraftId(): Promise<string> {
  const list = await forecaster.get('/api/outlooks').query({ state: 'draft' });
  const demo = (list.body.outlooks as { id: string; headline: string }[]).find((o) => o.headline.startsWith('Scattered severe storms'));
  if (!demo) throw new Error('The demo draft is missing.');
  return demo.id;
}

describe('GET /api/outlooks/:outlookId/evidence-candidates', () => {
  it('When the workspace computes each area from the candidates with the shared module, then counts, soundings and results equal the server evidence report', async () => {
    const outlookId = await demoDraftId();
    const [candidatesRes, evidenceRes, outlookRes, officeRes] = await Promise.all([
      forecaster.get(`/api/outlooks/${outlookId}/evidence-candidates`),
      forecaster.get(`/api/outlooks/${outlookId}/evidence`),
      forecaster.get(`/api/outlooks/${outlookId}`),
      forecaster.get('/api/office'),
    ]);
    expect(candidatesRes.status).toBe(200);
    const candidates = evidenceCandidatesSchema.parse(candidatesRes.body);
    const server = outlookEvidenceSchema.parse(evidenceRes.body);
    const outlook = outlookSchema.parse(outlookRes.body);
    expect(candidates.truncated).toBe(false);
    expect(candidates.soundings.length).toBe(server.soundingCount);
    const guidance = officeRes.body.guidance as SupportGuidance;
    const pool = evidencePool(evidenceSoundingsFromCandidates(candidates), { validFrom: outlook.validFrom, validUntil: outlook.validUntil });
    expect(outlook.areas.length).toBeGreaterThanOrEqual(4);
    for (const area of outlook.areas) {
      const live = areaReport(area, pool, officeRes.body.riskLadder ?? defaultRiskLadder, guidance);
      const recorded = server.areas.find((a) => a.areaId === area.id);
      expect(live.evidence.count, area.label).toBe(recorded?.evidence.count);
      expect([...live.evidence.soundingIds].sort(), area.label).toEqual([...(recorded?.evidence.soundingIds ?? [])].sort());
      expect(live.evidence.stats.mlCape?.median, area.label).toBe(recorded?.evidence.stats.mlCape?.median);
      expect(live.support, area.label).toEqual(recorded?.support);
    }
  });

  it('When a candidate is sent, then its figures come back by name in SI units', async () => {
    const outlookId = await demoDraftId();
    const res = await forecaster.get(`/api/outlooks/${outlookId}/evidence-candidates`);
    const payload = evidenceCandidatesSchema.parse(res.body);
    const first = payload.soundings[0];
    if (!first) throw new Error('The demo period has no soundings.');
    const detail = await forecaster.get(`/api/soundings/${first.id}`);
    const [decoded] = evidenceSoundingsFromCandidates({ figureKeys: payload.figureKeys, soundings: [first] });
    expect(detail.status).toBe(200);
    expect(decoded?.figures.mlCape).toBe(detail.body.figures.mlCape);
    expect(decoded?.figures.stp).toBe(detail.body.figures.stp);
    expect(decoded?.runId).toBeNull();
  });

  it('When the outlook does not exist, then 404', async () => {
    const res = await forecaster.get('/api/outlooks/00000000-0000-4000-8000-000000000000/evidence-candidates');
    expect(res.status).toBe(404);
  });

  it('When the id is not a UUID, then 400 names the address', async () => {
    const res = await forecaster.get('/api/outlooks/not-an-id/evidence-candidates');
    expect(res.status).toBe(400);
  });
});
