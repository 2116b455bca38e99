import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { createPostgresDatabase, startTestApp, testPostgresUrl } from './test-app';

declare module 'vitest' {
  export interface ProvidedContext {
    /** A migrated, seeded PGlite data directory dump that test files start from. */
    testTemplatePath: string;
    /** With TEST_POSTGRES_URL: a migrated, seeded database on that server that test files copy. */
    testTemplateDatabase: string;
  }
}

/**
 * Once per test run: migrate and seed one in-memory database and dump it, so each test file
 * starts from a copy (about 1.5 s) instead of migrating and seeding its own (several seconds).
 * The dump lives in a folder of this run, so parallel runs never read each other's.
 */
export default async function setup(project: TestProject): Promise<() => void> {
  const dir = mkdtempSync(path.join(tmpdir(), 'stormdraft-test-'));
  const file = path.join(dir, 'template.tar');
  if (testPostgresUrl()) {
    // PostgreSQL pass: the template is a database on the test server, copied per test app.
    const databaseUrl = await createPostgresDatabase();
    const template = await startTestApp({ databaseUrl }, 'none', { useTemplate: false });
    await template.close();
    project.provide('testTemplateDatabase', new URL(databaseUrl).pathname.slice(1));
    project.provide('testTemplatePath', '');
    return () => rmSync(dir, { recursive: true, force: true });
  }
  project.provide('testTemplateDatabase', '');
  const sd = await startTestApp({}, 'none', { useTemplate: false });
  try {
    if (!sd.dump) throw new Error('the test database is not PGlite');
    const blob = await sd.dump();
    writeFileSync(file, Buffer.from(await blob.arrayBuffer()));
  } finally {
    await sd.close();
  }
  project.provide('testTemplatePath', file);
  return () => rmSync(dir, { recursive: true, force: true });
}
