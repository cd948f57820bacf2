/**
 * `npm run bench:rank`: 10,000 buildings with 3 years of bills (an electricity, a gas and a water
 * meter each) in a fresh database; the ranking route of the built server under 20 concurrent
 * requests over loopback. Ends with one JSON line {"buildings","p95Ms","p99Ms","rssMb",…}.
 * Target: p95 ≤ 50 ms.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { Agent, request } from 'node:http';
import { startBenchServer } from './lib/server';

const ROOT = resolve(import.meta.dirname, '..', '..');
const BUILDINGS = Number(process.env.BENCH_BUILDINGS ?? 10_000);
const CONCURRENCY = 20;
const REQUESTS = Number(process.env.BENCH_REQUESTS ?? 2000);
/** BENCH_KEEP_DIR=path keeps (or reuses) the filled data folder, to repeat the load without the setup. */
const kept = process.env.BENCH_KEEP_DIR;
const reuse = kept !== undefined && existsSync(join(kept, 'bench-ready.json'));
const dir = kept ?? mkdtempSync(join(tmpdir(), 'plumbline-bench-rank-'));
const env: NodeJS.ProcessEnv = { ...process.env, PLUMBLINE_DATA_DIR: dir, PLUMBLINE_DEMO: '0', PLUMBLINE_JOBS: '0', BETTER_AUTH_SECRET: 'bench-secret-0123456789abcdef0123456789', ASTRO_TELEMETRY_DISABLED: '1' };
delete env.DATABASE_URL;

if (spawnSync('npm', ['run', 'build'], { cwd: ROOT, stdio: 'ignore', env }).status !== 0) throw new Error('build failed');
const t0 = Date.now();
let made: { buildings: number; bills: number; fitSeconds: number; metricsSeconds: number };
if (reuse) {
  made = JSON.parse(readFileSync(join(dir, 'bench-ready.json'), 'utf8'));
} else {
  const setup = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/bench/lib/rank-setup.ts'], { cwd: ROOT, env: { ...env, BENCH_BUILDINGS: String(BUILDINGS) }, encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] });
  if (setup.status !== 0) throw new Error('setup failed');
  made = JSON.parse(setup.stdout.trim().split('\n').pop()!);
  if (kept) writeFileSync(join(dir, 'bench-ready.json'), JSON.stringify(made));
}
console.log(reuse ? 'database: reused from BENCH_KEEP_DIR' : `database: ${made.buildings} buildings, ${made.bills.toLocaleString('en-US')} bills in ${((Date.now() - t0) / 1000).toFixed(1)} s (fits ${made.fitSeconds} s, metrics ${made.metricsSeconds} s)`);

const { base, process: server } = await startBenchServer(ROOT, env);
const signIn = await fetch(`${base}/api/auth/sign-in/email`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email: 'manager@bench.plumbline.test', password: 'bench-password-2026' }) });
const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');

// The load comes from node:http over keep-alive connections, the lightest client at hand: the
// client shares this machine's cores with the server, and what is measured is the server.
const agent = new Agent({ keepAlive: true, maxSockets: CONCURRENCY });
function get(path: string): Promise<{ status: number; bytes: number }> {
  return new Promise((res, rej) => {
    const req = request(`${base}${path}`, { agent, headers: { cookie } }, (r) => {
      let bytes = 0;
      r.on('data', (c: Buffer) => (bytes += c.length));
      r.on('end', () => res({ status: r.statusCode ?? 0, bytes }));
      r.on('error', rej);
    });
    req.on('error', rej);
    req.end();
  });
}

async function load(path: string, requests: number) {
  const times: number[] = [];
  let errors = 0;
  let next = 0;
  let bytes = 0;
  const worker = async () => {
    while (next < requests) {
      next++;
      const t = performance.now();
      const r = await get(path);
      times.push(performance.now() - t);
      bytes = r.bytes;
      if (r.status !== 200) errors++;
    }
  };
  await Promise.all(Array.from({ length: CONCURRENCY }, worker));
  times.sort((a, b) => a - b);
  const q = (p: number) => Number(times[Math.min(times.length - 1, Math.floor(p * times.length))]!.toFixed(1));
  return { requests: times.length, errors, bytes, p50Ms: q(0.5), p95Ms: q(0.95), p99Ms: q(0.99) };
}

const first = performance.now();
const r0 = await fetch(`${base}/api/shortlist`, { headers: { cookie } });
const body = (await r0.json()) as { total: number; items: unknown[] };
console.log(`first request (ranks ${body.total} buildings, cold): ${(performance.now() - first).toFixed(0)} ms`);
// Warm-up, not measured: the server compiles its hot paths on the first few hundred requests.
await load('/api/shortlist', 300);
const page = await load('/api/shortlist', REQUESTS);
console.log(`GET /api/shortlist (top 100, 25 explained), ${CONCURRENCY} concurrent: ${JSON.stringify(page)}`);
const full = process.env.BENCH_SKIP_FULL ? { errors: 0, p95Ms: null } : await load('/api/shortlist?limit=20000&explain=25', Math.max(100, REQUESTS / 10));
console.log(`GET /api/shortlist?limit=20000 (the whole list the screen loads), ${CONCURRENCY} concurrent: ${JSON.stringify(full)}`);
const status = readFileSync(`/proc/${server.pid}/status`, 'utf8');
const rssMb = Math.round(Number(/VmRSS:\s+(\d+)/.exec(status)![1]) / 1024);
const peakMb = Math.round(Number(/VmHWM:\s+(\d+)/.exec(status)![1]) / 1024);
server.kill('SIGTERM');
await new Promise((r) => server.once('exit', r));
if (!kept) rmSync(dir, { recursive: true, force: true });
const figures = { buildings: body.total, p95Ms: page.p95Ms, p99Ms: page.p99Ms, rssMb, peakRssMb: peakMb, p50Ms: page.p50Ms, errors: page.errors + full.errors, fullListP95Ms: full.p95Ms };
console.log(`target p95 <= 50 ms: ${page.p95Ms <= 50 ? 'met' : 'MISSED'}`);
console.log(JSON.stringify(figures));
