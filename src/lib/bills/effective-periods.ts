/**
 * Effective day ranges of one meter's bills. Periods include both dates; when a bill starts on
 * the previous bill's end date (a shared read date) the shared day belongs to the earlier bill,
 * so the later bill's effective range starts one day later and no day is counted twice. Real
 * overlaps beyond a shared read date are left as billed (and flagged by the series checks).
 */
import type { BillPeriod } from './bill';

export interface EffectivePeriods {
  /** Effective first day per bill, aligned with the input order. */
  start: Int32Array;
  /** Effective last day per bill; start − 1 when the bill has no effective day. */
  end: Int32Array;
  /** Effective days per bill (0 for a bill whose start is after its end). */
  days: Int32Array;
  /** Input indices sorted by start day, then end day, then input position. */
  order: Int32Array;
}

/** Input indices of `bills` sorted by (startDay, endDay, index). */
export function chronologicalOrder(bills: readonly BillPeriod[]): Int32Array {
  const order = new Int32Array(bills.length);
  let sorted = true;
  for (let i = 0; i < order.length; i++) {
    order[i] = i;
    if (i > 0) {
      const x = bills[i - 1] as BillPeriod;
      const y = bills[i] as BillPeriod;
      if (x.startDay > y.startDay || (x.startDay === y.startDay && x.endDay > y.endDay)) sorted = false;
    }
  }
  // Bills usually arrive in date order: skip the comparator sort then.
  if (sorted) return order;
  order.sort((a, b) => {
    const x = bills[a] as BillPeriod;
    const y = bills[b] as BillPeriod;
    return x.startDay - y.startDay || x.endDay - y.endDay || a - b;
  });
  return order;
}

/**
 * Effective ranges per bill. A bill whose start is after its end gets 0 days and is ignored as a
 * "previous bill" for the shared-read-date rule.
 * @example effectivePeriods([{ startDay: 0, endDay: 30 }, { startDay: 30, endDay: 59 }]).days // [31, 29]
 */
export function effectivePeriods(bills: readonly BillPeriod[]): EffectivePeriods {
  const n = bills.length;
  const order = chronologicalOrder(bills);
  const start = new Int32Array(n);
  const end = new Int32Array(n);
  const days = new Int32Array(n);
  let prevEnd = Number.NaN;
  for (let k = 0; k < n; k++) {
    const i = order[k] as number;
    const b = bills[i] as BillPeriod;
    if (b.startDay > b.endDay) {
      start[i] = b.startDay;
      end[i] = b.startDay - 1;
      continue;
    }
    const s = b.startDay === prevEnd ? b.startDay + 1 : b.startDay;
    start[i] = s;
    end[i] = b.endDay;
    days[i] = Math.max(0, b.endDay - s + 1);
    prevEnd = b.endDay;
  }
  return { start, end, days, order };
}

export type UsePerDayResult = { ok: true; value: number } | { ok: false; reason: 'missing-quantity' | 'no-days' };

/**
 * Use per day of a bill over its effective days, UPD = quantity / days (CalTRACK 2.0 §3.3.3).
 * @example usePerDay(310, 31) // { ok: true, value: 10 }
 */
export function usePerDay(quantity: number | null, effectiveDays: number): UsePerDayResult {
  if (quantity === null || !Number.isFinite(quantity)) return { ok: false, reason: 'missing-quantity' };
  if (effectiveDays <= 0) return { ok: false, reason: 'no-days' };
  return { ok: true, value: quantity / effectiveDays };
}
