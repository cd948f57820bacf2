/**
 * A plain-SQL transaction for the few hot paths that move many rows (bill import, its undo):
 * on PGlite, COPY … FROM a blob (the fastest way in); on a PostgreSQL server, array-parameter
 * inserts through one pooled connection. Everything inside `fn` commits or rolls back together.
 */
import type { PGlite, Transaction } from '@electric-sql/pglite';
import type pg from 'pg';
import { BinaryCopyWriter, encodeBinaryCopy, uuidBytes, type CopyColumn } from './binary-copy';
import { getDatabase } from './client';
import { isoFromDay } from '../lib/weather/day-number';

export interface RawTx {
  kind: 'pglite' | 'postgres';
  query<T = Record<string, unknown>>(text: string, params?: unknown[]): Promise<T[]>;
  /** Loads `rows` rows given column by column: binary COPY on PGlite, array inserts on a server. */
  copyColumns(table: string, columns: readonly CopyColumn[], rows: number): Promise<void>;
  /** PGlite only: loads rows already encoded in binary COPY format (see BinaryCopyWriter). */
  copyBinary?(table: string, columnNames: readonly string[], data: Uint8Array): Promise<void>;
  /** Inserts one row of (uuid, bytea) — for large files, where text encoding would be slow. */
  insertBytes(table: string, idColumn: string, bytesColumn: string, id: string, bytes: Uint8Array): Promise<void>;
}

function pgliteTx(tx: Transaction): RawTx {
  return {
    kind: 'pglite',
    async query<T>(text: string, params: unknown[] = []) {
      return (await tx.query<T>(text, params)).rows;
    },
    async copyColumns(table, columns, rows) {
      if (rows === 0) return;
      await this.copyBinary!(table, columns.map((c) => c.name), encodeBinaryCopy(columns, rows));
    },
    async copyBinary(table, columnNames, data) {
      await tx.query(`copy ${table} (${columnNames.join(', ')}) from '/dev/blob' with (format binary)`, [], { blob: new Blob([data as Uint8Array<ArrayBuffer>]) });
    },
    async insertBytes(table, idColumn, bytesColumn, id, bytes) {
      const w = new BinaryCopyWriter(bytes.length + 64);
      w.row(2);
      w.uuid(uuidBytes(id));
      w.text(bytes); // bytea travels as its raw bytes, like text
      await this.copyBinary!(table, [idColumn, bytesColumn], w.finish());
    },
  };
}

function serverTx(client: pg.PoolClient): RawTx {
  return {
    kind: 'postgres',
    async query<T>(text: string, params: unknown[] = []) {
      return (await client.query(text, params)).rows as T[];
    },
    async copyColumns(table, columns, rows) {
      const CHUNK = 50_000;
      const args = columns.map((c, i) => `$${i + 1}::${c.type}[]`).join(', ');
      const text = `insert into ${table} (${columns.map((c) => c.name).join(', ')}) select * from unnest(${args})`;
      for (let from = 0; from < rows; from += CHUNK) {
        const to = Math.min(rows, from + CHUNK);
        const params = columns.map((c) => {
          const out: unknown[] = new Array(to - from);
          for (let r = from; r < to; r++) {
            const v = c.values[r];
            out[r - from] =
              v === undefined || v === null || (c.type === 'float8' && Number.isNaN(v)) ? null
              : c.type === 'date' ? isoFromDay(v as number)
              : c.type === 'bool' ? Boolean(v)
              : v;
          }
          return out;
        });
        await client.query(text, params);
      }
    },
    async insertBytes(table, idColumn, bytesColumn, id, bytes) {
      await client.query(`insert into ${table} (${idColumn}, ${bytesColumn}) values ($1, $2)`, [id, Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength)]);
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
