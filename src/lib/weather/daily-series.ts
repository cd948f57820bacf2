/**
 * A station's daily mean temperatures as one contiguous, gap-aware series: index i is day
 * `firstDay + i`. Means are stored in °F (Float64Array) with a status byte per day
 * (missing / observed / interpolated), so sums over days never meet NaN.
 */
import { z } from 'zod';
import { dayFromIso } from './day-number';
import { dailyMeanTemperature, type TemperatureUnit, toF } from './temperature';

export const DAY_MISSING = 0;
export const DAY_OBSERVED = 1;
export const DAY_INTERPOLATED = 2;

export interface DailyTemperatureSeries {
  /** Day number (days since 1970-01-01) of index 0. */
  readonly firstDay: number;
  /** Daily mean temperature, °F; 0 where the day is missing. */
  readonly meanF: Float64Array;
  /** DAY_MISSING, DAY_OBSERVED or DAY_INTERPOLATED per day. */
  readonly status: Uint8Array;
}

/** One daily observation as it arrives at a boundary (CSV row, weather-service record). */
export const dailyObservationSchema = z.object({
  date: z.string().refine((s) => dayFromIso(s) !== null, 'expected an existing YYYY-MM-DD date'),
  tmax: z.number().nullable(),
  tmin: z.number().nullable(),
});
export type DailyObservation = z.infer<typeof dailyObservationSchema>;

// Source: WMO Weather and Climate Extremes Archive: highest 56.7 °C (Death Valley, 1913), lowest
// −89.2 °C (Vostok, 1983) [memory]. Values beyond these are recording errors.
const MIN_PLAUSIBLE_F = toF(-90, 'C');
const MAX_PLAUSIBLE_F = toF(57, 'C');

export interface DailySeriesInput {
  /** Day numbers, any order. */
  days: ArrayLike<number>;
  tmax: ArrayLike<number | null>;
  tmin: ArrayLike<number | null>;
  unit: TemperatureUnit;
}

export interface DailySeriesBuild {
  series: DailyTemperatureSeries;
  /** Days given more than once; the first value was kept. */
  duplicateDays: number[];
  /** Days with a missing or non-finite Tmax/Tmin, Tmin above Tmax, or a value beyond world records. */
  invalidDays: number[];
}

/** Number of days a series spans (observed or not). */
export function seriesLength(series: DailyTemperatureSeries): number {
  return series.status.length;
}

/** Last day number of a series (firstDay − 1 when empty). */
export function seriesLastDay(series: DailyTemperatureSeries): number {
  return series.firstDay + series.status.length - 1;
}

/**
 * Builds the contiguous series from the first to the last day given. Daily mean =
 * (Tmax + Tmin) / 2, converted to °F. Invalid and absent days are marked missing.
 * @example buildDailySeries({ days: [0, 2], tmax: [50, 60], tmin: [30, 40], unit: 'F' })
 *   // series.meanF = [40, 0, 50], status = [1, 0, 1]
 */
export function buildDailySeries(input: DailySeriesInput): DailySeriesBuild {
  const n = input.days.length;
  let first = Infinity;
  let last = -Infinity;
  for (let i = 0; i < n; i++) {
    const d = input.days[i] as number;
    if (d < first) first = d;
    if (d > last) last = d;
  }
  const length = n === 0 ? 0 : last - first + 1;
  const firstDay = n === 0 ? 0 : first;
  const meanF = new Float64Array(length);
  const status = new Uint8Array(length);
  const seen = new Uint8Array(length);
  const duplicateDays: number[] = [];
  const invalidDays: number[] = [];
  for (let i = 0; i < n; i++) {
    const day = input.days[i] as number;
    const k = day - firstDay;
    if (seen[k] === 1) {
      duplicateDays.push(day);
      continue;
    }
    seen[k] = 1;
    const hi = input.tmax[i];
    const lo = input.tmin[i];
    if (hi == null || lo == null || !Number.isFinite(hi) || !Number.isFinite(lo)) {
      invalidDays.push(day);
      continue;
    }
    const hiF = toF(hi, input.unit);
    const loF = toF(lo, input.unit);
    if (loF > hiF || loF < MIN_PLAUSIBLE_F || hiF > MAX_PLAUSIBLE_F) {
      invalidDays.push(day);
      continue;
    }
    meanF[k] = dailyMeanTemperature(hiF, loF);
    status[k] = DAY_OBSERVED;
  }
  return { series: { firstDay, meanF, status }, duplicateDays, invalidDays };
}
