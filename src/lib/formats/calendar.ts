/**
 * Calendar helpers for the format parsers on plain integers, no Date objects and no time zones.
 * Day numbers (days since 1970-01-01) and month lengths come from the weather module's
 * day-number.ts (Hinnant's days_from_civil / civil_from_days); this file adds what parsing and
 * messages need: a fast ISO formatter, month names and the ISO weekday.
 */
import { civilFromDay } from '../weather/day-number';

export { civilFromDay, dayFromCivil, daysInMonth, isLeapYear } from '../weather/day-number';

const PAD2: readonly string[] = Array.from({ length: 32 }, (_, i) => (i < 10 ? `0${i}` : String(i)));

export const MONTH_NAMES = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
] as const;

/** `yyyy-mm-dd` for a valid civil date with a four-digit year (table lookups, no padStart). */
export function isoDate(year: number, month: number, day: number): string {
  return `${year}-${PAD2[month]}-${PAD2[day]}`;
}

/** ISO date of a day number (days since 1970-01-01). */
export function isoFromDays(days: number): string {
  const c = civilFromDay(days);
  return isoDate(c.year, c.month, c.day);
}

/** ISO weekday (Monday = 1 ... Sunday = 7) of a day number; 1970-01-01 was a Thursday. */
export function isoWeekday(days: number): number {
  return ((((days + 3) % 7) + 7) % 7) + 1;
}
