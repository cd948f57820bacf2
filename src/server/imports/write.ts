/**
 * The write side of a bill import, in one transaction: new bills by COPY, changed bills updated
 * with their prior values kept for undo; and the undo itself. Plain SQL and binary COPY through rawTransaction
 * because these statements move up to a million rows.
 */
import { BinaryCopyWriter, uuidBytes, type CopyType } from '../../db/binary-copy';
import type { RawTx } from '../../db/raw-tx';
import { UNITS } from '../../lib/domain';
import { RowClass, type Analysis, type ExistingBill, type ImportMeter } from './analyze';
import type { BillRowStore } from './row-store';
import type { ImportProgress } from './progress';
import { touch } from './progress';

const COPY_CHUNK = 100_000;
const BILL_COLUMNS = ['meter_id', 'period_start', 'period_end', 'quantity', 'unit', 'cost', 'demand_kw', 'estimated', 'import_id', 'created_import_id'];
const BILL_TYPES: CopyType[] = ['uuid', 'date', 'date', 'float8', 'text', 'float8', 'float8', 'bool', 'uuid', 'uuid'];
const encoder = new TextEncoder();

/** Stored bills of the given meters, with dates as day numbers. */
export async function loadExisting(tx: RawTx, meters: readonly ImportMeter[], meterIndex: ReadonlyMap<string, number>): Promise<ExistingBill[]> {
  if (meters.length === 0) return [];
  const rows = await tx.query<{ id: number | string; meter_id: string; s: number; e: number; quantity: number; unit: string; cost: number | null; demand_kw: number | null; estimated: boolean }>(
    `select id, meter_id, (period_start - date '1970-01-01') as s, (period_end - date '1970-01-01') as e,
            quantity, unit, cost, demand_kw, estimated
       from bill where meter_id = any($1::uuid[])`,
    [meters.map((m) => m.id)],
  );
  return rows.map((r) => ({
    id: Number(r.id),
    meter: meterIndex.get(r.meter_id)!,
    start: Number(r.s),
    end: Number(r.e),
    quantity: r.quantity,
    unit: r.unit,
    cost: r.cost,
    demand: r.demand_kw,
    estimated: r.estimated,
  }));
}

export async function writeImport(
  tx: RawTx,
  args: { importId: string; rows: BillRowStore; meters: readonly ImportMeter[]; analysis: Analysis; progress: ImportProgress },
): Promise<void> {
  const { importId, rows, meters, analysis, progress } = args;
  const { cls } = analysis;
  // 1. New bills, loaded in chunks. Rows go in meter-id order, then by date: the unique index then
  // grows at its end, which is much faster than scattered inserts.
  const { offsets, order } = analysis.groups;
  const meterOrder = meters.map((_, m) => m).sort((a, b) => (meters[a]!.id < meters[b]!.id ? -1 : meters[a]!.id > meters[b]!.id ? 1 : 0));
  const picked = new Int32Array(analysis.counts.new);
  let n = 0;
  for (const m of meterOrder)
    for (let k = offsets[m]!; k < offsets[m + 1]!; k++) {
      const i = order[k]!;
      if (cls[i] === RowClass.New) picked[n++] = i;
    }
  const uuid = meters.map((m) => uuidBytes(m.id));
  const importBytes = uuidBytes(importId);
  const unitBytes = UNITS.map((u) => encoder.encode(u));
  for (let from = 0; from < n; from += COPY_CHUNK) {
    const idx = picked.subarray(from, Math.min(n, from + COPY_CHUNK));
    if (tx.copyBinary) {
      // PGlite: encode straight from the typed arrays, no per-row objects.
      const w = new BinaryCopyWriter(idx.length * 160);
      for (const i of idx) {
        w.row(BILL_COLUMNS.length);
        w.uuid(uuid[rows.meter[i]!]!);
        w.date(rows.start[i]!);
        w.date(rows.end[i]!);
        w.float8(rows.quantity[i]!);
        w.text(unitBytes[rows.unit[i]!]!);
        w.float8(rows.cost[i]!);
        w.float8(rows.demand[i]!);
        w.bool(rows.estimated[i] === 1);
        w.uuid(importBytes);
        w.uuid(importBytes);
      }
      await tx.copyBinary('bill', BILL_COLUMNS, w.finish());
    } else {
      const col = <T>(f: (i: number) => T): T[] => Array.from(idx, f);
      const values: unknown[][] = [
        col((i) => meters[rows.meter[i]!]!.id),
        col((i) => rows.start[i]!),
        col((i) => rows.end[i]!),
        col((i) => rows.quantity[i]!),
        col((i) => rows.unitOf(i)),
        col((i) => rows.cost[i]!),
        col((i) => rows.demand[i]!),
        col((i) => rows.estimated[i]!),
        col(() => importId),
        col(() => importId),
      ];
      await tx.copyColumns('bill', BILL_COLUMNS.map((name, k) => ({ name, type: BILL_TYPES[k]!, values: values[k]! })), idx.length);
    }
    touch(progress, { rowsStored: from + idx.length });
  }
  const stored = n;

  // 2. Changed bills: keep the prior row for undo, then update.
  const ids: number[] = [];
  const q: number[] = [];
  const unit: string[] = [];
  const cost: (number | null)[] = [];
  const demand: (number | null)[] = [];
  const est: boolean[] = [];
  for (let i = 0; i < rows.length; i++) {
    if (cls[i] !== RowClass.Changed) continue;
    ids.push(analysis.existingId[i]!);
    q.push(rows.quantity[i]!);
    unit.push(rows.unitOf(i));
    cost.push(Number.isNaN(rows.cost[i]!) ? null : rows.cost[i]!);
    demand.push(Number.isNaN(rows.demand[i]!) ? null : rows.demand[i]!);
    est.push(rows.estimated[i] === 1);
  }
  if (ids.length > 0) {
    await tx.query(
      `insert into import_change (import_id, bill_id, action, before)
       select $1, b.id, 'update', jsonb_build_object('quantity', b.quantity, 'unit', b.unit, 'cost', b.cost, 'demandKw', b.demand_kw,
              'estimated', b.estimated, 'importId', b.import_id, 'updatedAt', b.updated_at)
         from bill b where b.id = any($2::int8[])`,
      [importId, ids],
    );
    await tx.query(
      `update bill set quantity = u.q, unit = u.unit, cost = u.cost, demand_kw = u.demand, estimated = u.est, import_id = $1, updated_at = now()
         from unnest($2::int8[], $3::float8[], $4::text[], $5::float8[], $6::float8[], $7::bool[]) as u(id, q, unit, cost, demand, est)
        where bill.id = u.id`,
      [importId, ids, q, unit, cost, demand, est],
    );
    touch(progress, { rowsStored: stored + ids.length });
  }
}

/**
 * Undoes a committed import: its new bills are deleted and the bills it changed get their prior
 * values back. Refused (returns the later import's id) when a later import changed any of them.
 */
export async function undoImport(tx: RawTx, importId: string): Promise<{ ok: true; removed: number; restored: number } | { ok: false; laterImport: string }> {
  const [later] = await tx.query<{ import_id: string }>(
    `select b.import_id from bill b
      where (b.created_import_id = $1 or b.id in (select bill_id from import_change where import_id = $1))
        and b.import_id is distinct from $1
      limit 1`,
    [importId],
  );
  if (later) return { ok: false, laterImport: later.import_id };
  const removed = await tx.query(`delete from bill where created_import_id = $1 returning id`, [importId]);
  const restored = await tx.query(
    `update bill b set quantity = (c.before->>'quantity')::float8, unit = c.before->>'unit', cost = (c.before->>'cost')::float8,
            demand_kw = (c.before->>'demandKw')::float8, estimated = (c.before->>'estimated')::bool,
            import_id = (c.before->>'importId')::uuid, updated_at = (c.before->>'updatedAt')::timestamptz
       from import_change c
      where c.import_id = $1 and c.bill_id = b.id
      returning b.id`,
    [importId],
  );
  return { ok: true, removed: removed.length, restored: restored.length };
}
