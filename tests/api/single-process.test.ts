/** PGlite may be opened by one process only: a second server on the same data folder exits at once. */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, inject, it } from 'vitest';
import { freePort, ROOT, serverEnv } from '../support/server-process';

const dataDir = inject('serverDataDir');

describe.skipIf(!dataDir)('a second process on the same data folder', () => {
  it('the server entry exits with a clear message before touching the database', async () => {
    const started = Date.now();
    const r = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'src', 'server', 'main.ts')], {
      cwd: ROOT,
      env: serverEnv({ PLUMBLINE_DATA_DIR: dataDir, PORT: String(await freePort()), HOST: 'localhost' }),
      encoding: 'utf8',
      timeout: 60_000,
    });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/Another Plumbline process \(pid \d+, started .+\) is using the data folder/);
    expect(Date.now() - started).toBeLessThan(30_000);
  });

  it('`npm start` refuses before building or serving', () => {
    const r = spawnSync(process.execPath, [join(ROOT, 'scripts', 'start.mjs')], {
      cwd: ROOT,
      env: serverEnv({ PLUMBLINE_DATA_DIR: dataDir, PLUMBLINE_SKIP_BUILD: '1' }),
      encoding: 'utf8',
      timeout: 60_000,
    });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/Another Plumbline process/);
  });
});
