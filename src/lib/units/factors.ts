/**
 * Published conversion factors from billed units to site energy (kBtu) and to water volume (US
 * gallons). All energy factors are gross (higher) heating values, as EIA and EPA use them.
 * Each constant names its source; the full table with notes is in
 * tests/fixtures/units/energy-conversions.csv.
 */
import type { Commodity } from '../domain';

// Source: U.S. EIA, Units and calculators explained: British thermal units; MER Appendix A (3,412 Btu/kWh).
export const KBTU_PER_KWH = 3.412;
// Source: U.S. EIA, Units and calculators explained: 1 MWh = 1,000 kWh = 3,412,000 Btu.
export const KBTU_PER_MWH = 3412;
// Source: definition, 1 therm = 100,000 Btu (U.S. EIA, Units and calculators explained).
export const KBTU_PER_THERM = 100;
// Source: definition, 1 dekatherm = 10 therms = 1,000,000 Btu.
export const KBTU_PER_DTH = 1000;
// Source: definition, 1 MMBtu = 1,000,000 Btu.
export const KBTU_PER_MMBTU = 1000;
// Source: U.S. EIA, Units and calculators explained (2022 data): U.S. average 1,036 Btu/cf; MER Table A4.
export const DEFAULT_GAS_KBTU_PER_CF = 1.036;
// Source: definition, 1 ccf = 100 cubic feet.
export const CF_PER_CCF = 100;
// Source: definition, 1 Mcf = 1,000 cubic feet.
export const CF_PER_MCF = 1000;
// Source: definition of the ton of refrigeration, 12,000 Btu/h, so 1 ton-hour = 12,000 Btu.
export const KBTU_PER_TON_HOUR = 12;
// Source: definition, 1 Mlb = 1,000 lb (M = thousand, trade usage for steam).
export const LB_PER_MLB = 1000;
// Source: definition, 1 kgal = 1,000 gal.
export const GAL_PER_KGAL = 1000;
// Source: definition, 1 US gallon = 231 in³ (NIST Handbook 44, Appendix C); 1 ft³ = 1,728 in³.
export const GAL_PER_CF = 1728 / 231;
// Source: definition, 1 ccf (HCF) = 100 ft³ = 748.05 US gallons.
export const GAL_PER_CCF = 100 * GAL_PER_CF;
// Source: definition, 1 US gallon = 3.785411784 L exactly (NIST Handbook 44, Appendix C), so 1 m³ = 264.172 gal.
export const GAL_PER_M3 = 1000 / 3.785411784;

/** Liquid fuels billed by the US gallon. */
export type LiquidFuel = 'fuel_oil_2' | 'fuel_oil_6' | 'propane' | 'kerosene' | 'diesel';

/** kBtu per US gallon for each liquid fuel (gross heat content). */
export const KBTU_PER_GALLON: Readonly<Record<LiquidFuel, number>> = {
  // Source: U.S. EIA, Units and calculators explained: heating oil 1 gallon = 138,500 Btu (5.817 MMBtu/bbl).
  fuel_oil_2: 138.5,
  // Source: U.S. EIA, Monthly Energy Review Appendix A Table A1: residual fuel oil 6.287 MMBtu/bbl / 42.
  fuel_oil_6: 6287 / 42,
  // Source: U.S. EIA, Units and calculators explained: propane 1 gallon = 91,452 Btu.
  propane: 91.452,
  // Source: U.S. EIA, Monthly Energy Review Appendix A Table A1: kerosene 5.670 MMBtu/bbl / 42 = 135,000 Btu/gal.
  kerosene: 5670 / 42,
  // Source: U.S. EIA, Units and calculators explained: diesel fuel 1 gallon = 137,381 Btu.
  diesel: 137.381,
};

/** True for the commodities billed in gallons of fuel. */
export function isLiquidFuel(c: Commodity): c is LiquidFuel {
  return c === 'fuel_oil_2' || c === 'fuel_oil_6' || c === 'propane' || c === 'kerosene' || c === 'diesel';
}

/**
 * Offered to users as a labelled rule of thumb for steam meters, never applied silently: no
 * government default Btu/lb exists (steam tables give 970-1,194 Btu/lb depending on pressure
 * and condensate return). Source: project convention, see energy-conversions.csv.
 */
export const STEAM_BTU_PER_LB_RULE_OF_THUMB = 1000;
