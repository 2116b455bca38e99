import type { AddressInfo } from 'node:net';
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { pino } from 'pino';
import { defaultRiskLadder } from '../../shared/contracts/office';
import type { AreaGeometry, RiskArea } from '../../shared/contracts/outlooks';
import { emptyKeyFigures } from '../../shared/sounding/key-figures';
import type { EvidenceSounding } from '../../shared/evidence/evidence';
import { defaultSupportGuidance } from '../../shared/evidence/guidance';
import { loadConfig } from '../../server/config';
import { areasOfInterest, distributionJobs, issuances, offices, subscriptions, users } from '../../server/db/schema';
import { demoOutlookAreas } from '../../server/seed/demo-outlook';
import { processDistributionJobs } from '../../server/services/distribution.service';
import { demoOffice, demoPassword } from '../../server/services/seed.service';
import { listen, startStormdraft } from '../../server/start';
import { buildEvidenceReport } from '../../server/workers/evidence-report';
import { closeGeometryPool } from '../../server/workers/geometry-pool';
import type { BenchFigure } from './figures';

/** A closed wavy ring of `vertices` positions around a centre (degrees), like a detailed hand-drawn outline. */
function wavyArea(vertices: number, centre: [number, number], radius: number): AreaGeometry {
  const ring: [number, number][] = [];
  for (let i = 0; i < vertices - 1; i++) {
    const t = (2 * Math.PI * i) / (vertices - 1);
    const r = radius * (1 + 0.08 * Math.sin(60 * t));
    ring.push([centre[0] + r * Math.cos(t), centre[1] + 0.8 * r * Math.sin(t)]);
  }
  ring.push(ring[0] ?? [0, 0]);
  return { type: 'Polygon', coordinates: [ring] };
}

/**
 * Evidence for an outlook whose largest area has 10,000 points (the per-area limit) with a
 * 1,000-point area nested in it, over 2,000 soundings: crossings, region and nesting checks,
 * point-in-area tests, statistics and support. The work one evidence request gives a worker.
 * Median of 5 runs after a warm-up.
 */
export const evidenceTenThousandVertices: BenchFigure = {
  name: 'evidence_ms_area_10000_vertices',
  unit: 'ms',
  measure() {
    const { west, south, east, north } = demoOffice.region;
    let seed = 3;
    const random = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    const soundings: EvidenceSounding[] = Array.from({ length: 2000 }, (_, i) => ({
      id: `s${i}`,
      stationId: `X${i}`,
      latitude: south + random() * (north - south),
      longitude: west + random() * (east - west),
      validTime: '2027-04-18T18:00:00.000Z',
      source: 'model',
      modified: false,
      figures: { ...emptyKeyFigures(), mlCape: random() * 4000, muCape: random() * 4500, mlCin: -random() * 200, mlLclHeightM: 1000, precipitableWaterMm: 30, bulkShear0to6kmMs: random() * 35, srh0to1km: random() * 300, stp: random() * 5, scp: random() * 15, surfaceDewpointC: 15, surfaceMixingRatioGkg: 12, flagCount: 0 },
    }));
    const centre: [number, number] = [(west + east) / 2, (south + north) / 2];
    const areas: RiskArea[] = [
      { id: 'outer', levelKey: 'thunder', hazards: [], geometry: wavyArea(10_000, centre, 2.5), label: '', sortOrder: 0 },
      { id: 'inner', levelKey: 'level1', hazards: [], geometry: wavyArea(1_000, centre, 1.2), label: '', sortOrder: 1 },
    ];
    const outlook = { areas, validFrom: '2027-04-18T12:00:00.000Z', validUntil: '2027-04-19T11:00:00.000Z' };
    const run = () => buildEvidenceReport({ outlook, candidates: soundings, ladder: defaultRiskLadder, guidance: defaultSupportGuidance, region: demoOffice.region });
    run();
    const times: number[] = [];
    for (let i = 0; i < 5; i++) {
      const start = performance.now();
      const report = run();
      times.push(performance.now() - start);
      if (report.length !== 2 || (report[0]?.evidence.count ?? 0) === 0) throw new Error('evidence bench: expected two areas with soundings');
    }
    times.sort((a, b) => a - b);
    return Math.round(times[2] ?? 0);
  },
};

const origin = 'http://localhost:3999';

/**
 * The 99th percentile of /api/health answer times, asked every 20 ms over HTTP, from just
 * before a lead publishes until the publish's distribution job has queued the mail for 10,000
 * matching subscribers (one county-sized area each, 40 distinct areas, so 40 alert maps). The
 * app runs in this process on an in-memory PGlite, as in a single-machine office.
 */
export const healthDuringPublish: BenchFigure = {
  name: 'health_p99_ms_during_publish_10000_subscribers',
  unit: 'ms',
  async measure() {
    const config = { ...loadConfig({ NODE_ENV: 'test', LOG_LEVEL: 'silent', PUBLIC_URL: origin }, []), dataDir: undefined, outboxIntervalMs: 0 };
    const sd = await startStormdraft(config, { clientMode: 'none', logger: pino({ level: 'silent' }) });
    const server = await listen(sd.app, 0);
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    try {
      const db = sd.ctx.db;
      const [office] = await db.select({ id: offices.id }).from(offices).limit(1);
      if (!office) throw new Error('publish bench: no office');
      // 10,000 subscribers, each following one of 40 county-sized areas over the demo outlook.
      const areaChoices = Array.from({ length: 40 }, (_, i): AreaGeometry => {
        const x = -94.5 + (i % 8) * 0.5;
        const y = 37.2 + Math.floor(i / 8) * 0.4;
        return { type: 'Polygon', coordinates: [[[x, y], [x + 0.45, y], [x + 0.45, y + 0.36], [x, y + 0.36], [x, y]]] };
      });
      for (let start = 0; start < 10_000; start += 500) {
        const batch = Array.from({ length: 500 }, (_, k) => start + k);
        const userRows = batch.map((i) => ({ id: randomUUID(), name: `Bench subscriber ${i}`, email: `bench${i}@subscribers.test`, emailVerified: true, role: 'subscriber' }));
        await db.insert(users).values(userRows);
        const subRows = await db
          .insert(subscriptions)
          .values(userRows.map((u) => ({ officeId: office.id, userId: u.id, alertThreshold: 'thunder', emails: [u.email], days: [1, 2, 3], hazards: [] })))
          .returning({ id: subscriptions.id });
        await db.insert(areasOfInterest).values(subRows.map((s, k) => ({ subscriptionId: s.id, name: `Area ${k % 40}`, kind: 'drawn' as const, fipsCode: null, geometry: areaChoices[(start + k) % areaChoices.length] ?? wavyArea(8, [-92, 38.5], 0.2) })));
      }
      const signIn = async (email: string) => {
        const res = await fetch(`${base}/api/auth/sign-in/email`, { method: 'POST', headers: { 'content-type': 'application/json', origin }, body: JSON.stringify({ email, password: demoPassword }) });
        if (res.status !== 200) throw new Error(`publish bench: sign-in as ${email} gave ${res.status}`);
        return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
      };
      const forecaster = await signIn('forecaster@demo.stormdraft.test');
      const lead = await signIn('lead@demo.stormdraft.test');
      const call = async (cookie: string, method: string, path: string, body: unknown) => {
        const res = await fetch(`${base}${path}`, { method, headers: { 'content-type': 'application/json', origin, cookie }, body: JSON.stringify(body) });
        const json = (await res.json()) as Record<string, unknown>;
        if (!res.ok) throw new Error(`publish bench: ${method} ${path} gave ${res.status} ${JSON.stringify(json).slice(0, 200)}`);
        return json;
      };
      const created = await call(forecaster, 'POST', '/api/outlooks', { day: 1, headline: 'Bench publish' });
      const id = String(created.id);
      const areas = demoOutlookAreas.map((a) => ({ ...a, id: undefined }));
      const saved = await call(forecaster, 'PUT', `/api/outlooks/${id}`, { version: created.version, headline: 'Bench publish', discussion: 'Bench.', hazardNotes: {}, validFrom: created.validFrom, validUntil: created.validUntil, areas });
      const submitted = await call(forecaster, 'POST', `/api/outlooks/${id}/submit`, { version: saved.version });
      const approved = await call(lead, 'POST', `/api/outlooks/${id}/approve`, { version: submitted.version });

      const latencies: number[] = [];
      let sampling = true;
      const sampler = (async () => {
        while (sampling) {
          const start = performance.now();
          const res = await fetch(`${base}/api/health`);
          await res.arrayBuffer();
          latencies.push(performance.now() - start);
          await new Promise((resolve) => setTimeout(resolve, 20));
        }
      })();
      const published = await call(lead, 'POST', `/api/outlooks/${id}/publish`, { version: approved.version });
      const result = await processDistributionJobs(db, config);
      sampling = false;
      await sampler;
      const [issuance] = await db.select({ id: issuances.id }).from(issuances).where(eq(issuances.number, String(published.issuanceNumber)));
      const [job] = issuance ? await db.select().from(distributionJobs).where(eq(distributionJobs.issuanceId, issuance.id)) : [];
      if (job?.status !== 'done' || result.queued < 10_000) throw new Error(`publish bench: expected at least 10,000 messages queued, got ${result.queued} (job ${job?.status})`);
      latencies.sort((a, b) => a - b);
      return Math.round(latencies[Math.min(latencies.length - 1, Math.ceil(latencies.length * 0.99) - 1)] ?? 0);
    } finally {
      await new Promise((resolve) => server.close(resolve));
      await sd.close();
      await closeGeometryPool();
    }
  },
};
