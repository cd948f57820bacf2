/**
 * Fast inserts of many rows: one statement per chunk, one array parameter per column,
 * `insert … select * from unnest(…)`. Works the same on PGlite and on a PostgreSQL server, and is
 * an order of magnitude faster than multi-row VALUES lists built by the query builder.
 */
import { sql } from 'drizzle-orm';
import type { Db, Tx } from './client';

export interface BulkColumn {
  name: string;
  /** PostgreSQL type of the column's array elements, e.g. `date`, `float8`, `uuid`, `text`, `bool`. */
  type: 'date' | 'float8' | 'uuid' | 'text' | 'bool' | 'int4' | 'int8' | 'jsonb';
  values: readonly unknown[];
}

const CHUNK = 20_000;

/**
 * Inserts `columns[i].values[j]` as row j. All value arrays must have the same length.
 * @param suffix optional SQL after the select (e.g. `on conflict do nothing`), trusted text only.
 */
export async function bulkInsert(db: Db | Tx, table: string, columns: BulkColumn[], suffix = ''): Promise<void> {
  const n = columns[0]?.values.length ?? 0;
  if (columns.some((c) => c.values.length !== n)) throw new Error(`bulkInsert(${table}): columns differ in length`);
  const names = sql.join(columns.map((c) => sql.identifier(c.name)), sql`, `);
  for (let start = 0; start < n; start += CHUNK) {
    const arrays = sql.join(
      columns.map((c) => sql`${sql.param(c.values.slice(start, start + CHUNK))}::${sql.raw(c.type)}[]`),
      sql`, `,
    );
    await db.execute(sql`insert into ${sql.identifier(table)} (${names}) select * from unnest(${arrays}) ${sql.raw(suffix)}`);
  }
}
