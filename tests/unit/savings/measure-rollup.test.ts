/**
 * Measure inputs and roll-ups. Payback is checked against the UConn ITAC training example
 * (($12,000 − $2,000) ÷ $4,000 = 2.5 years, 10 CFR 436.23 simple payback); present values against
 * the standard annuity factor UPV(3 %, 10 yr) = 8.530203 (engineering-economics tables,
 * (P/A, 3 %, 10)); the other measures are constructed.
 */
import { describe, expect, it } from 'vitest';
import { measureEconomics } from '../../../src/lib/economics';
import { canMoveMeasure, economicsInput, measureInputSchema, measureStatusChangeSchema } from '../../../src/lib/savings/measure-input';
import { rollUpMeasures, type RollupMeasure } from '../../../src/lib/savings/measure-rollup';

const UPV_3_10 = 8.530203; // (P/A, 3 %, 10): standard annuity-factor tables

function measure(over: Partial<RollupMeasure>): RollupMeasure {
  return { status: 'proposed', savings: [], annualEnergyCostSavings: 0, annualWaterCostSavings: 0, annualOmCostSavings: 0, installedCost: 0, incentives: 0, pvSavingsUsd: 0, ...over };
}

describe('measure input', () => {
  it('refuses a unit that does not measure the commodity and two lines of one commodity', () => {
    const base = { installedCost: 1000, lifeYears: 10 };
    expect(measureInputSchema.safeParse({ ...base, savings: [{ commodity: 'water', quantity: 10, unit: 'kWh' }] }).success).toBe(false);
    expect(measureInputSchema.safeParse({ ...base, savings: [{ commodity: 'electricity', quantity: 10, unit: 'kWh' }, { commodity: 'electricity', quantity: 1, unit: 'MWh' }] }).success).toBe(false);
    expect(measureInputSchema.safeParse({ ...base, savings: [{ commodity: 'natural_gas', quantity: 500, unit: 'therm' }, { commodity: 'water', quantity: 12, unit: 'kgal' }] }).success).toBe(true);
  });

  it('feeds the economics: the ITAC example pays back in 2.5 years', () => {
    const m = measureInputSchema.parse({ installedCost: 12_000, incentives: 2_000, annualEnergyCostSavings: 4_000, lifeYears: 10 });
    const r = measureEconomics.run(economicsInput(m, 3));
    if (!r.ok) throw new Error(r.message);
    expect(r.value.simplePaybackYears).toBeCloseTo(2.5, 12); // Source: UConn ITAC training notes, "Payback"
    expect(r.value.upv).toBeCloseTo(UPV_3_10, 6);
  });

  it('moves proposed → approved → implemented (dated) and refuses a jump from proposed to implemented', () => {
    expect(canMoveMeasure('proposed', 'approved')).toBe(true);
    expect(canMoveMeasure('approved', 'implemented')).toBe(true);
    expect(canMoveMeasure('proposed', 'implemented')).toBe(false);
    expect(canMoveMeasure('rejected', 'approved')).toBe(false);
    expect(measureStatusChangeSchema.safeParse({ status: 'implemented' }).success).toBe(false);
    expect(measureStatusChangeSchema.safeParse({ status: 'implemented', implementedOn: '2026-05-01' }).success).toBe(true);
  });
});

describe('roll-up of measures', () => {
  const itac = measure({ status: 'approved', installedCost: 12_000, incentives: 2_000, annualEnergyCostSavings: 4_000, pvSavingsUsd: 4_000 * UPV_3_10 });
  const water = measure({ status: 'implemented', installedCost: 3_000, annualWaterCostSavings: 1_000, annualOmCostSavings: 200, savings: [{ commodity: 'water', quantity: 150, unit: 'kgal' }], pvSavingsUsd: 1_200 * UPV_3_10 });
  const proposed = measure({ status: 'proposed', installedCost: 5_000, annualEnergyCostSavings: 500, savings: [{ commodity: 'electricity', quantity: 4_000, unit: 'kWh' }, { commodity: 'water', quantity: 50, unit: 'kgal' }], pvSavingsUsd: 500 * UPV_3_10 });
  const rejected = measure({ status: 'rejected', installedCost: 99_999, annualEnergyCostSavings: 1, savings: [{ commodity: 'electricity', quantity: 1e6, unit: 'kWh' }] });

  it('a single measure rolls up to its own payback (ITAC: 2.5 years)', () => {
    expect(rollUpMeasures([itac]).committed.simplePaybackYears).toBeCloseTo(2.5, 12);
  });

  it('counts by status and leaves rejected measures out of every total', () => {
    const r = rollUpMeasures([itac, water, proposed, rejected]);
    expect(r.byStatus).toEqual({ proposed: 1, approved: 1, implemented: 1, rejected: 1 });
    expect(r.inPlay.count).toBe(3);
    expect(r.inPlay.installedCost).toBe(20_000);
    expect(r.inPlay.netInvestment).toBe(18_000);
    expect(r.inPlay.annualCostSavings).toEqual({ energy: 4_500, water: 1_000, om: 200, total: 5_700 });
    // Portfolio payback: Σ net investment ÷ Σ annual savings (10 CFR 436.23, undiscounted)
    expect(r.inPlay.simplePaybackYears).toBeCloseTo(18_000 / 5_700, 12);
    expect(r.inPlay.savings).toEqual([
      { commodity: 'electricity', unit: 'kWh', quantity: 4_000 },
      { commodity: 'water', unit: 'kgal', quantity: 200 },
    ]);
    // SIR of the bundle: every measure here has level savings over 10 years at 3 %.
    expect(r.inPlay.sir!).toBeCloseTo((5_700 * UPV_3_10) / 18_000, 9);
    expect(r.committed.count).toBe(2);
    expect(r.committed.simplePaybackYears).toBeCloseTo(13_000 / 5_200, 12);
  });

  it('has no payback when nothing is saved, and no SIR when a present value is unknown', () => {
    const r = rollUpMeasures([measure({ status: 'approved', installedCost: 1_000, pvSavingsUsd: null })]);
    expect(r.committed.simplePaybackYears).toBeNull();
    expect(r.committed.sir).toBeNull();
    expect(rollUpMeasures([]).inPlay).toMatchObject({ count: 0, simplePaybackYears: null, sir: null });
  });
});
