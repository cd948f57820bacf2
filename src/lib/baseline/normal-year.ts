/**
 * Normal-year degree days of a station: at base b, the mean over the station's complete
 * calendar years of the annual sum of daily degree days (methods.md §3; prefer ≥ 10 years and
 * show how many were used). A year is complete when every day has a temperature after single
 * missing days are interpolated.
 */
import { BASE_COUNT, BASE_MIN_F } from './grid';
import { firstDayOfYear, yearOfDay } from './calendar-days';
import type { DailyTemperatures } from './daily-temperatures';

/** Normal-year degree days as functions of the base, plus the normal mean temperature. */
export interface NormalYearDegreeDays {
  /** Calendar years averaged. */
  years: number[];
  /** Annual HDD at base b °F. */
  hdd(baseF: number): number;
  /** Annual CDD at base b °F. */
  cdd(baseF: number): number;
  /** Mean daily temperature of the normal year, °F (for the `linear` shape). */
  meanTempF: number;
}

/** Serializable normal year on the 30..90 °F grid (index k = base 30 + k). */
export interface NormalYearTable {
  years: number[];
  hddByBase: number[];
  cddByBase: number[];
  meanTempF: number;
}

/** Complete calendar years of a station, as [first, last] indices into `meanF`. */
function completeYears(temps: DailyTemperatures): { year: number; from: number; to: number }[] {
  const out: { year: number; from: number; to: number }[] = [];
  const n = temps.meanF.length;
  if (n === 0) return out;
  const firstYear = yearOfDay(temps.firstDay);
  const lastYear = yearOfDay(temps.firstDay + n - 1);
  for (let year = firstYear; year <= lastYear; year++) {
    const from = firstDayOfYear(year) - temps.firstDay;
    const to = firstDayOfYear(year + 1) - 1 - temps.firstDay;
    if (from < 0 || to >= n) continue;
    let complete = true;
    for (let i = from; i <= to && complete; i++) complete = !Number.isNaN(temps.meanF[i]!);
    if (complete) out.push({ year, from, to });
  }
  return out;
}

/**
 * Normal-year degree days on the 1 °F grid from a station's complete years.
 * @returns null when the station has no complete calendar year
 */
export function normalYearTable(temps: DailyTemperatures): NormalYearTable | null {
  const years = completeYears(temps);
  if (years.length === 0) return null;
  const hdd = new Float64Array(BASE_COUNT);
  const cdd = new Float64Array(BASE_COUNT);
  let meanSum = 0;
  for (const { from, to } of years) {
    const sorted = temps.meanF.slice(from, to + 1).sort();
    let total = 0;
    for (const t of sorted) total += t;
    meanSum += total / sorted.length;
    let below = 0;
    let sumBelow = 0;
    for (let k = 0; k < BASE_COUNT; k++) {
      const b = BASE_MIN_F + k;
      while (below < sorted.length && sorted[below]! < b) sumBelow += sorted[below++]!;
      hdd[k] = hdd[k]! + Math.max(0, b * below - sumBelow);
      cdd[k] = cdd[k]! + Math.max(0, total - sumBelow - b * (sorted.length - below));
    }
  }
  const y = years.length;
  return {
    years: years.map((v) => v.year),
    hddByBase: Array.from(hdd, (v) => v / y),
    cddByBase: Array.from(cdd, (v) => v / y),
    meanTempF: meanSum / y,
  };
}

/**
 * Normal-year degree-day functions from a grid table; bases off the grid are interpolated
 * linearly between grid points (degree days are piecewise linear in the base between daily
 * temperatures, so this is close, and exact on the grid).
 */
export function normalYearFromTable(table: NormalYearTable): NormalYearDegreeDays {
  const at = (values: number[], baseF: number): number => {
    const x = Math.min(Math.max(baseF - BASE_MIN_F, 0), BASE_COUNT - 1);
    const k = Math.min(Math.floor(x), BASE_COUNT - 2);
    const f = x - k;
    return values[k]! * (1 - f) + values[k + 1]! * f;
  };
  return {
    years: table.years,
    hdd: (b) => at(table.hddByBase, b),
    cdd: (b) => at(table.cddByBase, b),
    meanTempF: table.meanTempF,
  };
}
