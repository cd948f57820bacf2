import { describe, expect, it } from 'vitest';
import { lightingRetrofit } from '../../../src/lib/field/lighting-retrofit';
import { expectExact, expectInvalidField, expectWithin, okValue } from './expect-helpers';

describe('lighting retrofit savings', () => {
  it('computes annual energy and cost as in the DOE Energy Saver window-fan example', () => {
    // Source: U.S. DOE Energy Saver, "Estimating Appliance and Home Electronic Energy Use":
    // 200 W × 4 h/day × 120 days/yr ÷ 1000 = 96 kWh; at 8.5 ¢/kWh = $8.16/yr
    const r = okValue(lightingRetrofit.run({ existingFixtureCount: 1, existingWattsPerFixture: 200, proposedWattsPerFixture: 0, hoursPerDay: 4, daysPerYear: 120, priceUsdPerKwh: 0.085 }));
    expectExact(r.existingKwhPerYear, 96);
    expectWithin(r.existingUsdPerYear, 8.16, 0.005);
  });

  it('sums fixtures as in the DOE Energy Saver computer example', () => {
    // Source: same DOE page: (120 + 150) W × 4 h/day × 365 days ÷ 1000 = 394 kWh; at 11 ¢/kWh = $43.34/yr
    // Two "fixtures" of 135 W carry the same 270 W.
    const r = okValue(lightingRetrofit.run({ existingFixtureCount: 2, existingWattsPerFixture: 135, proposedWattsPerFixture: 0, hoursPerDay: 4, daysPerYear: 365, priceUsdPerKwh: 0.11 }));
    expectWithin(r.existingKwhPerYear, 394, 0.5);
    expectWithin(r.existingUsdPerYear, 43.34, 0.03);
  });

  it('gives savings per fixture for a one-for-one replacement', () => {
    // constructed: hand arithmetic, (400 − 150) W × 12 h × 365 d ÷ 1000 = 250 × 4,380 ÷ 1000 = 1,095 kWh/yr per fixture
    const r = okValue(lightingRetrofit.run({ existingFixtureCount: 1, existingWattsPerFixture: 400, proposedWattsPerFixture: 150, hoursPerDay: 12, daysPerYear: 365 }));
    expect(r.annualHoursExisting).toBe(4380);
    expectExact(r.kwhSavedPerYear, 1095);
    expectExact(r.kwReduction, 0.25);
    expect(r.usdSavedPerYear).toBeNull();
  });

  it('applies delamping (fewer proposed fixtures) and a controls reduction to the proposed hours', () => {
    // constructed: 40 × 86 W = 3.44 kW existing, 30 × 30 W = 0.9 kW proposed, 3,000 h;
    // proposed hours × (1 − 0.25) = 2,250 h → 10,320 − 2,025 = 8,295 kWh/yr; × $0.12 = $995.40
    const r = okValue(lightingRetrofit.run({ existingFixtureCount: 40, existingWattsPerFixture: 86, proposedFixtureCount: 30, proposedWattsPerFixture: 30, hoursPerDay: 12, daysPerYear: 250, controlsReductionPercent: 25, priceUsdPerKwh: 0.12 }));
    expectExact(r.existingKw, 3.44);
    expectExact(r.proposedKw, 0.9);
    expectExact(r.annualHoursProposed, 2250);
    expectExact(r.kwhSavedPerYear, 8295);
    expectExact(r.usdSavedPerYear, 995.4);
  });

  it('rejects impossible schedules and fractional fixture counts, naming the field', () => {
    const base = { existingFixtureCount: 10, existingWattsPerFixture: 60, proposedWattsPerFixture: 20, hoursPerDay: 10, daysPerYear: 250 };
    expectInvalidField(lightingRetrofit.run({ ...base, hoursPerDay: 25 }), 'hoursPerDay', 'Hours per day must be at most 24');
    expectInvalidField(lightingRetrofit.run({ ...base, existingFixtureCount: 2.5 }), 'existingFixtureCount', 'whole number');
    expectInvalidField(lightingRetrofit.run({ ...base, controlsReductionPercent: 120 }), 'controlsReductionPercent', 'at most 100');
  });
});
