import { describe, expect, it } from 'vitest';
import type { Commodity, Unit } from '../../../src/lib/domain';
import {
  conversionFactor,
  convertQuantity,
  type MeterHeatContent,
  toSiteKbtu,
  toWaterGallons,
} from '../../../src/lib/units';

/** Relative closeness for derived factors. */
function expectRel(actual: number, expected: number, rel = 1e-9): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * rel);
}

function kbtu(q: number, commodity: Commodity, unit: Unit, meter: MeterHeatContent = {}): number {
  const r = toSiteKbtu(q, commodity, unit, meter);
  if (!r.ok) throw new Error(r.reason);
  return r.value;
}

describe('site energy, quick checks', () => {
  it('converts electricity', () => {
    // Source: U.S. EIA, Units and calculators explained: 1 kWh = 3,412 Btu -> 10,000 kWh = 34,120 kBtu
    expectRel(kbtu(10_000, 'electricity', 'kWh'), 34_120);
    // Source: U.S. EIA, Units and calculators explained: 1 MWh = 1,000 kWh = 3,412,000 Btu
    expectRel(kbtu(1, 'electricity', 'MWh'), 3_412);
  });

  it('converts natural gas by energy and by volume', () => {
    // Source: definition (EIA Units and calculators explained): 1 therm = 100,000 Btu -> 1,000 therms = 100,000 kBtu
    expectRel(kbtu(1_000, 'natural_gas', 'therm'), 100_000);
    // Source: definition: 1 dekatherm = 1 MMBtu = 1,000,000 Btu
    expectRel(kbtu(1, 'natural_gas', 'Dth'), 1_000);
    expectRel(kbtu(1, 'natural_gas', 'MMBtu'), 1_000);
    // Source: U.S. EIA, Units and calculators explained (2022 data): 1,036 Btu per cubic foot
    expectRel(kbtu(1, 'natural_gas', 'cf'), 1.036);
    // Source: U.S. EIA 1,036 Btu/cf -> 1,000 ccf = 103,600 kBtu; 1 Mcf = 1,036,000 Btu
    expectRel(kbtu(1_000, 'natural_gas', 'ccf'), 103_600);
    expectRel(kbtu(1, 'natural_gas', 'Mcf'), 1_036);
  });

  it('uses the meter heat content when the utility states one', () => {
    // Constructed: a utility therm factor of 1.025 therm/ccf = 1.025 kBtu/cf
    expectRel(kbtu(1_000, 'natural_gas', 'ccf', { gasKbtuPerCf: 1.025 }), 102_500);
  });

  it('converts liquid fuels by the gallon', () => {
    // Source: U.S. EIA, Units and calculators explained: heating oil 1 gallon = 138,500 Btu
    expectRel(kbtu(1_000, 'fuel_oil_2', 'gal'), 138_500);
    // Source: U.S. EIA, Units and calculators explained: propane 1 gallon = 91,452 Btu
    expectRel(kbtu(1_000, 'propane', 'gal'), 91_452);
    // Source: U.S. EIA, Units and calculators explained: diesel fuel 1 gallon = 137,381 Btu
    expectRel(kbtu(1, 'diesel', 'gal'), 137.381);
    // Source: U.S. EIA, MER Appendix A Table A1: residual fuel oil 6.287 MMBtu per 42-gal barrel
    expectRel(kbtu(42, 'fuel_oil_6', 'gal'), 6_287);
    // Source: U.S. EIA, MER Appendix A Table A1: kerosene 5.670 MMBtu per 42-gal barrel
    expectRel(kbtu(42, 'kerosene', 'gal'), 5_670);
  });

  it('converts chilled water and steam', () => {
    // Source: definition of the ton of refrigeration (12,000 Btu/h): 100 ton-h = 1,200 kBtu
    expectRel(kbtu(100, 'chilled_water', 'ton_h'), 1_200);
    // Constructed: supplier states 1,150.4 Btu/lb (0 psig total heat, Keenan & Keyes via Armstrong)
    expectRel(kbtu(1_000, 'district_steam', 'lb', { steamBtuPerLb: 1150.4 }), 1_150.4);
    expectRel(kbtu(1, 'district_steam', 'Mlb', { steamBtuPerLb: 1150.4 }), 1_150.4);
  });
});

describe('water volume', () => {
  const gal = (q: number, unit: 'gal' | 'kgal' | 'ccf' | 'm3'): number => {
    const r = toWaterGallons(q, 'water', unit);
    if (!r.ok) throw new Error(r.reason);
    return r.value;
  };
  it('converts to US gallons', () => {
    expect(gal(12, 'gal')).toBe(12);
    // Source: definition, 1 kgal = 1,000 gal
    expect(gal(2, 'kgal')).toBe(2_000);
    // Source: definition, 1 ccf (HCF) = 100 ft³ = 748.05 US gal (1 gal = 231 in³, NIST Handbook 44 App. C)
    expect(gal(1, 'ccf')).toBeCloseTo(748.05, 2);
    // Source: definition, 1 m³ = 264.172 US gal (1 gal = 3.785411784 L, NIST Handbook 44 App. C)
    expect(gal(1, 'm3')).toBeCloseTo(264.172, 3);
  });
});

describe('typed failures', () => {
  it('rejects demand as energy', () => {
    expect(convertQuantity(500, 'electricity', 'kW')).toEqual({ ok: false, reason: 'demand-not-energy' });
  });
  it('requires a per-meter Btu/lb for steam by mass', () => {
    expect(toSiteKbtu(1, 'district_steam', 'Mlb')).toEqual({ ok: false, reason: 'steam-heat-content-missing' });
  });
  it('rejects units that do not fit the commodity', () => {
    expect(conversionFactor('natural_gas', 'kWh')).toEqual({ ok: false, reason: 'unit-not-valid-for-commodity' });
    expect(conversionFactor('water', 'therm')).toEqual({ ok: false, reason: 'unit-not-valid-for-commodity' });
    expect(conversionFactor('electricity', 'gal')).toEqual({ ok: false, reason: 'unit-not-valid-for-commodity' });
    expect(conversionFactor('propane', 'kgal')).toEqual({ ok: false, reason: 'unit-not-valid-for-commodity' });
  });
  it('rejects bad heat contents and quantities', () => {
    expect(conversionFactor('natural_gas', 'ccf', { gasKbtuPerCf: 0 })).toEqual({ ok: false, reason: 'invalid-heat-content' });
    expect(conversionFactor('district_steam', 'lb', { steamBtuPerLb: -5 })).toEqual({ ok: false, reason: 'invalid-heat-content' });
    expect(convertQuantity(Number.NaN, 'electricity', 'kWh')).toEqual({ ok: false, reason: 'invalid-quantity' });
  });
  it('keeps energy and water apart', () => {
    expect(toSiteKbtu(1, 'water', 'gal')).toEqual({ ok: false, reason: 'not-energy' });
    expect(toWaterGallons(1, 'electricity', 'kWh')).toEqual({ ok: false, reason: 'not-water' });
  });
  it('converts negative quantities (net metering) linearly', () => {
    // Source: U.S. EIA, Units and calculators explained: 1 kWh = 3,412 Btu
    expectRel(kbtu(-100, 'electricity', 'kWh'), -341.2);
  });
});
