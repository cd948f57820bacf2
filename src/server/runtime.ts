/**
 * Process start-up, once per process whichever way the app is started (the start script, the dev
 * server, tests): the auth secret, the database (opened and migrated), the demo scenario when
 * the database is empty, and the scheduled jobs.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { getDatabase } from '../db/client';
import { dataDir, MEMORY } from '../db/paths';
import { demoEnabled, jobsEnabled } from './config';

const KEY = Symbol.for('plumbline.runtime');
type Holder = typeof globalThis & { [KEY]?: Promise<void> };
const holder = globalThis as Holder;

/** BETTER_AUTH_SECRET, else a secret generated once and kept (mode 0600) in the data folder. */
export function ensureSecret(): void {
  if (process.env.BETTER_AUTH_SECRET) return;
  const dir = dataDir();
  if (dir === MEMORY) {
    process.env.BETTER_AUTH_SECRET = randomBytes(32).toString('hex');
    return;
  }
  mkdirSync(dir, { recursive: true });
  const file = join(dir, 'auth-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  process.env.BETTER_AUTH_SECRET = readFileSync(file, 'utf8').trim();
}

async function boot(): Promise<void> {
  ensureSecret();
  await getDatabase();
  if (demoEnabled()) {
    const { seedDemoIfEmpty } = await import('./demo');
    await seedDemoIfEmpty();
  }
  if (jobsEnabled()) {
    const { startJobs } = await import('./jobs');
    startJobs();
  }
}

/** Runs start-up once; later calls wait for the same promise. */
export function ensureRuntime(): Promise<void> {
  if (!holder[KEY]) {
    holder[KEY] = boot();
    holder[KEY].catch(() => {
      delete holder[KEY];
    });
  }
  return holder[KEY];
}
