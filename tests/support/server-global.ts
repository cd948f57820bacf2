/**
 * Per project (api, e2e): one built server with the demo scenario loaded, on its own data folder
 * (or its own PostgreSQL database when DATABASE_URL is set). The demo is loaded once into a
 * template folder and copied, so each project starts in about two seconds.
 */
import { createHash, randomBytes } from 'node:crypto';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import type { TestProject } from 'vitest/node';
import { ensureBuilt, ROOT, startServer, type RunningServer } from './server-process';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    serverDataDir: string;
    /** A stopped data folder with the demo loaded (PGlite runs only), to copy for offline tools. */
    demoTemplateDir: string;
  }
}

/** Changes to the schema, the migrations or the scenario make a new template. */
function templateKey(): string {
  const h = createHash('sha256');
  const walk = (dir: string) => {
    for (const e of readdirSync(dir, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
      const p = join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else h.update(p).update(readFileSync(p));
    }
  };
  walk(join(ROOT, 'drizzle'));
  walk(join(ROOT, 'src', 'db'));
  h.update(readFileSync(join(ROOT, 'src', 'server', 'demo.ts')));
  return h.digest('hex').slice(0, 16);
}

async function demoTemplate(): Promise<string> {
  const dir = join(ROOT, 'node_modules', '.cache', 'plumbline-test', `demo-${templateKey()}`);
  if (existsSync(join(dir, 'ready'))) return dir;
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const server = await startServer({ dataDir: dir });
  await server.stop('SIGTERM');
  if (!existsSync(join(dir, 'pglite')) || statSync(join(dir, 'pglite')).isFile()) throw new Error('demo template was not written');
  writeFileSync(join(dir, 'ready'), new Date().toISOString());
  return dir;
}

export default async function setup(project: TestProject) {
  ensureBuilt();
  let server: RunningServer;
  let cleanup: () => Promise<void>;
  const url = process.env.DATABASE_URL;
  if (url) {
    const name = `plumbline_srv_${randomBytes(5).toString('hex')}`;
    const admin = new pg.Client({ connectionString: url });
    await admin.connect();
    await admin.query(`create database ${name}`);
    await admin.end();
    const u = new URL(url);
    u.pathname = `/${name}`;
    server = await startServer({ databaseUrl: u.toString() });
    cleanup = async () => {
      const a = new pg.Client({ connectionString: url });
      await a.connect();
      await a.query(`drop database if exists ${name} with (force)`);
      await a.end();
    };
    project.provide('serverDataDir', '');
    project.provide('demoTemplateDir', '');
  } else {
    const template = await demoTemplate();
    const dataDir = mkdtempSync(join(tmpdir(), `plumbline-${project.name}-`));
    cpSync(join(template, 'pglite'), join(dataDir, 'pglite'), { recursive: true });
    cpSync(join(template, 'auth-secret'), join(dataDir, 'auth-secret'));
    server = await startServer({ dataDir });
    cleanup = async () => rmSync(dataDir, { recursive: true, force: true });
    project.provide('serverDataDir', dataDir);
    project.provide('demoTemplateDir', template);
  }
  project.provide('baseUrl', server.baseUrl);
  return async () => {
    await server.stop('SIGTERM');
    await cleanup();
  };
}
