import { describe, expect, it } from 'vitest';
import { packDailyMeans } from '../../../src/lib/baseline/daily-temperatures';
import { normalYearFromTable, normalYearTable } from '../../../src/lib/baseline/normal-year';
import { normalizedAnnualConsumption } from '../../../src/lib/baseline/nac';
import { fractionalSavingsUncertainty } from '../../../src/lib/baseline/savings-uncertainty';
import { reportingPeriodSavings } from '../../../src/lib/baseline/reporting-savings';
import { BaselineEngine } from '../../../src/lib/baseline/engine';
import { firstDayOfYear } from '../../../src/lib/baseline/calendar-days';
import { constantTemperatureSeries, readJson } from './support';

describe('normal-year degree days (methods.md §3: mean over complete years of annual sums)', () => {
  it('averages the complete calendar years only', () => {
    // 2021 at 50 °F and 2022 at 40 °F, both complete; 2023 has a 3-day gap and is left out
    const first = firstDayOfYear(2021);
    const mean = new Float64Array(365 * 3).fill(50);
    mean.fill(40, 365, 730);
    mean.fill(Number.NaN, 800, 803);
    const table = normalYearTable(packDailyMeans(first, mean))!;
    expect(table.years).toEqual([2021, 2022]);
    // HDD65: (15·365 + 25·365) / 2 = 7300; CDD45: (5·365 + 0) / 2 = 912.5
    expect(table.hddByBase[65 - 30]).toBe(7300);
    expect(table.cddByBase[45 - 30]).toBe(912.5);
    expect(table.meanTempF).toBe(45);
    const normal = normalYearFromTable(table);
    expect(normal.hdd(65)).toBe(7300);
    expect(normal.hdd(64.5)).toBeCloseTo((7300 + (7300 - 365)) / 2, 9);
  });

  it('returns null without a complete year', () => {
    expect(normalYearTable(packDailyMeans(firstDayOfYear(2021) + 5, new Float64Array(400).fill(50)))).toBeNull();
  });

  it('NAC of a linear model uses the normal mean temperature: 365·(μ + β·T̄)', () => {
    const normal = { years: [2021], hdd: () => 0, cdd: () => 0, meanTempF: 52 };
    const r = normalizedAnnualConsumption({ shape: 'linear', intercept: 10, heatingSlope: null, coolingSlope: null, slope: -0.1, heatingBalanceF: null, coolingBalanceF: null }, normal);
    expect(r).toEqual({ ok: true, nac: 365 * (10 - 5.2) });
  });
});

describe('reporting-period savings (CalTRACK 2.0 §3.6 and §4.3.2.4)', () => {
  const v = readJson<{ threeParameterHeating: { meanTempF: number[]; usePerDay: number[] } }>('baseline/constructed-vectors.json').threeParameterHeating;

  it('avoided use is Σ days·(ŷ − y): 10 % less use than the baseline model gives F = 0.10', () => {
    const base = constantTemperatureSeries(v.meanTempF, v.usePerDay);
    const fit = new BaselineEngine().fit(base.bills, base.temps);
    if (!fit.ok) throw new Error(fit.reason);
    // reporting bills over the same weather with 10 % less use
    const reporting = { startDay: base.bills.startDay, endDay: base.bills.endDay, quantity: Float64Array.from(base.bills.quantity, (q) => q * 0.9) };
    const r = reportingPeriodSavings(fit.selected, reporting, base.temps);
    if (!r.ok) throw new Error(r.reason);
    const baseline = Array.from(base.bills.quantity).reduce((a, b) => a + b, 0);
    expect(r.adjustedBaseline).toBeCloseTo(baseline, 6);
    expect(r.avoidedUse).toBeCloseTo(0.1 * baseline, 6);
    expect(r.savingsFraction!).toBeCloseTo(0.1, 12);
    expect(r.periods).toHaveLength(12);
    expect(r.months).toBeCloseTo(360 / (365.2425 / 12), 12);
  });

  it('FSU: negative ρ gets no credit (treated as 0, P′ = P); positive ρ shrinks P′ = P(1 − ρ)/(1 + ρ)', () => {
    const input = { cvrmse: 0.1, baselinePeriods: 24, slopeCount: 1, reportingPeriods: 12, reportingMonths: 12, savingsFraction: 0.2 };
    const zero = fractionalSavingsUncertainty({ ...input, rho: 0 });
    const negative = fractionalSavingsUncertainty({ ...input, rho: -0.6 });
    const positive = fractionalSavingsUncertainty({ ...input, rho: 0.5 });
    if (!zero.ok || !negative.ok || !positive.ok) throw new Error('unexpected failure');
    expect(negative.rhoUsed).toBe(0);
    expect(negative.fsu).toBe(zero.fsu);
    expect(positive.effectiveBaselinePeriods).toBeCloseTo(8, 12);
    // ratio of the sqrt terms: (24/8)(1 + 2/8) vs (1)(1 + 2/24)
    expect(positive.fsu / zero.fsu).toBeCloseTo(Math.sqrt((3 * 1.25) / (1 + 2 / 24)), 12);
  });

  it('FSU returns a typed reason for zero savings or too few baseline periods', () => {
    const input = { cvrmse: 0.1, baselinePeriods: 24, slopeCount: 1, rho: 0, reportingPeriods: 12, reportingMonths: 12 };
    expect(fractionalSavingsUncertainty({ ...input, savingsFraction: 0 })).toEqual({ ok: false, reason: 'zero-savings' });
    expect(fractionalSavingsUncertainty({ ...input, baselinePeriods: 1, savingsFraction: 0.1 })).toEqual({ ok: false, reason: 'too-few-periods' });
  });
});
