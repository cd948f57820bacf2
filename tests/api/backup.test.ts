/**
 * `plumbline backup` while the server runs on the embedded database: the server takes the backup
 * through the local control channel and keeps serving; the file restores into a folder whose
 * tables match the manifest and the live API. The control token is honoured only with the right
 * value; other roles cannot download a backup.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { btree_gist } from '@electric-sql/pglite/contrib/btree_gist';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { tableCounts } from '../../src/server/backup';
import { baseUrl, call } from '../support/http';
import { ROOT, serverEnv } from '../support/server-process';

const running = inject('serverDataDir');
const work = mkdtempSync(join(tmpdir(), 'plumbline-backup-api-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** Runs the command line without blocking this process (its HTTP connections stay alive meanwhile). */
function cli(env: Record<string, string | undefined>, ...args: string[]): Promise<{ status: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, ['--import', 'tsx', join(ROOT, 'src', 'cli', 'index.ts'), ...args], { cwd: ROOT, env: serverEnv(env), encoding: 'utf8', timeout: 240_000 }, (err, stdout, stderr) =>
      resolve({ status: err ? (typeof err.code === 'number' ? err.code : 1) : 0, stdout, stderr }),
    );
  });
}

describe('backups through the API', () => {
  it('only admins may take one; a wrong control token counts as no session', async () => {
    expect((await call('manager', 'POST', '/api/admin/backup', {})).status).toBe(403);
    expect((await call('analyst', 'POST', '/api/admin/backup', {})).status).toBe(403);
    const forged = await fetch(`${baseUrl()}/api/admin/backup`, { method: 'POST', headers: { 'x-plumbline-control': 'f'.repeat(64), origin: baseUrl() } });
    expect(forged.status).toBe(401);
  });
});

describe.skipIf(!running)('plumbline backup while the server runs', () => {
  it('the running server writes the backup; it restores into a folder that matches it and the live data', async () => {
    const file = join(work, 'live.tar.gz');
    const before = (await call('admin', 'GET', '/api/buildings')).body.items.length as number;
    const r = await cli({ PLUMBLINE_DATA_DIR: running }, 'backup', file, '--json');
    expect(r.status, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.via).toBe('server');
    expect(out.manifest.kind).toBe('pglite');
    // The server kept serving.
    expect((await call('admin', 'GET', '/api/health')).status).toBe(200);

    const target = join(work, 'restored');
    const restore = await cli({ PLUMBLINE_DATA_DIR: target }, 'restore', file, '--json');
    expect(restore.status, restore.stderr).toBe(0);
    const db = await PGlite.create({ dataDir: join(target, 'pglite'), extensions: { btree_gist } });
    try {
      const counts = await tableCounts(db);
      expect(counts).toEqual(out.manifest.tables);
      expect(counts.building).toBeGreaterThanOrEqual(before);
    } finally {
      await db.close();
    }
    const again = await cli({ PLUMBLINE_DATA_DIR: target }, 'restore', file);
    expect(again.status).toBe(2);
    expect(again.stderr).toMatch(/already holds a database: add --force/);
  }, 300_000);
});
