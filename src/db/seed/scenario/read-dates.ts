/**
 * Meter read dates: one bill per read cycle of 27–34 days (most 29–32), from a first start to the
 * last read before the bill run date. Two conventions:
 *   - separate days: the next bill starts the day after the previous end;
 *   - shared read date: the next bill starts on the previous end date, and that day belongs to
 *     the earlier bill (methods.md §2), so it covers the same days with a one-day-longer label.
 */
import type { Rng } from './prng';

export interface BillPeriod {
  /** Stated start and end (day numbers, inclusive). */
  start: number;
  end: number;
  /** First day the bill's use actually covers: start, or start + 1 under a shared read date. */
  coveredFrom: number;
}

const CYCLE_DAYS: readonly (readonly [number, number])[] = [
  [27, 1],
  [28, 3],
  [29, 8],
  [30, 12],
  [31, 12],
  [32, 8],
  [33, 3],
  [34, 1],
];

export function readSchedule(rng: Rng, firstStart: number, lastEnd: number, sharedReadDate: boolean): BillPeriod[] {
  const periods: BillPeriod[] = [];
  let coveredFrom = firstStart;
  let start = firstStart;
  for (;;) {
    const end = coveredFrom + rng.weighted(CYCLE_DAYS) - 1;
    if (end > lastEnd) break;
    periods.push({ start, end, coveredFrom });
    coveredFrom = end + 1;
    start = sharedReadDate ? end : end + 1;
  }
  return periods;
}
