/** Mail outbox, sign-in throttling and scheduled-job bookkeeping. */
import { bigint, integer, index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

/**
 * Every message Plumbline sends. With no SMTP_URL the in-process SMTP server receives it and
 * fills `receivedAt` and `raw`: the Outbox page is then the mailbox of a development install.
 */
export const mailOutbox = pgTable(
  'mail_outbox',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    messageId: text('message_id').notNull().unique(),
    toAddress: text('to_address').notNull(),
    fromAddress: text('from_address').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    /** queued | sent | failed */
    status: text('status').notNull().default('queued'),
    error: text('error'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    receivedAt: timestamp('received_at', { withTimezone: true }),
    raw: text('raw'),
  },
  (t) => [index('mail_created_idx').on(t.createdAt)],
);

/** Failed sign-ins per account within a window (ASVS 4.0.3 2.2.1: per-account throttling). */
export const signInThrottle = pgTable('sign_in_throttle', {
  key: text('key').primaryKey(),
  failures: integer('failures').notNull().default(0),
  windowStart: timestamp('window_start', { withTimezone: true }).notNull().defaultNow(),
  lockedUntil: timestamp('locked_until', { withTimezone: true }),
});

export const jobRun = pgTable(
  'job_run',
  {
    id: bigint('id', { mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    job: text('job').notNull(),
    instance: text('instance').notNull(),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
    /** running | ok | failed | skipped */
    status: text('status').notNull(),
    detail: text('detail').notNull().default(''),
    /** The scheduled time this run was elected for (null for a run started by hand). */
    slot: timestamp('slot', { withTimezone: true }),
  },
  (t) => [index('job_run_job_idx').on(t.job, t.startedAt)],
);

/**
 * One row per scheduled run of a job, claimed by the first instance to insert it: with several
 * instances on one database, each schedule slot of a job runs once (node-cron's distributed
 * coordinator, src/server/jobs.ts). Key: `<job>:<slot ISO time>`.
 */
export const jobClaim = pgTable('job_claim', {
  key: text('key').primaryKey(),
  instance: text('instance').notNull(),
  claimedAt: timestamp('claimed_at', { withTimezone: true }).notNull().defaultNow(),
});

/**
 * A counter per topic that triggers raise in the same transaction as the change they count
 * (drizzle/0008): a cache keyed on it (the audit shortlist) stays right across processes and
 * costs one primary-key read per request to check. Topic `ranking`: building, meter (its
 * commodity, building, active flag), installation, building_metric, building_flag, ranking_weights.
 */
export const changeCounter = pgTable('change_counter', {
  topic: text('topic').primaryKey(),
  version: bigint('version', { mode: 'number' }).notNull().default(0),
  changedAt: timestamp('changed_at', { withTimezone: true }).notNull().defaultNow(),
});
