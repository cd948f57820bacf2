/**
 * A month as calendar weeks for the reservation calendar: ISO 8601 weeks (Monday first), each
 * day an ISO date with whether it belongs to the month shown, and which holds cover it.
 */
import { civilFromDay, dayFromCivil, daysInMonth, isoFromDay } from '../weather/day-number';
import { rangesOverlap, type DateRange } from './loan-dates';

export interface GridDay {
  iso: string;
  inMonth: boolean;
}

/** Day of the week of a day number, ISO 8601: Monday 1 … Sunday 7 (1970-01-01 was a Thursday). */
export function isoWeekday(dayNumber: number): number {
  return ((((dayNumber + 3) % 7) + 7) % 7) + 1;
}

/**
 * The weeks (Monday to Sunday) that contain the days of `month` (1–12) of `year`, padded with
 * the neighbouring months' days.
 * @example monthGrid(2027, 2).length // 4 (February 2027 starts on a Monday and has 28 days)
 */
export function monthGrid(year: number, month: number): GridDay[][] {
  const first = dayFromCivil(year, month, 1);
  const last = first + daysInMonth(year, month) - 1;
  const from = first - (isoWeekday(first) - 1);
  const to = last + (7 - isoWeekday(last));
  const weeks: GridDay[][] = [];
  for (let d = from; d <= to; d += 7) {
    const week: GridDay[] = [];
    for (let k = 0; k < 7; k++) {
      const c = civilFromDay(d + k);
      week.push({ iso: isoFromDay(d + k), inMonth: c.month === month && c.year === year });
    }
    weeks.push(week);
  }
  return weeks;
}

/** The holds that cover day `iso`. */
export function holdsOn<T extends DateRange>(iso: string, holds: readonly T[]): T[] {
  return holds.filter((h) => h.start <= iso && iso <= h.end);
}

/** The holds that share a day with `range` (what the database would refuse). */
export function conflictingHolds<T extends DateRange>(range: DateRange, holds: readonly T[]): T[] {
  return holds.filter((h) => rangesOverlap(range, h));
}

/** Year and month `delta` months from the given one. */
export function shiftMonth(year: number, month: number, delta: number): { year: number; month: number } {
  const index = year * 12 + (month - 1) + delta;
  return { year: Math.floor(index / 12), month: (index % 12 + 12) % 12 + 1 };
}
