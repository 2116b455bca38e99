import { copyFile, mkdtemp, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import { evidenceCandidatesSchema } from '../../shared/contracts/evidence-candidates';
import { areaReport as evidenceAreaReport, evidencePool } from '../../shared/evidence/area-report';
import { evidenceSoundingsFromCandidates } from '../../shared/evidence/evidence-candidates';
import { intakeFileListSchema, type IntakeFile } from '../../shared/contracts/intake';
import { modelFieldSchema } from '../../shared/contracts/model-fields';
import { modelRunSummarySchema } from '../../shared/contracts/model-runs';
import { outlookEvidenceSchema } from '../../shared/contracts/outlooks';
import type { Stormdraft } from '../../server/start';
import { generateGribFixture, gribPresets, type GribFixtureSpec } from '../fixtures/grib/generate-grib';
import { signedInAgent, startTestApp } from './helpers/test-app';

/**
 * Issue 15's acceptance: a GRIB2 run dropped into the intake folder, with the app running,
 * becomes a run in the library, a field the map can colour and evidence in an outlook, with
 * nobody doing anything else.
 */

// An invented 8 × 6 run, 0.5° apart, inside the demo office region (96.5–87.5 °W, 35.5–41.5 °N).
const spec: GribFixtureSpec = {
  ...gribPresets.small,
  grid: { kind: 'regular_ll', nx: 8, ny: 6, north: 40, west: -95, stepDeg: 0.5 },
  cycle: '2031-06-01T12:00:00Z',
  forecastHours: [6],
};
const points = 8 * 6;

let sd: Stormdraft;
let folder: string;
let scratch: string;
let forecaster: TestAgent;

beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), 'grib-intake-'));
  scratch = await mkdtemp(path.join(tmpdir(), 'grib-fixture-'));
  sd = await startTestApp({ intakeDir: folder, intakeSettleMs: 200, intakePollMs: 0 });
  forecaster = await signedInAgent(sd.app, 'forecaster');
});

afterAll(async () => {
  await sd?.close();
  await rm(folder, { recursive: true, force: true });
  await rm(scratch, { recursive: true, force: true });
});

async function finished(fileName: string, seconds = 120): Promise<IntakeFile> {
  for (let i = 0; i < seconds * 5; i++) {
    const res = await forecaster.get('/api/intake-files');
    expect(res.status).toBe(200);
    const done = intakeFileListSchema.parse(res.body).files.find((f) => f.fileName === fileName && f.finishedAt !== null);
    if (done) return done;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`${fileName} was not taken in within ${seconds} s`);
}

describe('a GRIB2 run dropped into the intake folder', () => {
  it('When the file lands, then a run appears in the library, its field can be coloured and an outlook over it has evidence from it', async () => {
    const written = path.join(scratch, 'run.grib2');
    await generateGribFixture(spec, written);
    // Written elsewhere and moved in whole, as a data feed would.
    await copyFile(written, path.join(scratch, 'copy.grib2'));
    await rename(path.join(scratch, 'copy.grib2'), path.join(folder, 'model-run.grib2'));

    const file = await finished('model-run.grib2');
    expect(file).toMatchObject({ state: 'done', format: 'grib2', soundingCount: points, failure: null });
    expect(file.runIds).toHaveLength(1);
    const runId = file.runIds[0] as string;

    // The library lists the run, ready, with every grid point.
    const runs = await forecaster.get('/api/model-runs');
    expect(runs.status).toBe(200);
    const run = modelRunSummarySchema.array().parse(runs.body).find((r) => r.id === runId);
    expect(run).toMatchObject({ state: 'ready', soundingCount: points, cycleTime: '2031-06-01T12:00:00.000Z', forecastHour: 6, validTime: '2031-06-01T18:00:00.000Z' });

    // The map can colour a field of the run: bands with colours over the grid.
    const field = await forecaster.get(`/api/model-runs/${runId}/field?figure=precipitableWaterMm`);
    expect(field.status).toBe(200);
    const parsed = modelFieldSchema.parse(field.body);
    expect(parsed.valuedPoints).toBe(points);
    expect(parsed.features.features.length).toBeGreaterThan(0);

    // An outlook whose period holds the run's valid time takes its evidence from the run by default.
    const created = await forecaster.post('/api/outlooks').send({ day: 1, issuanceTime: '2031-06-01T15:00:00Z', headline: 'Grid run evidence' });
    expect(created.status).toBe(201);
    const draft = created.body as { id: string; version: number; validFrom: string; validUntil: string };
    const area = { type: 'Polygon', coordinates: [[[-95.2, 37.3], [-91.0, 37.2], [-91.2, 40.3], [-93.4, 40.6], [-95.4, 40.3], [-95.2, 37.3]]] };
    const saved = await forecaster.put(`/api/outlooks/${draft.id}`).send({ version: draft.version, headline: 'Grid run evidence', discussion: '', hazardNotes: {}, validFrom: draft.validFrom, validUntil: draft.validUntil, areas: [{ levelKey: 'level1', hazards: [], geometry: area }] });
    expect(saved.status).toBe(200);
    const evidence = await forecaster.get(`/api/outlooks/${draft.id}/evidence`);
    expect(evidence.status).toBe(200);
    const report = outlookEvidenceSchema.parse(evidence.body);
    expect(report.runs.map((r) => r.id)).toEqual([runId]);
    const [areaReport] = report.areas;
    expect(areaReport?.evidence.count).toBe(points);
    expect(report.sourcesByArea[areaReport?.areaId ?? '']).toEqual([{ runId, count: points }]);
    expect(areaReport?.support.reasons.join(' ')).toMatch(/of \d+ soundings/);

    // The workspace's live preview gets the same grid soundings and, with the shared code, the same answer.
    const candidates = await forecaster.get(`/api/outlooks/${draft.id}/evidence-candidates`);
    expect(candidates.status).toBe(200);
    const parsedCandidates = evidenceCandidatesSchema.parse(candidates.body);
    expect(parsedCandidates.soundings.filter((c) => c.runId === runId)).toHaveLength(points);
    const office = await forecaster.get('/api/office');
    const pool = evidencePool(evidenceSoundingsFromCandidates(parsedCandidates), { validFrom: draft.validFrom, validUntil: draft.validUntil });
    const savedArea = (saved.body as { areas: { id: string; levelKey: string; hazards: []; geometry: never }[] }).areas[0];
    if (!savedArea) throw new Error('the saved outlook has no area');
    const live = evidenceAreaReport(savedArea, pool, office.body.riskLadder, office.body.guidance);
    expect(live.evidence.count).toBe(areaReport?.evidence.count);
    expect(live.support).toEqual(areaReport?.support);
  });

  it('When a truncated GRIB2 file lands, then it is listed as failed with a reason and the stored run is untouched', async () => {
    const whole = await readFile(path.join(scratch, 'run.grib2'));
    await writeFile(path.join(scratch, 'cut.grib2'), whole.subarray(0, Math.floor(whole.length / 3)));
    await rename(path.join(scratch, 'cut.grib2'), path.join(folder, 'cut-off.grib2'));
    const file = await finished('cut-off.grib2');
    expect(file.state).toBe('failed');
    expect(file.failure ?? '').toMatch(/truncated or damaged/);
    expect(file.runIds).toEqual([]);
    const runs = modelRunSummarySchema.array().parse((await forecaster.get('/api/model-runs')).body);
    expect(runs.filter((r) => r.state === 'ready').map((r) => r.soundingCount)).toEqual([points]);
    expect((await forecaster.get('/api/health')).status).toBe(200);
  });
});
