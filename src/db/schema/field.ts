/** Walkthroughs, findings and measures, photos; the loaner kit library. */
import { sql } from 'drizzle-orm';
import { boolean, check, date, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { building, installation } from './inventory';

export const walkthrough = pgTable(
  'walkthrough',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    buildingId: uuid('building_id')
      .notNull()
      .references(() => building.id),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    flagId: uuid('flag_id'),
    title: text('title').notNull().default(''),
    plannedOn: date('planned_on').notNull(),
    auditorId: text('auditor_id'),
    /** planned | in-progress | completed | cancelled */
    status: text('status').notNull().default('planned'),
    form: jsonb('form').notNull().default(sql`'{}'::jsonb`),
    formVersion: integer('form_version').notNull().default(0),
    createdBy: text('created_by'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    completedAt: timestamp('completed_at', { withTimezone: true }),
  },
  (t) => [index('walkthrough_installation_idx').on(t.installationId, t.status)],
);

/** Something the auditor saw. It may become a measure (below). */
export const finding = pgTable(
  'finding',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    walkthroughId: uuid('walkthrough_id')
      .notNull()
      .references(() => walkthrough.id, { onDelete: 'cascade' }),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    buildingId: uuid('building_id')
      .notNull()
      .references(() => building.id),
    title: text('title').notNull(),
    /** A code of FINDING_CATEGORIES (src/lib/field/walkthrough-form.ts). */
    category: text('category').notNull(),
    location: text('location').notNull().default(''),
    description: text('description').notNull().default(''),
    /** open | dismissed */
    status: text('status').notNull().default('open'),
    createdBy: text('created_by'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('finding_walkthrough_idx').on(t.walkthroughId)],
);

/**
 * An energy or water conservation measure (ECM) proposed from a finding: its annual savings per
 * commodity, cost, life and economics (10 CFR 436 / NIST Handbook 135, at the discount rate in
 * force when it was last saved). proposed → approved → implemented (dated); or rejected.
 */
export const measure = pgTable(
  'measure',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    findingId: uuid('finding_id')
      .notNull()
      .unique()
      .references(() => finding.id, { onDelete: 'cascade' }),
    walkthroughId: uuid('walkthrough_id')
      .notNull()
      .references(() => walkthrough.id, { onDelete: 'cascade' }),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    buildingId: uuid('building_id')
      .notNull()
      .references(() => building.id),
    title: text('title').notNull(),
    /** proposed | approved | implemented | rejected */
    status: text('status').notNull().default('proposed'),
    /** [{ commodity, quantity, unit }]: annual savings in the commodity's billing unit (water included). */
    savings: jsonb('savings').notNull().default(sql`'[]'::jsonb`),
    annualEnergyCostSavings: doublePrecision('annual_energy_cost_savings').notNull().default(0),
    annualWaterCostSavings: doublePrecision('annual_water_cost_savings').notNull().default(0),
    annualOmCostSavings: doublePrecision('annual_om_cost_savings').notNull().default(0),
    installedCost: doublePrecision('installed_cost').notNull(),
    incentives: doublePrecision('incentives').notNull().default(0),
    lifeYears: integer('life_years').notNull(),
    /** The economics as last computed, with the discount-rate setting used. */
    economics: jsonb('economics').notNull().default(sql`'{}'::jsonb`),
    approvedBy: text('approved_by'),
    approvedAt: timestamp('approved_at', { withTimezone: true }),
    implementedOn: date('implemented_on'),
    createdBy: text('created_by'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('measure_walkthrough_idx').on(t.walkthroughId), index('measure_building_idx').on(t.buildingId, t.status)],
);

export const photo = pgTable('photo', {
  id: uuid('id').primaryKey().defaultRandom(),
  walkthroughId: uuid('walkthrough_id')
    .notNull()
    .references(() => walkthrough.id, { onDelete: 'cascade' }),
  installationId: uuid('installation_id')
    .notNull()
    .references(() => installation.id),
  findingId: uuid('finding_id').references(() => finding.id, { onDelete: 'set null' }),
  tag: text('tag').notNull(),
  caption: text('caption').notNull().default(''),
  mime: text('mime').notNull(),
  bytes: integer('bytes').notNull(),
  storedName: text('stored_name').notNull(),
  uploadedBy: text('uploaded_by'),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const kit = pgTable('kit', {
  id: uuid('id').primaryKey().defaultRandom(),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  description: text('description').notNull().default(''),
  homeLocation: text('home_location').notNull().default(''),
  active: boolean('active').notNull().default(true),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const instrument = pgTable(
  'instrument',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    kitId: uuid('kit_id').references(() => kit.id),
    type: text('type').notNull(),
    model: text('model').notNull().default(''),
    serial: text('serial').notNull(),
    calibrationDue: date('calibration_due'),
    /** good | fair | needs-repair | retired */
    condition: text('condition').notNull().default('good'),
    notes: text('notes').notNull().default(''),
    /** The last day a calibration reminder went out for the current due date (one per due date and stage). */
    calibrationNoticeOn: date('calibration_notice_on'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('instrument_kit_idx').on(t.kitId)],
);

export const loan = pgTable(
  'loan',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    kitId: uuid('kit_id')
      .notNull()
      .references(() => kit.id),
    installationId: uuid('installation_id').references(() => installation.id),
    walkthroughId: uuid('walkthrough_id').references(() => walkthrough.id, { onDelete: 'set null' }),
    requestedBy: text('requested_by'),
    purpose: text('purpose').notNull().default(''),
    startDate: date('start_date').notNull(),
    endDate: date('end_date').notNull(),
    /** requested | approved | shipped | in-use | returned | inspected | declined | cancelled */
    status: text('status').notNull().default('requested'),
    /** The day the last overdue reminder was sent (at most one a day). */
    overdueNoticeOn: date('overdue_notice_on'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  // No double booking: the exclusion constraint loan_no_double_booking (drizzle/0012) refuses two
  // loans of one kit with overlapping dates while both are requested, approved, shipped or in use.
  (t) => [index('loan_kit_idx').on(t.kitId, t.startDate), check('loan_dates_ordered', sql`${t.endDate} >= ${t.startDate}`)],
);

export const loanEvent = pgTable('loan_event', {
  id: uuid('id').primaryKey().defaultRandom(),
  loanId: uuid('loan_id')
    .notNull()
    .references(() => loan.id, { onDelete: 'cascade' }),
  fromStatus: text('from_status'),
  toStatus: text('to_status').notNull(),
  userId: text('user_id'),
  actor: text('actor').notNull().default(''),
  note: text('note').notNull().default(''),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
});
