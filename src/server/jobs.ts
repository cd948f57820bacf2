/**
 * Scheduled jobs (node-cron). Each run is recorded in job_run. Jobs are registered here by the
 * features that need them; the scheduler starts once per process.
 */
import cron, { type ScheduledTask } from 'node-cron';
import { eq } from 'drizzle-orm';
import { hostname } from 'node:os';
import { getDb } from '../db/client';
import { jobRun } from '../db/schema';

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

/** Runs one job now, recording the run. */
export async function runJob(job: JobDefinition): Promise<{ status: 'ok' | 'failed'; detail: string }> {
  const db = await getDb();
  const [row] = await db.insert(jobRun).values({ job: job.name, instance, status: 'running' }).returning({ id: jobRun.id });
  try {
    const detail = await job.run();
    await db.update(jobRun).set({ status: 'ok', detail, finishedAt: new Date() }).where(eq(jobRun.id, row!.id));
    return { status: 'ok', detail };
  } catch (e) {
    const detail = (e as Error).message;
    console.error(`[jobs] ${job.name} failed:`, e);
    await db.update(jobRun).set({ status: 'failed', detail, finishedAt: new Date() }).where(eq(jobRun.id, row!.id));
    return { status: 'failed', detail };
  }
}

export function startJobs(): void {
  if (holder[KEY]) return;
  holder[KEY] = JOBS.map((job) => cron.schedule(job.schedule, () => void runJob(job), { timezone: 'UTC' }));
}

export function stopJobs(): void {
  for (const t of holder[KEY] ?? []) void t.stop();
  delete holder[KEY];
}
