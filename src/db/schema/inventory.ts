/** Region → installation → building → meter → bill, and who may work on which installation. */
import { sql } from 'drizzle-orm';
import {
  bigint,
  boolean,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { user } from './auth';

const created = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();
const updated = () => timestamp('updated_at', { withTimezone: true }).notNull().defaultNow();

export const region = pgTable('region', {
  id: uuid('id').primaryKey().defaultRandom(),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  createdAt: created(),
});

export const installation = pgTable('installation', {
  id: uuid('id').primaryKey().defaultRandom(),
  regionId: uuid('region_id')
    .notNull()
    .references(() => region.id),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  climate: text('climate').notNull().default(''),
  timeZone: text('time_zone').notNull().default('UTC'),
  address: text('address').notNull().default(''),
  /** Intensity target: baseline fiscal year, reduction percent, target fiscal year. */
  targetBaselineFy: integer('target_baseline_fy'),
  targetReductionPct: doublePrecision('target_reduction_pct'),
  targetFy: integer('target_fy'),
  /** Last time bills or weather of this installation changed: fits older than this are stale. */
  dataChangedAt: timestamp('data_changed_at', { withTimezone: true }),
  createdAt: created(),
  updatedAt: updated(),
});

export const userInstallation = pgTable(
  'user_installation',
  {
    userId: text('user_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id, { onDelete: 'cascade' }),
    assignedAt: created(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.installationId] })],
);

export const building = pgTable(
  'building',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    number: text('number').notNull(),
    name: text('name').notNull(),
    useType: text('use_type').notNull(),
    grossAreaFt2: doublePrecision('gross_area_ft2').notNull(),
    yearBuilt: integer('year_built'),
    occupants: integer('occupants'),
    /** Date of the last energy and water evaluation (walkthrough audit); null = never. */
    lastEvaluatedOn: date('last_evaluated_on'),
    notes: text('notes').notNull().default(''),
    archived: boolean('archived').notNull().default(false),
    createdAt: created(),
    updatedAt: updated(),
  },
  (t) => [
    uniqueIndex('building_installation_number_uq').on(t.installationId, t.number),
    index('building_installation_idx').on(t.installationId),
  ],
);

export const meter = pgTable(
  'meter',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    buildingId: uuid('building_id')
      .notNull()
      .references(() => building.id),
    code: text('code').notNull(),
    commodity: text('commodity').notNull(),
    unit: text('unit').notNull(),
    account: text('account').notNull().default(''),
    /** Heat content per billing unit where the utility states one (gas kBtu/ccf, steam kBtu/Mlb, …). */
    heatContentKbtuPerUnit: doublePrecision('heat_content_kbtu_per_unit'),
    active: boolean('active').notNull().default(true),
    /** End of the latest bill, kept by the metrics job (data freshness). */
    lastBillEnd: date('last_bill_end'),
    createdAt: created(),
    updatedAt: updated(),
  },
  (t) => [
    uniqueIndex('meter_installation_code_uq').on(t.installationId, t.code),
    index('meter_building_idx').on(t.buildingId),
  ],
);

export const bill = pgTable(
  'bill',
  {
    id: bigint('id', { mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    // The meter carries the installation: bills are reached through their meter, so the scope
    // of a bill is its meter's (one foreign key less on the table that takes millions of rows).
    meterId: uuid('meter_id')
      .notNull()
      .references(() => meter.id),
    periodStart: date('period_start').notNull(),
    periodEnd: date('period_end').notNull(),
    quantity: doublePrecision('quantity').notNull(),
    unit: text('unit').notNull(),
    cost: doublePrecision('cost'),
    demandKw: doublePrecision('demand_kw'),
    estimated: boolean('estimated').notNull().default(false),
    /** The import that last wrote this row (null for rows entered by hand or by the demo). */
    importId: uuid('import_id'),
    /** The import that created this row: undoing that import removes it. */
    createdImportId: uuid('created_import_id'),
    createdAt: created(),
    updatedAt: updated(),
  },
  // One index only: bills arrive by the million and every index and foreign key slows the load
  // (decision 0006).
  // Reads go by meter (the unique key's prefix); undo scans by import, which is rare.
  (t) => [uniqueIndex('bill_meter_period_uq').on(t.meterId, t.periodStart, t.periodEnd)],
);

/** Activity log: who did what, when (security events, imports, exports, role changes). */
export const activityLog = pgTable(
  'activity_log',
  {
    id: bigint('id', { mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    userId: text('user_id'),
    actor: text('actor').notNull().default(''),
    action: text('action').notNull(),
    entityType: text('entity_type').notNull().default(''),
    entityId: text('entity_id').notNull().default(''),
    installationId: uuid('installation_id'),
    ip: text('ip').notNull().default(''),
    details: jsonb('details').notNull().default(sql`'{}'::jsonb`),
  },
  (t) => [index('activity_at_idx').on(t.at), index('activity_installation_idx').on(t.installationId)],
);

/** Key/value settings edited in the app (thresholds, factors, discount rate), each dated. */
export const appSetting = pgTable('app_setting', {
  key: text('key').primaryKey(),
  value: jsonb('value').notNull(),
  updatedAt: updated(),
  updatedBy: text('updated_by'),
});
