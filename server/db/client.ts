import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { drizzle as drizzlePglite } from 'drizzle-orm/pglite';
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator';
import { drizzle as drizzleNodePg } from 'drizzle-orm/node-postgres';
import { migrate as migrateNodePg } from 'drizzle-orm/node-postgres/migrator';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { sql } from 'drizzle-orm';
import pg from 'pg';
import * as schema from './schema';

export type Schema = typeof schema;
/** The one database type the rest of the server sees, whichever driver is underneath. */
export type Database = PgDatabase<PgQueryResultHKT, Schema>;
/** A transaction handle; services pass it down so a use case commits or rolls back as one. */
export type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];
export type DatabaseOrTransaction = Database | Transaction;

export interface DatabaseHandle {
  db: Database;
  driver: 'pglite' | 'postgres';
  /** Runs a trivial query; throws when the database does not answer. */
  ping(): Promise<void>;
  close(): Promise<void>;
  /** PGlite only: a tarball of the data directory, for cloning a migrated database in tests. */
  dump?: () => Promise<Blob>;
}

export interface DatabaseOptions {
  /** PostgreSQL server connection string; when set, node-postgres is used. */
  databaseUrl?: string | undefined;
  /** PGlite data directory; `undefined` means in memory. */
  dataDir?: string | undefined;
  /** PGlite only: start from a dumped data directory (tests). */
  loadDataDir?: Blob | undefined;
}

const migrationsFolder = path.resolve(import.meta.dirname, '../../drizzle');

/**
 * Opens the database and applies the drizzle-kit migrations. This is the only module that
 * knows which driver runs: PGlite embedded by default, node-postgres when DATABASE_URL is set.
 */
export async function openDatabase(options: DatabaseOptions): Promise<DatabaseHandle> {
  if (options.databaseUrl) {
    const pool = new pg.Pool({ connectionString: options.databaseUrl, max: 10 });
    const db = drizzleNodePg({ client: pool, schema, casing: 'snake_case' });
    await migrateNodePg(db, { migrationsFolder });
    return {
      // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- each driver's database is a PgDatabase with its own result kind; the services use only what all kinds share.
      db: db as unknown as Database,
      driver: 'postgres',
      ping: async () => {
        await db.execute(sql`select 1`);
      },
      close: () => pool.end(),
    };
  }
  if (options.dataDir) {
    // PGlite does not create missing parent folders.
    mkdirSync(path.dirname(path.resolve(options.dataDir)), { recursive: true });
  }
  const client = options.loadDataDir
    ? await PGlite.create({ loadDataDir: options.loadDataDir })
    : await PGlite.create(options.dataDir ? { dataDir: options.dataDir } : {});
  const db = drizzlePglite({ client, schema, casing: 'snake_case' });
  await migratePglite(db, { migrationsFolder });
  let closed = false;
  return {
    // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- each driver's database is a PgDatabase with its own result kind; the services use only what all kinds share.
    db: db as unknown as Database,
    driver: 'pglite',
    ping: async () => {
      await client.query('select 1');
    },
    close: async () => {
      if (closed) return;
      closed = true;
      await client.close();
    },
    dump: () => client.dumpDataDir('none') as Promise<Blob>,
  };
}

/**
 * True when `error` (or the driver error drizzle wraps in `cause`) is PostgreSQL's
 * unique_violation (SQLSTATE 23505), optionally on the named constraint or index.
 */
export function isUniqueViolation(error: unknown, constraint?: string): boolean {
  for (let e: unknown = error, depth = 0; e && typeof e === 'object' && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    const { code, constraint: name } = e as { code?: unknown; constraint?: unknown };
    if (code === '23505') return constraint === undefined || name === constraint;
  }
  return false;
}
