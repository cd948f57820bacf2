/** Bill and weather intake: imports with their original file, saved column mappings, weather. */
import { sql } from 'drizzle-orm';
import {
  bigint,
  boolean,
  customType,
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
import { installation } from './inventory';

const bytea = customType<{ data: Uint8Array; driverData: Uint8Array }>({
  dataType: () => 'bytea',
});

export const importRun = pgTable(
  'import_run',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    installationId: uuid('installation_id').references(() => installation.id),
    /** bills-csv | green-button | weather-csv | weather-service */
    kind: text('kind').notNull(),
    /** dry-run | committed | undone | failed */
    status: text('status').notNull(),
    fileName: text('file_name').notNull().default(''),
    fileSha256: text('file_sha256').notNull().default(''),
    fileBytes: bigint('file_bytes', { mode: 'number' }).notNull().default(0),
    mapping: jsonb('mapping'),
    counts: jsonb('counts').notNull().default(sql`'{}'::jsonb`),
    /** The first problems (the full report is rebuilt from the stored file on demand). */
    problems: jsonb('problems').notNull().default(sql`'[]'::jsonb`),
    problemCount: integer('problem_count').notNull().default(0),
    uploadedBy: text('uploaded_by'),
    uploadedByEmail: text('uploaded_by_email').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    committedAt: timestamp('committed_at', { withTimezone: true }),
    undoneAt: timestamp('undone_at', { withTimezone: true }),
    undoneBy: text('undone_by'),
    stationId: uuid('station_id'),
  },
  (t) => [index('import_installation_idx').on(t.installationId, t.createdAt)],
);

/** The original uploaded bytes, kept apart so listing imports stays light. */
export const importFile = pgTable('import_file', {
  importId: uuid('import_id')
    .primaryKey()
    .references(() => importRun.id, { onDelete: 'cascade' }),
  content: bytea('content').notNull(),
});

/** What an import changed, so it can be undone: inserted bill ids and the prior values of updates. */
export const importChange = pgTable(
  'import_change',
  {
    importId: uuid('import_id')
      .notNull()
      .references(() => importRun.id, { onDelete: 'cascade' }),
    billId: bigint('bill_id', { mode: 'number' }).notNull(),
    /** insert | update */
    action: text('action').notNull(),
    before: jsonb('before'),
  },
  (t) => [primaryKey({ columns: [t.importId, t.billId] })],
);

export const columnMapping = pgTable(
  'column_mapping',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id),
    name: text('name').notNull(),
    mapping: jsonb('mapping').notNull(),
    createdBy: text('created_by'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('column_mapping_name_uq').on(t.installationId, t.name)],
);

export const weatherStation = pgTable('weather_station', {
  id: uuid('id').primaryKey().defaultRandom(),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  latitude: doublePrecision('latitude'),
  longitude: doublePrecision('longitude'),
  elevationFt: doublePrecision('elevation_ft'),
  /** Identifier at the weather service (GHCN-Daily station id), when there is one. */
  serviceId: text('service_id'),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const installationStation = pgTable(
  'installation_station',
  {
    installationId: uuid('installation_id')
      .notNull()
      .references(() => installation.id, { onDelete: 'cascade' }),
    stationId: uuid('station_id')
      .notNull()
      .references(() => weatherStation.id, { onDelete: 'cascade' }),
    primary: boolean('is_primary').notNull().default(true),
  },
  (t) => [primaryKey({ columns: [t.installationId, t.stationId] })],
);

export const weatherDay = pgTable(
  'weather_day',
  {
    stationId: uuid('station_id')
      .notNull()
      .references(() => weatherStation.id, { onDelete: 'cascade' }),
    date: date('date').notNull(),
    tmaxF: doublePrecision('tmax_f'),
    tminF: doublePrecision('tmin_f'),
    /** file | service | demo */
    source: text('source').notNull(),
    importId: uuid('import_id'),
  },
  (t) => [primaryKey({ columns: [t.stationId, t.date] })],
);
