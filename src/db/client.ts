/**
 * The database: PGlite embedded in the process by default, or a PostgreSQL server through `pg`
 * when DATABASE_URL is set. Same schema, same migrations, same queries.
 *
 * One database per process, kept on globalThis: the dev server's module reloads, the tsx-run
 * start script and the built bundle all share it instead of opening the folder twice.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { btree_gist } from '@electric-sql/pglite/contrib/btree_gist';
import { drizzle as drizzlePglite } from 'drizzle-orm/pglite';
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator';
import { drizzle as drizzlePg } from 'drizzle-orm/node-postgres';
import { migrate as migratePg } from 'drizzle-orm/node-postgres/migrator';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import type { SQL } from 'drizzle-orm';
import pg from 'pg';
import * as schema from './schema';
import { acquireDataDirLock } from './lock';
import { dataDir, MEMORY, migrationsDir } from './paths';

export type Schema = typeof schema;
export type Db = PgDatabase<PgQueryResultHKT, Schema>;
/** A transaction handle accepts the same queries as the database. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export interface DatabaseHandle {
  kind: 'pglite' | 'postgres';
  /** The raw client: a PGlite instance or a pg Pool. */
  raw: PGlite | pg.Pool;
  /** Where the data lives, for messages (folder, `memory://` or the server URL without password). */
  location: string;
  close(): Promise<void>;
}

const HANDLE = Symbol.for('plumbline.database');
type Holder = typeof globalThis & { [HANDLE]?: Promise<DatabaseHandle> };
const holder = globalThis as Holder;

/** Advisory-lock key under which migrations run on a shared server (two instances may start together). */
const MIGRATION_LOCK_KEY = 72_657_801;

async function openPostgres(url: string): Promise<DatabaseHandle> {
  const pool = new pg.Pool({ connectionString: url, max: Number(process.env.PG_POOL_MAX ?? 10) });
  const client = await pool.connect();
  try {
    await client.query('select pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
    await client.query('create extension if not exists btree_gist');
    await migratePg(drizzlePg(client, { schema }), { migrationsFolder: migrationsDir() });
  } finally {
    await client.query('select pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]).catch(() => undefined);
    client.release();
  }
  return {
    kind: 'postgres',
    raw: pool,
    location: url.replace(/:\/\/([^:@/]+):[^@/]*@/, '://$1:***@'),
    close: () => pool.end(),
  };
}

/**
 * PostgreSQL settings for the embedded database. PGlite's WASM heap never shrinks, and its
 * buffer cache is part of it: PLUMBLINE_PGLITE_SHARED_BUFFERS (default 64MB, half of PGlite's
 * default) trades some cache for a smaller process.
 */
function pgliteConf(): string[] {
  const sb = process.env.PLUMBLINE_PGLITE_SHARED_BUFFERS ?? '64MB';
  return /^\d+(kB|MB|GB)$/.test(sb) ? [`shared_buffers=${sb}`] : [];
}

async function openPglite(dir: string): Promise<DatabaseHandle> {
  const extensions = { btree_gist };
  const postgresqlconf = pgliteConf();
  let client: PGlite;
  let release: (() => void) | undefined;
  if (dir === MEMORY) {
    const template = process.env.PLUMBLINE_PGLITE_TEMPLATE;
    client = template
      ? await PGlite.create({ loadDataDir: new Blob([readFileSync(template)]), extensions, postgresqlconf })
      : await PGlite.create({ extensions, postgresqlconf });
  } else {
    release = acquireDataDirLock(dir);
    const pgdata = join(dir, 'pglite');
    mkdirSync(pgdata, { recursive: true });
    try {
      client = await PGlite.create({ dataDir: pgdata, extensions, postgresqlconf });
    } catch (e) {
      release();
      throw e;
    }
  }
  try {
    await client.exec('create extension if not exists btree_gist');
    await migratePglite(drizzlePglite(client, { schema }), { migrationsFolder: migrationsDir() });
  } catch (e) {
    await client.close().catch(() => undefined);
    release?.();
    throw e;
  }
  return {
    kind: 'pglite',
    raw: client,
    location: dir,
    close: async () => {
      if (!client.closed) {
        await client.exec('checkpoint').catch(() => undefined);
        await client.close();
      }
      release?.();
    },
  };
}

/** Opens (once per process) and migrates the database. */
export function getDatabase(): Promise<DatabaseHandle> {
  if (!holder[HANDLE]) {
    const url = process.env.DATABASE_URL;
    holder[HANDLE] = url ? openPostgres(url) : openPglite(dataDir());
    holder[HANDLE].catch(() => {
      delete holder[HANDLE];
    });
  }
  return holder[HANDLE];
}

const wrapped = new WeakMap<object, Db>();

/** The Drizzle database over the process's one connection (pool). */
export async function getDb(): Promise<Db> {
  const handle = await getDatabase();
  let db = wrapped.get(handle.raw);
  if (!db) {
    db =
      handle.kind === 'postgres'
        ? (drizzlePg(handle.raw as pg.Pool, { schema }) as unknown as Db)
        : (drizzlePglite(handle.raw as PGlite, { schema }) as unknown as Db);
    wrapped.set(handle.raw, db);
  }
  return db;
}

/** Closes the database if it was opened (checkpoint first on PGlite). */
export async function closeDatabase(): Promise<void> {
  const pending = holder[HANDLE];
  if (!pending) return;
  delete holder[HANDLE];
  const handle = await pending.catch(() => null);
  await handle?.close();
}

export { schema };

/** Rows of a raw SQL query (`sql\`…\``), typed by the caller; the same on PGlite and pg. */
export async function queryRows<T>(db: Db | Tx, query: SQL): Promise<T[]> {
  const r = await db.execute(query);
  return (r as unknown as { rows: T[] }).rows;
}
