/**
 * Use over any window of days (a fiscal year, the trailing 12 months, a calendar year): each bill
 * contributes its quantity × (days inside the window / its effective days), the even spread used
 * by calendarization. The result states how much of the window the bills cover.
 */
import { dayFromCivil, firstDayOfMonthIndex } from '../weather/day-number';
import type { BillRow } from './bill';
import { type CalendarizeOptions, usableQuantity } from './calendarize';
import { addCompensated } from './compensated-sum';
import { effectivePeriods } from './effective-periods';

export interface DayWindow {
  fromDay: number;
  toDay: number;
}

export type WindowTotal =
  | {
      ok: true;
      total: number;
      windowDays: number;
      /** Days of the window covered by at least one bill with a quantity. */
      coveredDays: number;
      /** coveredDays / windowDays */
      coverage: number;
      /** Bills that contributed. */
      billsUsed: number;
    }
  | { ok: false; reason: 'empty-window' };

/**
 * US federal fiscal year `fy`: 1 October of fy − 1 to 30 September of fy.
 * Source: 31 U.S.C. 1102 (the fiscal year begins on October 1 and ends on September 30).
 * @example federalFiscalYear(2024) // 2023-10-01 … 2024-09-30
 */
export function federalFiscalYear(fy: number): DayWindow {
  return { fromDay: dayFromCivil(fy - 1, 10, 1), toDay: dayFromCivil(fy, 9, 30) };
}

/** Calendar year: 1 January to 31 December. */
export function calendarYear(year: number): DayWindow {
  return { fromDay: dayFromCivil(year, 1, 1), toDay: dayFromCivil(year, 12, 31) };
}

/**
 * The `months` whole calendar months ending with (and including) `lastYear`-`lastMonth`.
 * @example trailingMonths(2024, 6) // 2023-07-01 … 2024-06-30
 */
export function trailingMonths(lastYear: number, lastMonth: number, months = 12): DayWindow {
  const lastIndex = lastYear * 12 + lastMonth - 1;
  return { fromDay: firstDayOfMonthIndex(lastIndex - months + 1), toDay: firstDayOfMonthIndex(lastIndex + 1) - 1 };
}

/**
 * Total use of one meter's bills over [fromDay, toDay], both inclusive.
 * @example sumOverWindow(bills, federalFiscalYear(2024)) // { ok: true, total, coverage, … }
 */
export function sumOverWindow(
  bills: readonly BillRow[],
  window: DayWindow,
  options: CalendarizeOptions = {},
): WindowTotal {
  const { fromDay, toDay } = window;
  const windowDays = toDay - fromDay + 1;
  if (windowDays <= 0) return { ok: false, reason: 'empty-window' };
  const eff = effectivePeriods(bills);
  const covered = new Uint8Array(windowDays);
  const sum = new Float64Array(1);
  const err = new Float64Array(1);
  let billsUsed = 0;
  for (let i = 0; i < bills.length; i++) {
    const days = eff.days[i] as number;
    const bill = bills[i] as BillRow;
    if (days === 0 || !usableQuantity(bill, options)) continue;
    const s = Math.max(eff.start[i] as number, fromDay);
    const e = Math.min(eff.end[i] as number, toDay);
    if (e < s) continue;
    covered.fill(1, s - fromDay, e - fromDay + 1);
    addCompensated(sum, err, 0, ((bill.quantity as number) * (e - s + 1)) / days);
    billsUsed++;
  }
  let coveredDays = 0;
  for (let d = 0; d < windowDays; d++) coveredDays += covered[d] as number;
  return {
    ok: true,
    total: (sum[0] as number) + (err[0] as number),
    windowDays,
    coveredDays,
    coverage: coveredDays / windowDays,
    billsUsed,
  };
}
