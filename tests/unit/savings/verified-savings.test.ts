/**
 * Verified savings on a constructed building (constructed vectors, not published data): a heating
 * load whose slope drops at a known date. Checked against the avoided-use definition of CalTRACK
 * 2.0 §3.6 (AEU_p = n_p·(ŷ_p − UPD_p)) evaluated directly from the daily temperatures, and against
 * the fractional savings uncertainty formula of CalTRACK 2.0 §4.3.2.4 with Student t from the
 * NIST/SEMATECH e-Handbook table (tests/fixtures/baseline/t-table.csv).
 */
import { describe, expect, it } from 'vitest';
import { BaselineEngine, DEFAULT_ACCEPTANCE, fitOptionsSchema, packDailyMeans, prepareBaselineBills, studentTQuantile, type BaselineBill } from '../../../src/lib/baseline';
import { BILLING_FSU_COEFFICIENTS } from '../../../src/lib/baseline/savings-uncertainty';
import { MIN_REPORTING_PERIODS, verifiedSavings, type VerifiedSavingsInput } from '../../../src/lib/savings/verified-savings';
import { DAY0, readCsvNumbers, seeded } from '../baseline/support';

// Constructed climate: daily mean 50 °F ± 30 °F over the year (a smooth annual cycle).
const YEARS = 4;
const meanF = Float64Array.from({ length: 365 * YEARS }, (_, d) => 50 - 30 * Math.cos((2 * Math.PI * d) / 365));
const temps = packDailyMeans(DAY0, meanF.slice());
const hdd65 = (d: number) => Math.max(0, 65 - meanF[d - DAY0]!);

/** Consecutive 30-day bills with daily use μ + β(day)·HDD65(day). */
function bills(count: number, usePerDay: (day: number) => number, noise: (i: number) => number = () => 1): BaselineBill[] {
  return Array.from({ length: count }, (_, i) => {
    const startDay = DAY0 + 30 * i;
    let q = 0;
    for (let d = startDay; d < startDay + 30; d++) q += usePerDay(d);
    return { startDay, endDay: startDay + 29, quantity: q * noise(i), unit: 'therm' as const, estimated: false };
  });
}

const IMPL_INDEX = 24; // the measure took effect with bill 24
const implDay = DAY0 + 30 * IMPL_INDEX;
const implementedOn = new Date(implDay * 86_400_000).toISOString().slice(0, 10);
const before = (d: number) => 100 + 5 * hdd65(d);
const after = (d: number) => 100 + 3 * hdd65(d); // heating slope 5 → 3 therm per HDD

const input = (b: BaselineBill[], extra: Partial<VerifiedSavingsInput> = {}): VerifiedSavingsInput => ({
  implementedOn,
  bills: b,
  commodity: 'natural_gas',
  unit: 'therm',
  temps,
  stored: null,
  shapes: ['mean', 'heating', 'linear'],
  acceptance: DEFAULT_ACCEPTANCE,
  windowDays: 3 * 365,
  ...extra,
});

describe('verified savings of a constructed step change', () => {
  const all = bills(36, (d) => (d < implDay ? before(d) : after(d)));

  it('avoided use equals Σ days·(ŷ − y): here 2 therm per HDD65 over the reporting days (CalTRACK 2.0 §3.6)', () => {
    const r = verifiedSavings(input(all));
    if (!r.ok) throw new Error(r.detail);
    let expected = 0;
    for (let d = implDay; d < DAY0 + 30 * 36; d++) expected += 2 * hdd65(d);
    expect(r.baseline.source).toBe('refit');
    expect(r.baseline.shape).toBe('heating');
    expect(r.reporting.periods).toHaveLength(12);
    expect(r.avoidedUse).toBeCloseTo(expected, 6);
    let reportingUse = 0;
    for (let d = implDay; d < DAY0 + 30 * 36; d++) reportingUse += after(d);
    expect(r.reportingUse).toBeCloseTo(reportingUse, 6);
    expect(r.savingsFraction!).toBeCloseTo(expected / (expected + reportingUse), 9);
    expect(r.caveats).toEqual([]);
  });

  it('leaves out a bill that spans the implementation date, and uses only bills before it for the baseline', () => {
    // Implementation in the middle of bill 24: that bill is in neither period.
    const mid = implDay + 15;
    const b = bills(36, (d) => (d < mid ? before(d) : after(d)));
    const r = verifiedSavings(input(b, { implementedOn: new Date(mid * 86_400_000).toISOString().slice(0, 10) }));
    if (!r.ok) throw new Error(r.detail);
    expect(r.blackoutBills).toBe(1);
    expect(r.reporting.periods).toHaveLength(11);
    expect(r.baseline.periodEnd < r.reporting.start).toBe(true);
    let expected = 0;
    for (let d = implDay + 30; d < DAY0 + 30 * 36; d++) expected += 2 * hdd65(d);
    expect(r.avoidedUse).toBeCloseTo(expected, 6);
  });

  it('uses the stored baseline only when its period ends before the implementation date', () => {
    const refit = verifiedSavings(input(all));
    if (!refit.ok) throw new Error(refit.detail);
    // A stored model that is wrong on purpose (slope 4) and ends before the date: it is used as is.
    const engineFit = fitBaselinePart(all);
    const fake = { ...engineFit.selected, heatingSlope: 4 };
    const stored = (periodEnd: string) => ({ periodStart: '2020-01-01', periodEnd, model: fake, acceptance: engineFit.acceptance });
    const early = verifiedSavings(input(all, { stored: stored('2021-06-30') }));
    if (!early.ok) throw new Error(early.detail);
    expect(early.baseline.source).toBe('stored');
    let expected = 0;
    for (let d = implDay; d < DAY0 + 30 * 36; d++) expected += 1 * hdd65(d); // (4 − 3) per HDD
    expect(early.avoidedUse).toBeCloseTo(expected, 6);
    // The same model stored over a period that reaches past the date is not used: a refit is.
    const late = verifiedSavings(input(all, { stored: stored('2022-12-31') }));
    if (!late.ok) throw new Error(late.detail);
    expect(late.baseline.source).toBe('refit');
    expect(late.avoidedUse).toBeCloseTo(refit.avoidedUse, 9);
  });

  it(`says when the reporting period is shorter than ${MIN_REPORTING_PERIODS} periods`, () => {
    const r = verifiedSavings(input(all.slice(0, IMPL_INDEX + 2)));
    if (!r.ok) throw new Error(r.detail);
    expect(r.reporting.periods).toHaveLength(2);
    expect(r.caveats).toContain('short-reporting-period');
  });

  it('gives typed reasons when there are no bills on one side of the date', () => {
    expect(verifiedSavings(input(all.slice(0, IMPL_INDEX)))).toMatchObject({ ok: false, reason: 'no-reporting-bills' });
    expect(verifiedSavings(input(all.slice(IMPL_INDEX)))).toMatchObject({ ok: false, reason: 'no-baseline-bills' });
  });
});

describe('fractional savings uncertainty (CalTRACK 2.0 §4.3.2.4)', () => {
  const rng = seeded(20260101);
  const noise = Array.from({ length: 36 }, () => 1 + 0.04 * rng.gaussian());
  const noisy = bills(36, (d) => (d < implDay ? before(d) : after(d)), (i) => (i < IMPL_INDEX ? noise[i]! : 1));
  const r = verifiedSavings(input(noisy));

  it('at 90 % equals t·(aM² + bM + d)·CV·√((P/P′)(1 + 2/P′)/Q)/F with t from the NIST table', () => {
    if (!r.ok) throw new Error(r.detail);
    // Re-fit statistics the engine reports (its CV(RMSE) and lag-1 autocorrelation are tested in tests/unit/baseline).
    const fit = fitBaselinePart(noisy).selected.quality;
    const P = fit.n;
    const c = fit.slopeCount;
    const table = readCsvNumbers('baseline/t-table.csv');
    const row = table.find((x) => x.df === P - c);
    expect(row, `t-table has df ${P - c}`).toBeDefined();
    const t90 = row!['0.05']!; // two-sided 90 %: P(T > t) = 0.05
    const rho = Math.max(0, fit.lag1Autocorrelation ?? 0);
    const pPrime = (P * (1 - rho)) / (1 + rho);
    const M = r.reporting.months;
    const Q = r.reporting.periods.length;
    const { a, b, d } = BILLING_FSU_COEFFICIENTS; // CalTRACK 2.0 §4.3.2.4 billing coefficients
    const expected = (t90 * (a * M * M + b * M + d) * fit.cvrmseCaltrack! * Math.sqrt((P / pPrime) * (1 + 2 / pPrime) * (1 / Q))) / Math.abs(r.savingsFraction!);
    const u90 = r.uncertainty.find((u) => u.confidence === 0.9)!;
    // The table prints t to 3 decimals.
    expect(Math.abs(u90.fsu! - expected) / expected).toBeLessThan(1e-3);
    expect(u90.plusMinus!).toBeCloseTo(u90.fsu! * Math.abs(r.avoidedUse), 6);
  });

  it('at 68 % differs from 90 % only by the ratio of the t quantiles', () => {
    if (!r.ok) throw new Error(r.detail);
    const fit = fitBaselinePart(noisy).selected.quality;
    const df = fit.n - fit.slopeCount;
    const u68 = r.uncertainty.find((u) => u.confidence === 0.68)!;
    const u90 = r.uncertainty.find((u) => u.confidence === 0.9)!;
    expect(u68.fsu! / u90.fsu!).toBeCloseTo(studentTQuantile(0.84, df) / studentTQuantile(0.95, df), 9);
    expect(u68.fsu!).toBeLessThan(u90.fsu!);
  });

  it('flags a baseline that fails its criteria (CV(RMSE) above 20 %, ASHRAE Guideline 14)', () => {
    const wild = Array.from({ length: 36 }, () => 1 + 0.6 * rng.gaussian());
    const bad = bills(36, (d) => (d < implDay ? before(d) : after(d)), (i) => (i < IMPL_INDEX ? Math.max(0.05, wild[i]!) : 1));
    const x = verifiedSavings(input(bad));
    if (!x.ok) throw new Error(x.detail);
    expect(x.baseline.cvrmse!).toBeGreaterThan(0.2);
    expect(x.caveats).toContain('baseline-fails-criteria');
  });
});

/** The engine's fit of the bills before the date (its statistics are tested in tests/unit/baseline). */
function fitBaselinePart(b: BaselineBill[]) {
  const pre = b.filter((x) => x.endDay < implDay);
  const prepared = prepareBaselineBills(pre, { commodity: 'natural_gas', unit: 'therm', fromDay: DAY0, toDay: implDay - 1 });
  const fit = new BaselineEngine().fit(prepared, temps, fitOptionsSchema.parse({ shapes: ['mean', 'heating', 'linear'] }));
  if (!fit.ok) throw new Error(fit.reason);
  return fit;
}
