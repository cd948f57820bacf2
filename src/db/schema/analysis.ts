/** Baselines, shortlist flags and ranking weights. */
import { sql } from 'drizzle-orm';
import { boolean, date, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { building, installation, region } from './inventory';

export const baseline = pgTable(
  'baseline',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    buildingId: uuid('building_id')
      .notNull()
      .references(() => building.id),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    commodity: text('commodity').notNull(),
    periodStart: date('period_start'),
    periodEnd: date('period_end'),
    /** accepted | needs-review | failing-criteria | insufficient-data */
    status: text('status').notNull(),
    shape: text('shape'),
    reason: text('reason'),
    fit: jsonb('fit').notNull().default(sql`'{}'::jsonb`),
    /** Hash of the bills and weather the fit was made from, to tell a stale fit. */
    inputHash: text('input_hash').notNull().default(''),
    current: boolean('is_current').notNull().default(true),
    fittedAt: timestamp('fitted_at', { withTimezone: true }).notNull().defaultNow(),
    reviewedBy: text('reviewed_by'),
    reviewedAt: timestamp('reviewed_at', { withTimezone: true }),
    note: text('note').notNull().default(''),
  },
  (t) => [index('baseline_building_idx').on(t.buildingId, t.commodity), index('baseline_installation_idx').on(t.installationId)],
);

export const baselineDecision = pgTable('baseline_decision', {
  id: uuid('id').primaryKey().defaultRandom(),
  baselineId: uuid('baseline_id')
    .notNull()
    .references(() => baseline.id, { onDelete: 'cascade' }),
  userId: text('user_id'),
  actor: text('actor').notNull().default(''),
  action: text('action').notNull(),
  shape: text('shape'),
  note: text('note').notNull(),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
});

export const buildingFlag = pgTable(
  'building_flag',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    buildingId: uuid('building_id')
      .notNull()
      .references(() => building.id),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    reason: text('reason').notNull(),
    flaggedBy: text('flagged_by'),
    flaggedAt: timestamp('flagged_at', { withTimezone: true }).notNull().defaultNow(),
    clearedBy: text('cleared_by'),
    clearedAt: timestamp('cleared_at', { withTimezone: true }),
  },
  (t) => [index('flag_building_idx').on(t.buildingId)],
);

export const rankingWeights = pgTable('ranking_weights', {
  regionId: uuid('region_id')
    .primaryKey()
    .references(() => region.id),
  weights: jsonb('weights').notNull(),
  updatedBy: text('updated_by'),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});
