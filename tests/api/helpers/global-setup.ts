import { writeFileSync } from 'node:fs';
import { startTestApp, testTemplatePath } from './test-app';

/**
 * Once per test run: migrate and seed one in-memory database and dump it, so each test file
 * starts from a copy (about 1.5 s) instead of migrating and seeding its own (several seconds).
 */
export default async function setup(): Promise<void> {
  const sd = await startTestApp({}, 'none', { useTemplate: false });
  try {
    if (!sd.dump) throw new Error('the test database is not PGlite');
    const blob = await sd.dump();
    writeFileSync(testTemplatePath, Buffer.from(await blob.arrayBuffer()));
  } finally {
    await sd.close();
  }
}
