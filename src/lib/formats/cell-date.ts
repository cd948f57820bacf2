/**
 * Reads a date cell from a utility or weather export into an ISO `yyyy-mm-dd` string with a
 * hand-written scanner (no regular expressions, no Date objects, no time zones).
 *
 * Accepted shapes (anything else is `bad-date`):
 * - ISO `yyyy-mm-dd` (also `yyyy/mm/dd`), optionally followed by a time (`T…` or ` …`), which is ignored;
 * - compact `yyyymmdd`;
 * - US `m/d/yyyy`, `m-d-yyyy` and `m/d/yy` (slashes and dashes are always month first), optionally
 *   followed by ` time`;
 * - `dd-Mon-yyyy`, `d Mon yyyy`, `dd-Mon-yy` (English month names or 3-letter abbreviations);
 * - `d.m.yyyy` (dots are day first, the European convention — common practice).
 *
 * Two-digit years use the POSIX `%y` pivot: 69-99 are 1969-1999 and 00-68 are 2000-2068
 * (Source: POSIX.1-2017, strptime `%y`). The pivot can be changed per import.
 * A date outside 1900-2099 is refused as `date-out-of-range`: no utility bill or daily
 * weather record this product handles lies outside it.
 */
import { daysInMonth, isoDate, MONTH_NAMES } from './calendar';

export type DateCellFailure = 'bad-date' | 'impossible-date' | 'date-out-of-range';
export type DateCellResult = { ok: true; iso: string } | { ok: false; code: DateCellFailure; why: string };

/** Two-digit years below the pivot are 20yy, the others 19yy (POSIX strptime `%y`). */
export const DEFAULT_TWO_DIGIT_YEAR_PIVOT = 69;
const MIN_YEAR = 1900;
const MAX_YEAR = 2099;

const MONTH_KEYS = ['jan', 'feb', 'mar', 'apr', 'may', 'jun', 'jul', 'aug', 'sep', 'oct', 'nov', 'dec'];
const BAD_SHAPE =
  'write dates as yyyy-mm-dd (2024-01-31), m/d/yyyy (1/31/2024) or dd-Mon-yyyy (31-Jan-2024)';

const C_0 = 48;
const C_9 = 57;
const C_SLASH = 47;
const C_DASH = 45;
const C_DOT = 46;
const C_SPACE = 32;
const C_T = 84;

function isDigit(c: number): boolean {
  return c >= C_0 && c <= C_9;
}

function isLetter(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
}

/** Reads up to `max` digits from `pos`; returns the value and the end index (end === pos: none). */
function digitsAt(s: string, pos: number, max: number): { value: number; end: number } {
  let value = 0;
  let end = pos;
  while (end < s.length && end - pos < max) {
    const c = s.charCodeAt(end);
    if (!isDigit(c)) break;
    value = value * 10 + (c - C_0);
    end++;
  }
  return { value, end };
}

/** True when only a time part (or nothing) follows `pos`. */
function restIsTimeOrEnd(s: string, pos: number): boolean {
  if (pos === s.length) return true;
  const c = s.charCodeAt(pos);
  return (c === C_T || c === C_SPACE) && pos + 1 < s.length && isDigit(s.charCodeAt(pos + 1));
}

function fail(code: DateCellFailure, why: string): DateCellResult {
  return { ok: false, code, why };
}

function check(year: number, month: number, day: number, order: string): DateCellResult {
  if (year < MIN_YEAR || year > MAX_YEAR) return fail('date-out-of-range', `year ${year} is outside ${MIN_YEAR}-${MAX_YEAR}`);
  if (month < 1 || month > 12) return fail('impossible-date', `there is no month ${month} (${order})`);
  const dim = daysInMonth(year, month);
  if (day < 1 || day > dim) {
    return fail('impossible-date', `${MONTH_NAMES[month - 1]} ${year} has ${dim} days (${order})`);
  }
  return { ok: true, iso: isoDate(year, month, day) };
}

function monthFromName(name: string): number {
  if (name.length < 3) return 0;
  const lower = name.toLowerCase();
  const index = MONTH_KEYS.indexOf(lower.slice(0, 3));
  if (index < 0) return 0;
  const full = (MONTH_NAMES[index] ?? '').toLowerCase();
  return full.startsWith(lower) || lower === 'sept' ? index + 1 : 0;
}

function expandYear(value: number, digitCount: number, pivot: number): number {
  if (digitCount === 4) return value;
  return value < pivot ? 2000 + value : 1900 + value;
}

/**
 * Parses one date cell.
 * @example parseDateCell('1/31/2024') // { ok: true, iso: '2024-01-31' }
 * @example parseDateCell('2/30/2023') // { ok: false, code: 'impossible-date', why: 'February 2023 has 28 days (...)' }
 */
export function parseDateCell(raw: string, pivot: number = DEFAULT_TWO_DIGIT_YEAR_PIVOT): DateCellResult {
  const s = raw.trim();
  const first = digitsAt(s, 0, 8);
  const n1 = first.end;
  if (n1 === 0) return fail('bad-date', BAD_SHAPE);
  if (n1 === 8 && s.length === 8) {
    return check(Math.floor(first.value / 10000), Math.floor(first.value / 100) % 100, first.value % 100, 'read as yyyymmdd');
  }
  const sep = s.charCodeAt(n1);
  if (n1 === 4 && (sep === C_DASH || sep === C_SLASH)) {
    const m = digitsAt(s, n1 + 1, 2);
    if (m.end === n1 + 1 || s.charCodeAt(m.end) !== sep) return fail('bad-date', BAD_SHAPE);
    const d = digitsAt(s, m.end + 1, 2);
    if (d.end === m.end + 1 || !restIsTimeOrEnd(s, d.end)) return fail('bad-date', BAD_SHAPE);
    return check(first.value, m.value, d.value, 'read as year-month-day');
  }
  if (n1 > 2) return fail('bad-date', BAD_SHAPE);
  if ((sep === C_DASH || sep === C_SPACE) && isLetter(s.charCodeAt(n1 + 1))) {
    let end = n1 + 1;
    while (end < s.length && isLetter(s.charCodeAt(end))) end++;
    const month = monthFromName(s.slice(n1 + 1, end));
    const sep2 = s.charCodeAt(end);
    if (month === 0 || (sep2 !== C_DASH && sep2 !== C_SPACE)) return fail('bad-date', BAD_SHAPE);
    const y = digitsAt(s, end + 1, 4);
    const yDigits = y.end - end - 1;
    if ((yDigits !== 2 && yDigits !== 4) || y.end !== s.length) return fail('bad-date', BAD_SHAPE);
    return check(expandYear(y.value, yDigits, pivot), month, first.value, 'read as day-month-year');
  }
  if (sep !== C_SLASH && sep !== C_DASH && sep !== C_DOT) return fail('bad-date', BAD_SHAPE);
  const second = digitsAt(s, n1 + 1, 2);
  if (second.end === n1 + 1 || s.charCodeAt(second.end) !== sep) return fail('bad-date', BAD_SHAPE);
  const y = digitsAt(s, second.end + 1, 4);
  const yDigits = y.end - second.end - 1;
  if ((yDigits !== 2 && yDigits !== 4) || !restIsTimeOrEnd(s, y.end)) return fail('bad-date', BAD_SHAPE);
  const year = expandYear(y.value, yDigits, pivot);
  if (sep === C_DOT) return check(year, second.value, first.value, 'dates with dots are read day.month.year');
  return check(year, first.value, second.value, 'dates with slashes are read month/day/year');
}
