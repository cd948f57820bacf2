/**
 * The roll-up of a walkthrough's measures and the reading of stored economics, checked against
 * the published conversion factors and the NIST Handbook 135 present-value formula recomputed here.
 */
import { describe, expect, it } from 'vitest';
import { measureEconomics } from '../../../src/lib/economics';
import { readStoredEconomics, rollUpMeasures, walkthroughReportSchema } from '../../../src/lib/reports';
import { fullReport, minimalReport } from './report-fixture';

// Source: NIST Handbook 135 (FEMP life-cycle costing manual), uniform present value factor.
const upv = (d: number, n: number) => ((1 + d) ** n - 1) / (d * (1 + d) ** n);

describe('rollUpMeasures', () => {
  const r = walkthroughReportSchema.parse(fullReport());
  const t = rollUpMeasures(r);

  it('leaves out rejected measures and dismissed findings', () => {
    expect(t.measureCount).toBe(4);
    expect(t.byStatus).toEqual({ proposed: 2, approved: 1, implemented: 1, rejected: 1 });
    expect(t.savings.find((s) => s.commodity === 'electricity')!.quantity).toBe(21500); // not + 30,000 rejected
  });

  it('site energy by the EIA factors and the meter heat content; water in gallons', () => {
    // Source: U.S. EIA, Units and calculators explained: 3,412 Btu/kWh, 100,000 Btu/therm,
    // 138,500 Btu/gal No. 2 fuel oil; 104.2 kBtu/ccf is the constructed meter's stated value.
    expect(t.siteKbtu).toBeCloseTo(21500 * 3.412 + 5200 * 104.2 + 60 * 100 + 300 * 138.5, 6);
    // Definition: 1 kgal = 1,000 gal.
    expect(t.waterGallons).toBeCloseTo(38500, 9);
    expect(t.unconverted).toBe(0);
  });

  it('costs, simple payback (10 CFR 436.23) and the package SIR from present values (NIST Handbook 135)', () => {
    const annual = 2236 + 150 + 6070 + 67 + 400 + 1095 - 50;
    expect(t.annualCostSavingsUsd).toBeCloseTo(annual, 9);
    expect(t.installedCostUsd).toBe(110400);
    expect(t.netInvestmentUsd).toBe(108400);
    expect(t.simplePaybackYears).toBeCloseTo(108400 / annual, 9);
    const pv = (2236 + 150) * upv(0.03, 15) + 6070 * upv(0.03, 25) + (67 + 400) * upv(0.03, 10) + (1095 - 50) * upv(0.03, 3);
    expect(t.pvSavingsUsd).toBeCloseTo(pv, 6);
    expect(t.sir).toBeCloseTo(pv / 108400, 9);
    expect(t.discountRatePercent).toBe(3);
  });

  it('an empty walkthrough totals to zero with no payback and no SIR', () => {
    const e = rollUpMeasures(walkthroughReportSchema.parse(minimalReport()));
    expect([e.measureCount, e.installedCostUsd, e.siteKbtu, e.simplePaybackYears, e.sir, e.pvSavingsUsd]).toEqual([0, 0, 0, null, null, null]);
  });

  it('gives no package SIR when measures were priced at different discount rates', () => {
    const x = fullReport();
    x.findings[0]!.measure!.economics!.discountRatePercent = 4;
    const m = rollUpMeasures(walkthroughReportSchema.parse(x));
    expect(m.sir).toBeNull();
    expect(m.discountRatePercent).toBeNull();
  });
});

describe('readStoredEconomics', () => {
  const outcome = measureEconomics.run({ installedCostUsd: 5000, annualEnergySavingsUsd: 1000, lifeYears: 10, discountRatePercent: 3 });
  if (!outcome.ok) throw new Error(outcome.message);
  const rate = { realDiscountRatePercent: 3, effectiveFrom: '2010-04-01', source: 'FEMP' };

  it('reads the result flat with the rate beside it', () => {
    const e = readStoredEconomics({ ...outcome.value, discountRatePercent: 3, effectiveFrom: '2010-04-01', source: 'FEMP' });
    // Worked example in src/lib/economics: payback 5 yr; SIR = 1,000 × UPV(3 %, 10) / 5,000.
    expect(e?.simplePaybackYears).toBe(5);
    expect(e?.sir).toBeCloseTo((1000 * upv(0.03, 10)) / 5000, 9);
    expect([e?.discountRatePercent, e?.rateEffectiveFrom, e?.rateSource]).toEqual([3, '2010-04-01', 'FEMP']);
  });

  it('reads a whole calculator outcome under `result` and the setting under `rate`', () => {
    const e = readStoredEconomics({ result: outcome, rate });
    expect(e?.pvSavingsUsd).toBeCloseTo(1000 * upv(0.03, 10), 9);
    expect(e?.discountRatePercent).toBe(3);
  });

  it('gives null for nothing stored or something else', () => {
    expect(readStoredEconomics({})).toBeNull();
    expect(readStoredEconomics(null)).toBeNull();
    expect(readStoredEconomics({ sir: 'high' })).toBeNull();
  });
});
