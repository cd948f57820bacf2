/**
 * Temperature coverage of a station per calendar year: observed, interpolated and missing days.
 * Days of the year outside the series count as missing.
 */
import { DAY_INTERPOLATED, DAY_OBSERVED, type DailyTemperatureSeries, seriesLastDay } from './daily-series';
import { dayFromCivil, daysInYear, yearOfDay } from './day-number';

export interface YearCoverage {
  year: number;
  daysInYear: number;
  observedDays: number;
  interpolatedDays: number;
  missingDays: number;
  /** (observed + interpolated) / daysInYear */
  coverage: number;
  /** No missing day (interpolated days allowed): the year counts toward normals. */
  complete: boolean;
}

/** Coverage for every calendar year the series touches, oldest first. */
export function coverageByYear(series: DailyTemperatureSeries): YearCoverage[] {
  if (series.status.length === 0) return [];
  const firstYear = yearOfDay(series.firstDay);
  const lastYear = yearOfDay(seriesLastDay(series));
  const out: YearCoverage[] = [];
  for (let year = firstYear; year <= lastYear; year++) {
    const jan1 = dayFromCivil(year, 1, 1);
    const n = daysInYear(year);
    const i0 = Math.max(0, jan1 - series.firstDay);
    const i1 = Math.min(series.status.length - 1, jan1 + n - 1 - series.firstDay);
    let observedDays = 0;
    let interpolatedDays = 0;
    for (let i = i0; i <= i1; i++) {
      const s = series.status[i];
      if (s === DAY_OBSERVED) observedDays++;
      else if (s === DAY_INTERPOLATED) interpolatedDays++;
    }
    const missingDays = n - observedDays - interpolatedDays;
    out.push({
      year,
      daysInYear: n,
      observedDays,
      interpolatedDays,
      missingDays,
      coverage: (observedDays + interpolatedDays) / n,
      complete: missingDays === 0,
    });
  }
  return out;
}
