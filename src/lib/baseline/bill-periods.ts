/**
 * Bills of one series to model periods: use per day, degree days at every base, temperature
 * coverage.
 *
 * - A bill covers [start, end], both dates inclusive; when a bill starts on the previous bill's
 *   end date (a shared read date) the shared day belongs to the earlier bill (methods.md §2).
 * - Use per day `UPD = quantity / days` (CalTRACK 2.0 §3.3.3 [confirmed]).
 * - A period needs a temperature on ≥ 90 % of its days (CalTRACK 2.0 §2.2.3.2 [confirmed]);
 *   periods below are dropped and reported, never silently.
 * - Bills are sorted by start date, so the order in which they arrive changes nothing.
 */
import { BASE_COUNT } from './grid';
import type { DailyTemperatures } from './daily-temperatures';
import { addWeightedPeriodSums, fillPeriodFromStation, stationDegreeDays, temperatureDays, type PeriodFill } from './station-degree-days';

/** Bills of one series as parallel arrays of day numbers (inclusive) and quantities. */
export interface BillArrays {
  readonly startDay: ArrayLike<number>;
  readonly endDay: ArrayLike<number>;
  readonly quantity: ArrayLike<number>;
}

export type DropReason = 'invalid-dates' | 'invalid-quantity' | 'no-days-left' | 'insufficient-temperature';

/** A bill left out of the fit, with why. `index` is its position in the caller's input. */
export interface DroppedPeriod {
  index: number;
  startDay: number;
  endDay: number;
  reason: DropReason;
  /** Share of days with a temperature (for `insufficient-temperature`). */
  temperatureCoverage: number | null;
}

/**
 * Model periods of one series in time order, in reusable typed arrays (capacity grows on demand).
 * Degree days are period-major: `hdd[i * BASE_COUNT + k]` is HDD_p of period i at base 30 + k °F.
 */
export class PeriodTable {
  n = 0;
  capacity = 0;
  sourceIndex = new Int32Array(0);
  startDay = new Int32Array(0);
  endDay = new Int32Array(0);
  days = new Float64Array(0);
  quantity = new Float64Array(0);
  usePerDay = new Float64Array(0);
  meanTempF = new Float64Array(0);
  /** First grid index where HDD_p > 0, and last where CDD_p > 0 (sparsity of the DD rows). */
  heatingFrom = new Int32Array(0);
  coolingTo = new Int32Array(0);
  hdd = new Float64Array(0);
  cdd = new Float64Array(0);
  /** Σ_i days_i·HDD_p,i at each base (and cooling alike): the weighted means times W. */
  readonly weightedHdd = new Float64Array(BASE_COUNT);
  readonly weightedCdd = new Float64Array(BASE_COUNT);
  /** Periods whose start was moved one day later by the shared-read-date rule. */
  sharedReadDates = 0;
  /** Pairs of consecutive bills that overlap by more than a shared read date (kept, reported). */
  overlaps = 0;
  order = new Int32Array(0);
  /** Station rows bounding each period and days / days-with-temperature (for the weighted sums). */
  rowFrom = new Int32Array(0);
  rowTo = new Int32Array(0);
  factor = new Float64Array(0);
  readonly fill: PeriodFill = { count: 0, meanF: 0, heatingFrom: 0, coolingTo: 0, rowFrom: 0, rowTo: 0 };

  ensureCapacity(n: number): void {
    if (n <= this.capacity) return;
    const cap = Math.max(n, this.capacity * 2, 16);
    this.capacity = cap;
    this.sourceIndex = new Int32Array(cap);
    this.startDay = new Int32Array(cap);
    this.endDay = new Int32Array(cap);
    this.days = new Float64Array(cap);
    this.quantity = new Float64Array(cap);
    this.usePerDay = new Float64Array(cap);
    this.meanTempF = new Float64Array(cap);
    this.heatingFrom = new Int32Array(cap);
    this.coolingTo = new Int32Array(cap);
    this.hdd = new Float64Array(cap * BASE_COUNT);
    this.cdd = new Float64Array(cap * BASE_COUNT);
    this.order = new Int32Array(cap);
    this.rowFrom = new Int32Array(cap);
    this.rowTo = new Int32Array(cap);
    this.factor = new Float64Array(cap);
  }
}

/** Sort bill indices by start day, then end day, then input position (stable, deterministic). */
function sortBillOrder(bills: BillArrays, order: Int32Array, count: number): void {
  let sorted = true;
  for (let i = 0; i < count; i++) {
    order[i] = i;
    if (i > 0 && (bills.startDay[i]! < bills.startDay[i - 1]! || (bills.startDay[i] === bills.startDay[i - 1] && bills.endDay[i]! < bills.endDay[i - 1]!))) sorted = false;
  }
  if (sorted) return;
  const view = order.subarray(0, count);
  view.sort((a, b) => bills.startDay[a]! - bills.startDay[b]! || bills.endDay[a]! - bills.endDay[b]! || a - b);
}

/**
 * Fill `table` with the usable periods of `bills` and return the bills left out.
 * @param minCoverage share of a period's days that must have a temperature (default 0.9)
 */
export function buildPeriodTable(
  bills: BillArrays,
  temps: DailyTemperatures,
  table: PeriodTable,
  minCoverage = 0.9,
): DroppedPeriod[] {
  const count = bills.startDay.length;
  table.ensureCapacity(count);
  table.n = 0;
  table.sharedReadDates = 0;
  table.overlaps = 0;
  table.weightedHdd.fill(0);
  table.weightedCdd.fill(0);
  const dropped: DroppedPeriod[] = [];
  const station = stationDegreeDays(temps);
  const order = table.order;
  sortBillOrder(bills, order, count);
  let prevEnd = Number.NEGATIVE_INFINITY;
  for (let r = 0; r < count; r++) {
    const idx = order[r]!;
    const start0 = bills.startDay[idx]!;
    const end = bills.endDay[idx]!;
    const q = bills.quantity[idx]!;
    if (!Number.isInteger(start0) || !Number.isInteger(end) || end < start0) {
      dropped.push({ index: idx, startDay: start0, endDay: end, reason: 'invalid-dates', temperatureCoverage: null });
      continue;
    }
    let start = start0;
    if (start === prevEnd) {
      start++; // shared read date: the day belongs to the earlier bill
      table.sharedReadDates++;
    } else if (start < prevEnd) {
      table.overlaps++;
    }
    prevEnd = Math.max(prevEnd, end);
    if (!Number.isFinite(q)) {
      dropped.push({ index: idx, startDay: start0, endDay: end, reason: 'invalid-quantity', temperatureCoverage: null });
      continue;
    }
    const days = end - start + 1;
    if (days < 1) {
      dropped.push({ index: idx, startDay: start0, endDay: end, reason: 'no-days-left', temperatureCoverage: null });
      continue;
    }
    const known = temperatureDays(station, start, end);
    if (known / days < minCoverage || known === 0) {
      dropped.push({ index: idx, startDay: start0, endDay: end, reason: 'insufficient-temperature', temperatureCoverage: known / days });
      continue;
    }
    const i = table.n;
    const s = fillPeriodFromStation(station, start, end, table.hdd, table.cdd, i * BASE_COUNT, table.fill);
    table.sourceIndex[i] = idx;
    table.startDay[i] = start;
    table.endDay[i] = end;
    table.days[i] = days;
    table.quantity[i] = q;
    table.usePerDay[i] = q / days;
    table.meanTempF[i] = s.meanF;
    table.heatingFrom[i] = s.heatingFrom;
    table.coolingTo[i] = s.coolingTo;
    table.rowFrom[i] = s.rowFrom;
    table.rowTo[i] = s.rowTo;
    table.factor[i] = days / s.count;
    table.n = i + 1;
  }
  addWeightedPeriodSums(station, table.rowFrom, table.rowTo, table.factor, table.n, table.weightedHdd, table.weightedCdd);
  return dropped;
}
