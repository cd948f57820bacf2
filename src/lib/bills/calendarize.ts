/**
 * Calendarization: each bill's quantity is spread evenly over its effective days and summed per
 * calendar month (common practice for monthly charts and fiscal-year totals). The total is
 * conserved: the last month a bill touches receives the bill's remainder, so the monthly sums of
 * the bills used add up to their quantities.
 */
import { firstDayOfMonthIndex, monthIndexOfDay } from '../weather/day-number';
import { type BillRow, hasQuantity } from './bill';
import { addCompensated } from './compensated-sum';
import { effectivePeriods } from './effective-periods';

export interface CalendarizeOptions {
  /** Treat a zero quantity as missing (CalTRACK 2.0 §2.2.1.3 does so for electricity). */
  zeroIsMissing?: boolean;
}

export interface MonthTotal {
  year: number;
  /** 1-12 */
  month: number;
  quantity: number;
  /** Days of the month covered by at least one bill with a quantity. */
  coveredDays: number;
  daysInMonth: number;
}

/** True when the bill's quantity takes part in sums. */
export function usableQuantity(bill: BillRow, options: CalendarizeOptions): boolean {
  return hasQuantity(bill) && !(options.zeroIsMissing === true && bill.quantity === 0);
}

/**
 * Monthly totals from the first to the last month any usable bill touches, oldest first; months
 * without bills appear with quantity 0 and coveredDays 0.
 * @example calendarizeMonthly([{ startDay: d('2024-01-17'), endDay: d('2024-02-15'), quantity: 300 }])
 *   // January 15 days → 150, February 15 days → 150
 */
export function calendarizeMonthly(bills: readonly BillRow[], options: CalendarizeOptions = {}): MonthTotal[] {
  const eff = effectivePeriods(bills);
  let firstDay = Infinity;
  let lastDay = -Infinity;
  for (let i = 0; i < bills.length; i++) {
    if ((eff.days[i] as number) === 0 || !usableQuantity(bills[i] as BillRow, options)) continue;
    firstDay = Math.min(firstDay, eff.start[i] as number);
    lastDay = Math.max(lastDay, eff.end[i] as number);
  }
  if (firstDay > lastDay) return [];
  const m0 = monthIndexOfDay(firstDay);
  const nMonths = monthIndexOfDay(lastDay) - m0 + 1;
  const monthStart = new Float64Array(nMonths + 1);
  for (let m = 0; m <= nMonths; m++) monthStart[m] = firstDayOfMonthIndex(m0 + m);
  const sum = new Float64Array(nMonths);
  const err = new Float64Array(nMonths);
  const covered = new Uint8Array(lastDay - firstDay + 1);
  for (let i = 0; i < bills.length; i++) {
    const days = eff.days[i] as number;
    const bill = bills[i] as BillRow;
    if (days === 0 || !usableQuantity(bill, options)) continue;
    const s = eff.start[i] as number;
    const e = eff.end[i] as number;
    covered.fill(1, s - firstDay, e - firstDay + 1);
    const q = bill.quantity as number;
    const mEnd = monthIndexOfDay(e) - m0;
    let left = q;
    for (let m = monthIndexOfDay(s) - m0; m <= mEnd; m++) {
      const overlap = Math.min(e, (monthStart[m + 1] as number) - 1) - Math.max(s, monthStart[m] as number) + 1;
      const share = m === mEnd ? left : (q * overlap) / days;
      left -= share;
      addCompensated(sum, err, m, share);
    }
  }
  const out: MonthTotal[] = [];
  for (let m = 0; m < nMonths; m++) {
    const from = monthStart[m] as number;
    const to = (monthStart[m + 1] as number) - 1;
    let coveredDays = 0;
    for (let d = Math.max(from, firstDay); d <= Math.min(to, lastDay); d++) {
      coveredDays += covered[d - firstDay] as number;
    }
    const mi = m0 + m;
    const year = Math.floor(mi / 12);
    out.push({
      year,
      month: mi - year * 12 + 1,
      quantity: (sum[m] as number) + (err[m] as number),
      coveredDays,
      daysInMonth: to - from + 1,
    });
  }
  return out;
}
