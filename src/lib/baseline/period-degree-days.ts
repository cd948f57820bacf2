/**
 * Period degree days at every candidate balance point.
 *
 * CalTRACK 2.0 §3.3.4–3.3.5 [confirmed]: `HDD_p(b) = (1/n) Σ_d max(0, b − T_d)` and
 * `CDD_p(b) = (1/n) Σ_d max(0, T_d − b)` from daily mean temperatures T_d. Here n is the number
 * of days of the period that have a temperature: with complete data this is CalTRACK's n_dp
 * (days elapsed); with up to 10 % of days missing it averages over the known days instead of
 * counting the missing ones as zero degree days.
 *
 * All 61 bases are computed from one sorted copy of the period's temperatures:
 * with k days below b and S their sum, Σ max(0, b − T) = b·k − S, so a single sweep over the
 * sorted temperatures gives every base in O(days·log(days) + bases) instead of O(days·bases).
 */
import { BASE_COUNT, BASE_MIN_F } from './grid';
import type { DailyTemperatures } from './daily-temperatures';

/** Summary of the temperatures of one period. */
export interface PeriodTemperatureSummary {
  /** Days with a temperature. */
  count: number;
  meanF: number;
  minF: number;
  maxF: number;
}

/** Insertion sort for short runs; typed-array sort for long ones. */
function sortAscending(a: Float64Array, m: number): void {
  if (m > 48) {
    a.subarray(0, m).sort();
    return;
  }
  for (let i = 1; i < m; i++) {
    const v = a[i]!;
    let j = i - 1;
    while (j >= 0 && a[j]! > v) {
      a[j + 1] = a[j]!;
      j--;
    }
    a[j + 1] = v;
  }
}

/**
 * Write HDD_p and CDD_p at every grid base for the days `startDay..endDay` (inclusive) into
 * `hdd[offset + k]` and `cdd[offset + k]`, k = 0..60 (base 30 + k °F).
 * `scratch` must hold at least endDay − startDay + 1 values.
 * @returns the temperature summary; `count` is 0 when no day has a temperature (outputs untouched)
 */
export function fillPeriodDegreeDays(
  temps: DailyTemperatures,
  startDay: number,
  endDay: number,
  hdd: Float64Array,
  cdd: Float64Array,
  offset: number,
  scratch: Float64Array,
  summary: PeriodTemperatureSummary,
): PeriodTemperatureSummary {
  const mean = temps.meanF;
  const from = Math.max(startDay - temps.firstDay, 0);
  const to = Math.min(endDay - temps.firstDay, mean.length - 1);
  let m = 0;
  for (let i = from; i <= to; i++) {
    const t = mean[i]!;
    if (t === t) scratch[m++] = t; // t === t is false only for NaN (missing)
  }
  summary.count = m;
  if (m === 0) {
    summary.meanF = 0;
    summary.minF = 0;
    summary.maxF = 0;
    return summary;
  }
  sortAscending(scratch, m);
  let total = 0;
  for (let i = 0; i < m; i++) total += scratch[i]!;
  summary.meanF = total / m;
  summary.minF = scratch[0]!;
  summary.maxF = scratch[m - 1]!;

  let below = 0; // days with T < b
  let sumBelow = 0;
  for (let k = 0; k < BASE_COUNT; k++) {
    const b = BASE_MIN_F + k;
    while (below < m && scratch[below]! < b) sumBelow += scratch[below++]!;
    const h = (b * below - sumBelow) / m;
    // When every day is below b, sumBelow equals total exactly (same additions in the same order).
    const c = (total - sumBelow - b * (m - below)) / m;
    hdd[offset + k] = h > 0 ? h : 0;
    cdd[offset + k] = c > 0 ? c : 0;
  }
  return summary;
}

/**
 * Heating and cooling degree days per day of one period at one base (any real °F), CalTRACK
 * §3.3.4–3.3.5, averaged over the days that have a temperature.
 * @returns null when no day of the period has a temperature
 * @example periodDegreeDays(temps, d0, d0 + 29, 65) // { hdd: 12.5, cdd: 0, days: 30, meanF: 52.5 }
 */
export function periodDegreeDays(
  temps: DailyTemperatures,
  startDay: number,
  endDay: number,
  baseF: number,
): { hdd: number; cdd: number; days: number; meanF: number } | null {
  const mean = temps.meanF;
  const from = Math.max(startDay - temps.firstDay, 0);
  const to = Math.min(endDay - temps.firstDay, mean.length - 1);
  let m = 0;
  let h = 0;
  let c = 0;
  let s = 0;
  for (let i = from; i <= to; i++) {
    const t = mean[i]!;
    if (t !== t) continue;
    m++;
    s += t;
    if (t < baseF) h += baseF - t;
    else c += t - baseF;
  }
  if (m === 0) return null;
  return { hdd: h / m, cdd: c / m, days: m, meanF: s / m };
}
