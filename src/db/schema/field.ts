/** Walkthroughs, findings and measures, photos; the loaner kit library. */
import { sql } from 'drizzle-orm';
import { boolean, date, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
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
    category: text('category').notNull(),
    description: text('description').notNull().default(''),
    /** observed | proposed | approved | implemented | rejected */
    status: text('status').notNull().default('observed'),
    savings: jsonb('savings').notNull().default(sql`'{}'::jsonb`),
    annualCostSavings: doublePrecision('annual_cost_savings'),
    installedCost: doublePrecision('installed_cost'),
    lifeYears: doublePrecision('life_years'),
    implementedOn: date('implemented_on'),
    createdBy: text('created_by'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('finding_walkthrough_idx').on(t.walkthroughId)],
);

export const photo = pgTable('photo', {
  id: uuid('id').primaryKey().defaultRandom(),
  walkthroughId: uuid('walkthrough_id')
    .notNull()
    .references(() => walkthrough.id, { onDelete: 'cascade' }),
  installationId: uuid('installation_id')
    .notNull()
    .references(() => installation.id),
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
    condition: text('condition').notNull().default('good'),
    notes: text('notes').notNull().default(''),
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
    walkthroughId: uuid('walkthrough_id'),
    requestedBy: text('requested_by'),
    purpose: text('purpose').notNull().default(''),
    startDate: date('start_date').notNull(),
    endDate: date('end_date').notNull(),
    /** requested | approved | shipped | in-use | returned | inspected | declined | cancelled */
    status: text('status').notNull().default('requested'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('loan_kit_idx').on(t.kitId, t.startDate)],
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
