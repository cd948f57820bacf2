/**
 * Normal-year degree days at a base: the mean over the station's complete calendar years of the
 * annual sum of daily degree days (methods: PRISM's long-term normal H0(τ), Fels 1986; prefer at
 * least 10 years). A year is complete when every one of its days has a temperature, observed or
 * filled by single-day interpolation: build the table from `fillSingleMissingDays` output. Leap
 * years contribute their 366 days as they are.
 */
import { dayFromCivil, daysInYear, yearOfDay } from './day-number';
import { daysWithTemperature, type DegreeDayTable, degreeDaySum } from './degree-day-table';
import type { DegreeDayKind, TemperatureUnit } from './temperature';

// Source: common practice: a stable mean wants at least 10 years; official climate normals span 30.
export const PREFERRED_NORMAL_YEARS = 10;

export type NormalYearDegreeDays =
  | {
      ok: true;
      /** Mean annual degree days over the years used. */
      value: number;
      yearsUsed: number[];
      /** Annual sums, aligned with yearsUsed. */
      annualTotals: number[];
      /** True when fewer than PREFERRED_NORMAL_YEARS complete years were available. */
      fewYears: boolean;
    }
  | { ok: false; reason: 'no-complete-years' };

export interface NormalYearOptions {
  unit?: TemperatureUnit;
  /** Only use years from this one on. */
  fromYear?: number;
  /** Only use years up to this one. */
  toYear?: number;
}

/** Calendar years fully inside the table with a temperature on every day. */
export function completeYears(table: DegreeDayTable, options: NormalYearOptions = {}): number[] {
  if (table.nDays === 0) return [];
  const lastDay = table.firstDay + table.nDays - 1;
  const from = Math.max(yearOfDay(table.firstDay), options.fromYear ?? -Infinity);
  const to = Math.min(yearOfDay(lastDay), options.toYear ?? Infinity);
  const years: number[] = [];
  for (let year = from; year <= to; year++) {
    const jan1 = dayFromCivil(year, 1, 1);
    const n = daysInYear(year);
    if (daysWithTemperature(table, jan1, jan1 + n - 1) === n) years.push(year);
  }
  return years;
}

/**
 * Mean annual HDD or CDD at `base` over the complete years.
 * @example normalYearDegreeDays(table, 'hdd', 65) // { ok: true, value: 4521.3, yearsUsed: [...], ... }
 */
export function normalYearDegreeDays(
  table: DegreeDayTable,
  kind: DegreeDayKind,
  base: number,
  options: NormalYearOptions = {},
): NormalYearDegreeDays {
  const yearsUsed = completeYears(table, options);
  if (yearsUsed.length === 0) return { ok: false, reason: 'no-complete-years' };
  const annualTotals = yearsUsed.map((year) => {
    const jan1 = dayFromCivil(year, 1, 1);
    return degreeDaySum(table, kind, base, jan1, jan1 + daysInYear(year) - 1, options.unit ?? 'F');
  });
  let sum = 0;
  for (const t of annualTotals) sum += t;
  return {
    ok: true,
    value: sum / yearsUsed.length,
    yearsUsed,
    annualTotals,
    fewYears: yearsUsed.length < PREFERRED_NORMAL_YEARS,
  };
}
