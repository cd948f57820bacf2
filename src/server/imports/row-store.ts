/**
 * Validated bill rows held as columns of typed arrays (about 50 bytes a row), so a file of a
 * million bills fits in memory without a million objects.
 */
import { UNITS, type Unit } from '../../lib/domain';

const UNIT_INDEX = new Map<Unit, number>(UNITS.map((u, i) => [u, i]));

export class BillRowStore {
  length = 0;
  meter = new Int32Array(1024);
  start = new Int32Array(1024);
  end = new Int32Array(1024);
  line = new Int32Array(1024);
  quantity = new Float64Array(1024);
  /** NaN = no cost stated */
  cost = new Float64Array(1024);
  /** NaN = no demand stated */
  demand = new Float64Array(1024);
  unit = new Uint8Array(1024);
  estimated = new Uint8Array(1024);

  private grow(): void {
    const n = this.meter.length * 2;
    const g = <T extends Int32Array | Float64Array | Uint8Array>(a: T): T => {
      const b = new (a.constructor as new (n: number) => T)(n);
      b.set(a);
      return b;
    };
    this.meter = g(this.meter);
    this.start = g(this.start);
    this.end = g(this.end);
    this.line = g(this.line);
    this.quantity = g(this.quantity);
    this.cost = g(this.cost);
    this.demand = g(this.demand);
    this.unit = g(this.unit);
    this.estimated = g(this.estimated);
  }

  push(r: { meter: number; start: number; end: number; line: number; quantity: number; cost: number | undefined; demand: number | undefined; unit: Unit; estimated: boolean }): void {
    if (this.length === this.meter.length) this.grow();
    const i = this.length++;
    this.meter[i] = r.meter;
    this.start[i] = r.start;
    this.end[i] = r.end;
    this.line[i] = r.line;
    this.quantity[i] = r.quantity;
    this.cost[i] = r.cost ?? Number.NaN;
    this.demand[i] = r.demand ?? Number.NaN;
    this.unit[i] = UNIT_INDEX.get(r.unit)!;
    this.estimated[i] = r.estimated ? 1 : 0;
  }

  unitOf(i: number): Unit {
    return UNITS[this.unit[i]!]!;
  }
}

/** Row indices grouped by meter (counting sort), each group ordered by start then end date. */
export function groupByMeter(rows: BillRowStore, meterCount: number): { offsets: Int32Array; order: Int32Array } {
  const offsets = new Int32Array(meterCount + 1);
  for (let i = 0; i < rows.length; i++) offsets[rows.meter[i]! + 1]!++;
  for (let m = 0; m < meterCount; m++) offsets[m + 1]! += offsets[m]!;
  const fill = offsets.slice(0, meterCount);
  const order = new Int32Array(rows.length);
  for (let i = 0; i < rows.length; i++) order[fill[rows.meter[i]!]!++] = i;
  for (let m = 0; m < meterCount; m++) {
    const from = offsets[m]!;
    const to = offsets[m + 1]!;
    if (to - from < 2) continue;
    const group = Array.from(order.subarray(from, to)).sort((a, b) => rows.start[a]! - rows.start[b]! || rows.end[a]! - rows.end[b]! || rows.line[a]! - rows.line[b]!);
    order.set(group, from);
  }
  return { offsets, order };
}

/**
 * ISO date text → day number, memoized: a file of a million bills has only a few thousand
 * distinct dates, and the conversion is on the hot path of every row.
 */
export class DateMemo {
  private readonly toDay = new Map<string, number>();
  constructor(private readonly dayOf: (iso: string) => number | null) {}

  day(iso: string): number {
    let d = this.toDay.get(iso);
    if (d === undefined) {
      d = this.dayOf(iso)!;
      this.toDay.set(iso, d);
    }
    return d;
  }
}
