/**
 * Calendar dates as whole day numbers (days since 1970-01-01, UTC), so that bill periods and
 * daily weather can be indexed with plain integers and typed arrays.
 */
import { z } from 'zod';

const MS_PER_DAY = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Day number of an ISO calendar date `YYYY-MM-DD`, or null when the text is not a real date
 * (e.g. `2023-02-30`).
 * @example isoDateToDay('1970-01-02') // 1
 */
export function isoDateToDay(iso: string): number | null {
  const m = ISO_DATE.exec(iso.trim());
  if (m === null) return null;
  const year = Number(m[1]);
  const month = Number(m[2]);
  const day = Number(m[3]);
  if (month < 1 || month > 12 || day < 1 || day > 31) return null;
  const ms = Date.UTC(year, month - 1, day);
  const back = new Date(ms);
  if (back.getUTCFullYear() !== year || back.getUTCMonth() !== month - 1 || back.getUTCDate() !== day) {
    return null;
  }
  return Math.round(ms / MS_PER_DAY);
}

/**
 * ISO calendar date `YYYY-MM-DD` of a day number.
 * @example dayToIsoDate(0) // '1970-01-01'
 */
export function dayToIsoDate(dayNumber: number): string {
  return new Date(dayNumber * MS_PER_DAY).toISOString().slice(0, 10);
}

/** Calendar year of a day number. */
export function yearOfDay(dayNumber: number): number {
  return new Date(dayNumber * MS_PER_DAY).getUTCFullYear();
}

/** Day number of 1 January of `year`. */
export function firstDayOfYear(year: number): number {
  return Math.round(Date.UTC(year, 0, 1) / MS_PER_DAY);
}

/** zod schema for an ISO date that is a real calendar date. */
export const isoDateSchema = z
  .string()
  .refine((s) => isoDateToDay(s) !== null, { message: 'expected a real calendar date YYYY-MM-DD' });
