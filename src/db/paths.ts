/** Where the project's folders are, resolved the same way from source, tests and the build. */
import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';

/** The project root: PLUMBLINE_ROOT, or the nearest folder upward holding drizzle/meta/_journal.json. */
export function projectRoot(): string {
  if (process.env.PLUMBLINE_ROOT) return resolve(process.env.PLUMBLINE_ROOT);
  let dir = process.cwd();
  for (;;) {
    if (existsSync(join(dir, 'drizzle', 'meta', '_journal.json'))) return dir;
    const up = dirname(dir);
    if (up === dir) return process.cwd();
    dir = up;
  }
}

export const MEMORY = 'memory://';

/** PLUMBLINE_DATA_DIR (default `data/` under the project root), or `memory://` for tests. */
export function dataDir(): string {
  const v = process.env.PLUMBLINE_DATA_DIR;
  if (v === MEMORY) return MEMORY;
  return resolve(projectRoot(), v && v.length > 0 ? v : 'data');
}

export function migrationsDir(): string {
  return process.env.PLUMBLINE_MIGRATIONS_DIR ?? join(projectRoot(), 'drizzle');
}

/** Folder for files kept beside the database (photos, secrets). Null for an in-memory database. */
export function filesDir(): string | null {
  const d = dataDir();
  return d === MEMORY ? (process.env.PLUMBLINE_FILES_DIR ?? null) : join(d, 'files');
}
