/**
 * Calendar dates as whole day numbers (days since 1970-01-01, proleptic Gregorian), so that bill
 * periods and daily weather can be indexed with plain integers and typed arrays. The conversions
 * are the shared ones of src/lib/weather/day-number.ts (H. Hinnant's integer algorithms).
 */
import { z } from 'zod';
import { dayFromCivil, dayFromIso, isoFromDay, yearOfDay as yearOf } from '../weather/day-number';

/**
 * Day number of an ISO calendar date `YYYY-MM-DD` (surrounding spaces allowed), or null when the
 * text is not a real date (e.g. `2023-02-30`).
 * @example isoDateToDay('1970-01-02') // 1
 */
export function isoDateToDay(iso: string): number | null {
  return dayFromIso(iso.trim());
}

/**
 * ISO calendar date `YYYY-MM-DD` of a day number (years 0–9999).
 * @example dayToIsoDate(0) // '1970-01-01'
 */
export function dayToIsoDate(dayNumber: number): string {
  return isoFromDay(dayNumber);
}

/** Calendar year of a day number. */
export function yearOfDay(dayNumber: number): number {
  return yearOf(dayNumber);
}

/** Day number of 1 January of `year`. */
export function firstDayOfYear(year: number): number {
  return dayFromCivil(year, 1, 1);
}

/** zod schema for an ISO date that is a real calendar date. */
export const isoDateSchema = z
  .string()
  .refine((s) => isoDateToDay(s) !== null, { message: 'expected a real calendar date YYYY-MM-DD' });
