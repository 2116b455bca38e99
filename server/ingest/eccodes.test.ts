import { afterEach, describe, expect, it } from 'vitest';
import { pino } from 'pino';
import { eccodesStatus } from './eccodes';
import { ingestGribFile } from './grib/ingest-grib';
import type { Database } from '../db/client';

const realPath = process.env.PATH;
afterEach(async () => {
  process.env.PATH = realPath;
  await eccodesStatus({ refresh: true });
});

describe('eccodesStatus', () => {
  it('When the ecCodes tools are installed, then the status gives their version', async () => {
    const status = await eccodesStatus({ refresh: true });
    expect(status.available).toBe(true);
    expect(status.version).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('When the tools cannot be found, then GRIB intake is refused with a reason that says how to install them', async () => {
    process.env.PATH = '/nonexistent';
    const status = await eccodesStatus({ refresh: true });
    expect(status).toEqual({ available: false, version: null, message: expect.stringContaining('libeccodes-tools') as unknown as string });
    // The tools are checked before the database is touched, so no database is needed here.
    const result = await ingestGribFile({ db: {} as Database, logger: pino({ level: 'silent' }) }, { officeId: '00000000-0000-4000-8000-000000000000', filePath: '/tmp/none.grib2' });
    expect(result).toEqual({ ok: false, error: { reason: status.message } });
  });
});
