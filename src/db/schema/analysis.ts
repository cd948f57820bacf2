/** Baselines, shortlist flags and ranking weights. */
import { sql } from 'drizzle-orm';
import { boolean, date, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { building, installation, meter, region } from './inventory';

/**
 * The weather-normalized baseline of one meter (a building × commodity), refitted when its bills
 * or weather change. One row per meter; the decisions taken on it are in baseline_decision.
 */
export const baseline = pgTable(
  'baseline',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    meterId: uuid('meter_id')
      .notNull()
      .references(() => meter.id),
    buildingId: uuid('building_id')
      .notNull()
      .references(() => building.id),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    commodity: text('commodity').notNull(),
    /** The unit use per day is fitted in: the meter's billing unit. */
    unit: text('unit').notNull().default(''),
    /** The baseline period; chosen by an analyst when periodChosen, else the default window. */
    periodStart: date('period_start'),
    periodEnd: date('period_end'),
    periodChosen: boolean('period_chosen').notNull().default(false),
    /** accepted | needs-review | failing-criteria | insufficient-data */
    status: text('status').notNull(),
    /** The shape in use: the engine's selection, or the analyst's override. */
    shape: text('shape'),
    /** Set when an analyst chose the shape. */
    overrideShape: text('override_shape'),
    /** Why there is no model (insufficient-data): a typed reason from the engine. */
    reason: text('reason'),
    r2: doublePrecision('r2'),
    adjR2: doublePrecision('adj_r2'),
    cvrmse: doublePrecision('cvrmse'),
    /** Normalized annual consumption in the meter's unit, and in kBtu (energy) or gallons (water). */
    nac: doublePrecision('nac'),
    nacConverted: doublePrecision('nac_converted'),
    /** The whole engine result: models of every shape, statistics, periods, acceptance. */
    fit: jsonb('fit').notNull().default(sql`'{}'::jsonb`),
    /** Hash of the bills and weather the fit was made from, to tell a stale fit. */
    inputHash: text('input_hash').notNull().default(''),
    fittedAt: timestamp('fitted_at', { withTimezone: true }).notNull().defaultNow(),
    reviewedBy: text('reviewed_by'),
    reviewedAt: timestamp('reviewed_at', { withTimezone: true }),
    note: text('note').notNull().default(''),
  },
  (t) => [
    uniqueIndex('baseline_meter_uq').on(t.meterId),
    index('baseline_building_idx').on(t.buildingId, t.commodity),
    index('baseline_installation_idx').on(t.installationId, t.status),
  ],
);

export const baselineDecision = pgTable('baseline_decision', {
  id: uuid('id').primaryKey().defaultRandom(),
  baselineId: uuid('baseline_id')
    .notNull()
    .references(() => baseline.id, { onDelete: 'cascade' }),
  userId: text('user_id'),
  actor: text('actor').notNull().default(''),
  /** accept | override | reopen | period */
  action: text('action').notNull(),
  shape: text('shape'),
  note: text('note').notNull(),
  /** The statistics the decision was taken on. */
  details: jsonb('details').notNull().default(sql`'{}'::jsonb`),
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

/**
 * Intensities and audit-priority inputs per building, computed from bills and baselines by the
 * metrics job (src/server/benchmark/metrics.ts) so that screens and rankings read them at once.
 * Energy in site kBtu, water in gallons, money in dollars; `windowStart`–`windowEnd` is the
 * 12-month window the main figures cover; `years` holds the same per federal fiscal year.
 */
export const buildingMetric = pgTable(
  'building_metric',
  {
    buildingId: uuid('building_id')
      .primaryKey()
      .references(() => building.id, { onDelete: 'cascade' }),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    windowStart: date('window_start').notNull(),
    windowEnd: date('window_end').notNull(),
    areaFt2: doublePrecision('area_ft2').notNull(),
    siteKbtu: doublePrecision('site_kbtu'),
    siteEui: doublePrecision('site_eui'),
    sourceEui: doublePrecision('source_eui'),
    ghgKgPerFt2: doublePrecision('ghg_kg_per_ft2'),
    euiNormalized: doublePrecision('eui_normalized'),
    euiNormalizedUncertainty: doublePrecision('eui_normalized_uncertainty'),
    /** True when some baseline behind the normalized EUI is not accepted yet. */
    normalizedProvisional: boolean('normalized_provisional').notNull().default(false),
    waterGal: doublePrecision('water_gal'),
    wui: doublePrecision('wui'),
    costUsd: doublePrecision('cost_usd'),
    costIntensity: doublePrecision('cost_intensity'),
    pricePerKbtu: doublePrecision('price_per_kbtu'),
    /** Lowest share of the window covered by bills among the building's commodities, 0–1. */
    coverage: doublePrecision('coverage'),
    yoyCurrentKbtu: doublePrecision('yoy_current_kbtu'),
    yoyPreviousKbtu: doublePrecision('yoy_previous_kbtu'),
    anomalyPeriods: integer('anomaly_periods'),
    anomalyBeyond: integer('anomaly_beyond'),
    commodities: jsonb('commodities').notNull().default(sql`'{}'::jsonb`),
    years: jsonb('years').notNull().default(sql`'{}'::jsonb`),
    computedAt: timestamp('computed_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('building_metric_installation_idx').on(t.installationId)],
);
