/**
 * An exclusive lock on a PGlite data folder. PGlite has no lock of its own and two processes on
 * one folder corrupt it silently, so the app takes an O_EXCL pid file before opening it and a
 * second process refuses to start.
 */
import { closeSync, mkdirSync, openSync, readFileSync, unlinkSync, writeSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';

export const LOCK_FILE = 'plumbline.lock';

export class DataDirLockedError extends Error {
  constructor(
    readonly dir: string,
    readonly holderPid: number,
    readonly since: string,
  ) {
    super(
      `Another Plumbline process (pid ${holderPid}, started ${since}) is using the data folder ${dir}. ` +
        'Only one process may open an embedded database. Stop that process first, or point ' +
        'PLUMBLINE_DATA_DIR at another folder. If no Plumbline process is running, delete ' +
        `${join(dir, LOCK_FILE)}.`,
    );
    this.name = 'DataDirLockedError';
  }
}

interface LockInfo {
  pid: number;
  host: string;
  startedAt: string;
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Reads the lock file; null when there is none or it is unreadable. */
export function readLock(dir: string): LockInfo | null {
  try {
    return JSON.parse(readFileSync(join(dir, LOCK_FILE), 'utf8')) as LockInfo;
  } catch {
    return null;
  }
}

/** The live holder of the lock on `dir`, if any (a lock left by a dead process does not count). */
export function lockHolder(dir: string): LockInfo | null {
  const info = readLock(dir);
  if (!info) return null;
  if (info.host === hostname() && !isAlive(info.pid)) return null;
  return info;
}

/**
 * Takes the lock for this process and returns its release function.
 * @throws DataDirLockedError when a live process holds it.
 */
export function acquireDataDirLock(dir: string): () => void {
  mkdirSync(dir, { recursive: true });
  const path = join(dir, LOCK_FILE);
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      const fd = openSync(path, 'wx', 0o600);
      const info: LockInfo = { pid: process.pid, host: hostname(), startedAt: new Date().toISOString() };
      writeSync(fd, JSON.stringify(info));
      closeSync(fd);
      let released = false;
      const release = () => {
        if (released) return;
        released = true;
        try {
          if (readLock(dir)?.pid === process.pid) unlinkSync(path);
        } catch {
          /* already gone */
        }
      };
      process.once('exit', release);
      return release;
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'EEXIST') throw e;
      const holder = lockHolder(dir);
      if (holder && holder.pid !== process.pid) throw new DataDirLockedError(dir, holder.pid, holder.startedAt);
      // A stale lock from a process that died: take it over.
      try {
        unlinkSync(path);
      } catch {
        /* raced with another starter */
      }
    }
  }
  const holder = readLock(dir);
  throw new DataDirLockedError(dir, holder?.pid ?? -1, holder?.startedAt ?? 'unknown');
}
