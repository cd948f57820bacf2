/**
 * Constructed check vectors (NOT published): weather-normalization methods notes §6, copied to
 * tests/fixtures/baseline/constructed-vectors.json; expected values were computed there with
 * 60-digit arithmetic and cross-checked with numpy. Tolerance: relative 1e-9.
 */
import { describe, expect, it } from 'vitest';
import { weightedLeastSquares } from '../../../src/lib/baseline/least-squares';
import { fitQuality } from '../../../src/lib/baseline/fit-statistics';
import { BaselineEngine, fitOptionsSchema } from '../../../src/lib/baseline/engine';
import { normalizedAnnualConsumption } from '../../../src/lib/baseline/nac';
import { BILLING_FSU_COEFFICIENTS, DAILY_FSU_COEFFICIENTS, fractionalSavingsUncertainty } from '../../../src/lib/baseline/savings-uncertainty';
import type { NormalYearDegreeDays } from '../../../src/lib/baseline/normal-year';
import { constantTemperatureSeries, readJson, relativeError } from './support';

interface Vectors {
  hdd12: {
    days: number[];
    hdd65Total: number[];
    use: number[];
    ols: Record<string, number>;
    wls: Record<string, number>;
    lag1AutocorrelationApprox: number;
  };
  fsu: Record<string, number>;
  threeParameterHeating: { meanTempF: number[]; usePerDay: number[] };
  fiveParameter: { meanTempF: number[]; usePerDay: number[] };
}
const v = readJson<Vectors>('baseline/constructed-vectors.json');
const TOL = 1e-9;
const { days, hdd65Total, use } = v.hdd12;
const x = hdd65Total.map((h, i) => h / days[i]!);
const y = use.map((u, i) => u / days[i]!);
const normal5800: NormalYearDegreeDays = { years: [], hdd: (b) => (b === 65 ? 5800 : Number.NaN), cdd: () => 0, meanTempF: 0 };

describe('12-bill fixed-base HDD regression (constructed, notes §6.1)', () => {
  it('WLS with weight = days gives μ, βH, weighted R² and adjusted R²', () => {
    const fit = weightedLeastSquares([x], y, days);
    if (!fit.ok) throw new Error(fit.reason);
    expect(relativeError(fit.intercept, v.hdd12.wls.intercept!)).toBeLessThan(TOL);
    expect(relativeError(fit.slopes[0]!, v.hdd12.wls.slope!)).toBeLessThan(TOL);
    const q = fitQuality(y, fit.fitted, days, 1, 2);
    expect(relativeError(q.r2, v.hdd12.wls.r2Weighted!)).toBeLessThan(TOL);
    expect(relativeError(q.adjR2, v.hdd12.wls.adjR2Weighted!)).toBeLessThan(TOL);
  });

  it('WLS: GL14 CV(RMSE) and NMBE on use per day (n − p = 10), CalTRACK CV(RMSE) on totals (P − c = 11)', () => {
    const fit = weightedLeastSquares([x], y, days);
    if (!fit.ok) throw new Error(fit.reason);
    const q = fitQuality(y, fit.fitted, days, 1, 2);
    expect(relativeError(q.cvrmse!, v.hdd12.wls.cvrmseGl14!)).toBeLessThan(TOL);
    expect(relativeError(q.nmbe!, v.hdd12.wls.nmbeGl14!)).toBeLessThan(TOL);
    expect(relativeError(q.cvrmseCaltrack!, v.hdd12.wls.cvrmseCaltrack!)).toBeLessThan(TOL);
    // property stated with the vector: WLS makes period-total residuals sum to zero
    const totalResidual = fit.residuals.reduce((s, e, i) => s + e * days[i]!, 0);
    expect(Math.abs(totalResidual)).toBeLessThan(1e-10);
  });

  it('OLS gives μ, βH, R², adjusted R² and GL14 CV(RMSE), with use-per-day residuals summing to zero', () => {
    const fit = weightedLeastSquares([x], y);
    if (!fit.ok) throw new Error(fit.reason);
    expect(relativeError(fit.intercept, v.hdd12.ols.intercept!)).toBeLessThan(TOL);
    expect(relativeError(fit.slopes[0]!, v.hdd12.ols.slope!)).toBeLessThan(TOL);
    const ones = days.map(() => 1);
    const q = fitQuality(y, fit.fitted, ones, 1, 2);
    expect(relativeError(q.r2, v.hdd12.ols.r2!)).toBeLessThan(TOL);
    expect(relativeError(q.adjR2, v.hdd12.ols.adjR2!)).toBeLessThan(TOL);
    expect(relativeError(q.cvrmse!, v.hdd12.ols.cvrmseGl14!)).toBeLessThan(TOL);
    expect(Math.abs(q.nmbe!)).toBeLessThan(1e-12);
    expect(q.lag1Autocorrelation!).toBeCloseTo(v.hdd12.lag1AutocorrelationApprox, 3);
  });

  it('NAC at a normal year of 5800 HDD65 = 365·μ + βH·5800 for both fits', () => {
    for (const [kind, w] of [['wls', days], ['ols', undefined]] as const) {
      const fit = weightedLeastSquares([x], y, w);
      if (!fit.ok) throw new Error(fit.reason);
      const nac = normalizedAnnualConsumption(
        { shape: 'heating', intercept: fit.intercept, heatingSlope: fit.slopes[0]!, coolingSlope: null, slope: null, heatingBalanceF: 65, coolingBalanceF: null },
        normal5800,
      );
      if (!nac.ok) throw new Error(nac.reason);
      expect(relativeError(nac.nac, v.hdd12[kind].nacAt5800!)).toBeLessThan(TOL);
    }
  });

  it('the engine, given daily weather that yields these HDD65, selects 65 °F (lowest of the tied bases 65–90) and the WLS fit', () => {
    // constant temperature 65 − HDD/days in each period: at every base ≥ 65 the HDD column only
    // shifts by a constant, so SS_res ties and the lower-balance-point rule must pick 65 °F
    const s = constantTemperatureSeries(x.map((h) => 65 - h), y, days);
    const r = new BaselineEngine().fit(s.bills, s.temps, fitOptionsSchema.parse({ shapes: ['mean', 'heating'] }));
    if (!r.ok) throw new Error(r.reason);
    expect(r.selected.shape).toBe('heating');
    expect(r.selected.heatingBalanceF).toBe(65);
    expect(relativeError(r.selected.intercept, v.hdd12.wls.intercept!)).toBeLessThan(TOL);
    expect(relativeError(r.selected.heatingSlope!, v.hdd12.wls.slope!)).toBeLessThan(TOL);
    expect(relativeError(r.selected.quality.cvrmseCaltrack!, v.hdd12.wls.cvrmseCaltrack!)).toBeLessThan(TOL);
    // GL14 CV with p = 3 (the searched balance point counts): the n − p = 10 value × sqrt(10/9)
    expect(relativeError(r.selected.quality.cvrmse!, v.hdd12.wls.cvrmseGl14! * Math.sqrt(10 / 9))).toBeLessThan(TOL);
  });
});

describe('noise-free change-point recovery on the 1 °F grid (constructed, notes §6.3)', () => {
  const engine = new BaselineEngine();

  it('3P heating: change point 60 °F, μ = 50, βH = 4, SSE = 0, selected over every other shape', () => {
    const s = constantTemperatureSeries(v.threeParameterHeating.meanTempF, v.threeParameterHeating.usePerDay);
    const r = engine.fit(s.bills, s.temps);
    if (!r.ok) throw new Error(r.reason);
    expect(r.selected.shape).toBe('heating');
    expect(r.selected.heatingBalanceF).toBe(60);
    expect(r.selected.intercept).toBeCloseTo(50, 9);
    expect(r.selected.heatingSlope!).toBeCloseTo(4, 9);
    expect(r.selected.quality.sse).toBeLessThan(1e-18);
    expect(r.selected.quality.r2).toBeCloseTo(1, 12);
  });

  it('5P: change points 55 and 70 °F, μ = 100, βH = 3, βC = 5, SSE = 0', () => {
    const s = constantTemperatureSeries(v.fiveParameter.meanTempF, v.fiveParameter.usePerDay);
    const r = engine.fit(s.bills, s.temps);
    if (!r.ok) throw new Error(r.reason);
    expect(r.selected.shape).toBe('heating-cooling');
    expect([r.selected.heatingBalanceF, r.selected.coolingBalanceF]).toEqual([55, 70]);
    expect(r.selected.intercept).toBeCloseTo(100, 9);
    expect(r.selected.heatingSlope!).toBeCloseTo(3, 9);
    expect(r.selected.coolingSlope!).toBeCloseTo(5, 9);
    expect(r.selected.quality.sse).toBeLessThan(1e-18);
    expect(r.selected.quality.parameterCount).toBe(5);
  });
});

describe('CalTRACK fractional savings uncertainty, arithmetic of the printed formula (constructed, notes §6.2)', () => {
  it('billing polynomial 1.30558, daily 1.3925, and FSU = 0.15661152 at P = Q = M = 12, c = 1, ρ = 0, F = 0.10, 90 %', () => {
    const r = fractionalSavingsUncertainty({
      cvrmse: v.fsu.cvrmse!,
      baselinePeriods: 12,
      slopeCount: 1,
      rho: 0,
      reportingPeriods: 12,
      reportingMonths: 12,
      savingsFraction: 0.1,
      confidence: 0.9,
    });
    if (!r.ok) throw new Error(r.reason);
    expect(relativeError(r.polynomial, v.fsu.polynomialBilling!)).toBeLessThan(TOL);
    expect(relativeError(r.t, v.fsu['t_0.95_11']!)).toBeLessThan(TOL);
    // the notes print FSU to 8 significant digits
    expect(Math.abs(r.fsu - v.fsu.fsu!)).toBeLessThan(5e-9);
    const daily = DAILY_FSU_COEFFICIENTS.a * 144 + DAILY_FSU_COEFFICIENTS.b * 12 + DAILY_FSU_COEFFICIENTS.d;
    expect(relativeError(daily, v.fsu.polynomialDaily!)).toBeLessThan(TOL);
    expect(BILLING_FSU_COEFFICIENTS).toEqual({ a: -0.00022, b: 0.03306, d: 0.94054 });
  });
});
