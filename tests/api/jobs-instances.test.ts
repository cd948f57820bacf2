/**
 * Two app instances on one PostgreSQL database run each scheduled job slot once: the job is
 * scheduled every 2 seconds on both for ~12 s, and job_run must hold one run per slot, from either
 * instance, never two. Needs a PostgreSQL server (DATABASE_URL; CI runs it), as PGlite is one process.
 */
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { startServer, type RunningServer } from '../support/server-process';

const adminUrl = process.env.DATABASE_URL;

describe.skipIf(!adminUrl)('scheduled jobs across two instances', () => {
  const name = `plumbline_jobs_${randomBytes(5).toString('hex')}`;
  const servers: RunningServer[] = [];
  let dbUrl = '';

  afterAll(async () => {
    await Promise.all(servers.map((s) => s.stop('SIGTERM')));
    const a = new pg.Client({ connectionString: adminUrl });
    await a.connect();
    await a.query(`drop database if exists ${name} with (force)`);
    await a.end();
  });

  it('each 2-second slot of purge-expired ran exactly once across both instances', async () => {
    const a = new pg.Client({ connectionString: adminUrl });
    await a.connect();
    await a.query(`create database ${name}`);
    await a.end();
    const u = new URL(adminUrl!);
    u.pathname = `/${name}`;
    dbUrl = u.toString();
    const env = { PLUMBLINE_JOBS: '1', PLUMBLINE_DEMO: '0', PLUMBLINE_JOB_SCHEDULES: JSON.stringify({ 'purge-expired': '*/2 * * * * *' }) };
    // Started together, so both race for the first slots.
    servers.push(...(await Promise.all([startServer({ databaseUrl: dbUrl, env }), startServer({ databaseUrl: dbUrl, env })])));
    await new Promise((r) => setTimeout(r, 12_000));
    await Promise.all(servers.map((s) => s.stop('SIGTERM')));

    const c = new pg.Client({ connectionString: dbUrl });
    await c.connect();
    const runs = (await c.query<{ slot: Date; instance: string; status: string }>(`select slot, instance, status from job_run where job = 'purge-expired' and slot is not null order by slot`)).rows;
    const claims = (await c.query<{ key: string; instance: string }>(`select key, instance from job_claim where key like 'purge-expired:%'`)).rows;
    await c.end();

    expect(runs.length).toBeGreaterThanOrEqual(4);
    const perSlot = new Map<number, number>();
    for (const r of runs) perSlot.set(r.slot.getTime(), (perSlot.get(r.slot.getTime()) ?? 0) + 1);
    expect([...perSlot.values()].every((n) => n === 1)).toBe(true);
    expect(runs.every((r) => r.status === 'ok')).toBe(true);
    // One claim per slot; every run has its claim, made by the instance that ran it.
    expect(claims.length).toBe(runs.length);
    const claimBy = new Map(claims.map((k) => [k.key, k.instance]));
    for (const r of runs) expect(claimBy.get(`purge-expired:${r.slot.toISOString()}`)).toBe(r.instance);
  }, 240_000);
});
