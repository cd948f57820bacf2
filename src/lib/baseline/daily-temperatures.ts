/**
 * Daily mean temperatures of one weather station, packed in a typed array indexed by day.
 *
 * Daily mean `T = (Tmax + Tmin) / 2` (NOAA/NWS mean-temperature method, methods.md §3).
 * A day lacking either extreme is missing (stored as NaN inside the array, never exposed in
 * results). A single missing day between two known days is filled by linear interpolation and
 * counted (methods.md §3: "fill single missing days by linear interpolation and flag").
 */
import { z } from 'zod';
import { isoDateSchema, isoDateToDay } from './calendar-days';

/** Daily mean temperatures, °F. `meanF[i]` is the mean of day `firstDay + i`; NaN = missing. */
export interface DailyTemperatures {
  readonly firstDay: number;
  readonly meanF: Float64Array;
  /** Days filled by interpolating between two neighbours. */
  readonly filledDays: number;
}

export const dailyTemperatureRowSchema = z.object({
  date: isoDateSchema,
  tmaxF: z.number().nullable(),
  tminF: z.number().nullable(),
});
export type DailyTemperatureRow = z.infer<typeof dailyTemperatureRowSchema>;

/**
 * Fill every isolated missing day (missing, with known days on both sides) with the mean of its
 * neighbours, in place. Longer gaps stay missing.
 * @returns the number of days filled
 */
export function fillSingleMissingDays(meanF: Float64Array): number {
  let filled = 0;
  for (let i = 1; i < meanF.length - 1; i++) {
    const prev = meanF[i - 1]!;
    const next = meanF[i + 1]!;
    if (Number.isNaN(meanF[i]!) && !Number.isNaN(prev) && !Number.isNaN(next)) {
      meanF[i] = (prev + next) / 2;
      filled++;
    }
  }
  return filled;
}

/**
 * Pack a daily mean series that starts at `firstDay` (NaN = missing), filling single gaps.
 * The array is used as given (not copied).
 */
export function packDailyMeans(firstDay: number, meanF: Float64Array): DailyTemperatures {
  const filledDays = fillSingleMissingDays(meanF);
  return { firstDay, meanF, filledDays };
}

/**
 * Build daily mean temperatures from rows of Tmax/Tmin (°F) by date. Rows may come in any order;
 * when a date repeats, the last row wins. Returns null when no row has a usable date.
 * @example dailyTemperaturesFromRows([{ date: '2024-01-01', tmaxF: 75, tminF: 65 }]).meanF[0] // 70
 */
export function dailyTemperaturesFromRows(rows: readonly DailyTemperatureRow[]): DailyTemperatures | null {
  let first = Number.POSITIVE_INFINITY;
  let last = Number.NEGATIVE_INFINITY;
  const days = new Int32Array(rows.length);
  for (let i = 0; i < rows.length; i++) {
    const d = isoDateToDay(rows[i]!.date);
    days[i] = d ?? -2_147_483_648;
    if (d === null) continue;
    if (d < first) first = d;
    if (d > last) last = d;
  }
  if (!Number.isFinite(first)) return null;
  const meanF = new Float64Array(last - first + 1).fill(Number.NaN);
  for (let i = 0; i < rows.length; i++) {
    const d = days[i]!;
    if (d === -2_147_483_648) continue;
    const { tmaxF, tminF } = rows[i]!;
    meanF[d - first] = tmaxF === null || tminF === null ? Number.NaN : (tmaxF + tminF) / 2;
  }
  return packDailyMeans(first, meanF);
}
