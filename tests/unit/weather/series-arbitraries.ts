/** Constructed random daily series for the property tests (not reference data). */
import fc from 'fast-check';
import { buildDailySeries, type DailyTemperatureSeries, DAY_MISSING } from '../../../src/lib/weather';

/** Daily means in °F between −20 and 100 (one decimal), about 15 % of days missing. */
export const dailyMeans = fc.array(
  fc.option(fc.integer({ min: -200, max: 1000 }).map((t) => t / 10), { freq: 7 }),
  { minLength: 1, maxLength: 400 },
);

/** A series starting at `firstDay` whose daily mean is each value (Tmax = mean + 6, Tmin = mean − 6). */
export function seriesFrom(firstDay: number, means: readonly (number | null)[]): DailyTemperatureSeries {
  const days = means.map((_, i) => firstDay + i);
  const tmax = means.map((m) => (m === null ? null : m + 6));
  const tmin = means.map((m) => (m === null ? null : m - 6));
  return buildDailySeries({ days, tmax, tmin, unit: 'F' }).series;
}

/** The plain loop every fast path must match: Σ over days with temperature of max(0, ±(base − T)). */
export function naiveSum(
  series: DailyTemperatureSeries,
  kind: 'hdd' | 'cdd',
  baseF: number,
  startDay: number,
  endDay: number,
): number {
  let sum = 0;
  for (let d = startDay; d <= endDay; d++) {
    const i = d - series.firstDay;
    if (i < 0 || i >= series.status.length || series.status[i] === DAY_MISSING) continue;
    const t = series.meanF[i] as number;
    sum += kind === 'hdd' ? Math.max(0, baseF - t) : Math.max(0, t - baseF);
  }
  return sum;
}
