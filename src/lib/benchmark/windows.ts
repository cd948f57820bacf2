/**
 * Reporting windows for intensities: the 12 months ending with a given month, and the US federal
 * fiscal year. Dates are ISO calendar dates ('YYYY-MM-DD'), both ends inclusive, computed in UTC
 * so that time zones never move a day.
 *
 * US federal fiscal year: FY N runs 1 October N−1 to 30 September N (31 U.S.C. 1102).
 */
import { z } from 'zod';

const MS_PER_DAY = 86_400_000;

export const isoDateSchema = z.iso.date();
export const yearMonthSchema = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'expected YYYY-MM');

export interface Window {
  readonly kind: 'rolling-12' | 'fiscal-year';
  /** First day, inclusive. */
  readonly start: string;
  /** Last day, inclusive. */
  readonly end: string;
  /** Calendar days in the window (365 or 366 for both kinds). */
  readonly days: number;
  /** 'FY2024' or '12 months to 2024-06'. */
  readonly label: string;
}

function parseIso(date: string): number {
  const parsed = isoDateSchema.safeParse(date);
  if (!parsed.success) throw new Error(`not an ISO date: ${date}`);
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return Date.UTC(y, m - 1, d);
}

function formatIso(ms: number): string {
  return new Date(ms).toISOString().slice(0, 10);
}

/** Days from `start` to `end`, both inclusive (0 when end precedes start). */
export function inclusiveDays(start: string, end: string): number {
  return Math.max(0, Math.round((parseIso(end) - parseIso(start)) / MS_PER_DAY) + 1);
}

/**
 * The US federal fiscal year containing `date`: October–December belong to the next year's FY.
 * @example fiscalYearOf('2023-10-01') // 2024
 */
export function fiscalYearOf(date: string): number {
  parseIso(date);
  const y = Number(date.slice(0, 4));
  const m = Number(date.slice(5, 7));
  return m >= 10 ? y + 1 : y;
}

/**
 * US federal fiscal year window (31 U.S.C. 1102): 1 October of `fy − 1` through 30 September of `fy`.
 * @example fiscalYearWindow(2024) // { start: '2023-10-01', end: '2024-09-30', days: 366, ... }
 */
export function fiscalYearWindow(fy: number): Window {
  if (!Number.isInteger(fy)) throw new Error(`fiscal year must be an integer: ${fy}`);
  const start = `${String(fy - 1).padStart(4, '0')}-10-01`;
  const end = `${String(fy).padStart(4, '0')}-09-30`;
  return { kind: 'fiscal-year', start, end, days: inclusiveDays(start, end), label: `FY${fy}` };
}

/**
 * The 12 calendar months ending with month `endMonth` ('YYYY-MM'): from the first day of the
 * month eleven months earlier to the last day of `endMonth`.
 * @example rolling12Window('2024-06') // { start: '2023-07-01', end: '2024-06-30', days: 366 }
 */
export function rolling12Window(endMonth: string): Window {
  const parsed = yearMonthSchema.safeParse(endMonth);
  if (!parsed.success) throw new Error(`not a YYYY-MM month: ${endMonth}`);
  const y = Number(endMonth.slice(0, 4));
  const m = Number(endMonth.slice(5, 7));
  const start = formatIso(Date.UTC(y, m - 12, 1));
  const end = formatIso(Date.UTC(y, m, 0)); // day 0 of the next month = last day of this one
  return {
    kind: 'rolling-12',
    start,
    end,
    days: inclusiveDays(start, end),
    label: `12 months to ${endMonth}`,
  };
}

/** The same kind of window one year earlier (for year-over-year comparisons). */
export function previousWindow(w: Window): Window {
  if (w.kind === 'fiscal-year') return fiscalYearWindow(fiscalYearOf(w.end) - 1);
  const y = Number(w.end.slice(0, 4)) - 1;
  return rolling12Window(`${String(y).padStart(4, '0')}-${w.end.slice(5, 7)}`);
}

/**
 * Days of [start, end] (inclusive) that fall inside the window: the coverage a bill period gives.
 * @example overlapDays(fiscalYearWindow(2024), '2023-09-15', '2023-10-14') // 14
 */
export function overlapDays(w: Window, start: string, end: string): number {
  const a = Math.max(parseIso(w.start), parseIso(start));
  const b = Math.min(parseIso(w.end), parseIso(end));
  return b < a ? 0 : Math.round((b - a) / MS_PER_DAY) + 1;
}

/**
 * Days of the window covered by at least one of the periods (each [start, end] inclusive); periods
 * that overlap each other are counted once. This is the "covered days" input of an intensity.
 * @example coveredDays(fiscalYearWindow(2024), [{start:'2023-10-01',end:'2023-10-31'}]) // 31
 */
export function coveredDays(
  w: Window,
  periods: readonly { readonly start: string; readonly end: string }[],
): number {
  const lo = parseIso(w.start);
  const hi = parseIso(w.end);
  const spans: [number, number][] = [];
  for (const p of periods) {
    const a = Math.max(lo, parseIso(p.start));
    const b = Math.min(hi, parseIso(p.end));
    if (b >= a) spans.push([a, b]);
  }
  spans.sort((x, y) => x[0] - y[0]);
  let total = 0;
  let curA = Number.NaN;
  let curB = Number.NaN;
  for (const [a, b] of spans) {
    if (Number.isNaN(curA) || a > curB + MS_PER_DAY) {
      if (!Number.isNaN(curA)) total += Math.round((curB - curA) / MS_PER_DAY) + 1;
      curA = a;
      curB = b;
    } else if (b > curB) {
      curB = b;
    }
  }
  if (!Number.isNaN(curA)) total += Math.round((curB - curA) / MS_PER_DAY) + 1;
  return total;
}
