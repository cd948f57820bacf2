/**
 * Starting and stopping the built Plumbline server for API, browser and fault tests: the same
 * entry `npm start` runs (src/server/main.ts through tsx), on a free loopback port.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createServer } from 'node:net';
import { join, resolve } from 'node:path';

export const ROOT = resolve(import.meta.dirname, '..', '..');

export function freePort(): Promise<number> {
  return new Promise((res, rej) => {
    const s = createServer();
    s.once('error', rej);
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      const port = typeof a === 'object' && a ? a.port : 0;
      s.close(() => res(port));
    });
  });
}

/** Builds the app if dist/ is missing (normally `npm test` has just built it). */
export function ensureBuilt(): void {
  if (existsSync(join(ROOT, 'dist', 'server', 'entry.mjs'))) return;
  const r = spawnSync('npm', ['run', 'build'], { cwd: ROOT, stdio: 'inherit' });
  if (r.status !== 0) throw new Error('npm run build failed');
}

export interface RunningServer {
  baseUrl: string;
  port: number;
  child: ChildProcess;
  output(): string;
  stop(signal?: NodeJS.Signals): Promise<number | null>;
}

/** A clean environment for a child server: nothing of the test runner's own settings leaks in. */
export function serverEnv(extra: Record<string, string | undefined>): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env };
  for (const k of ['PLUMBLINE_DATA_DIR', 'PLUMBLINE_PGLITE_TEMPLATE', 'BETTER_AUTH_URL', 'PLUMBLINE_URL', 'SMTP_URL', 'PORT', 'HOST', 'PLUMBLINE_DEMO', 'PLUMBLINE_JOBS', 'VITEST', 'VITEST_POOL_ID', 'VITEST_WORKER_ID', 'NODE_ENV']) delete env[k];
  env.ASTRO_TELEMETRY_DISABLED = '1';
  env.PLUMBLINE_DEMO_TODAY = '2026-11-30';
  for (const [k, v] of Object.entries(extra)) {
    if (v === undefined) delete env[k];
    else env[k] = v;
  }
  return env;
}

export async function startServer(opts: { dataDir?: string; databaseUrl?: string; port?: number; env?: Record<string, string | undefined>; timeoutMs?: number }): Promise<RunningServer> {
  const port = opts.port ?? (await freePort());
  const env = serverEnv({
    HOST: 'localhost',
    PORT: String(port),
    PLUMBLINE_DATA_DIR: opts.dataDir,
    DATABASE_URL: opts.databaseUrl,
    PLUMBLINE_JOBS: '0',
    // Many test files sign in from the same loopback address within a minute.
    PLUMBLINE_SIGNIN_RATE: '2000',
    ...opts.env,
  });
  let out = '';
  const child = spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'src', 'server', 'main.ts')], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
  child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (out += d.toString()));
  const baseUrl = `http://localhost:${port}`;
  const deadline = Date.now() + (opts.timeoutMs ?? 150_000);
  let exited: number | null | undefined;
  child.once('exit', (code) => (exited = code));
  while (Date.now() < deadline) {
    if (exited !== undefined) throw new Error(`server exited (${exited}) before it was ready:\n${out}`);
    try {
      const r = await fetch(`${baseUrl}/api/health`);
      if (r.ok) break;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  if (Date.now() >= deadline) {
    child.kill('SIGKILL');
    throw new Error(`server did not become ready in time:\n${out}`);
  }
  return {
    baseUrl,
    port,
    child,
    output: () => out,
    stop: (signal: NodeJS.Signals = 'SIGTERM') =>
      new Promise((res) => {
        if (child.exitCode !== null || child.signalCode !== null) return res(child.exitCode);
        child.once('exit', (code) => res(code));
        child.kill(signal);
      }),
  };
}
