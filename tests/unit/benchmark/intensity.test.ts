import { describe, expect, it } from 'vitest';
import {
  blendedPricePerKbtu,
  buildingIntensity,
  buildingUsageSchema,
  type BuildingUsage,
} from '../../../src/lib/benchmark/intensity';
import { fiscalYearWindow } from '../../../src/lib/benchmark/windows';

// Source: EIA "Units and calculators explained": 1 kWh = 3.412 kBtu; 1 therm = 100 kBtu.
const KBTU_PER_KWH = 3.412;
const KBTU_PER_THERM = 100;

const FY2024 = fiscalYearWindow(2024); // 366 days (31 U.S.C. 1102 window; leap year)

// Constructed building: 20,000 ft², 200,000 kWh and 3,176 therms in FY2024,
// 400,000 gal of water; every bill day covered.
const usage: BuildingUsage = {
  buildingId: 'b-1',
  areaFt2: 20_000,
  uses: [
    {
      commodity: 'electricity',
      quantity: 200_000 * KBTU_PER_KWH, // 682,400 kBtu
      costUsd: 40_000,
      coveredDays: 366,
      normalizedAnnualKbtu: 700_000,
      normalizedUncertaintyKbtu: 30_000,
    },
    {
      commodity: 'natural_gas',
      quantity: 3_176 * KBTU_PER_THERM, // 317,600 kBtu
      costUsd: 20_000,
      coveredDays: 366,
      normalizedAnnualKbtu: 300_000,
      normalizedUncertaintyKbtu: 40_000,
    },
    { commodity: 'water', quantity: 400_000, costUsd: 2_000, coveredDays: 366 },
  ],
};

describe('buildingIntensity: hand-computable building', () => {
  const r = buildingIntensity(usage, FY2024);

  it('site EUI = (682,400 + 317,600) kBtu / 20,000 ft² = 50 kBtu/ft²·yr', () => {
    // Source: methods §5 definition; conversions EIA (3.412 kBtu/kWh, 100 kBtu/therm)
    expect(r.siteEui).toMatchObject({ ok: true, value: 50, total: 1_000_000, unit: 'kBtu/ft²·yr' });
    expect(r.siteEui.ok && r.siteEui.coverage).toBe(1);
    expect(r.siteEui.ok && r.siteEui.annualized).toBe(false);
  });

  it('WUI = 400,000 gal / 20,000 ft² = 20 gal/ft²·yr', () => {
    expect(r.wui).toMatchObject({ ok: true, value: 20, unit: 'gal/ft²·yr' });
  });

  it('cost intensity = $62,000 / 20,000 = $3.10/ft²; energy cost index = $60,000 / 20,000 = $3.00', () => {
    expect(r.costIntensity.ok && r.costIntensity.value).toBeCloseTo(3.1, 12);
    expect(r.energyCostIntensity.ok && r.energyCostIntensity.value).toBeCloseTo(3.0, 12);
  });

  it('normalized EUI = (700,000 + 300,000) / 20,000 = 50, uncertainty √(30,000² + 40,000²) / 20,000 = 2.5', () => {
    // Source: GUM (JCGM 100:2008) §5.1, uncorrelated inputs add in quadrature; 3-4-5 triangle
    expect(r.normalizedEui).toMatchObject({ ok: true, value: 50, missing: [] });
    expect(r.normalizedEui.ok && r.normalizedEui.uncertainty).toBeCloseTo(2.5, 12);
  });

  it('no source EUI or GHG unless factors are given', () => {
    expect(r.sourceEui).toBeNull();
    expect(r.ghgIntensity).toBeNull();
  });

  it('blended price = $60,000 / 1,000,000 kBtu = $0.06/kBtu (water cost excluded)', () => {
    expect(blendedPricePerKbtu(usage.uses)).toBeCloseTo(0.06, 12);
    expect(
      blendedPricePerKbtu([{ commodity: 'water', quantity: 10, coveredDays: 1, costUsd: 5 }]),
    ).toBeNull();
  });
});

describe('buildingIntensity: source energy and GHG with supplied factors', () => {
  it('source EUI with ASHRAE 105-2021 ratios (electricity 2.74, gas 1.09)', () => {
    // Source: ASHRAE 105-2021 Table K-2 (as transcribed in the reference notes).
    // 682,400 × 2.74 + 317,600 × 1.09 = 1,869,776 + 346,184 = 2,215,960 kBtu; / 20,000 = 110.798
    const r = buildingIntensity(usage, FY2024, {
      sourceSiteRatios: { electricity: 2.74, natural_gas: 1.09 },
    });
    expect(r.sourceEui?.ok && r.sourceEui.value).toBeCloseTo(110.798, 9);
  });

  it('GHG of 100,000 kBtu of natural gas is 5,311.45 kg CO2e', () => {
    // Source: EPA GHG Emission Factors Hub 2025 Table 1 (53.06 kg CO2, 1.0 g CH4, 0.10 g N2O per
    // MMBtu) and Table 11 GWPs (CH4 28, N2O 265): 5,306 + 0.1·28 + 0.01·265 = 5,311.45 kg
    const kgPerKbtu = (53.06 + (1.0 * 28 + 0.1 * 265) / 1000) / 1000;
    const r = buildingIntensity(
      {
        buildingId: 'g',
        areaFt2: 1_000,
        uses: [{ commodity: 'natural_gas', quantity: 100_000, coveredDays: 366 }],
      },
      FY2024,
      { ghgKgPerKbtu: { natural_gas: kgPerKbtu } },
    );
    expect(r.ghgIntensity).toMatchObject({ ok: true, unit: 'kg CO2e/ft²·yr' });
    expect(r.ghgIntensity?.ok && r.ghgIntensity.total).toBeCloseTo(5311.45, 9);
    expect(r.ghgIntensity?.ok && r.ghgIntensity.value).toBeCloseTo(5.31145, 9);
  });

  it('lists a commodity without a factor as missing instead of counting it as zero', () => {
    const r = buildingIntensity(usage, FY2024, { sourceSiteRatios: { electricity: 2.74 } });
    expect(r.sourceEui).toMatchObject({ ok: true, missing: ['natural_gas'] });
    const none = buildingIntensity(usage, FY2024, { ghgKgPerKbtu: {} });
    expect(none.ghgIntensity).toEqual({
      ok: false,
      reason: 'missing-factor',
      missing: ['electricity', 'natural_gas'],
    });
  });
});

describe('buildingIntensity: coverage and annualization', () => {
  const partial: BuildingUsage = {
    buildingId: 'p',
    areaFt2: 10_000,
    uses: [
      { commodity: 'electricity', quantity: 300_000, costUsd: 9_000, coveredDays: 366 },
      { commodity: 'natural_gas', quantity: 100_000, costUsd: 3_000, coveredDays: 183 },
    ],
  };

  it('reports coverage as the lowest commodity share and does not annualize by default', () => {
    // gas covers 183 / 366 = 0.5 of FY2024
    const r = buildingIntensity(partial, FY2024);
    expect(r.siteEui).toMatchObject({ ok: true, value: 40, coverage: 0.5, annualized: false });
    expect(r.siteEui.ok && r.siteEui.coverageByCommodity).toEqual({
      electricity: 1,
      natural_gas: 0.5,
    });
  });

  it('annualizes only when asked, and says so: gas 100,000 × 366/183 = 200,000 kBtu', () => {
    const r = buildingIntensity(partial, FY2024, { annualize: true });
    // (300,000 + 200,000) / 10,000 = 50 kBtu/ft²; cost (9,000 + 6,000) / 10,000 = 1.5
    expect(r.siteEui).toMatchObject({ ok: true, value: 50, annualized: true, coverage: 0.5 });
    expect(r.siteEui.ok && r.siteEui.notes).toEqual([
      'natural_gas annualized from 183 of 366 days',
    ]);
    expect(r.costIntensity.ok && r.costIntensity.value).toBeCloseTo(1.5, 12);
  });

  it('reports a missing NAC instead of understating the normalized EUI silently', () => {
    const withOne: BuildingUsage = {
      ...partial,
      uses: [{ ...partial.uses[0]!, normalizedAnnualKbtu: 310_000 }, partial.uses[1]!],
    };
    expect(buildingIntensity(withOne, FY2024).normalizedEui).toMatchObject({
      ok: true,
      value: 31,
      missing: ['natural_gas'],
      uncertainty: null,
    });
    expect(buildingIntensity(partial, FY2024).normalizedEui).toEqual({
      ok: false,
      reason: 'missing-normalized',
      missing: ['electricity', 'natural_gas'],
    });
  });

  it('says no-data for a building without water bills', () => {
    expect(buildingIntensity(partial, FY2024).wui).toEqual({
      ok: false,
      reason: 'no-data',
      missing: [],
    });
  });

  it('rejects a zero floor area at the boundary', () => {
    expect(buildingUsageSchema.safeParse({ ...partial, areaFt2: 0 }).success).toBe(false);
    expect(buildingUsageSchema.safeParse(partial).success).toBe(true);
  });
});
