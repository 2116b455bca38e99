import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pino from 'pino';
import { openDatabase } from '../../server/db/client';
import { offices } from '../../server/db/schema';
import { ingestGribFile } from '../../server/ingest/grib/ingest-grib';
import { ensureOffice } from '../../server/services/seed.service';
import { runRetentionIdle } from '../../server/services/model-runs.service';
import { closeSoundingPool } from '../../server/workers/sounding-pool';
import { generateGribFixture, gribPresets } from '../fixtures/grib/generate-grib';
import type { BenchFigure } from './figures';

interface GribBenchResult {
  seconds: number;
  soundings: number;
  storedBytes: number;
}

let measured: Promise<GribBenchResult> | undefined;

/**
 * One intake of the benchmark GRIB2 run (200 × 200 points, 25 levels, surface fields; made
 * beforehand by the fixture generator, not timed): decode with ecCodes, build, analyse in the
 * worker pool and store in an in-memory PGlite. Measured once; both GRIB figures read it.
 */
function measureGribIngest(): Promise<GribBenchResult> {
  measured ??= (async () => {
    const dir = await mkdtemp(join(tmpdir(), 'grib-bench-'));
    const handle = await openDatabase({});
    try {
      const file = join(dir, 'bench.grib2');
      await generateGribFixture(gribPresets.bench, file);
      await ensureOffice(handle.db);
      const [office] = await handle.db.select({ id: offices.id }).from(offices);
      if (!office) throw new Error('grib bench: no office');
      const start = performance.now();
      const result = await ingestGribFile({ db: handle.db, logger: pino({ level: 'silent' }) }, { officeId: office.id, filePath: file, model: 'BENCH' });
      const seconds = (performance.now() - start) / 1000;
      if (!result.ok) throw new Error(`grib bench: ${result.error.reason}`);
      if (result.value.soundingCount !== 40_000) throw new Error(`grib bench: ${result.value.soundingCount} soundings instead of 40000`);
      await runRetentionIdle();
      return { seconds, soundings: result.value.soundingCount, storedBytes: result.value.storedBytes };
    } finally {
      await closeSoundingPool();
      await handle.close();
      await rm(dir, { recursive: true, force: true });
    }
  })();
  return measured;
}

/** Wall time of one 40,000-sounding GRIB2 intake, s (issue 15's target: ≤ 60 s). */
export const gribIngestFortyThousand: BenchFigure = {
  name: 'grib_ingest_s_40000_soundings',
  unit: 's',
  async measure() {
    return Math.round((await measureGribIngest()).seconds * 10) / 10;
  },
};

/** Bytes stored per grid sounding of that run (row size as PostgreSQL counts it; target ≤ 2 KB). */
export const gribBytesPerSounding: BenchFigure = {
  name: 'grib_bytes_per_sounding',
  unit: 'bytes',
  async measure() {
    const { storedBytes, soundings } = await measureGribIngest();
    return Math.round(storedBytes / soundings);
  },
};
