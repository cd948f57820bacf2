/**
 * Calendar helpers for the generator on day numbers (days since 1970-01-01, proleptic Gregorian),
 * built on the project's day-number module so no Date object or time zone is involved.
 */
import {
  civilFromDay,
  dayFromCivil,
  dayFromIso,
  firstDayOfMonthIndex,
  isoFromDay,
  monthIndexOfDay,
  type CivilDate,
} from '../../../lib/weather/day-number';

/** Day number of a civil date. */
export const civilToDay: (year: number, month: number, day: number) => number = dayFromCivil;
/** Civil date of a day number. */
export const dayToCivil: (dayNumber: number) => CivilDate = civilFromDay;
/** ISO date of a day number. */
export const dayToIso: (dayNumber: number) => string = isoFromDay;

/** True when the text is a real calendar date in ISO form. */
export function isIsoDate(text: string): boolean {
  return dayFromIso(text) !== null;
}

/** Day number of an ISO date; throws on malformed input (a caller's bug). */
export function isoToDay(iso: string): number {
  const day = dayFromIso(iso);
  if (day === null) throw new Error(`not an ISO date: ${iso}`);
  return day;
}

/** First day of the month `months` months after (negative: before) the month of `dayNumber`. */
export function firstOfMonthOffset(dayNumber: number, months: number): number {
  return firstDayOfMonthIndex(monthIndexOfDay(dayNumber) + months);
}

/** US federal fiscal year of a date: FY N runs 1 October N-1 to 30 September N (31 U.S.C. 1102). */
export function federalFiscalYear(dayNumber: number): number {
  const { year, month } = civilFromDay(dayNumber);
  return month >= 10 ? year + 1 : year;
}
