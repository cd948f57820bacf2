/** The data-folder lock: a second process is refused with a message naming the holder; stale locks are taken over. */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { hostname, tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { acquireDataDirLock, DataDirLockedError, LOCK_FILE, readLock } from '../../src/db/lock';

describe('data folder lock', () => {
  it('refuses a second holder and names the first', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-lock-'));
    const release = acquireDataDirLock(dir);
    const child = spawnSync(
      process.execPath,
      ['--import', 'tsx', '-e', `import('${join(process.cwd(), 'src/db/lock.ts')}').then(m => { try { m.acquireDataDirLock(${JSON.stringify(dir)}); console.log('acquired'); } catch (e) { console.log(e.name + ': ' + e.message); } })`],
      { encoding: 'utf8' },
    );
    expect(child.stdout).toMatch(new RegExp(`DataDirLockedError: Another Plumbline process \\(pid ${process.pid},`));
    release();
    expect(readLock(dir)).toBeNull();
  });

  it('takes over a lock left by a process that no longer runs', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-lock-'));
    const dead = spawnSync(process.execPath, ['-e', 'console.log(process.pid)'], { encoding: 'utf8' });
    writeFileSync(join(dir, LOCK_FILE), JSON.stringify({ pid: Number(dead.stdout.trim()), host: hostname(), startedAt: '2026-01-01T00:00:00Z' }));
    const release = acquireDataDirLock(dir);
    expect(readLock(dir)?.pid).toBe(process.pid);
    release();
  });

  it('the error is typed', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-lock-'));
    writeFileSync(join(dir, LOCK_FILE), JSON.stringify({ pid: process.ppid, host: hostname(), startedAt: 'earlier' }));
    expect(() => acquireDataDirLock(dir)).toThrow(DataDirLockedError);
  });
});
