import { describe, expect, it } from 'vitest';
import { BASELINE_USE, annualFixtureGallons, fixtureWaterUse, waterHeatingInputBtu } from '../../../src/lib/field/fixture-water-use';
import { expectExact, expectInvalidField, expectWithin, okValue } from './expect-helpers';

describe('fixture water use', () => {
  it('uses the IAPMO L 701.2 baseline durations and uses per day', () => {
    // Source: IAPMO Green Plumbing Supplement L 701.2 baseline table: showerhead 8 min × 1 use; private
    // lavatory 0.25 min × 4; residential kitchen faucet 4 min × 1; non-residential lavatory 0.25 min × 4
    expect(BASELINE_USE.showerhead).toMatchObject({ minutesPerUse: 8, usesPerPersonPerDay: 1 });
    expect(BASELINE_USE.lavatory_faucet_private).toMatchObject({ minutesPerUse: 0.25, usesPerPersonPerDay: 4 });
    expect(BASELINE_USE.kitchen_faucet).toMatchObject({ minutesPerUse: 4, usesPerPersonPerDay: 1 });
    expect(BASELINE_USE.lavatory_faucet_public).toMatchObject({ minutesPerUse: 0.25, usesPerPersonPerDay: 4 });
  });

  it('gives 20 gal per person per day for a baseline 2.5 gpm shower (IAPMO table, constructed product)', () => {
    // constructed from the IAPMO table: 2.5 gpm × 8 min × 1 use = 20 gal/person/day
    expectExact(annualFixtureGallons(2.5, 8, 1, 1, 1), 20);
  });

  it('computes annual water and cost saved with the baseline assumptions', () => {
    // constructed: (2.5 − 2.0) gpm × 8 min × 1 × 10 people × 250 days = 10,000 gal/yr; at $12.50/kgal = $125/yr
    const out = fixtureWaterUse.run({ useType: 'showerhead', existingFlowGpm: 2.5, proposedFlowGpm: 2.0, people: 10, daysPerYear: 250, waterSewerUsdPerKgal: 12.5 });
    const r = okValue(out);
    expectExact(r.existingGalPerYear, 50_000);
    expectExact(r.galSavedPerYear, 10_000);
    expectExact(r.usdSavedPerYear, 125);
    expect(r.heaterInputBtuSavedPerYear).toBe(0);
    expect(out.ok && out.notes.join(' ')).toContain('IAPMO');
  });

  it('adds water-heating energy for the hot share', () => {
    // constructed: 30 min/day at 2.5 vs 1.5 gpm saves 30 gal/day; 60 % hot = 18 gal/day;
    // 18 × 8.34 × 82.5 / 0.85 = 14,570.47 Btu/day; over 365 days = 5,318,223 Btu/yr
    const r = okValue(fixtureWaterUse.run({ useType: 'showerhead', existingFlowGpm: 2.5, proposedFlowGpm: 1.5, people: 1, daysPerYear: 365, minutesPerUse: 30, usesPerPersonPerDay: 1, hotWaterPercent: 60, temperatureRiseF: 82.5, waterHeaterEfficiencyPercent: 85 }));
    expectExact(r.galSavedPerYear, 30 * 365);
    expectWithin(r.heaterInputBtuSavedPerYear, (18 * 8.34 * 82.5 * 365) / 0.85, 1e-6);
    expectWithin(waterHeatingInputBtu(1, 82.5, 0.85), 809.47, 0.01);
  });

  it('asks for the heater details when a hot share is given, naming the field', () => {
    expectInvalidField(fixtureWaterUse.run({ useType: 'showerhead', existingFlowGpm: 2.5, proposedFlowGpm: 1.5, people: 1, daysPerYear: 365, hotWaterPercent: 60 }), 'hotWaterPercent', 'temperature rise');
    expectInvalidField(fixtureWaterUse.run({ useType: 'showerhead', existingFlowGpm: 2.5, proposedFlowGpm: 1.5, people: 0, daysPerYear: 365 }), 'people', 'greater than 0');
  });
});
