/**
 * Missing days in a daily temperature series: a single missing day between two observed days
 * is filled by linear interpolation (the mean of its neighbours) and flagged; longer gaps are
 * left missing and reported as ranges. CalTRACK 2.0 §2.2.3.2 requires temperature for 90 % of
 * a billing period; single-day fills keep isolated dropouts from failing that test.
 */
import { DAY_INTERPOLATED, DAY_MISSING, DAY_OBSERVED, type DailyTemperatureSeries } from './daily-series';

export interface DayRange {
  startDay: number;
  endDay: number;
  /** endDay − startDay + 1 */
  days: number;
}

export interface GapFill {
  series: DailyTemperatureSeries;
  /** Day numbers that were interpolated. */
  filledDays: number[];
}

/**
 * Returns a copy with each isolated missing day (observed on both sides) set to the mean of its
 * two neighbours and marked DAY_INTERPOLATED. Runs of two or more missing days, and missing days
 * at either end, stay missing.
 * @example fillSingleMissingDays(series with means [40, missing, 50]) // means [40, 45, 50]
 */
export function fillSingleMissingDays(series: DailyTemperatureSeries): GapFill {
  const meanF = series.meanF.slice();
  const status = series.status.slice();
  const filledDays: number[] = [];
  for (let i = 1; i < status.length - 1; i++) {
    if (status[i] !== DAY_MISSING) continue;
    if (series.status[i - 1] === DAY_OBSERVED && series.status[i + 1] === DAY_OBSERVED) {
      meanF[i] = ((series.meanF[i - 1] as number) + (series.meanF[i + 1] as number)) / 2;
      status[i] = DAY_INTERPOLATED;
      filledDays.push(series.firstDay + i);
    }
  }
  return { series: { firstDay: series.firstDay, meanF, status }, filledDays };
}

/**
 * Runs of missing days, in order. Days outside the series are not reported (the series does
 * not claim them); use `coverageByYear` for calendar coverage.
 */
export function missingRanges(series: DailyTemperatureSeries): DayRange[] {
  const ranges: DayRange[] = [];
  const s = series.status;
  let i = 0;
  while (i < s.length) {
    if (s[i] !== DAY_MISSING) {
      i++;
      continue;
    }
    let j = i;
    while (j + 1 < s.length && s[j + 1] === DAY_MISSING) j++;
    ranges.push({ startDay: series.firstDay + i, endDay: series.firstDay + j, days: j - i + 1 });
    i = j + 1;
  }
  return ranges;
}
