/**
 * Combustion efficiency of natural gas from the U.S. DOE table (Steam Tip Sheet #4, "Improve
 * Your Boiler's Combustion Efficiency", January 2006), by flue-gas O2 and net stack temperature
 * (flue gas less combustion air). The table assumes complete combustion and dry combustion air;
 * U.S. tables of this kind are on a gross (higher heating value) basis [memory]. Between grid
 * points the value is interpolated bilinearly; outside the grid there is no value.
 *
 * @example
 * doeNaturalGasCombustionEfficiency(7, 400) // { ok: true, efficiencyPercent: 78.2, interpolated: false }
 */

/** Rows: O2 % (excess air % beside it in the tip sheet: 9.5, 15.0, 28.1, 44.9, 81.6). */
export const DOE_TABLE_O2_PERCENT = [2, 3, 5, 7, 10] as const;
export const DOE_TABLE_EXCESS_AIR_PERCENT = [9.5, 15.0, 28.1, 44.9, 81.6] as const;
/** Columns: flue-gas temperature less combustion-air temperature, °F. */
export const DOE_TABLE_NET_STACK_F = [200, 300, 400, 500, 600] as const;

/** Combustion efficiency, % (DOE Steam Tip Sheet #4, table "Combustion Efficiency for Natural Gas"). */
export const DOE_TABLE_EFFICIENCY_PERCENT: readonly (readonly number[])[] = [
  [85.4, 83.1, 80.8, 78.4, 76.0],
  [85.2, 82.8, 80.4, 77.9, 75.4],
  [84.7, 82.1, 79.5, 76.7, 74.0],
  [84.1, 81.2, 78.2, 75.2, 72.1],
  [82.8, 79.3, 75.6, 71.9, 68.2],
];

export type DoeTableOutcome =
  | { ok: true; efficiencyPercent: number; interpolated: boolean }
  | { ok: false; reason: 'outside-table-range'; message: string };

/** Index i with grid[i] ≤ x ≤ grid[i+1], and the fraction of the way from grid[i]. */
function bracket(grid: readonly number[], x: number): { i: number; t: number } | null {
  const last = grid.length - 1;
  if (x < (grid[0] as number) || x > (grid[last] as number)) return null;
  for (let i = 0; i < last; i += 1) {
    const lo = grid[i] as number;
    const hi = grid[i + 1] as number;
    if (x <= hi) return { i, t: (x - lo) / (hi - lo) };
  }
  return { i: last - 1, t: 1 };
}

export function doeNaturalGasCombustionEfficiency(o2Percent: number, netStackTempF: number): DoeTableOutcome {
  const row = bracket(DOE_TABLE_O2_PERCENT, o2Percent);
  const col = bracket(DOE_TABLE_NET_STACK_F, netStackTempF);
  if (row === null || col === null) {
    return {
      ok: false,
      reason: 'outside-table-range',
      message: 'The DOE table covers O2 2–10 % and net stack temperature 200–600 °F.',
    };
  }
  const at = (r: number, c: number) => (DOE_TABLE_EFFICIENCY_PERCENT[r] as readonly number[])[c] as number;
  const top = at(row.i, col.i) * (1 - col.t) + at(row.i, col.i + 1) * col.t;
  const bottom = at(row.i + 1, col.i) * (1 - col.t) + at(row.i + 1, col.i + 1) * col.t;
  const efficiencyPercent = top * (1 - row.t) + bottom * row.t;
  const onGrid = (t: number) => t === 0 || t === 1;
  return { ok: true, efficiencyPercent, interpolated: !(onGrid(row.t) && onGrid(col.t)) };
}

/**
 * Fuel saved by raising combustion efficiency from E1 to E2 (DOE Steam Tip Sheet #4):
 * saved = fuel × (1 − E1/E2); cost = saved × price.
 */
export function combustionTuneUpSavings(annualFuelMMBtu: number, efficiencyBeforePercent: number, efficiencyAfterPercent: number, fuelPriceUsdPerMMBtu: number) {
  const savedMMBtu = annualFuelMMBtu * (1 - efficiencyBeforePercent / efficiencyAfterPercent);
  return { savedMMBtu, savedUsd: savedMMBtu * fuelPriceUsdPerMMBtu };
}
