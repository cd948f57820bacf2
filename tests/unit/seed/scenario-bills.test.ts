import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { generateDemoScenario, type DemoScenario } from '../../../src/db/seed/scenario';
import {
  billsByMeter,
  dailyMeanMap,
  dayNumber,
  expectedPerDay,
  messyMeters,
  periodDegreeDays,
  stationOfMeter,
  type CoveredBill,
} from './scenario-helpers';

const scenario = generateDemoScenario();

/** Meters whose parameters never change and whose bills are untouched by the messy data. */
function plainMeters(s: DemoScenario): string[] {
  const changed = new Set([s.truth.retrofit.meterCode, ...s.truth.poorPerformers.filter((p) => p.after).map((p) => p.meterCode)]);
  const messy = messyMeters(s);
  return s.meters.map((m) => m.code).filter((c) => !changed.has(c) && !messy.has(c));
}

/** Half a unit of the last decimal a bill's quantity is stated to (bills are rounded). */
function roundingSlack(quantity: number): number {
  const decimals = (String(quantity).split('.')[1] ?? '').length;
  return 0.5 * 10 ** -Math.max(decimals, 3);
}

/**
 * Check each bill against use per day = base + βH·HDD_p(τH) + βC·CDD_p(τC) from the stated
 * parameters and the published weather: |quantity/expected − 1| within 4 noise sd.
 */
function checkBillsFollowTruth(s: DemoScenario, meterCodes: string[]): { bills: number; outside: string[] } {
  const byMeter = billsByMeter(s);
  const outside: string[] = [];
  let bills = 0;
  for (const code of meterCodes) {
    const truth = s.truth.meters[code]!;
    const means = dailyMeanMap(stationOfMeter(s, code));
    for (const b of byMeter.get(code)!) {
      const expected = expectedPerDay(truth, means, b.from, b.to) * b.days;
      const ratio = b.bill.quantity / expected;
      const tolerance = 4 * truth.noiseCv + roundingSlack(b.bill.quantity) / expected;
      if (Math.abs(ratio - 1) >= tolerance) outside.push(`${code} ${b.bill.periodStart} ratio ${ratio.toFixed(3)} cv ${truth.noiseCv}`);
      bills++;
    }
  }
  return { bills, outside };
}

/**
 * OLS of use per day on period HDD at the true balance point (simple-statistics linearRegression)
 * with the slope's standard error for the known multiplicative noise:
 * Var(m) = Σ (x_i − x̄)² σ_i² / Sxx², σ_i = cv · E[y_i] (heteroscedastic OLS variance, standard result).
 */
function fitHeatingSlope(s: DemoScenario, code: string, bills: CoveredBill[], tauH: number, cv: number, truthSlope: number, truthBase: number) {
  const means = dailyMeanMap(stationOfMeter(s, code));
  const pts = bills.map((b) => {
    const x = periodDegreeDays(means, b.from, b.to, tauH, null).hddPerDay;
    return { x, y: b.bill.quantity / b.days, ey: truthBase + truthSlope * x };
  });
  const { m, b } = linearRegression(pts.map((p) => [p.x, p.y]));
  const xbar = pts.reduce((a, p) => a + p.x, 0) / pts.length;
  const sxx = pts.reduce((a, p) => a + (p.x - xbar) ** 2, 0);
  const varM = pts.reduce((a, p) => a + (p.x - xbar) ** 2 * (cv * p.ey) ** 2, 0) / sxx ** 2;
  return { slope: m, intercept: b, se: Math.sqrt(varM), n: pts.length };
}

describe('demo bills: periods', () => {
  it('has valid periods: start ≤ end, 25–35 days, in order, each meter either separate or shared read dates', () => {
    const byMeter = billsByMeter(scenario);
    const messy = new Map(scenario.truth.messy.map((m) => [m.meterCode, m.kind]));
    const problems: string[] = [];
    let shared = 0;
    for (const [code, bills] of byMeter) {
      for (let i = 0; i < bills.length; i++) {
        const b = bills[i]!;
        const stated = dayNumber(b.bill.periodEnd) - dayNumber(b.bill.periodStart) + 1;
        // CalTRACK 2.0 §2.2.3.4–5: monthly periods under 25 or over 35 days are off-cycle.
        if (stated < 25 || stated > 35) problems.push(`${code} ${b.bill.periodStart} ${stated} days`);
        if (i === 0) continue;
        const prev = bills[i - 1]!;
        const step = dayNumber(b.bill.periodStart) - dayNumber(prev.bill.periodEnd);
        if (step === 0 && b.bill.periodStart !== prev.bill.periodStart) shared++;
        else if (step !== 1) {
          const expectedMessy = (messy.get(code) === 'gap' && step > 50) || (messy.get(code) === 'duplicate' && b.bill.periodStart === prev.bill.periodStart);
          if (!expectedMessy) problems.push(`${code} step ${step} at ${b.bill.periodStart}`);
        }
      }
    }
    expect(problems).toEqual([]);
    expect(shared).toBeGreaterThan(0);
    // Read dates are irregular: more than four different period lengths occur.
    const lengths = new Set(scenario.bills.map((b) => dayNumber(b.periodEnd) - dayNumber(b.periodStart)));
    expect(lengths.size).toBeGreaterThan(4);
  });

  it('states electricity peak demand, no demand on other commodities, and finite costs', () => {
    const commodity = new Map(scenario.meters.map((m) => [m.code, m.commodity]));
    let missingDemand = 0;
    const problems: string[] = [];
    for (const b of scenario.bills) {
      if (!Number.isFinite(b.cost) || !Number.isFinite(b.quantity) || b.cost < 0) problems.push(`${b.meterCode} ${b.periodStart} cost`);
      if (commodity.get(b.meterCode) === 'electricity') {
        if (b.demandKw === null) missingDemand++;
        // Peak demand is at least the period's average power (kWh over hours).
        else if (b.demandKw <= b.quantity / (35 * 24)) problems.push(`${b.meterCode} ${b.periodStart} demand`);
      } else if (b.demandKw !== null) problems.push(`${b.meterCode} ${b.periodStart} demand on ${commodity.get(b.meterCode)}`);
    }
    expect(problems).toEqual([]);
    expect(missingDemand).toBe(1); // the zero read only
  });

  it('prices bills from a blended unit price that escalates modestly from year to year', () => {
    const byMeter = billsByMeter(scenario);
    for (const m of scenario.meters.slice(0, 40)) {
      const priced = byMeter.get(m.code)!.filter((b) => b.bill.quantity > 0).map((b) => b.bill.cost / b.bill.quantity);
      const first = priced[0]!;
      const last = priced.at(-1)!;
      expect(last).toBeGreaterThanOrEqual(first * 0.999);
      expect(last / first).toBeLessThan(1.25);
    }
  });
});

describe('demo bills: generated from the stated parameters', () => {
  it('every plain meter’s bills match base + βH·HDD + βC·CDD within four noise sd', () => {
    const codes = plainMeters(scenario);
    expect(codes.length).toBeGreaterThan(250);
    const { bills, outside } = checkBillsFollowTruth(scenario, codes);
    expect(bills).toBeGreaterThan(12000);
    expect(outside).toEqual([]);
  });

  it('holds for another seed too', () => {
    const other = generateDemoScenario({ seed: 11, years: 3 });
    const { outside } = checkBillsFollowTruth(other, plainMeters(other).filter((_, i) => i % 3 === 0));
    expect(outside).toEqual([]);
  });

  it('the retrofit and changed meters follow their before and after parameters', () => {
    const byMeter = billsByMeter(scenario);
    const changes = [
      { code: scenario.truth.retrofit.meterCode, date: scenario.truth.retrofit.date, before: scenario.truth.retrofit.before, after: scenario.truth.retrofit.after },
      ...scenario.truth.poorPerformers.filter((p) => p.after).map((p) => ({ code: p.meterCode, date: p.changedOn!, before: scenario.truth.meters[p.meterCode]!, after: p.after! })),
    ];
    expect(changes).toHaveLength(2);
    for (const c of changes) {
      const means = dailyMeanMap(stationOfMeter(scenario, c.code));
      const change = dayNumber(c.date);
      for (const b of byMeter.get(c.code)!.filter((x) => x.to < change || x.from >= change)) {
        const truth = b.to < change ? c.before : c.after;
        const ratio = b.bill.quantity / (expectedPerDay(truth, means, b.from, b.to) * b.days);
        expect(Math.abs(ratio - 1)).toBeLessThan(4 * truth.noiseCv);
      }
    }
  });

  it('a least-squares fit of use per day on period HDD recovers each heating slope within its standard error', () => {
    const byMeter = billsByMeter(scenario);
    const fuelMeters = plainMeters(scenario).filter((code) => {
      const m = scenario.meters.find((x) => x.code === code)!;
      const t = scenario.truth.meters[code]!;
      return (m.commodity === 'natural_gas' || m.commodity === 'fuel_oil_2') && t.heatingSlope > 0;
    });
    expect(fuelMeters.length).toBeGreaterThan(40);
    const off: string[] = [];
    for (const code of fuelMeters) {
      const t = scenario.truth.meters[code]!;
      const fit = fitHeatingSlope(scenario, code, byMeter.get(code)!, t.heatingBalanceF!, t.noiseCv, t.heatingSlope, t.basePerDay);
      if (Math.abs(fit.slope - t.heatingSlope) > 4 * fit.se) off.push(`${code}: fit ${fit.slope} true ${t.heatingSlope} se ${fit.se}`);
    }
    expect(off).toEqual([]);
  });

  it('the retrofit shows: heating slope per HDD after the boiler replacement is lower by about the stated percentage', () => {
    const r = scenario.truth.retrofit;
    expect(r.after.heatingSlope).toBeLessThan(r.before.heatingSlope);
    expect(r.after.heatingSlope / r.before.heatingSlope).toBeCloseTo(1 - r.reductionPct / 100, 2);
    const bills = billsByMeter(scenario).get(r.meterCode)!;
    const change = dayNumber(r.date);
    const tau = r.before.heatingBalanceF!;
    const before = fitHeatingSlope(scenario, r.meterCode, bills.filter((b) => b.to < change), tau, r.before.noiseCv, r.before.heatingSlope, r.before.basePerDay);
    const after = fitHeatingSlope(scenario, r.meterCode, bills.filter((b) => b.from >= change), tau, r.after.noiseCv, r.after.heatingSlope, r.after.basePerDay);
    expect(after.n).toBeGreaterThanOrEqual(12);
    expect(after.slope).toBeLessThan(before.slope);
    expect(Math.abs(before.slope - r.before.heatingSlope)).toBeLessThan(4 * before.se);
    expect(Math.abs(after.slope - r.after.heatingSlope)).toBeLessThan(4 * after.se);
  });
});
