/**
 * Loan dates: inclusive calendar days (a loan of 3–5 March holds the kit on the 3rd, 4th and 5th),
 * checked the same way in the request form and on the server. Dates are ISO `YYYY-MM-DD` and
 * counted as day numbers (src/lib/weather/day-number.ts), so no time zone can shift them.
 */
import { formatDate } from '../format';
import { dayFromIso, isoFromDay } from '../weather/day-number';

/** The longest loan, in days (a policy of this library: a walkthrough season, not a permanent issue). */
export const MAX_LOAN_DAYS = 60;
/** How far ahead a loan may start, in days (policy: calibration and repairs are not planned further out). */
export const MAX_LEAD_DAYS = 365;

export interface DateRange {
  start: string;
  end: string;
}

export type LoanDatesCheck =
  | { ok: true; days: number }
  | { ok: false; reason: 'not-a-date' | 'end-before-start' | 'start-in-past' | 'too-long' | 'too-far-ahead'; field: 'start' | 'end'; message: string };

/** Inclusive count of days from `start` to `end` (1 for a one-day loan); null for a bad date. */
export function loanDays(start: string, end: string): number | null {
  const a = dayFromIso(start);
  const b = dayFromIso(end);
  return a === null || b === null ? null : b - a + 1;
}

/** `iso` moved by `days` (negative goes back). @throws on a date that does not exist (a bug). */
export function addDays(iso: string, days: number): string {
  const d = dayFromIso(iso);
  if (d === null) throw new Error(`not an ISO date: ${iso}`);
  return isoFromDay(d + days);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). @throws on a bad date (a bug). */
export function daysBetween(from: string, to: string): number {
  const a = dayFromIso(from);
  const b = dayFromIso(to);
  if (a === null || b === null) throw new Error(`not an ISO date: ${from} / ${to}`);
  return b - a;
}

/** True when two inclusive ranges share at least one day (the constraint's `daterange(…,'[]') &&`). */
export function rangesOverlap(a: DateRange, b: DateRange): boolean {
  return a.start <= b.end && b.start <= a.end;
}

/** `3 Mar 2026 – 5 Mar 2026`, or one date for a one-day range. */
export function formatRange(r: DateRange): string {
  return r.start === r.end ? formatDate(r.start) : `${formatDate(r.start)} – ${formatDate(r.end)}`;
}

/**
 * Checks the dates of a loan request: real dates, start ≤ end, at most MAX_LOAN_DAYS days, and
 * for a new request a start neither before `today` nor more than MAX_LEAD_DAYS ahead.
 * @example checkLoanDates({ start: '2026-03-03', end: '2026-03-05' }, '2026-03-01') // { ok: true, days: 3 }
 */
export function checkLoanDates(r: DateRange, today: string, isNew = true): LoanDatesCheck {
  const a = dayFromIso(r.start);
  const b = dayFromIso(r.end);
  const t = dayFromIso(today);
  if (a === null) return { ok: false, reason: 'not-a-date', field: 'start', message: 'The first day is not a date (use YYYY-MM-DD).' };
  if (b === null) return { ok: false, reason: 'not-a-date', field: 'end', message: 'The last day is not a date (use YYYY-MM-DD).' };
  if (t === null) throw new Error(`not an ISO date: ${today}`);
  if (b < a) return { ok: false, reason: 'end-before-start', field: 'end', message: `The last day (${formatDate(r.end)}) is before the first day (${formatDate(r.start)}).` };
  if (isNew && a < t) return { ok: false, reason: 'start-in-past', field: 'start', message: `The first day (${formatDate(r.start)}) is in the past: a new loan starts today (${formatDate(today)}) or later.` };
  if (isNew && a - t > MAX_LEAD_DAYS) return { ok: false, reason: 'too-far-ahead', field: 'start', message: `A loan may start at most ${MAX_LEAD_DAYS} days ahead (by ${formatDate(isoFromDay(t + MAX_LEAD_DAYS))}).` };
  const days = b - a + 1;
  if (days > MAX_LOAN_DAYS) return { ok: false, reason: 'too-long', field: 'end', message: `A loan may last at most ${MAX_LOAN_DAYS} days; these dates make ${days}. Return the kit by ${formatDate(isoFromDay(a + MAX_LOAN_DAYS - 1))}.` };
  return { ok: true, days };
}

/** Today's date (`YYYY-MM-DD`) in an IANA time zone; UTC for a zone the runtime does not know. */
export function todayIn(timeZone: string | null | undefined, now: Date = new Date()): string {
  try {
    // en-CA writes dates as YYYY-MM-DD.
    return new Intl.DateTimeFormat('en-CA', { timeZone: timeZone || 'UTC', year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
  } catch {
    return now.toISOString().slice(0, 10);
  }
}
