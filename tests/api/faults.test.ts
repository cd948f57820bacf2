/**
 * Faults: the server is killed (SIGKILL, no shutdown) at a random moment of a large bill import,
 * 20 times over, and restarted each time. After every restart the import is either fully present
 * (every row, a committed import record) or fully absent (no row, no committed record), and at
 * the end the database passes consistency checks (every committed import created exactly the rows
 * it counted as new, kept its original file, and no bill belongs to an import that is not committed).
 * Runs on its own copy of the demo (PGlite) or its own PostgreSQL database.
 */
import { randomBytes } from 'node:crypto';
import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { btree_gist } from '@electric-sql/pglite/contrib/btree_gist';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startServer, type RunningServer } from '../support/server-process';

const ROUNDS = Number(process.env.PLUMBLINE_FAULT_ROUNDS ?? 20);
const METERS = 40;
const MONTHS = 600; // 1970-01 … 2019-12, one bill a month
const template = inject('demoTemplateDir');
const adminUrl = process.env.DATABASE_URL;

let dataDir = '';
let dbUrl = '';
let dbName = '';
let server: RunningServer | null = null;
let cookie = '';
let buildingId = '';

async function start(): Promise<RunningServer> {
  return adminUrl ? startServer({ databaseUrl: dbUrl, env: { PLUMBLINE_DEMO: '1' } }) : startServer({ dataDir });
}

async function api(method: string, path: string, body?: unknown): Promise<{ status: number; body: any }> {
  const init: RequestInit = { method, headers: { cookie, origin: server!.baseUrl } };
  if (body instanceof FormData) init.body = body;
  else if (body !== undefined) {
    init.body = JSON.stringify(body);
    (init.headers as Record<string, string>)['content-type'] = 'application/json';
  }
  const r = await fetch(`${server!.baseUrl}${path}`, init);
  const text = await r.text();
  return { status: r.status, body: text ? JSON.parse(text) : null };
}

function csvFor(round: number): string {
  const lines = ['Meter,Start,End,Usage'];
  for (let k = 0; k < METERS; k++) {
    for (let m = 0; m < MONTHS; m++) {
      const y = 1970 + Math.floor(m / 12);
      const mo = (m % 12) + 1;
      const start = `${y}-${String(mo).padStart(2, '0')}-01`;
      const endDay = new Date(Date.UTC(y, mo, 0)).getUTCDate();
      lines.push(`FLT${round}-${k},${start},${y}-${String(mo).padStart(2, '0')}-${endDay},${1000 + ((k * 31 + m * 7) % 500)}`);
    }
  }
  return `${lines.join('\n')}\n`;
}

/** Bills now stored for the round's meters, and whether a committed import of its file exists. */
async function state(round: number, meterIds: string[]): Promise<{ bills: number[]; committed: number }> {
  const bills: number[] = [];
  for (const id of meterIds) bills.push((await api('GET', `/api/bills?meter=${id}`)).body.items.length);
  const imports = (await api('GET', '/api/imports?installation=BNP&all=1')).body.items as { fileName: string; status: string }[];
  return { bills, committed: imports.filter((i) => i.fileName === `fault-${round}.csv` && i.status === 'committed').length };
}

beforeAll(async () => {
  if (adminUrl) {
    dbName = `plumbline_fault_${randomBytes(5).toString('hex')}`;
    const a = new pg.Client({ connectionString: adminUrl });
    await a.connect();
    await a.query(`create database ${dbName}`);
    await a.end();
    const u = new URL(adminUrl);
    u.pathname = `/${dbName}`;
    dbUrl = u.toString();
  } else {
    dataDir = mkdtempSync(join(tmpdir(), 'plumbline-faults-'));
    cpSync(join(template, 'pglite'), join(dataDir, 'pglite'), { recursive: true });
    cpSync(join(template, 'auth-secret'), join(dataDir, 'auth-secret'));
  }
  server = await start();
  const r = await fetch(`${server.baseUrl}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: server.baseUrl },
    body: JSON.stringify({ email: 'admin@demo.plumbline.test', password: 'plumbline-demo-2026' }),
  });
  cookie = r.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  buildingId = (await api('GET', '/api/buildings?installation=BNP')).body.items[0].id;
}, 300_000);

afterAll(async () => {
  await server?.stop('SIGTERM');
  if (adminUrl && dbName) {
    const a = new pg.Client({ connectionString: adminUrl });
    await a.connect();
    await a.query(`drop database if exists ${dbName} with (force)`);
    await a.end();
  }
  if (dataDir) rmSync(dataDir, { recursive: true, force: true });
});

describe('SIGKILL during a large import', () => {
  it(`${ROUNDS} kills at random moments: each import all there or not at all`, async () => {
    const outcomes: { round: number; delayMs: number; answered: boolean; present: boolean }[] = [];
    let importMs = 0;
    for (let round = 0; round <= ROUNDS; round++) {
      const meterIds: string[] = [];
      for (let k = 0; k < METERS; k++) {
        const m = await api('POST', '/api/meters', { buildingId, code: `FLT${round}-${k}`, commodity: 'electricity', unit: 'kWh' });
        expect(m.status, JSON.stringify(m.body)).toBe(201);
        meterIds.push(m.body.id);
      }
      const form = new FormData();
      form.set('file', new File([csvFor(round)], `fault-${round}.csv`, { type: 'text/csv' }));
      form.set('installation', 'BNP');
      form.set('dryRun', 'false');
      const t0 = performance.now();
      const pending = api('POST', '/api/imports', form).then(
        (r) => r,
        () => null,
      );
      // Round 0 measures an import undisturbed; later rounds kill somewhere between its start and a little after its end.
      const delayMs = round === 0 ? -1 : Math.round(Math.random() * importMs * 1.4);
      let killer: NodeJS.Timeout | null = null;
      if (round > 0) killer = setTimeout(() => server!.child.kill('SIGKILL'), delayMs);
      const answer = await pending;
      if (round === 0) {
        importMs = performance.now() - t0;
        expect(answer?.status).toBe(201);
        expect(answer?.body.counts.new).toBe(METERS * MONTHS);
      }
      if (killer) {
        // Wait for the kill to land even when the import answered first.
        await new Promise((r) => setTimeout(r, Math.max(0, delayMs - (performance.now() - t0)) + 50));
        clearTimeout(killer);
        server!.child.kill('SIGKILL');
        await server!.stop('SIGKILL');
        server = await start();
      }
      const s = await state(round, meterIds);
      const present = s.bills.every((n) => n === MONTHS) && s.committed === 1;
      const absent = s.bills.every((n) => n === 0) && s.committed === 0;
      expect(present || absent, `round ${round}: bills per meter ${[...new Set(s.bills)].join('/')}, committed imports ${s.committed}`).toBe(true);
      // An import that answered was committed: it must have survived the kill.
      if (answer?.status === 201) expect(present, `round ${round} answered but its rows are gone`).toBe(true);
      outcomes.push({ round, delayMs, answered: answer?.status === 201, present });
    }
    const killed = outcomes.filter((o) => o.round > 0);
    console.log(
      `[faults] import of ${METERS * MONTHS} rows takes ${Math.round(importMs)} ms undisturbed; ${killed.length} kills: ` +
        `${killed.filter((o) => o.present).length} imports complete, ${killed.filter((o) => !o.present).length} absent, ` +
        `${killed.filter((o) => o.answered).length} answered before the kill`,
    );

    // Consistency of the whole database, read directly.
    await server!.stop('SIGTERM');
    server = null;
    const checks = [
      `select count(*)::int as n from import_run r where r.status = 'committed' and (r.counts->>'new')::int <> (select count(*) from bill b where b.created_import_id = r.id)`,
      `select count(*)::int as n from bill b join import_run r on r.id = b.created_import_id where r.status not in ('committed')`,
      `select count(*)::int as n from import_run r where r.status = 'committed' and not exists (select 1 from import_file f where f.import_id = r.id)`,
    ];
    const run = async (q: { query: (s: string) => Promise<{ rows: { n: number }[] }> }) => {
      for (const c of checks) expect((await q.query(c)).rows[0]!.n, c).toBe(0);
    };
    if (adminUrl) {
      const c = new pg.Client({ connectionString: dbUrl });
      await c.connect();
      await run(c);
      await c.end();
    } else {
      const db = await PGlite.create({ dataDir: join(dataDir, 'pglite'), extensions: { btree_gist } });
      await run(db as never);
      await db.close();
    }
    server = await start();
  }, 1_800_000);
});
