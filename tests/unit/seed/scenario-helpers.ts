/**
 * Independent helpers for checking the demo scenario from its published output only: dates through
 * the platform's Date (UTC), degree days from the published daily weather, bills grouped by meter.
 * Nothing here imports the generator's own arithmetic.
 */
import type { DemoScenario } from '../../../src/db/seed/scenario';

type Bill = DemoScenario['bills'][number];
type Truth = DemoScenario['truth']['meters'][string];

const MS_PER_DAY = 86_400_000;

/** Days since 1970-01-01 of an ISO date (UTC). */
export function dayNumber(iso: string): number {
  return Math.round(Date.parse(`${iso}T00:00:00Z`) / MS_PER_DAY);
}

const meanMaps = new WeakMap<object, Map<number, number | null>>();

/** Daily mean temperature by day number; null where either value is missing; absent rows absent. */
export function dailyMeanMap(station: DemoScenario['stations'][number]): Map<number, number | null> {
  const cached = meanMaps.get(station);
  if (cached) return cached;
  const map = new Map<number, number | null>();
  for (const d of station.days) {
    map.set(dayNumber(d.date), d.tmaxF === null || d.tminF === null ? null : (d.tmaxF + d.tminF) / 2);
  }
  meanMaps.set(station, map);
  return map;
}

/** HDD at base b of a daily mean (NOAA/NWS mean-temperature method). */
export const hdd = (meanF: number, baseF: number): number => Math.max(0, baseF - meanF);
/** CDD at base b of a daily mean. */
export const cdd = (meanF: number, baseF: number): number => Math.max(0, meanF - baseF);

/** A bill with the days its use covers (a shared read day belongs to the earlier bill). */
export interface CoveredBill {
  bill: Bill;
  from: number;
  to: number;
  days: number;
}

/** Bills per meter in period order, duplicates kept, with their covered days. */
export function billsByMeter(scenario: DemoScenario): Map<string, CoveredBill[]> {
  const out = new Map<string, CoveredBill[]>();
  for (const bill of scenario.bills) {
    const list = out.get(bill.meterCode) ?? [];
    const prev = list.at(-1);
    const start = dayNumber(bill.periodStart);
    const to = dayNumber(bill.periodEnd);
    const from = prev && prev.to === start && prev.bill.periodStart !== bill.periodStart ? start + 1 : start;
    list.push({ bill, from, to, days: to - from + 1 });
    out.set(bill.meterCode, list);
  }
  return out;
}

/**
 * Period averages CalTRACK-style: mean over the covered days that have temperatures of HDD at
 * τH and CDD at τC (CalTRACK 2.0 §3.3.4–3.3.5), and the share of days with data.
 */
export function periodDegreeDays(
  means: Map<number, number | null>,
  from: number,
  to: number,
  heatingBaseF: number | null,
  coolingBaseF: number | null,
): { hddPerDay: number; cddPerDay: number; coverage: number } {
  let h = 0;
  let c = 0;
  let n = 0;
  for (let d = from; d <= to; d++) {
    const t = means.get(d);
    if (t === undefined || t === null) continue;
    if (heatingBaseF !== null) h += hdd(t, heatingBaseF);
    if (coolingBaseF !== null) c += cdd(t, coolingBaseF);
    n++;
  }
  return { hddPerDay: n ? h / n : 0, cddPerDay: n ? c / n : 0, coverage: n / (to - from + 1) };
}

/** Expected use per day of a period from stated parameters. */
export function expectedPerDay(truth: Truth, means: Map<number, number | null>, from: number, to: number): number {
  const dd = periodDegreeDays(means, from, to, truth.heatingBalanceF, truth.coolingBalanceF);
  return truth.basePerDay + truth.heatingSlope * dd.hddPerDay + truth.coolingSlope * dd.cddPerDay;
}

/** The station of the installation a meter belongs to. */
export function stationOfMeter(scenario: DemoScenario, meterCode: string): DemoScenario['stations'][number] {
  const meter = scenario.meters.find((m) => m.code === meterCode);
  const inst = scenario.installations.find((i) => i.code === meter?.installationCode);
  const station = scenario.stations.find((s) => s.code === inst?.stationCode);
  if (!station) throw new Error(`no station for ${meterCode}`);
  return station;
}

/** Meter codes named by any messy-data item. */
export function messyMeters(scenario: DemoScenario): Set<string> {
  return new Set(scenario.truth.messy.map((m) => m.meterCode));
}
