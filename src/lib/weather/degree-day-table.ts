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
  /**
   * Prefix sums, day-major so that all bases of one day sit together: [i × nBases + b] = Σ of
   * daily HDD at base b over the first i days.
   */
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

/** Kahan step: adds x ≥ 0 to sum[b], carrying the rounding error in err[b]. */
function kahanAdd(sum: Float64Array, err: Float64Array, b: number, x: number): void {
  const y = x - (err[b] as number);
  const next = (sum[b] as number) + y;
  err[b] = next - (sum[b] as number) - y;
  sum[b] = next;
}

/**
 * Builds the prefix-sum table. Memory: 2 × (nDays + 1) × nBases doubles, about 3.6 MB for ten
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
  const hddPrefix = new Float64Array((nDays + 1) * nBases);
  const cddPrefix = new Float64Array((nDays + 1) * nBases);
  const countPrefix = new Int32Array(nDays + 1);
  const { meanF, status } = series;
  // Kahan-compensated running sums per base: every term is ≥ 0, so each sum dominates its terms.
  const hdd = new Float64Array(nBases);
  const hddErr = new Float64Array(nBases);
  const cdd = new Float64Array(nBases);
  const cddErr = new Float64Array(nBases);
  for (let i = 0; i < nDays; i++) {
    const present = status[i] !== DAY_MISSING;
    countPrefix[i + 1] = (countPrefix[i] as number) + (present ? 1 : 0);
    if (present) {
      const t = meanF[i] as number;
      for (let b = 0; b < nBases; b++) {
        const diff = baseMinF + b - t;
        if (diff > 0) kahanAdd(hdd, hddErr, b, diff);
        else if (diff < 0) kahanAdd(cdd, cddErr, b, -diff);
      }
    }
    hddPrefix.set(hdd, (i + 1) * nBases);
    cddPrefix.set(cdd, (i + 1) * nBases);
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
    const n = table.nBases;
    return (prefix[(i1 + 1) * n + b] as number) - (prefix[i0 * n + b] as number);
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
 * Writes the degree-day sum over [startDay, endDay] at every grid base, times `scale`, into
 * `out[offset + b × stride]` (b = 0 … nBases − 1) and returns the days with temperature.
 * Allocation-free: the baseline engine calls it once per bill (scale = 1 / days gives the
 * CalTRACK per-day form).
 */
export function fillDegreeDaySums(
  table: DegreeDayTable,
  kind: DegreeDayKind,
  startDay: number,
  endDay: number,
  out: Float64Array,
  offset = 0,
  stride = 1,
  scale = 1,
): number {
  const n = table.nBases;
  const i0 = Math.max(0, startDay - table.firstDay);
  const i1 = Math.min(table.nDays - 1, endDay - table.firstDay);
  if (i1 < i0) {
    for (let b = 0; b < n; b++) out[offset + b * stride] = 0;
    return 0;
  }
  const prefix = kind === 'hdd' ? table.hddPrefix : table.cddPrefix;
  const hi = (i1 + 1) * n;
  const lo = i0 * n;
  for (let b = 0; b < n; b++) out[offset + b * stride] = ((prefix[hi + b] as number) - (prefix[lo + b] as number)) * scale;
  return (table.countPrefix[i1 + 1] as number) - (table.countPrefix[i0] as number);
}
