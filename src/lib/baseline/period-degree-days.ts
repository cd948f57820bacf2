/**
 * Heating and cooling degree days of one period at one base, from daily mean temperatures.
 *
 * CalTRACK 2.0 §3.3.4–3.3.5 [confirmed]: `HDD_p(b) = (1/n) Σ_d max(0, b − T_d)` and
 * `CDD_p(b) = (1/n) Σ_d max(0, T_d − b)`. Here n is the number of days of the period that have a
 * temperature: with complete data this is CalTRACK's n_dp (days elapsed); with up to 10 % of
 * days missing it averages over the known days instead of counting the missing ones as zero.
 * (The engine gets all 61 grid bases at once from station-degree-days.ts.)
 */
import type { DailyTemperatures } from './daily-temperatures';

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
