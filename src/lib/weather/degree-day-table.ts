/**
 * Fast degree-day sums for any day range and many bases. For every whole-°F base on a grid
 * (default 30-90 °F, the CalTRACK 2.0 §3.2.1 balance-point range) it keeps prefix sums of daily
 * HDD and CDD, so the sum over [startDay, endDay] at a grid base is two array reads. Off-grid
 * bases (e.g. 18 °C = 64.4 °F) fall back to an exact loop over the range's days. Days outside
 * the series or without temperature contribute nothing and are not counted.
 *
 * Build it from a gap-filled series (`fillSingleMissingDays`) so interpolated days count.
 */
import { DAY_MISSING, type DailyTemperatureSeries } from './daily-series';
import { cToF, type DegreeDayKind, degreeDaysFToC, type TemperatureUnit } from './temperature';

export interface DegreeDayTable {
  readonly firstDay: number;
  readonly nDays: number;
  /** Lowest grid base, whole °F. */
  readonly baseMinF: number;
  /** Number of grid bases: baseMinF, baseMinF + 1, … */
  readonly nBases: number;
  /** Prefix sums, base-major: [b × (nDays + 1) + i] = Σ of daily HDD over the first i days. */
  readonly hddPrefix: Float64Array;
  readonly cddPrefix: Float64Array;
  /** [i] = number of days with temperature among the first i days. */
  readonly countPrefix: Int32Array;
  readonly meanF: Float64Array;
  readonly status: Uint8Array;
}

export interface DegreeDayGrid {
  /** Lowest whole-°F base; default 30 (CalTRACK 2.0 §3.2.1.1). */
  baseMinF?: number;
  /** Highest whole-°F base; default 90 (CalTRACK 2.0 §3.2.1.2). */
  baseMaxF?: number;
}

/** Grid bases are snapped when this close to a whole °F (e.g. 18.333… °C → 65 °F). */
const SNAP_F = 1e-9;

/**
 * Builds the prefix-sum table. Memory: 2 × nBases × (nDays + 1) doubles, about 3.6 MB for ten
 * years at 61 bases. Each prefix is accumulated with Kahan compensation.
 * @throws RangeError when the grid is not whole °F with baseMinF ≤ baseMaxF (a programming error).
 */
export function buildDegreeDayTable(series: DailyTemperatureSeries, grid: DegreeDayGrid = {}): DegreeDayTable {
  const baseMinF = grid.baseMinF ?? 30;
  const baseMaxF = grid.baseMaxF ?? 90;
  if (!Number.isInteger(baseMinF) || !Number.isInteger(baseMaxF) || baseMaxF < baseMinF) {
    throw new RangeError(`degree-day grid must be whole °F with min ≤ max, got ${baseMinF}-${baseMaxF}`);
  }
  const nDays = series.status.length;
  const nBases = baseMaxF - baseMinF + 1;
  const stride = nDays + 1;
  const hddPrefix = new Float64Array(nBases * stride);
  const cddPrefix = new Float64Array(nBases * stride);
  const countPrefix = new Int32Array(stride);
  const { meanF, status } = series;
  for (let i = 0; i < nDays; i++) countPrefix[i + 1] = (countPrefix[i] as number) + (status[i] === DAY_MISSING ? 0 : 1);
  for (let b = 0; b < nBases; b++) {
    const base = baseMinF + b;
    const row = b * stride;
    // Kahan-compensated running sums: every term is ≥ 0, so the running sum dominates each term.
    let hdd = 0, hddErr = 0, cdd = 0, cddErr = 0;
    for (let i = 0; i < nDays; i++) {
      if (status[i] !== DAY_MISSING) {
        const t = meanF[i] as number;
        if (t < base) {
          const y = base - t - hddErr;
          const s = hdd + y;
          hddErr = s - hdd - y;
          hdd = s;
        } else if (t > base) {
          const y = t - base - cddErr;
          const s = cdd + y;
          cddErr = s - cdd - y;
          cdd = s;
        }
      }
      hddPrefix[row + i + 1] = hdd;
      cddPrefix[row + i + 1] = cdd;
    }
  }
  return { firstDay: series.firstDay, nDays, baseMinF, nBases, hddPrefix, cddPrefix, countPrefix, meanF, status };
}

/** Index of a base on the table's grid, or −1 when off the grid. */
export function gridBaseIndex(table: DegreeDayTable, baseF: number): number {
  const r = Math.round(baseF);
  if (Math.abs(baseF - r) > SNAP_F) return -1;
  const b = r - table.baseMinF;
  return b >= 0 && b < table.nBases ? b : -1;
}

/** The grid's bases in °F, lowest first. */
export function gridBasesF(table: DegreeDayTable): Float64Array {
  const out = new Float64Array(table.nBases);
  for (let b = 0; b < table.nBases; b++) out[b] = table.baseMinF + b;
  return out;
}

/** Days in [startDay, endDay] (inclusive) that have a temperature. */
export function daysWithTemperature(table: DegreeDayTable, startDay: number, endDay: number): number {
  const i0 = Math.max(0, startDay - table.firstDay);
  const i1 = Math.min(table.nDays - 1, endDay - table.firstDay);
  return i1 < i0 ? 0 : (table.countPrefix[i1 + 1] as number) - (table.countPrefix[i0] as number);
}

/**
 * Sum of daily degree days over [startDay, endDay] (inclusive) at base `baseF` (°F), over the
 * days with temperature. O(1) for grid bases, O(days) otherwise.
 */
export function degreeDaySumF(
  table: DegreeDayTable,
  kind: DegreeDayKind,
  baseF: number,
  startDay: number,
  endDay: number,
): number {
  const i0 = Math.max(0, startDay - table.firstDay);
  const i1 = Math.min(table.nDays - 1, endDay - table.firstDay);
  if (i1 < i0) return 0;
  const b = gridBaseIndex(table, baseF);
  if (b >= 0) {
    const prefix = kind === 'hdd' ? table.hddPrefix : table.cddPrefix;
    const row = b * (table.nDays + 1);
    return (prefix[row + i1 + 1] as number) - (prefix[row + i0] as number);
  }
  let sum = 0;
  const { meanF, status } = table;
  for (let i = i0; i <= i1; i++) {
    if (status[i] === DAY_MISSING) continue;
    const diff = kind === 'hdd' ? baseF - (meanF[i] as number) : (meanF[i] as number) - baseF;
    if (diff > 0) sum += diff;
  }
  return sum;
}

/**
 * Degree-day sum with base and result in °F or °C (°C·day = °F·day × 5/9).
 * @example degreeDaySum(table, 'hdd', 18, d0, d0, 'C') // 8 for a day with mean 10 °C
 */
export function degreeDaySum(
  table: DegreeDayTable,
  kind: DegreeDayKind,
  base: number,
  startDay: number,
  endDay: number,
  unit: TemperatureUnit = 'F',
): number {
  if (unit === 'F') return degreeDaySumF(table, kind, base, startDay, endDay);
  return degreeDaysFToC(degreeDaySumF(table, kind, cToF(base), startDay, endDay));
}

/**
 * Writes the degree-day sum over [startDay, endDay] at every grid base into
 * `out[offset + b × stride]` (b = 0 … nBases − 1) and returns the days with temperature.
 * Allocation-free: the baseline engine calls it once per bill.
 */
export function fillDegreeDaySums(
  table: DegreeDayTable,
  kind: DegreeDayKind,
  startDay: number,
  endDay: number,
  out: Float64Array,
  offset = 0,
  stride = 1,
): number {
  const i0 = Math.max(0, startDay - table.firstDay);
  const i1 = Math.min(table.nDays - 1, endDay - table.firstDay);
  const prefix = kind === 'hdd' ? table.hddPrefix : table.cddPrefix;
  const rowStride = table.nDays + 1;
  for (let b = 0; b < table.nBases; b++) {
    const row = b * rowStride;
    out[offset + b * stride] = i1 < i0 ? 0 : (prefix[row + i1 + 1] as number) - (prefix[row + i0] as number);
  }
  return i1 < i0 ? 0 : (table.countPrefix[i1 + 1] as number) - (table.countPrefix[i0] as number);
}
