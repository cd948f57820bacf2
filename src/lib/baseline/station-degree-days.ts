/**
 * Cumulative daily degree days of one station at every grid base, so that the degree days of
 * any period at all 61 bases cost 2 × 61 subtractions.
 *
 * Row d of `cumHdd` holds Σ_{days before d} max(0, b − T) for b = 30..90 °F (CalTRACK 2.0
 * §3.3.4–3.3.5 daily terms); likewise cooling, the count of days with a temperature and the sum
 * of temperatures. A period's HDD_p(b) is then (row(end+1) − row(start)) / days with temperature.
 * Rounding: a difference of prefix sums of at most ~60 °F·day per day over a decade (< 3·10⁵)
 * carries an absolute error near 10⁻¹¹ °F·day, far below any bill's resolution; and when no day
 * of a period lies below (above) a base, both rows are equal and the difference is exactly 0.
 * Memory: 2·61 doubles per day (~1 KB/day, ~3.6 MB for ten years).
 */
import { BASE_COUNT, BASE_MIN_F } from './grid';
import type { DailyTemperatures } from './daily-temperatures';

export interface StationDegreeDays {
  readonly firstDay: number;
  readonly days: number;
  /** (days + 1) × 61, day-major. */
  readonly cumHdd: Float64Array;
  readonly cumCdd: Float64Array;
  /** (days + 1): days with a temperature before day d. */
  readonly cumCount: Float64Array;
  /** (days + 1): sum of temperatures before day d. */
  readonly cumTemp: Float64Array;
}

const cache = new WeakMap<DailyTemperatures, StationDegreeDays>();

/** Build the cumulative tables of a station (O(days × 61)). */
export function buildStationDegreeDays(temps: DailyTemperatures): StationDegreeDays {
  const n = temps.meanF.length;
  const cumHdd = new Float64Array((n + 1) * BASE_COUNT);
  const cumCdd = new Float64Array((n + 1) * BASE_COUNT);
  const cumCount = new Float64Array(n + 1);
  const cumTemp = new Float64Array(n + 1);
  for (let d = 0; d < n; d++) {
    const t = temps.meanF[d]!;
    const prev = d * BASE_COUNT;
    const next = prev + BASE_COUNT;
    const known = t === t; // false for NaN (missing day)
    cumCount[d + 1] = cumCount[d]! + (known ? 1 : 0);
    cumTemp[d + 1] = cumTemp[d]! + (known ? t : 0);
    for (let k = 0; k < BASE_COUNT; k++) {
      const b = BASE_MIN_F + k;
      const h = known && t < b ? b - t : 0;
      const c = known && t > b ? t - b : 0;
      cumHdd[next + k] = cumHdd[prev + k]! + h;
      cumCdd[next + k] = cumCdd[prev + k]! + c;
    }
  }
  return { firstDay: temps.firstDay, days: n, cumHdd, cumCdd, cumCount, cumTemp };
}

/** The station tables of `temps`, built once per temperatures object and cached. */
export function stationDegreeDays(temps: DailyTemperatures): StationDegreeDays {
  let s = cache.get(temps);
  if (s === undefined) {
    s = buildStationDegreeDays(temps);
    cache.set(temps, s);
  }
  return s;
}

/** Result of filling one period; reused by the caller. */
export interface PeriodFill {
  /** Days with a temperature. */
  count: number;
  meanF: number;
  /** First grid index with HDD > 0 (BASE_COUNT when none). */
  heatingFrom: number;
  /** Last grid index with CDD > 0 (−1 when none). */
  coolingTo: number;
  /** Station rows bounding the period: its degree days are row(rowTo) − row(rowFrom). */
  rowFrom: number;
  rowTo: number;
}

/**
 * Add Σ_i f_i·(row(to_i) − row(from_i)) of the cumulative tables to `sumHdd`/`sumCdd` (per base),
 * with f_i = days_i / (days with a temperature)_i, i.e. Σ_i days_i·HDD_p,i: the weighted means
 * of a series times W. Periods are given in time order; where one ends at the row where the
 * next starts with the same factor (consecutive complete periods), the two rows cancel exactly,
 * so a run of back-to-back bills costs two rows instead of one per bill.
 */
export function addWeightedPeriodSums(
  s: StationDegreeDays,
  rowFrom: ArrayLike<number>,
  rowTo: ArrayLike<number>,
  factor: ArrayLike<number>,
  n: number,
  sumHdd: Float64Array,
  sumCdd: Float64Array,
): void {
  const add = (row: number, coef: number): void => {
    if (coef === 0 || row < 0) return;
    const r = row * BASE_COUNT;
    for (let k = 0; k < BASE_COUNT; k++) {
      sumHdd[k] = sumHdd[k]! + coef * s.cumHdd[r + k]!;
      sumCdd[k] = sumCdd[k]! + coef * s.cumCdd[r + k]!;
    }
  };
  // the end row of the previous period carries +f; it merges with a start at the same row
  let prevRow = -1;
  let prevCoef = 0;
  for (let i = 0; i < n; i++) {
    const f = factor[i]!;
    const from = rowFrom[i]!;
    if (from === prevRow) add(from, prevCoef - f);
    else {
      add(prevRow, prevCoef);
      add(from, -f);
    }
    prevRow = rowTo[i]!;
    prevCoef = f;
  }
  add(prevRow, prevCoef);
}

/** Days of `startDay..endDay` that have a temperature. */
export function temperatureDays(s: StationDegreeDays, startDay: number, endDay: number): number {
  const a = Math.max(startDay - s.firstDay, 0);
  const b = Math.min(endDay - s.firstDay + 1, s.days);
  return b > a ? s.cumCount[b]! - s.cumCount[a]! : 0;
}

/**
 * Write HDD_p and CDD_p of days `startDay..endDay` at every grid base into `hdd[offset + k]` and
 * `cdd[offset + k]`, averaged over the days with a temperature.
 * @returns `out`, with count 0 (outputs untouched) when no day has a temperature
 */
export function fillPeriodFromStation(
  s: StationDegreeDays,
  startDay: number,
  endDay: number,
  hdd: Float64Array,
  cdd: Float64Array,
  offset: number,
  out: PeriodFill,
): PeriodFill {
  const a = Math.max(startDay - s.firstDay, 0);
  const b = Math.min(endDay - s.firstDay + 1, s.days);
  const count = b > a ? s.cumCount[b]! - s.cumCount[a]! : 0;
  out.count = count;
  out.rowFrom = a;
  out.rowTo = b;
  out.heatingFrom = BASE_COUNT;
  out.coolingTo = -1;
  if (count === 0) {
    out.meanF = 0;
    return out;
  }
  out.meanF = (s.cumTemp[b]! - s.cumTemp[a]!) / count;
  const inv = 1 / count;
  const ra = a * BASE_COUNT;
  const rb = b * BASE_COUNT;
  const { cumHdd, cumCdd } = s;
  for (let k = 0; k < BASE_COUNT; k++) {
    hdd[offset + k] = (cumHdd[rb + k]! - cumHdd[ra + k]!) * inv;
    cdd[offset + k] = (cumCdd[rb + k]! - cumCdd[ra + k]!) * inv;
  }
  // HDD_p rises and CDD_p falls with the base: find where each is non-zero
  let from = 0;
  while (from < BASE_COUNT && hdd[offset + from] === 0) from++;
  let to = BASE_COUNT - 1;
  while (to >= 0 && cdd[offset + to] === 0) to--;
  out.heatingFrom = from;
  out.coolingTo = to;
  return out;
}
