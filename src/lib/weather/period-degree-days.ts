/**
 * Degree days per bill period in the CalTRACK 2.0 form (§3.3.4-3.3.5):
 * HDD_p(b) = (1/n_dp) Σ_d max(0, b − T_d), n_dp = days elapsed in the period; likewise CDD.
 * A period needs temperature on at least 90 % of its days (§2.2.3.2).
 */
import {
  daysWithTemperature,
  type DegreeDayTable,
  degreeDaySum,
  fillDegreeDaySums,
} from './degree-day-table';
import type { DegreeDayKind, TemperatureUnit } from './temperature';

// Source: CalTRACK 2.0 §2.2.3.2, temperature data must cover 90 % of each billing period.
export const CALTRACK_MIN_TEMPERATURE_COVERAGE = 0.9;

export interface PeriodDegreeDaysOptions {
  /** Unit of the base and of the result; default °F. */
  unit?: TemperatureUnit;
  /** Minimum share of days with temperature; default 0.9 (CalTRACK). */
  minCoverage?: number;
}

interface PeriodCounts {
  daysElapsed: number;
  daysWithData: number;
  /** daysWithData / daysElapsed */
  coverage: number;
}

export type PeriodDegreeDays =
  | (PeriodCounts & {
      ok: true;
      /** Σ daily degree days over the days with temperature. */
      total: number;
      /** CalTRACK form: total / days elapsed. */
      perDay: number;
      /** total / days with temperature (equals perDay at full coverage). */
      perDayObserved: number;
    })
  | (PeriodCounts & { ok: false; reason: 'empty-period' | 'insufficient-temperature-coverage' });

/** Share of [startDay, endDay] with temperature; 0 for an empty range. */
export function periodCoverage(table: DegreeDayTable, startDay: number, endDay: number): number {
  const days = endDay - startDay + 1;
  return days <= 0 ? 0 : daysWithTemperature(table, startDay, endDay) / days;
}

/**
 * Degree days of one period [startDay, endDay], both inclusive, at any base.
 * @example periodDegreeDays(table, 'hdd', 65, d0, d0 + 29) // { ok: true, total, perDay, … }
 */
export function periodDegreeDays(
  table: DegreeDayTable,
  kind: DegreeDayKind,
  base: number,
  startDay: number,
  endDay: number,
  options: PeriodDegreeDaysOptions = {},
): PeriodDegreeDays {
  const daysElapsed = Math.max(0, endDay - startDay + 1);
  const daysWithData = daysElapsed === 0 ? 0 : daysWithTemperature(table, startDay, endDay);
  const coverage = daysElapsed === 0 ? 0 : daysWithData / daysElapsed;
  const counts = { daysElapsed, daysWithData, coverage };
  if (daysElapsed === 0) return { ok: false, reason: 'empty-period', ...counts };
  if (coverage < (options.minCoverage ?? CALTRACK_MIN_TEMPERATURE_COVERAGE)) {
    return { ok: false, reason: 'insufficient-temperature-coverage', ...counts };
  }
  const total = degreeDaySum(table, kind, base, startDay, endDay, options.unit ?? 'F');
  return { ok: true, total, perDay: total / daysElapsed, perDayObserved: total / daysWithData, ...counts };
}

export interface PeriodDegreeDayMatrix {
  nPeriods: number;
  nBases: number;
  /** Lowest grid base, °F; base b is baseMinF + b. */
  baseMinF: number;
  /** Base-major: perDay[b × nPeriods + p] = CalTRACK HDD_p or CDD_p at base b, °F·day per day. */
  perDay: Float64Array;
  /** coverage[p] = share of period p's days with temperature. */
  coverage: Float64Array;
}

/**
 * Per-day degree days (CalTRACK form) of many periods at every grid base at once, for the
 * balance-point search. Periods with no days get 0 and coverage 0; the caller decides what to
 * do with periods under the coverage threshold. Pass `into` to reuse buffers across calls
 * (perDay of length ≥ nBases × nPeriods, coverage ≥ nPeriods).
 */
export function periodDegreeDayMatrix(
  table: DegreeDayTable,
  kind: DegreeDayKind,
  startDays: ArrayLike<number>,
  endDays: ArrayLike<number>,
  into?: { perDay: Float64Array; coverage: Float64Array },
): PeriodDegreeDayMatrix {
  const nPeriods = startDays.length;
  const nBases = table.nBases;
  const perDay = into?.perDay ?? new Float64Array(nBases * nPeriods);
  const coverage = into?.coverage ?? new Float64Array(nPeriods);
  if (perDay.length < nBases * nPeriods || coverage.length < nPeriods) {
    throw new RangeError('periodDegreeDayMatrix: buffers too small');
  }
  for (let p = 0; p < nPeriods; p++) {
    const start = startDays[p] as number;
    const days = (endDays[p] as number) - start + 1;
    if (days <= 0) {
      for (let b = 0; b < nBases; b++) perDay[b * nPeriods + p] = 0;
      coverage[p] = 0;
      continue;
    }
    coverage[p] = fillDegreeDaySums(table, kind, start, start + days - 1, perDay, p, nPeriods, 1 / days) / days;
  }
  return { nPeriods, nBases, baseMinF: table.baseMinF, perDay, coverage };
}
