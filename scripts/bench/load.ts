/**
 * `npm run bench:load`: 50 simulated people (the six demo roles) use the built server on the demo
 * region for 60 s over loopback — pages and API calls in the mix each role makes, with a short
 * pause between steps, each person on a session of their own. Reports errors (any answer that
 * is not 2xx, or a failed connection), requests per second, and p50/p95/p99 latency overall, for
 * pages and for API calls; ends with one JSON line of figures. Target: 0 errors.
 *
 * BENCH_USERS (50), BENCH_SECONDS (60), BENCH_KEEP_DIR (reuse a loaded demo folder) and
 * BENCH_CPU_PROFILE (a folder for the server's CPU profile) adjust it.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { Agent, request } from 'node:http';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { startBenchServer } from './lib/server';

const ROOT = resolve(import.meta.dirname, '..', '..');
const USERS = Number(process.env.BENCH_USERS ?? 50);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 60);
const PASSWORD = 'plumbline-demo-2026';
const kept = process.env.BENCH_KEEP_DIR;
const dir = kept ?? mkdtempSync(join(tmpdir(), 'plumbline-bench-load-'));
const env: NodeJS.ProcessEnv = { ...process.env, PLUMBLINE_DATA_DIR: dir, PLUMBLINE_JOBS: '0', BETTER_AUTH_SECRET: 'bench-secret-0123456789abcdef0123456789', ASTRO_TELEMETRY_DISABLED: '1' };
delete env.DATABASE_URL;

if (spawnSync('npm', ['run', 'build'], { cwd: ROOT, stdio: 'ignore', env }).status !== 0) throw new Error('build failed');

const t0 = Date.now();
const { base, process: server } = await startBenchServer(ROOT, env, ['ignore', 'ignore', 'inherit']);
console.log(`server ready with the demo region in ${((Date.now() - t0) / 1000).toFixed(1)} s`);

const agent = new Agent({ keepAlive: true, maxSockets: USERS * 2 });
interface Answer {
  status: number;
  body: string;
}
function send(method: string, path: string, cookie: string, body?: string): Promise<Answer> {
  return new Promise((res, rej) => {
    const headers: Record<string, string> = { cookie, origin: base };
    if (body !== undefined) headers['content-type'] = 'application/json';
    const req = request(`${base}${path}`, { method, agent, headers }, (r) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => res({ status: r.statusCode ?? 0, body: Buffer.concat(chunks).toString('utf8') }));
      r.on('error', rej);
    });
    req.on('error', rej);
    req.end(body);
  });
}

async function signIn(email: string): Promise<string> {
  const r = await fetch(`${base}/api/auth/sign-in/email`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email, password: PASSWORD }) });
  if (!r.ok) throw new Error(`sign-in ${email}: ${r.status}`);
  return r.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

// What the demo holds, read once by the administrator.
const admin = await signIn('admin@demo.plumbline.test');
const read = async <T>(path: string): Promise<T> => JSON.parse((await send('GET', path, admin)).body) as T;
const buildings = (await read<{ items: { id: string; installationCode: string }[] }>('/api/buildings')).items;
const meters = (await read<{ items: { id: string; installationCode: string }[] }>('/api/meters')).items;
const walkthroughs = (await read<{ items: { id: string; installationCode: string }[] }>('/api/walkthroughs')).items;
const kits = (await read<{ items: { id: string }[] }>('/api/kits')).items;
const inBnp = <T extends { installationCode: string }>(xs: T[]) => xs.filter((x) => x.installationCode === 'BNP');
const pick = <T>(xs: T[]): T => xs[Math.floor(Math.random() * xs.length)]!;

type Step = () => { kind: 'page' | 'api'; method: string; path: string; body?: string };
const page = (path: () => string): Step => () => ({ kind: 'page', method: 'GET', path: path() });
const api = (path: () => string, method = 'GET', body?: () => string): Step => () => ({ kind: 'api', method, path: path(), ...(body ? { body: body() } : {}) });

/** Each role's mix: the pages they open and the calls their screens make. */
const MIX: Record<string, Step[]> = {
  manager: [
    page(() => '/'),
    page(() => '/shortlist'),
    api(() => '/api/shortlist'),
    api(() => '/api/shortlist?installation=KSL&limit=200'),
    api(() => `/api/shortlist/${pick(buildings).id}`),
    page(() => `/buildings/${pick(buildings).id}`),
    api(() => '/api/intensity'),
    page(() => '/targets'),
    api(() => '/api/measures/rollup'),
  ],
  staff: [
    page(() => '/installations'),
    api(() => '/api/buildings?installation=BNP'),
    page(() => `/buildings/${pick(inBnp(buildings)).id}`),
    page(() => '/intake'),
    api(() => '/api/imports?installation=BNP'),
    api(() => `/api/bills?meter=${pick(inBnp(meters)).id}`),
    api(() => '/api/walkthroughs?installation=BNP'),
  ],
  analyst: [
    page(() => '/baselines'),
    api(() => '/api/baselines?installation=BNP'),
    page(() => `/baselines/${pick(meters).id}`),
    api(() => `/api/baselines/meter/${pick(meters).id}`),
    api(() => '/api/weather/degree-days?station=BNPWX&start=2025-01-01&end=2025-12-31&base=65'),
  ],
  auditor: [
    page(() => '/walkthroughs'),
    page(() => `/walkthroughs/${pick(inBnp(walkthroughs)).id}`),
    api(() => `/api/walkthroughs/${pick(inBnp(walkthroughs)).id}`),
    api(() => `/api/walkthroughs/${pick(inBnp(walkthroughs)).id}/suggestions`),
    api(() => '/api/kits'),
  ],
  custodian: [page(() => '/kits'), page(() => `/kits/${pick(kits).id}`), api(() => '/api/loans'), api(() => '/api/instruments')],
  admin: [page(() => '/admin/users'), api(() => '/api/activity'), api(() => '/api/users'), page(() => '/admin/outbox')],
};
// How many of the simulated people hold each role (the region's staff outnumber its managers).
const SHARE: [string, number][] = [
  ['staff', 0.3],
  ['manager', 0.2],
  ['analyst', 0.15],
  ['auditor', 0.15],
  ['custodian', 0.1],
  ['admin', 0.1],
];
const roles: string[] = [];
for (const [role, share] of SHARE) for (let i = 0; i < Math.round(share * USERS); i++) roles.push(role);
while (roles.length < USERS) roles.push('manager');
roles.length = USERS;

const cookies = await Promise.all(roles.map((r) => signIn(`${r}@demo.plumbline.test`)));
console.log(`${USERS} people signed in (${SHARE.map(([r]) => `${roles.filter((x) => x === r).length} ${r}`).join(', ')}); load for ${SECONDS} s`);

const times = { page: [] as number[], api: [] as number[] };
/** Latencies per route pattern (ids replaced), to name the slowest. */
const byRoute = new Map<string, number[]>();
const pattern = (method: string, path: string) => `${method} ${path.split('?')[0]!.replace(/[0-9a-f]{8}-[0-9a-f-]{27}/g, ':id')}`;
const failures: string[] = [];
let errors = 0;
let retried = 0;
const end = Date.now() + SECONDS * 1000;
async function person(i: number) {
  const mix = MIX[roles[i]!]!;
  while (Date.now() < end) {
    const step = pick(mix)();
    const t = performance.now();
    try {
      let r: Answer;
      try {
        r = await send(step.method, step.path, cookies[i]!, step.body);
      } catch (e) {
        // A keep-alive connection the server closed as it was reused: a GET may be sent again
        // (RFC 9110 §9.2.2), as browsers do. Counted, not hidden.
        const code = (e as NodeJS.ErrnoException).code;
        if (step.method !== 'GET' || (code !== 'ECONNRESET' && code !== 'EPIPE')) throw e;
        retried++;
        r = await send(step.method, step.path, cookies[i]!, step.body);
      }
      const ms = performance.now() - t;
      times[step.kind].push(ms);
      const key = pattern(step.method, step.path);
      const list = byRoute.get(key) ?? [];
      list.push(ms);
      byRoute.set(key, list);
      if (r.status < 200 || r.status >= 300) {
        errors++;
        if (failures.length < 10) failures.push(`${step.method} ${step.path} → ${r.status} ${r.body.slice(0, 160)}`);
      }
    } catch (e) {
      errors++;
      if (failures.length < 10) failures.push(`${step.method} ${step.path} → ${(e as Error).message}`);
    }
    await new Promise((r) => setTimeout(r, 50 + Math.random() * 200)); // a person reads between steps
  }
}
const started = performance.now();
await Promise.all(roles.map((_, i) => person(i)));
const seconds = (performance.now() - started) / 1000;

const q = (xs: number[], p: number) => (xs.length ? Number(xs[Math.min(xs.length - 1, Math.floor(p * xs.length))]!.toFixed(1)) : null);
const stats = (xs: number[]) => {
  xs.sort((a, b) => a - b);
  return { requests: xs.length, p50Ms: q(xs, 0.5), p95Ms: q(xs, 0.95), p99Ms: q(xs, 0.99) };
};
const all = stats([...times.page, ...times.api]);
const pages = stats(times.page);
const apis = stats(times.api);
const status = readFileSync(`/proc/${server.pid}/status`, 'utf8');
const peakRssMb = Math.round(Number(/VmHWM:\s+(\d+)/.exec(status)![1]) / 1024);
server.kill('SIGTERM');
await new Promise((r) => server.once('exit', r));
if (!kept) rmSync(dir, { recursive: true, force: true });

console.log(`pages: ${JSON.stringify(pages)}`);
console.log(`API:   ${JSON.stringify(apis)}`);
const slowest = [...byRoute].map(([route, xs]) => ({ route, ...stats(xs) })).sort((a, b) => (b.p95Ms ?? 0) - (a.p95Ms ?? 0)).slice(0, 6);
for (const r of slowest) console.log(`slowest: ${r.route} ${JSON.stringify({ requests: r.requests, p50Ms: r.p50Ms, p95Ms: r.p95Ms })}`);
for (const f of failures) console.log(`error: ${f}`);
console.log(`target 0 errors: ${errors === 0 ? 'met' : 'MISSED'}`);
console.log(JSON.stringify({ users: USERS, seconds: Number(seconds.toFixed(1)), requests: all.requests, requestsPerSecond: Number((all.requests / seconds).toFixed(1)), errors, retriedOnClosedConnection: retried, p50Ms: all.p50Ms, p95Ms: all.p95Ms, p99Ms: all.p99Ms, pageP95Ms: pages.p95Ms, apiP95Ms: apis.p95Ms, peakRssMb }));
process.exit(errors === 0 ? 0 : 1);
