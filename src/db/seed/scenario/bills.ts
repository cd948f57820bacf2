/**
 * Bills of one meter from its physical parameters and the station's daily weather:
 *
 *   expected = Σ_days ( base + βH·max(0, τH − T_d) + βC·max(0, T_d − τC) )   over the covered days
 *   quantity = expected · (1 + cv·z),   z ~ N(0, 1) truncated at ±3.5
 *
 * T_d is the daily mean (Tmax + Tmin)/2 of the complete series. When the parameters change
 * partway (a retrofit, a fault), each day uses the parameters in force that day.
 * Cost = quantity × blended unit price × (1 + escalation)^(fiscal years since the first bill).
 * Peak demand (electricity) = average kW / load factor · (1 + 0.04·z').
 */
import type { DemoMeter, MeterTruth } from './types';
import type { BillPeriod } from './read-dates';
import { federalFiscalYear } from './dates';
import { round } from './load-parameters';
import type { Rng } from './prng';
import { quantityDecimals } from './meters';

/** Parameters in force from `fromDay` (day number) on; the first regime's fromDay is ignored. */
export interface Regime {
  fromDay: number;
  truth: MeterTruth;
}

export interface BillInputs {
  meter: DemoMeter;
  regimes: readonly Regime[];
  periods: readonly BillPeriod[];
  /** Daily mean temperatures of the complete series from `weatherFirstDay`. */
  dailyMeanF: Float64Array;
  weatherFirstDay: number;
  unitPrice: number;
  escalationPct: number;
  /** Electricity only: average over peak demand. */
  loadFactor: number | null;
}

/** A bill before it is written out, with what the messy-data step needs. */
export interface DraftBill {
  period: BillPeriod;
  /** Noise-free use over the covered days. */
  expected: number;
  quantity: number;
  unitPrice: number;
  demandKw: number | null;
  estimated: boolean;
}

const NOISE_LIMIT_SD = 3.5; // demo choice: no bill further than 3.5 noise sd from its expectation

export function draftBills(input: BillInputs, rng: Rng): DraftBill[] {
  const firstPeriod = input.periods[0];
  if (!firstPeriod) return [];
  const firstFy = federalFiscalYear(firstPeriod.start);
  const decimals = quantityDecimals(input.meter.unit);
  return input.periods.map((period) => {
    const expected = expectedUse(input, period);
    const quantity = round(expected * (1 + input.regimes[0]!.truth.noiseCv * rng.truncatedNormal(NOISE_LIMIT_SD)), decimals);
    const price = input.unitPrice * (1 + input.escalationPct / 100) ** (federalFiscalYear(period.end) - firstFy);
    let demandKw: number | null = null;
    if (input.loadFactor !== null) {
      const days = period.end - period.coveredFrom + 1;
      demandKw = round((quantity / (days * 24) / input.loadFactor) * (1 + 0.04 * rng.truncatedNormal(3)), 1);
    }
    return { period, expected, quantity, unitPrice: price, demandKw, estimated: false };
  });
}

/** Noise-free use over a period's covered days. */
export function expectedUse(input: BillInputs, period: BillPeriod): number {
  let total = 0;
  for (let d = period.coveredFrom; d <= period.end; d++) {
    const t = input.dailyMeanF[d - input.weatherFirstDay];
    if (t === undefined) throw new Error(`no weather for day ${d} (${input.meter.code})`);
    const p = truthOn(input.regimes, d);
    total += p.basePerDay;
    if (p.heatingBalanceF !== null && t < p.heatingBalanceF) total += p.heatingSlope * (p.heatingBalanceF - t);
    if (p.coolingBalanceF !== null && t > p.coolingBalanceF) total += p.coolingSlope * (t - p.coolingBalanceF);
  }
  return total;
}

function truthOn(regimes: readonly Regime[], day: number): MeterTruth {
  let current = regimes[0]!.truth;
  for (let i = 1; i < regimes.length; i++) {
    const r = regimes[i]!;
    if (day >= r.fromDay) current = r.truth;
  }
  return current;
}

/** Cost of a quantity at a bill's unit price, to the cent. */
export function billCost(quantity: number, unitPrice: number): number {
  return round(quantity * unitPrice, 2);
}
