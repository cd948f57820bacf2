/**
 * Classifies validated bill rows against the bills already stored (new, changed, unchanged),
 * folds exact duplicates within the file, refuses conflicting ones, and runs the series checks
 * of each meter on the bills as they would be after the import. Flags, never drops: every
 * finding on a row of this file becomes a problem with its file line.
 */
import type { Commodity } from '../../lib/domain';
import { checkBillSeries, type BillFlagCode, type BillRow } from '../../lib/bills';
import { isoFromDay } from '../../lib/weather/day-number';

import { groupByMeter, type BillRowStore } from './row-store';

/** A problem on one line of an imported file (row-level codes from the parser, series codes from here). */
export interface ImportProblem {
  row: number;
  column: string | null;
  code: string;
  message: string;
  severity: 'error' | 'warning';
}

export interface ImportMeter {
  id: string;
  code: string;
  commodity: Commodity;
}

export interface ExistingBill {
  id: number;
  meter: number;
  start: number;
  end: number;
  quantity: number;
  unit: string;
  cost: number | null;
  demand: number | null;
  estimated: boolean;
}

export const enum RowClass {
  New = 0,
  Changed = 1,
  Unchanged = 2,
  /** A repeat of an earlier line with the same values: counted once. */
  Repeat = 3,
  /** A repeat of an earlier line with other values: refused. */
  Conflict = 4,
}

export interface Analysis {
  cls: Uint8Array;
  /** For changed and unchanged rows, the id of the stored bill. */
  existingId: Float64Array;
  problems: ImportProblem[];
  counts: { new: number; changed: number; unchanged: number; conflicts: number; repeats: number };
  /** Row indices grouped by meter (see groupByMeter), reused by the writer. */
  groups: { offsets: Int32Array; order: Int32Array };
}

/** Series findings worth reporting on an import (row-level ones come from the row validator). */
const SERIES_CODES = new Set<BillFlagCode>(['overlapping-periods', 'gap', 'short-period', 'long-period', 'outlier', 'estimated-read']);

function same(a: number, b: number | null): boolean {
  if (b === null) return Number.isNaN(a);
  if (Number.isNaN(a)) return false;
  return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

export function analyzeRows(rows: BillRowStore, meters: readonly ImportMeter[], existing: readonly ExistingBill[], todayDay: number): Analysis {
  const cls = new Uint8Array(rows.length);
  const existingId = new Float64Array(rows.length).fill(Number.NaN);
  const problems: ImportProblem[] = [];
  const counts = { new: 0, changed: 0, unchanged: 0, conflicts: 0, repeats: 0 };
  const { offsets, order } = groupByMeter(rows, meters.length);

  const stored: ExistingBill[][] = Array.from({ length: meters.length }, () => []);
  for (const b of existing) stored[b.meter]!.push(b);

  for (let m = 0; m < meters.length; m++) {
    const from = offsets[m]!;
    const to = offsets[m + 1]!;
    if (from === to) continue;
    const byPeriod = new Map<number, ExistingBill>();
    for (const b of stored[m]!) byPeriod.set(b.start * 100_000 + (b.end - b.start), b);
    const seen = new Map<number, number>();
    const series: BillRow[] = [];
    const seriesRow: number[] = []; // file row index, or -1 for a stored bill
    const replaced = new Set<number>();
    for (let k = from; k < to; k++) {
      const i = order[k]!;
      const key = rows.start[i]! * 100_000 + (rows.end[i]! - rows.start[i]!);
      const first = seen.get(key);
      if (first !== undefined) {
        const identical =
          rows.quantity[i] === rows.quantity[first] &&
          rows.unit[i] === rows.unit[first] &&
          Object.is(rows.cost[i], rows.cost[first]) &&
          Object.is(rows.demand[i], rows.demand[first]) &&
          rows.estimated[i] === rows.estimated[first];
        const period = `${isoFromDay(rows.start[i]!)} to ${isoFromDay(rows.end[i]!)}`;
        if (identical) {
          cls[i] = RowClass.Repeat;
          counts.repeats++;
          problems.push({ row: rows.line[i]!, column: null, code: 'duplicate-period', message: `Meter ${meters[m]!.code}, ${period}: the same bill as line ${rows.line[first]}; counted once.`, severity: 'warning' });
        } else {
          cls[i] = RowClass.Conflict;
          counts.conflicts++;
          problems.push({ row: rows.line[i]!, column: null, code: 'duplicate-period', message: `Meter ${meters[m]!.code}, ${period}: line ${rows.line[first]} has the same period with other values. Keep one of them.`, severity: 'error' });
        }
        continue;
      }
      seen.set(key, i);
      const old = byPeriod.get(key);
      if (old) {
        existingId[i] = old.id;
        replaced.add(old.id);
        const unchanged =
          same(rows.quantity[i]!, old.quantity) &&
          rows.unitOf(i) === old.unit &&
          same(rows.cost[i]!, old.cost) &&
          same(rows.demand[i]!, old.demand) &&
          (rows.estimated[i] === 1) === old.estimated;
        cls[i] = unchanged ? RowClass.Unchanged : RowClass.Changed;
        if (unchanged) counts.unchanged++;
        else counts.changed++;
      } else {
        cls[i] = RowClass.New;
        counts.new++;
      }
      series.push({ startDay: rows.start[i]!, endDay: rows.end[i]!, quantity: rows.quantity[i]!, cost: Number.isNaN(rows.cost[i]!) ? null : rows.cost[i]!, estimated: rows.estimated[i] === 1 });
      seriesRow.push(i);
    }
    for (const b of stored[m]!) {
      if (replaced.has(b.id)) continue;
      series.push({ startDay: b.start, endDay: b.end, quantity: b.quantity, cost: b.cost, estimated: b.estimated });
      seriesRow.push(-1);
    }
    const flags = checkBillSeries(series, { commodity: meters[m]!.commodity, todayDay, billing: 'monthly' });
    for (const f of flags) {
      if (!SERIES_CODES.has(f.code)) continue;
      // Report a finding on the first row of this file it concerns; findings only about stored bills are not this import's.
      const fileRows = f.bills.map((b) => seriesRow[b]!).filter((r) => r >= 0);
      if (fileRows.length === 0) continue;
      const line = Math.min(...fileRows.map((r) => rows.line[r]!));
      problems.push({ row: line, column: null, code: f.code, message: `Meter ${meters[m]!.code}: ${f.message}`, severity: 'warning' });
    }
  }
  return { cls, existingId, problems, counts, groups: { offsets, order } };
}
