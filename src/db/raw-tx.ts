/**
 * A plain-SQL transaction for the few hot paths that move many rows (bill import, its undo):
 * on PGlite, COPY … FROM a blob (the fastest way in); on a PostgreSQL server, array-parameter
 * inserts through one pooled connection. Everything inside `fn` commits or rolls back together.
 */
import type { PGlite, Transaction } from '@electric-sql/pglite';
import type pg from 'pg';
import { getDatabase } from './client';

export interface RawTx {
  kind: 'pglite' | 'postgres';
  query<T = Record<string, unknown>>(text: string, params?: unknown[]): Promise<T[]>;
  /**
   * Loads CSV text (RFC 4180, no header, `\N` not used: empty unquoted field = NULL) into
   * `table (columns)`. `types` are the columns' PostgreSQL types, used where COPY is unavailable.
   */
  copyCsv(table: string, columns: readonly string[], types: readonly string[], csv: string): Promise<void>;
}

function pgliteTx(tx: Transaction): RawTx {
  return {
    kind: 'pglite',
    async query<T>(text: string, params: unknown[] = []) {
      return (await tx.query<T>(text, params)).rows;
    },
    async copyCsv(table, columns, _types, csv) {
      await tx.query(`copy ${table} (${columns.join(', ')}) from '/dev/blob' with (format csv)`, [], { blob: new Blob([csv]) });
    },
  };
}

function serverTx(client: pg.PoolClient): RawTx {
  return {
    kind: 'postgres',
    async query<T>(text: string, params: unknown[] = []) {
      return (await client.query(text, params)).rows as T[];
    },
    async copyCsv(table, columns, types, csv) {
      // Without a COPY stream client, split the CSV back into columns and insert with unnest.
      const { parseCsvColumns } = await import('./csv-columns');
      const cols = parseCsvColumns(csv, columns.length);
      const args = types.map((t, i) => `$${i + 1}::${t}[]`).join(', ');
      await client.query(`insert into ${table} (${columns.join(', ')}) select * from unnest(${args})`, cols);
    },
  };
}

export async function rawTransaction<T>(fn: (tx: RawTx) => Promise<T>): Promise<T> {
  const handle = await getDatabase();
  if (handle.kind === 'pglite') return (handle.raw as PGlite).transaction((tx) => fn(pgliteTx(tx)));
  const client = await (handle.raw as pg.Pool).connect();
  try {
    await client.query('begin');
    const result = await fn(serverTx(client));
    await client.query('commit');
    return result;
  } catch (e) {
    await client.query('rollback').catch(() => undefined);
    throw e;
  } finally {
    client.release();
  }
}
