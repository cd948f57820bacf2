/**
 * The production entry (`npm start` runs it through tsx): take the data folder, open and migrate
 * the database, load the demo into an empty one, start the local mail catcher and the jobs, then
 * serve the built app (dist/server/entry.mjs, @astrojs/node standalone) on HOST:PORT.
 * A second process on the same data folder exits at once with a clear message.
 */
import './production-env';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { closeDatabase, getDatabase } from '../db/client';
import { DataDirLockedError } from '../db/lock';
import { projectRoot } from '../db/paths';
import { appBaseUrl } from './config';
import { ensureLocalSmtp, stopLocalSmtp } from './mail/local-smtp';
import { ensureRuntime } from './runtime';
import { stopJobs } from './jobs';
import { removeControlFile, writeControlFile } from './control';

async function main(): Promise<void> {
  process.env.ASTRO_TELEMETRY_DISABLED ??= '1';
  process.env.HOST ??= 'localhost';
  process.env.PORT ??= '4321';
  process.env.BETTER_AUTH_URL ??= appBaseUrl();
  const entry = join(projectRoot(), 'dist', 'server', 'entry.mjs');
  if (!existsSync(entry)) {
    console.error('Plumbline is not built yet: run `npm start` (it builds first) or `npm run build`.');
    process.exit(1);
  }
  try {
    await ensureRuntime();
  } catch (e) {
    if (e instanceof DataDirLockedError) {
      console.error(`\n${e.message}\n`);
      process.exit(2);
    }
    console.error('Plumbline could not open its database:', e);
    process.exit(1);
  }
  const db = await getDatabase();
  if (!process.env.SMTP_URL) process.env.SMTP_URL = await ensureLocalSmtp();

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n[plumbline] ${signal}: stopping`);
    stopJobs();
    removeControlFile();
    await stopLocalSmtp().catch(() => undefined);
    await closeDatabase().catch((e) => console.error(e));
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));

  await import(pathToFileURL(entry).href);
  writeControlFile(appBaseUrl());
  console.log(`[plumbline] serving ${appBaseUrl()} · database ${db.kind} at ${db.location}`);
}

void main();
