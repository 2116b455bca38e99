import path from 'node:path';
import { pino } from 'pino';
import { afterEach, describe, expect, it } from 'vitest';
import type { Database } from '../../db/client';
import { ingestBufrFile } from './ingest-bufr';

const fixture = path.resolve(import.meta.dirname, '../../../tests/fixtures/bufr/three-stations.bufr');
const savedPath = process.env.PATH;

afterEach(() => {
  process.env.PATH = savedPath;
});

describe('ingestBufrFile without ecCodes', () => {
  it('When bufr_dump is not on the PATH, then the file fails with a reason that names libeccodes-tools (no exception, nothing stored)', async () => {
    process.env.PATH = '/nonexistent-folder';
    // The database is never reached: decoding fails first (an empty object would throw if it were).
    const out = await ingestBufrFile({ db: {} as Database, logger: pino({ level: 'silent' }) }, { filePath: fixture });
    expect(out).toEqual({ ok: false, error: { reason: 'bufr_dump is not installed: GRIB2 and BUFR files need ecCodes (Debian package libeccodes-tools).' } });
  });
});
