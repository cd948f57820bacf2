import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { measureEconomics } from '../../../src/lib/economics/measure-economics';
import { expectExact, expectInvalidField, expectWithin, okValue } from '../field/expect-helpers';

describe('measure economics', () => {
  it('reproduces the UConn ITAC NPV example: $5,000, $1,500/yr, 5 yr, 10 % → +$686', () => {
    // Source: UConn ITAC training notes, "Time Value of Money and Net Present Value": NPV = +$686
    const r = okValue(measureEconomics.run({ installedCostUsd: 5000, annualEnergySavingsUsd: 1500, lifeYears: 5, discountRatePercent: 10 }));
    expectWithin(r.netSavingsUsd, 686, 1);
    expect(r.costEffective).toBe(true);
  });

  it('reproduces the UConn ITAC simple payback with a rebate: 2.5 years', () => {
    // Source: UConn ITAC training notes, "Payback Period": ($12,000 − $2,000) / $4,000 = 2.5 years
    const r = okValue(measureEconomics.run({ installedCostUsd: 12_000, incentivesUsd: 2000, annualEnergySavingsUsd: 4000, lifeYears: 10, discountRatePercent: 3 }));
    expectExact(r.simplePaybackYears, 2.5);
    expectExact(r.netInvestmentUsd, 10_000);
  });

  it('reproduces the UConn ITAC comparison case: $15,000 / $5,000 → 3.0 years', () => {
    // Source: UConn ITAC training notes, "Payback Period", comparison table: simple payback 3.0 years
    expectExact(okValue(measureEconomics.run({ installedCostUsd: 15_000, annualEnergySavingsUsd: 5000, lifeYears: 10, discountRatePercent: 10 })).simplePaybackYears, 3);
  });

  it('gives SIR 1.706 and AIRR 8.65 % for $5,000 saving $1,000 a year for 10 years at 3 % (constructed)', () => {
    // constructed from the 10 CFR 436.21–436.23 definitions: SIR = 1000 × 8.5302 / 5000 = 1.706;
    // AIRR = 1.03 × 1.706^(1/10) − 1 = 8.65 %; payback 5.0 years
    const r = okValue(measureEconomics.run({ installedCostUsd: 5000, annualEnergySavingsUsd: 1000, lifeYears: 10, discountRatePercent: 3 }));
    expectWithin(r.sir, 1.706, 0.001);
    expectWithin(r.airrPercent, 8.65, 0.01);
    expectExact(r.simplePaybackYears, 5);
    expectWithin(r.upv, 8.5302, 0.00005);
    expectWithin(r.spv, 0.7441, 0.00005);
  });

  it('escalates only the energy savings (UPV*), not water or O&M', () => {
    // constructed: energy $1,000 × UPV*(3 %, 1 %, 10) 8.99190 + water $200 × UPV 8.5302 − O&M $50 × 8.5302
    const r = okValue(measureEconomics.run({ installedCostUsd: 6000, annualEnergySavingsUsd: 1000, annualWaterSavingsUsd: 200, annualOmSavingsUsd: -50, lifeYears: 10, discountRatePercent: 3, energyEscalationPercent: 1 }));
    expectWithin(r.pvSavingsUsd, 1000 * 8.9919 + 150 * 8.5302, 0.05);
    expectExact(r.annualNetSavingsUsd, 1150);
  });

  it('gives typed nulls, not NaN, when there is no payback or no investment', () => {
    const never = measureEconomics.run({ installedCostUsd: 1000, annualEnergySavingsUsd: 0, lifeYears: 10, discountRatePercent: 3 });
    expect(okValue(never).simplePaybackYears).toBeNull();
    expect(okValue(never).airrPercent).toBeNull();
    expect(never.ok && never.notes.join(' ')).toContain('does not pay back');
    const free = okValue(measureEconomics.run({ installedCostUsd: 1000, incentivesUsd: 1000, annualEnergySavingsUsd: 100, lifeYears: 5, discountRatePercent: 3 }));
    expect(free.sir).toBeNull();
    expect(free.simplePaybackYears).toBe(0);
  });

  it('SIR > 1 exactly when net savings > 0, and then AIRR > d', () => {
    fc.assert(
      fc.property(fc.integer({ min: 100, max: 1_000_000 }), fc.integer({ min: 1, max: 200_000 }), fc.integer({ min: 1, max: 40 }), fc.double({ min: 3, max: 10, noNaN: true }), (cost, saving, life, rate) => {
        const r = okValue(measureEconomics.run({ installedCostUsd: cost, annualEnergySavingsUsd: saving, lifeYears: life, discountRatePercent: rate }));
        const sir = r.sir as number;
        if (Math.abs(sir - 1) < 1e-9) return true;
        return sir > 1 === r.netSavingsUsd > 0 && sir > 1 === (r.airrPercent as number) > rate;
      }),
    );
  });

  it('rejects a discount rate of 2 % or 11 %, naming the field and the rule', () => {
    const base = { installedCostUsd: 5000, annualEnergySavingsUsd: 1000, lifeYears: 10 };
    expectInvalidField(measureEconomics.run({ ...base, discountRatePercent: 2 }), 'discountRatePercent', '10 CFR 436.14');
    expectInvalidField(measureEconomics.run({ ...base, discountRatePercent: 11 }), 'discountRatePercent', 'between 3 % and 10 %');
    expectInvalidField(measureEconomics.run({ ...base, discountRatePercent: 3, incentivesUsd: 6000 }), 'incentivesUsd', 'must not exceed');
    expectInvalidField(measureEconomics.run({ ...base, discountRatePercent: 3, lifeYears: 7.5 }), 'lifeYears', 'whole number');
  });
});
