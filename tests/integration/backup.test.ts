/**
 * Backups: an exact round trip (every table's rows, by content fingerprint, and the files beside
 * the database), refusals that leave data untouched, and what a restore keeps aside. Runs on the
 * embedded database and, with DATABASE_URL, on PostgreSQL (pg_dump / pg_restore).
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { btree_gist } from '@electric-sql/pglite/contrib/btree_gist';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getDatabase, getDb } from '../../src/db/client';
import { loadScenarioData } from '../../src/db/seed/load';
import { generateDemoScenario } from '../../src/db/seed/scenario';
import { BackupError, createBackup, restoreBackup, tableCounts, tableFingerprints } from '../../src/server/backup';

const work = mkdtempSync(join(tmpdir(), 'plumbline-backup-test-'));
const filesDir = join(work, 'files-live');
const onServer = !!process.env.DATABASE_URL;
let live: Record<string, string>;
const photo = randomBytes(50_000);

async function liveQueryable() {
  const h = await getDatabase();
  return h.kind === 'pglite' ? (h.raw as PGlite) : (h.raw as pg.Pool);
}

beforeAll(async () => {
  process.env.PLUMBLINE_FILES_DIR = filesDir;
  mkdirSync(join(filesDir, 'photos', 'w1'), { recursive: true });
  writeFileSync(join(filesDir, 'photos', 'w1', 'p1.jpg'), photo);
  const db = await getDb();
  await db.transaction((tx) => loadScenarioData(tx, generateDemoScenario({ today: '2026-11-30' })));
  live = await tableFingerprints(await liveQueryable());
}, 180_000);

afterAll(() => {
  delete process.env.PLUMBLINE_FILES_DIR;
  rmSync(work, { recursive: true, force: true });
});

describe('a backup', () => {
  const file = join(work, 'one.tar.gz');

  it('counts what it saved: the manifest matches the live tables', async () => {
    const manifest = await createBackup(file);
    expect(manifest.kind).toBe(onServer ? 'postgres' : 'pglite');
    expect(manifest.tables).toEqual(await tableCounts(await liveQueryable()));
    expect(manifest.tables.bill).toBeGreaterThan(10_000);
    expect(manifest.files).toBe(1);
  }, 120_000);

  it('restores exactly: every table has the same rows, and the files the same bytes', async () => {
    if (onServer) {
      const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
      await admin.connect();
      const name = `plumbline_restore_${randomBytes(5).toString('hex')}`;
      await admin.query(`create database ${name}`);
      await admin.end();
      const u = new URL(process.env.DATABASE_URL!);
      u.pathname = `/${name}`;
      const target = join(work, 'restored-files');
      try {
        await restoreBackup(file, { databaseUrl: u.toString(), targetDir: target });
        expect(readFileSync(join(target, 'files', 'photos', 'w1', 'p1.jpg')).equals(photo)).toBe(true);
        const c = new pg.Client({ connectionString: u.toString() });
        await c.connect();
        expect(await tableFingerprints(c)).toEqual(live);
        await c.end();
      } finally {
        const a = new pg.Client({ connectionString: process.env.DATABASE_URL });
        await a.connect();
        await a.query(`drop database if exists ${name} with (force)`);
        await a.end();
      }
      return;
    }
    const target = join(work, 'restored');
    const r = await restoreBackup(file, { targetDir: target });
    expect(r.keptAside).toEqual([]);
    const db = await PGlite.create({ dataDir: join(target, 'pglite'), extensions: { btree_gist } });
    try {
      expect(await tableFingerprints(db)).toEqual(live);
    } finally {
      await db.close();
    }
    expect(readFileSync(join(target, 'files', 'photos', 'w1', 'p1.jpg')).equals(photo)).toBe(true);
  }, 180_000);

  it.skipIf(onServer)('refuses to replace a database without --force, and keeps the replaced one aside with it', async () => {
    const target = join(work, 'restored');
    await expect(restoreBackup(file, { targetDir: target })).rejects.toThrow(/already holds a database: add --force/);
    const r = await restoreBackup(file, { targetDir: target, force: true });
    expect(r.keptAside.length).toBe(2);
    for (const k of r.keptAside) expect(existsSync(k)).toBe(true);
  }, 180_000);

  it('refuses a file that is not a backup, by name', async () => {
    const junk = join(work, 'junk.tar.gz');
    writeFileSync(junk, 'meter,start,end\n');
    await expect(restoreBackup(junk, { targetDir: join(work, 'never') })).rejects.toBeInstanceOf(BackupError);
    await expect(restoreBackup(junk, { targetDir: join(work, 'never') })).rejects.toThrow(/junk\.tar\.gz is not a Plumbline backup/);
    expect(existsSync(join(work, 'never', 'pglite'))).toBe(false);
  });
});
