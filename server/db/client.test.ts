import { existsSync, readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { isUniqueViolation, openDatabase, type DatabaseHandle } from './client';
import { issuanceCounters, offices } from './schema';

let handle: DatabaseHandle;
beforeAll(async () => {
  // Start from the migrated database the test run's global setup dumped, when there is one.
  const template = inject('testTemplatePath');
  handle = await openDatabase(template && existsSync(template) ? { loadDataDir: new Blob([readFileSync(template)]) } : {});
});
afterAll(async () => {
  await handle?.close();
});

async function failureOf(run: () => Promise<unknown>): Promise<unknown> {
  try {
    await run();
  } catch (error) {
    return error;
  }
  throw new Error('expected the query to fail');
}

describe('isUniqueViolation', () => {
  it('when a row repeats a primary key, recognises the wrapped driver error and its constraint name', async () => {
    const [office] = await handle.db.insert(offices).values({ slug: 'unique-violation-test', name: 'Test office', region: { west: -95, south: 36, east: -90, north: 40 }, timeZone: 'UTC', riskLadder: [] }).returning({ id: offices.id });
    const row = { officeId: office!.id, year: 2027, lastSequence: 1 }; // insert returned the row
    await handle.db.insert(issuanceCounters).values(row);
    const error = await failureOf(() => handle.db.insert(issuanceCounters).values(row));
    expect(isUniqueViolation(error)).toBe(true);
    expect(isUniqueViolation(error, 'issuance_counters_office_id_year_pk')).toBe(true);
    expect(isUniqueViolation(error, 'outlooks_open_amendment_idx')).toBe(false);
  });

  it('when a query fails for another reason, says no', async () => {
    const error = await failureOf(() => handle.db.execute(sql`select * from no_such_table`));
    expect(isUniqueViolation(error)).toBe(false);
    expect(isUniqueViolation(new Error('plain'))).toBe(false);
  });
});
