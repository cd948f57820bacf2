/**
 * Backups and restores of a whole Plumbline: the database, the files kept beside it (photos) and,
 * for the embedded database, the generated auth secret, in one .tar.gz:
 *
 *   plumbline-backup/manifest.json    what is inside, with the row count of every table
 *   plumbline-backup/database.tar.gz  PGlite: its data folder (dumpDataDir), or
 *   plumbline-backup/database.pgdump  PostgreSQL: pg_dump's custom format
 *   plumbline-backup/files/…          data/files
 *   plumbline-backup/auth-secret      when the data folder has one
 *
 * PGlite: the dump is taken in the process that owns the database, after a checkpoint, once every
 * open transaction has ended and with new ones held back (PGlite's transaction lock); the dump is
 * then opened in memory and counted, so the manifest describes exactly what was saved and a backup
 * that does not open is never written. PostgreSQL: the counts and pg_dump share one exported
 * snapshot. A restore refuses to replace data unless told to, and keeps what it replaces.
 */
import { spawn } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, dirname, join } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { btree_gist } from '@electric-sql/pglite/contrib/btree_gist';
import pg from 'pg';
import * as tar from 'tar';
import { z } from 'zod';
import { getDatabase } from '../db/client';
import { acquireDataDirLock } from '../db/lock';
import { dataDir, MEMORY } from '../db/paths';

const ROOT_DIR = 'plumbline-backup';

export const manifestSchema = z.object({
  format: z.literal('plumbline-backup'),
  version: z.literal(1),
  kind: z.enum(['pglite', 'postgres']),
  createdAt: z.string(),
  /** The last migration applied to the saved database. */
  migration: z.string(),
  tables: z.record(z.string(), z.number().int().nonnegative()),
  files: z.number().int().nonnegative(),
  hasSecret: z.boolean(),
});
export type BackupManifest = z.infer<typeof manifestSchema>;

export class BackupError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'BackupError';
  }
}

interface Queryable {
  query<T>(sql: string, params?: unknown[]): Promise<{ rows: T[] }>;
}

/** Tables of the public schema, in name order. */
async function tableNames(q: Queryable): Promise<string[]> {
  const r = await q.query<{ name: string }>(`select tablename as name from pg_tables where schemaname = 'public' order by tablename`);
  return r.rows.map((x) => x.name);
}

/** Row count of every table of the public schema. */
export async function tableCounts(q: Queryable): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const t of await tableNames(q)) {
    const r = await q.query<{ n: string | number }>(`select count(*) as n from "${t}"`);
    out[t] = Number(r.rows[0]!.n);
  }
  return out;
}

/**
 * A fingerprint of every table's content (row count and an order-independent md5 of its rows as
 * text), for checking that a restore gave back exactly what was saved.
 */
export async function tableFingerprints(q: Queryable): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const t of await tableNames(q)) {
    const r = await q.query<{ n: string | number; h: string | null }>(`select count(*) as n, md5(coalesce(string_agg(md5(x::text), '' order by md5(x::text)), '')) as h from "${t}" x`);
    out[t] = `${Number(r.rows[0]!.n)}:${r.rows[0]!.h}`;
  }
  return out;
}

async function lastMigration(q: Queryable): Promise<string> {
  try {
    const r = await q.query<{ hash: string; created_at: string | number }>(`select hash, created_at from drizzle.__drizzle_migrations order by created_at desc limit 1`);
    return r.rows[0] ? `${r.rows[0].created_at}:${r.rows[0].hash.slice(0, 12)}` : 'none';
  } catch {
    return 'none';
  }
}

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { env, stdio: ['ignore', 'ignore', 'pipe'] });
    let err = '';
    child.stderr.on('data', (d: Buffer) => (err += d.toString()));
    child.once('error', (e) => reject(new BackupError(`${cmd} could not start (${(e as Error).message}): is the PostgreSQL client installed?`)));
    child.once('exit', (code) => (code === 0 ? resolve() : reject(new BackupError(`${cmd} failed (exit ${code}): ${err.trim().slice(0, 2000)}`))));
  });
}

function countFiles(dir: string): number {
  if (!existsSync(dir)) return 0;
  let n = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) n += e.isDirectory() ? countFiles(join(dir, e.name)) : 1;
  return n;
}

function filesFolder(): string | null {
  const d = dataDir();
  return d === MEMORY ? (process.env.PLUMBLINE_FILES_DIR ?? null) : join(d, 'files');
}

async function dumpPglite(db: PGlite, into: string): Promise<{ tables: Record<string, number>; migration: string }> {
  // A checkpoint first keeps recovery short on restore; then, with PGlite's transaction lock held
  // (every open transaction finished, new ones wait), the data folder is dumped as one piece.
  await db.exec('checkpoint');
  const blob = await db._runExclusiveTransaction(() => db.dumpDataDir('gzip'));
  const bytes = new Uint8Array(await blob.arrayBuffer());
  writeFileSync(join(into, 'database.tar.gz'), bytes);
  // Open what was saved and count it: the manifest describes the dump itself.
  const check = await PGlite.create({ loadDataDir: new Blob([bytes]), extensions: { btree_gist } });
  try {
    return { tables: await tableCounts(check), migration: await lastMigration(check) };
  } finally {
    await check.close();
  }
}

async function dumpPostgres(pool: pg.Pool, url: string, into: string): Promise<{ tables: Record<string, number>; migration: string }> {
  const client = await pool.connect();
  try {
    await client.query('begin isolation level repeatable read, read only');
    const snap = await client.query<{ id: string }>('select pg_export_snapshot() as id');
    const tables = await tableCounts(client);
    const migration = await lastMigration(client);
    await run('pg_dump', ['--format=custom', '--no-owner', '--no-privileges', `--snapshot=${snap.rows[0]!.id}`, `--file=${join(into, 'database.pgdump')}`, `--dbname=${url}`]);
    await client.query('commit');
    return { tables, migration };
  } catch (e) {
    await client.query('rollback').catch(() => undefined);
    throw e;
  } finally {
    client.release();
  }
}

/**
 * Writes a backup of the open database (this process must own it) and its files to `outFile`.
 * @throws BackupError when pg_dump fails or is missing.
 */
export async function createBackup(outFile: string): Promise<BackupManifest> {
  const handle = await getDatabase();
  const work = mkdtempSync(join(tmpdir(), 'plumbline-backup-'));
  try {
    const root = join(work, ROOT_DIR);
    mkdirSync(root);
    const saved =
      handle.kind === 'pglite' ? await dumpPglite(handle.raw as PGlite, root) : await dumpPostgres(handle.raw as pg.Pool, process.env.DATABASE_URL!, root);
    const files = filesFolder();
    if (files && existsSync(files)) cpSync(files, join(root, 'files'), { recursive: true });
    const secretFile = dataDir() === MEMORY ? null : join(dataDir(), 'auth-secret');
    const hasSecret = handle.kind === 'pglite' && secretFile !== null && existsSync(secretFile);
    if (hasSecret) cpSync(secretFile!, join(root, 'auth-secret'));
    const manifest: BackupManifest = {
      format: 'plumbline-backup',
      version: 1,
      kind: handle.kind,
      createdAt: new Date().toISOString(),
      migration: saved.migration,
      tables: saved.tables,
      files: countFiles(join(root, 'files')),
      hasSecret,
    };
    writeFileSync(join(root, 'manifest.json'), JSON.stringify(manifest, null, 2));
    mkdirSync(dirname(outFile), { recursive: true });
    const partial = `${outFile}.partial`;
    await tar.c({ gzip: true, file: partial, cwd: work, portable: true }, [ROOT_DIR]);
    renameSync(partial, outFile);
    return manifest;
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

/** Reads and checks a backup's manifest without restoring it. */
export async function readBackup(file: string): Promise<{ manifest: BackupManifest; dir: string; cleanup: () => void }> {
  if (!existsSync(file) || !statSync(file).isFile()) throw new BackupError(`No backup file at ${file}.`);
  const work = mkdtempSync(join(tmpdir(), 'plumbline-restore-'));
  const cleanup = () => rmSync(work, { recursive: true, force: true });
  try {
    await tar.x({ file, cwd: work, strict: true });
  } catch (e) {
    cleanup();
    throw new BackupError(`${basename(file)} is not a Plumbline backup (${(e as Error).message}).`);
  }
  const root = join(work, ROOT_DIR);
  const manifestFile = join(root, 'manifest.json');
  const parsed = existsSync(manifestFile) ? manifestSchema.safeParse(JSON.parse(readFileSync(manifestFile, 'utf8'))) : null;
  if (!parsed?.success) {
    cleanup();
    throw new BackupError(`${basename(file)} is not a Plumbline backup (no valid manifest.json).`);
  }
  return { manifest: parsed.data, dir: root, cleanup };
}

function moveAside(path: string, stamp: string): string | null {
  if (!existsSync(path)) return null;
  const aside = `${path}.replaced-${stamp}`;
  renameSync(path, aside);
  return aside;
}

function compareCounts(expected: Record<string, number>, actual: Record<string, number>): void {
  const wrong = Object.entries(expected).filter(([t, n]) => actual[t] !== n);
  if (wrong.length > 0) throw new BackupError(`The restored database differs from the backup: ${wrong.map(([t, n]) => `${t} ${actual[t] ?? 'missing'} rows, expected ${n}`).join('; ')}.`);
}

export interface RestoreResult {
  manifest: BackupManifest;
  /** Where the replaced data was moved (PGlite), to delete once the restore is checked. */
  keptAside: string[];
}

/**
 * Restores `file` into the data folder `targetDir` (PGlite) or the database at `databaseUrl`
 * (PostgreSQL). The database must not be open anywhere (the PGlite folder lock is taken).
 * Without `force` a target holding data is refused. Migrations newer than the backup apply on the
 * next start.
 */
export async function restoreBackup(file: string, opts: { targetDir?: string; databaseUrl?: string; force?: boolean }): Promise<RestoreResult> {
  const { manifest, dir, cleanup } = await readBackup(file);
  try {
    if (opts.databaseUrl) {
      if (manifest.kind !== 'postgres') throw new BackupError('This backup is of an embedded database: restore it into a data folder (unset DATABASE_URL).');
      const client = new pg.Client({ connectionString: opts.databaseUrl });
      await client.connect();
      try {
        const existing = await tableNames(client);
        if (existing.length > 0 && !opts.force) throw new BackupError(`The database already holds ${existing.length} tables: add --force to replace them.`);
      } finally {
        await client.end();
      }
      await run('pg_restore', ['--clean', '--if-exists', '--no-owner', '--no-privileges', '--single-transaction', `--dbname=${opts.databaseUrl}`, join(dir, 'database.pgdump')]);
      const check = new pg.Client({ connectionString: opts.databaseUrl });
      await check.connect();
      try {
        compareCounts(manifest.tables, await tableCounts(check));
      } finally {
        await check.end();
      }
      // The files live beside each instance (a shared volume when there are several).
      const keptAside: string[] = [];
      const files = opts.targetDir ? join(opts.targetDir, 'files') : filesFolder();
      if (files && existsSync(join(dir, 'files'))) {
        const aside = moveAside(files, new Date().toISOString().replace(/[:.]/g, '-'));
        if (aside) keptAside.push(aside);
        cpSync(join(dir, 'files'), files, { recursive: true });
      }
      return { manifest, keptAside };
    }
    if (manifest.kind !== 'pglite') throw new BackupError('This backup is of a PostgreSQL server: restore it with DATABASE_URL set.');
    const target = opts.targetDir ?? dataDir();
    if (target === MEMORY) throw new BackupError('Restore needs a data folder (PLUMBLINE_DATA_DIR), not memory://.');
    mkdirSync(target, { recursive: true });
    const release = acquireDataDirLock(target);
    try {
      const pgdata = join(target, 'pglite');
      const holdsData = existsSync(pgdata) && readdirSync(pgdata).length > 0;
      if (holdsData && !opts.force) throw new BackupError(`${target} already holds a database: add --force to replace it (the old one is kept beside it).`);
      const stamp = new Date().toISOString().replace(/[:.]/g, '-');
      const keptAside = [moveAside(pgdata, stamp), moveAside(join(target, 'files'), stamp)].filter((x): x is string => x !== null);
      mkdirSync(pgdata, { recursive: true });
      const restored = await PGlite.create({ dataDir: pgdata, loadDataDir: new Blob([readFileSync(join(dir, 'database.tar.gz'))]), extensions: { btree_gist } });
      try {
        compareCounts(manifest.tables, await tableCounts(restored));
        await restored.exec('checkpoint');
      } finally {
        await restored.close();
      }
      if (existsSync(join(dir, 'files'))) cpSync(join(dir, 'files'), join(target, 'files'), { recursive: true });
      if (manifest.hasSecret && existsSync(join(dir, 'auth-secret'))) {
        const secret = join(target, 'auth-secret');
        const aside = moveAside(secret, stamp);
        if (aside) keptAside.push(aside);
        cpSync(join(dir, 'auth-secret'), secret);
      }
      return { manifest, keptAside };
    } finally {
      release();
    }
  } finally {
    cleanup();
  }
}
