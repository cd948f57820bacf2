/**
 * Calendar days as integers: day 0 is 1970-01-01 (proleptic Gregorian, UTC). Everything that
 * deals with bill periods or daily weather works on these numbers, so no local time zone or
 * daylight-saving shift can move a date. Conversions use Howard Hinnant's public-domain
 * "days_from_civil" / "civil_from_days" algorithms (chrono-compatible low-level date
 * algorithms), pure integer arithmetic.
 */

/** Year, month (1-12) and day of month (1-31). */
export interface CivilDate {
  year: number;
  month: number;
  day: number;
}

/** True for Gregorian leap years. */
export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** Days in a month (month 1-12). */
export function daysInMonth(year: number, month: number): number {
  return month === 2 && isLeapYear(year) ? 29 : (MONTH_DAYS[month - 1] ?? 0);
}

/** Days in a calendar year: 365 or 366. */
export function daysInYear(year: number): number {
  return isLeapYear(year) ? 366 : 365;
}

/** Day number of a civil date; no validation (use `dayFromYmd` for untrusted input). */
export function dayFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const doy = Math.floor((153 * (month + (month > 2 ? -3 : 9)) + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

/** Day number of a date given as numbers, or null when the date does not exist (e.g. 2023-02-29). */
export function dayFromYmd(year: number, month: number, day: number): number | null {
  if (!Number.isInteger(year) || !Number.isInteger(month) || !Number.isInteger(day)) return null;
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return null;
  return dayFromCivil(year, month, day);
}

/** Civil date of a day number. */
export function civilFromDay(dayNumber: number): CivilDate {
  const z = dayNumber + 719468;
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: yoe + era * 400 + (month <= 2 ? 1 : 0), month, day };
}

/**
 * Month index `year × 12 + (month − 1)` of a day number: consecutive months have consecutive
 * indices, which keeps month loops free of objects.
 */
export function monthIndexOfDay(dayNumber: number): number {
  const c = civilFromDay(dayNumber);
  return c.year * 12 + c.month - 1;
}

/** Day number of the first day of a month index. */
export function firstDayOfMonthIndex(monthIndex: number): number {
  const year = Math.floor(monthIndex / 12);
  return dayFromCivil(year, monthIndex - year * 12 + 1, 1);
}

/** Calendar year of a day number. */
export function yearOfDay(dayNumber: number): number {
  return civilFromDay(dayNumber).year;
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Day number of an ISO `YYYY-MM-DD` date, or null when the text is not such a date or the date
 * does not exist.
 * @example dayFromIso('1970-01-02') // 1
 * @example dayFromIso('2023-02-29') // null
 */
export function dayFromIso(iso: string): number | null {
  const m = ISO_DATE.exec(iso);
  if (m === null) return null;
  return dayFromYmd(Number(m[1]), Number(m[2]), Number(m[3]));
}

function pad(n: number, width: number): string {
  return String(n).padStart(width, '0');
}

/**
 * ISO `YYYY-MM-DD` text of a day number (years 0-9999).
 * @example isoFromDay(0) // '1970-01-01'
 */
export function isoFromDay(dayNumber: number): string {
  const c = civilFromDay(dayNumber);
  return `${pad(c.year, 4)}-${pad(c.month, 2)}-${pad(c.day, 2)}`;
}
