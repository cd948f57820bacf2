/**
 * Scheduled jobs (node-cron). Each run is recorded in job_run. Jobs are registered here by the
 * features that need them; the scheduler starts once per process.
 */
import cron, { type RunCoordinator, type ScheduledTask } from 'node-cron';
import { eq, lt, sql } from 'drizzle-orm';
import type pg from 'pg';
import { hostname } from 'node:os';
import { getDatabase, getDb } from '../db/client';
import { jobClaim, jobRun, rateLimit, session, signInThrottle, verification } from '../db/schema';

export interface JobDefinition {
  name: string;
  /** cron expression, server time zone UTC */
  schedule: string;
  run(): Promise<string>;
}

const KEY = Symbol.for('plumbline.jobs');
type Holder = typeof globalThis & { [KEY]?: ScheduledTask[] };
const holder = globalThis as Holder;

export const JOBS: JobDefinition[] = [
  {
    name: 'refit-baselines',
    schedule: '30 2 * * *',
    async run() {
      const { refitBaselines } = await import('./baselines/run');
      const { computeBuildingMetrics } = await import('./benchmark/metrics');
      const r = await refitBaselines({}, 'nightly');
      const m = await computeBuildingMetrics();
      return `${r.fitted} fitted, ${r.failed} without a model, ${r.seconds.toFixed(1)} s; metrics of ${m.buildings} buildings in ${m.seconds.toFixed(1)} s`;
    },
  },
  {
    name: 'purge-expired',
    schedule: '15 * * * *',
    /** Expired sessions and reset tokens, stale throttling counters, old job claims and runs. */
    async run() {
      const db = await getDb();
      const now = new Date();
      const days = (n: number) => new Date(now.getTime() - n * 86_400_000);
      const sessions = await db.delete(session).where(lt(session.expiresAt, now)).returning({ id: session.id });
      const tokens = await db.delete(verification).where(lt(verification.expiresAt, now)).returning({ id: verification.id });
      await db.delete(rateLimit).where(lt(rateLimit.lastRequest, now.getTime() - 86_400_000));
      await db.delete(signInThrottle).where(sql`${signInThrottle.windowStart} < ${days(1)} and (${signInThrottle.lockedUntil} is null or ${signInThrottle.lockedUntil} < ${now})`);
      await db.delete(jobClaim).where(lt(jobClaim.claimedAt, days(30)));
      await db.delete(jobRun).where(lt(jobRun.startedAt, days(180)));
      return `${sessions.length} expired sessions, ${tokens.length} expired tokens removed`;
    },
  },
  {
    // Kit library: a reminder a day for each loan out past its last day (src/server/kits/reminders.ts).
    name: 'loan-overdue',
    schedule: '0 7 * * *',
    async run() {
      const { sendOverdueReminders } = await import('./kits/reminders');
      const r = await sendOverdueReminders();
      return `${r.loans} overdue loans, ${r.mails} mails`;
    },
  },
  {
    // Kit library: one mail per instrument when its calibration falls due within 30 days, one when it has passed.
    name: 'calibration-reminders',
    schedule: '15 7 * * *',
    async run() {
      const { sendCalibrationReminders } = await import('./kits/reminders');
      const r = await sendCalibrationReminders();
      return `${r.instruments} instruments announced, ${r.mails} mails`;
    },
  },
];

const instance = `${hostname()}:${process.pid}`;

/**
 * A job run takes, besides its schedule slot, a PostgreSQL advisory lock on its name for as long as
 * it runs (a session lock on one pooled connection), so a run started by hand never overlaps a
 * scheduled one on another instance. PGlite has one process by construction (the data-folder lock)
 * and one session, where advisory locks are re-entrant, so an in-process set does the same there.
 */
const ADVISORY_NAMESPACE = 72_657_802;
const runningHere = new Set<string>();

function lockKey(name: string): number {
  let h = 0;
  for (let i = 0; i < name.length; i++) h = (Math.imul(h, 31) + name.charCodeAt(i)) | 0;
  return h;
}

async function withJobLock<T>(name: string, fn: () => Promise<T>): Promise<{ ran: true; value: T } | { ran: false }> {
  if (runningHere.has(name)) return { ran: false };
  runningHere.add(name);
  try {
    const handle = await getDatabase();
    if (handle.kind === 'pglite') return { ran: true, value: await fn() };
    const client = await (handle.raw as pg.Pool).connect();
    try {
      const { rows } = await client.query<{ ok: boolean }>('select pg_try_advisory_lock($1, $2) as ok', [ADVISORY_NAMESPACE, lockKey(name)]);
      if (!rows[0]?.ok) return { ran: false };
      try {
        return { ran: true, value: await fn() };
      } finally {
        await client.query('select pg_advisory_unlock($1, $2)', [ADVISORY_NAMESPACE, lockKey(name)]).catch(() => undefined);
      }
    } finally {
      client.release();
    }
  } finally {
    runningHere.delete(name);
  }
}

/** Runs one job now, recording the run; `slot` is the schedule time it was elected for. */
export async function runJob(job: JobDefinition, slot: Date | null = null): Promise<{ status: 'ok' | 'failed' | 'skipped'; detail: string }> {
  const db = await getDb();
  const outcome = await withJobLock(job.name, async () => {
    const [row] = await db.insert(jobRun).values({ job: job.name, instance, status: 'running', slot }).returning({ id: jobRun.id });
    try {
      const detail = await job.run();
      await db.update(jobRun).set({ status: 'ok', detail, finishedAt: new Date() }).where(eq(jobRun.id, row!.id));
      return { status: 'ok' as const, detail };
    } catch (e) {
      const detail = (e as Error).message;
      console.error(`[jobs] ${job.name} failed:`, e);
      await db.update(jobRun).set({ status: 'failed', detail, finishedAt: new Date() }).where(eq(jobRun.id, row!.id));
      return { status: 'failed' as const, detail };
    }
  });
  return outcome.ran ? outcome.value : { status: 'skipped', detail: 'already running' };
}

/**
 * node-cron's run coordinator, backed by the database: the first instance to insert the claim
 * `<job>:<slot>` runs that slot; the others skip it. Claims older than 30 days are purged.
 */
const coordinator: RunCoordinator = {
  async shouldRun(key: string): Promise<boolean> {
    const db = await getDb();
    const claimed = await db.insert(jobClaim).values({ key, instance }).onConflictDoNothing().returning({ key: jobClaim.key });
    return claimed.length === 1;
  },
};

/**
 * Schedules, each overridable by PLUMBLINE_JOB_SCHEDULES (a JSON object job name → cron
 * expression, six fields allowed for seconds), e.g. to run the reminders at another hour.
 */
export function jobSchedules(): Record<string, string> {
  const schedules: Record<string, string> = Object.fromEntries(JOBS.map((j) => [j.name, j.schedule]));
  const raw = process.env.PLUMBLINE_JOB_SCHEDULES;
  if (!raw) return schedules;
  let parsed: unknown;
  try {
    parsed = JSON.parse(raw);
  } catch {
    throw new Error('PLUMBLINE_JOB_SCHEDULES must be a JSON object of job name to cron expression.');
  }
  for (const [name, expr] of Object.entries(parsed as Record<string, unknown>)) {
    if (!(name in schedules)) throw new Error(`PLUMBLINE_JOB_SCHEDULES names an unknown job "${name}" (known: ${Object.keys(schedules).join(', ')}).`);
    if (typeof expr !== 'string' || !cron.validate(expr)) throw new Error(`PLUMBLINE_JOB_SCHEDULES: "${String(expr)}" is not a cron expression (job ${name}).`);
    schedules[name] = expr;
  }
  return schedules;
}

export function startJobs(): void {
  if (holder[KEY]) return;
  const schedules = jobSchedules();
  holder[KEY] = JOBS.map((job) =>
    cron.schedule(schedules[job.name]!, (ctx) => void runJob(job, ctx.date), {
      name: job.name,
      timezone: 'UTC',
      noOverlap: true,
      distributed: true,
      runCoordinator: coordinator,
    }),
  );
}

export function stopJobs(): void {
  for (const t of holder[KEY] ?? []) void t.stop();
  delete holder[KEY];
}
