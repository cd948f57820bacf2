import { describe, expect, it } from 'vitest';
import {
  ASHRAE_105_2021_RATIOS,
  DEFAULT_GHG_FACTORS,
  DOE_2015_RATIOS,
  ghgFactorsSchema,
  ghgKgCo2e,
  KG_PER_LB,
  sourceKbtu,
  sourceSiteRatiosSchema,
} from '../../../src/lib/units';
import { readReferenceCsv, referenceRow } from './reference-tables';

const emissions = readReferenceCsv('emission-factors.csv');

describe('sourceKbtu', () => {
  it('applies the ratios per commodity', () => {
    // Source: ASHRAE 105-2021 Table K-2: electricity 2.74, natural gas 1.09
    const r = sourceKbtu({ electricity: 1000, natural_gas: 500 }, ASHRAE_105_2021_RATIOS);
    expect(r.ok && r.totalKbtu).toBeCloseTo(2740 + 545, 9);
    // Source: DOE 2015 ZEB definition: electricity 3.15
    const d = sourceKbtu({ electricity: 1000 }, DOE_2015_RATIOS);
    expect(d.ok && d.byCommodity.electricity).toBeCloseTo(3150, 9);
  });

  it('takes edited ratios and rejects water and bad input', () => {
    const edited = { source: 'user', ratios: { ...ASHRAE_105_2021_RATIOS.ratios, electricity: 2 } };
    expect(sourceSiteRatiosSchema.safeParse(edited).success).toBe(true);
    const r = sourceKbtu({ electricity: 10 }, edited);
    expect(r.ok && r.totalKbtu).toBe(20);
    expect(sourceKbtu({ water: 10 }, edited)).toMatchObject({ ok: false, reason: 'not-energy' });
    expect(sourceKbtu({ propane: Number.POSITIVE_INFINITY }, edited)).toMatchObject({ ok: false, reason: 'invalid-quantity' });
    const zero = { source: 'user', ratios: { ...edited.ratios, propane: 0 } };
    expect(sourceSiteRatiosSchema.safeParse(zero).success).toBe(false);
    expect(sourceKbtu({ propane: 1 }, zero)).toMatchObject({ ok: false, reason: 'invalid-ratio' });
  });
});

describe('default emission factors match emission-factors.csv (EPA GHG Emission Factors Hub 2025; eGRID2023)', () => {
  it.each([
    ['natural gas', 'natural_gas'],
    ['fuel oil No. 2', 'fuel_oil_2'],
    ['fuel oil No. 6', 'fuel_oil_6'],
    ['propane (liquid)', 'propane'],
    ['kerosene', 'kerosene'],
    ['district steam', 'district_steam'],
  ] as const)('%s', (fuel, commodity) => {
    const row = referenceRow(emissions, 'fuel_or_grid', fuel);
    const f = DEFAULT_GHG_FACTORS.fuels[commodity];
    expect(f?.co2KgPerMmbtu).toBe(Number(row['co2_kg_per_mmbtu']));
    expect(f?.ch4GPerMmbtu).toBe(Number(row['ch4_g_per_mmbtu']));
    expect(f?.n2oGPerMmbtu).toBe(Number(row['n2o_g_per_mmbtu']));
  });

  it('electricity and GWPs', () => {
    const row = referenceRow(emissions, 'fuel_or_grid', 'U.S. national average (eGRID2023');
    expect(DEFAULT_GHG_FACTORS.electricity.co2LbPerMwh).toBe(Number(row['co2_per_unit']));
    expect(DEFAULT_GHG_FACTORS.electricity.ch4LbPerMwh).toBe(Number(row['ch4_per_unit']));
    expect(DEFAULT_GHG_FACTORS.electricity.n2oLbPerMwh).toBe(Number(row['n2o_per_unit']));
    expect(DEFAULT_GHG_FACTORS.gwp.ch4).toBe(Number(referenceRow(emissions, 'fuel_or_grid', 'CH4')['co2_per_unit']));
    expect(DEFAULT_GHG_FACTORS.gwp.n2o).toBe(Number(referenceRow(emissions, 'fuel_or_grid', 'N2O')['co2_per_unit']));
    expect(ghgFactorsSchema.safeParse(DEFAULT_GHG_FACTORS).success).toBe(true);
  });
});

describe('ghgKgCo2e', () => {
  it('natural gas: 100,000 kBtu -> 5,306 kg CO2, 0.1 kg CH4, 0.01 kg N2O', () => {
    // Source: EPA GHG Emission Factors Hub 2025 Table 1: 53.06 kg CO2, 1.0 g CH4, 0.10 g N2O per MMBtu
    const r = ghgKgCo2e({ natural_gas: 100_000 }, DEFAULT_GHG_FACTORS);
    if (!r.ok) throw new Error(r.reason);
    const g = r.byCommodity.natural_gas;
    expect(g?.co2Kg).toBeCloseTo(5306, 9);
    expect(g?.ch4Kg).toBeCloseTo(0.1, 12);
    expect(g?.n2oKg).toBeCloseTo(0.01, 12);
    // Source: Hub 2025 Table 11 GWPs (AR5): CH4 28, N2O 265 -> 5306 + 2.8 + 2.65
    expect(r.totalKgCo2e).toBeCloseTo(5311.45, 9);
  });

  it('fuel oil No. 2 at the EPA default heat content reproduces the Hub per-gallon factor', () => {
    // Source: EPA GHG Emission Factors Hub 2025 Table 1: 0.138 MMBtu/gal, 10.21 kg CO2 per gallon
    const r = ghgKgCo2e({ fuel_oil_2: 138 }, DEFAULT_GHG_FACTORS);
    expect(r.ok && r.byCommodity.fuel_oil_2?.co2Kg).toBeCloseTo(10.21, 2);
  });

  it('electricity: 1 MWh at the eGRID2023 U.S. average', () => {
    const r = ghgKgCo2e({ electricity: 3412 }, DEFAULT_GHG_FACTORS);
    if (!r.ok) throw new Error(r.reason);
    // Source: eGRID2023 USCO2RTA 767.209 lb/MWh; 1 lb = 0.45359237 kg (definition)
    expect(r.byCommodity.electricity?.co2Kg).toBeCloseTo(767.209 * KG_PER_LB, 9);
    // Source: eGRID2023 USC2ERTA 770.884 lb CO2e/MWh = 349.7 kg; recomputed from rounded CH4/N2O rates within 0.01 %
    expect(Math.abs(r.totalKgCo2e / KG_PER_LB - 770.884)).toBeLessThan(770.884 * 1e-4);
    expect(r.totalKgCo2e).toBeCloseTo(349.7, 1);
  });

  it('sums commodities, uses edited factors, and fails without a factor', () => {
    const both = ghgKgCo2e({ electricity: 3412, natural_gas: 100_000 }, DEFAULT_GHG_FACTORS);
    const elec = ghgKgCo2e({ electricity: 3412 }, DEFAULT_GHG_FACTORS);
    const gas = ghgKgCo2e({ natural_gas: 100_000 }, DEFAULT_GHG_FACTORS);
    expect(both.ok && elec.ok && gas.ok && both.totalKgCo2e - elec.totalKgCo2e - gas.totalKgCo2e).toBeCloseTo(0, 9);

    expect(ghgKgCo2e({ chilled_water: 1200 }, DEFAULT_GHG_FACTORS)).toMatchObject({ ok: false, reason: 'missing-factor' });
    // Constructed: a user-supplied chilled-water factor of 20 kg CO2 per MMBtu delivered
    const edited = {
      ...DEFAULT_GHG_FACTORS,
      fuels: { ...DEFAULT_GHG_FACTORS.fuels, chilled_water: { co2KgPerMmbtu: 20, ch4GPerMmbtu: 0, n2oGPerMmbtu: 0, source: 'user' } },
    };
    const r = ghgKgCo2e({ chilled_water: 1200 }, edited);
    expect(r.ok && r.totalKgCo2e).toBeCloseTo(24, 9);
    expect(ghgKgCo2e({ water: 5 }, DEFAULT_GHG_FACTORS)).toMatchObject({ ok: false, reason: 'not-energy' });
  });
});
