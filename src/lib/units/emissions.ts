/**
 * Greenhouse-gas emissions (kg CO2e) from site energy with emission factors the user can edit.
 * Defaults: EPA GHG Emission Factors Hub 2025 (stationary combustion Table 1 = 40 CFR 98
 * Subpart C Tables C-1/C-2; steam and heat Table 7; GWPs Table 11) and eGRID2023 U.S. national
 * average for purchased electricity. Full table: tests/fixtures/units/emission-factors.csv.
 */
import { z } from 'zod';
import type { Commodity } from '../domain';
import { KBTU_PER_KWH } from './factors';
import { ENERGY_COMMODITIES, type EnergyCommodity, type SiteKbtuByCommodity, siteEnergyEntries } from './site-energy';

// Source: definition, 1 lb = 0.45359237 kg exactly (international avoirdupois pound, 1959).
export const KG_PER_LB = 0.45359237;

const perMmbtuSchema = z.object({
  co2KgPerMmbtu: z.number().nonnegative(),
  ch4GPerMmbtu: z.number().nonnegative(),
  n2oGPerMmbtu: z.number().nonnegative(),
  source: z.string().min(1),
});
/** A fuel's factors per MMBtu of (gross) heat input, or per MMBtu delivered for steam. */
export type PerMmbtuFactor = z.infer<typeof perMmbtuSchema>;

export const ghgFactorsSchema = z.object({
  electricity: z.object({
    co2LbPerMwh: z.number().nonnegative(),
    ch4LbPerMwh: z.number().nonnegative(),
    n2oLbPerMwh: z.number().nonnegative(),
    source: z.string().min(1),
  }),
  fuels: z.partialRecord(z.enum(ENERGY_COMMODITIES), perMmbtuSchema),
  gwp: z.object({ ch4: z.number().positive(), n2o: z.number().positive(), source: z.string().min(1) }),
});
export type GhgFactors = z.infer<typeof ghgFactorsSchema>;

const STATIONARY_SOURCE = 'EPA GHG Emission Factors Hub 2025, Table 1 (40 CFR 98 Subpart C Tables C-1, C-2)';

/** Defaults. Chilled water has no published default: the user must add a factor for it. */
export const DEFAULT_GHG_FACTORS: GhgFactors = {
  electricity: {
    co2LbPerMwh: 767.209, // Source: EPA eGRID2023 U.S. total output emission rate, USCO2RTA
    ch4LbPerMwh: 0.057, // Source: EPA eGRID2023 U.S. total output emission rate, USCH4RTA
    n2oLbPerMwh: 0.008, // Source: EPA eGRID2023 U.S. total output emission rate, USN2ORTA
    source: 'EPA eGRID2023 (January 2025), U.S. national average total output emission rate',
  },
  fuels: {
    // Source: EPA GHG Emission Factors Hub 2025, Table 1, natural gas: 53.06 kg CO2, 1.0 g CH4, 0.10 g N2O per MMBtu
    natural_gas: { co2KgPerMmbtu: 53.06, ch4GPerMmbtu: 1.0, n2oGPerMmbtu: 0.1, source: STATIONARY_SOURCE },
    // Source: EPA GHG Emission Factors Hub 2025, Table 1, distillate fuel oil No. 2: 73.96 kg CO2/MMBtu
    fuel_oil_2: { co2KgPerMmbtu: 73.96, ch4GPerMmbtu: 3.0, n2oGPerMmbtu: 0.6, source: STATIONARY_SOURCE },
    // Source: 40 CFR 98 Subpart C Table C-1, residual fuel oil No. 6: 75.10 kg CO2/MMBtu
    fuel_oil_6: { co2KgPerMmbtu: 75.1, ch4GPerMmbtu: 3.0, n2oGPerMmbtu: 0.6, source: STATIONARY_SOURCE },
    // Source: 40 CFR 98 Subpart C Table C-1, propane: 62.87 kg CO2/MMBtu
    propane: { co2KgPerMmbtu: 62.87, ch4GPerMmbtu: 3.0, n2oGPerMmbtu: 0.6, source: STATIONARY_SOURCE },
    // Source: 40 CFR 98 Subpart C Table C-1, kerosene: 75.20 kg CO2/MMBtu
    kerosene: { co2KgPerMmbtu: 75.2, ch4GPerMmbtu: 3.0, n2oGPerMmbtu: 0.6, source: STATIONARY_SOURCE },
    // Source: EPA GHG Emission Factors Hub 2025, Table 1: distillate No. 2 factor also used for stationary diesel
    diesel: { co2KgPerMmbtu: 73.96, ch4GPerMmbtu: 3.0, n2oGPerMmbtu: 0.6, source: STATIONARY_SOURCE },
    // Source: EPA GHG Emission Factors Hub 2025, Table 7 Steam and Heat: 66.33 kg CO2, 1.25 g CH4, 0.125 g N2O per MMBtu
    district_steam: {
      co2KgPerMmbtu: 66.33,
      ch4GPerMmbtu: 1.25,
      n2oGPerMmbtu: 0.125,
      source: 'EPA GHG Emission Factors Hub 2025, Table 7 (steam and heat)',
    },
  },
  // Source: EPA GHG Emission Factors Hub 2025, Table 11 (IPCC AR5, 100-year): CH4 28, N2O 265
  gwp: { ch4: 28, n2o: 265, source: 'EPA GHG Emission Factors Hub 2025, Table 11 (IPCC AR5 100-year GWP)' },
};

export interface GasMassesKg {
  co2Kg: number;
  ch4Kg: number;
  n2oKg: number;
  co2eKg: number;
}

export type GhgResult =
  | { ok: true; totalKgCo2e: number; byCommodity: Partial<Record<EnergyCommodity, GasMassesKg>> }
  | { ok: false; reason: 'not-energy' | 'invalid-quantity' | 'missing-factor'; commodity: Commodity };

/** Gas masses for one commodity's site energy; undefined when no factor applies. */
function gasMasses(c: EnergyCommodity, siteKbtu: number, f: GhgFactors): GasMassesKg | undefined {
  let co2Kg: number;
  let ch4Kg: number;
  let n2oKg: number;
  if (c === 'electricity') {
    const mwh = siteKbtu / KBTU_PER_KWH / 1000;
    co2Kg = mwh * f.electricity.co2LbPerMwh * KG_PER_LB;
    ch4Kg = mwh * f.electricity.ch4LbPerMwh * KG_PER_LB;
    n2oKg = mwh * f.electricity.n2oLbPerMwh * KG_PER_LB;
  } else {
    const factor = f.fuels[c];
    if (factor === undefined) return undefined;
    const mmbtu = siteKbtu / 1000;
    co2Kg = mmbtu * factor.co2KgPerMmbtu;
    ch4Kg = (mmbtu * factor.ch4GPerMmbtu) / 1000;
    n2oKg = (mmbtu * factor.n2oGPerMmbtu) / 1000;
  }
  return { co2Kg, ch4Kg, n2oKg, co2eKg: co2Kg + f.gwp.ch4 * ch4Kg + f.gwp.n2o * n2oKg };
}

/**
 * Emissions per commodity and in total, kg CO2e = CO2 + GWP_CH4·CH4 + GWP_N2O·N2O. Electricity
 * site kBtu is turned back into MWh at 3.412 kBtu/kWh. Fails with `missing-factor` when a
 * commodity with energy has no factor (chilled water by default).
 * @example ghgKgCo2e({ natural_gas: 100_000 }, DEFAULT_GHG_FACTORS) // CO2 5,306 kg
 */
export function ghgKgCo2e(siteKbtuByCommodity: SiteKbtuByCommodity, factors: GhgFactors): GhgResult {
  const site = siteEnergyEntries(siteKbtuByCommodity);
  if (!site.ok) return site;
  const byCommodity: Partial<Record<EnergyCommodity, GasMassesKg>> = {};
  let total = 0;
  for (const [c, kbtu] of site.entries) {
    const masses = gasMasses(c, kbtu, factors);
    if (masses === undefined) return { ok: false, reason: 'missing-factor', commodity: c };
    byCommodity[c] = masses;
    total += masses.co2eKg;
  }
  return { ok: true, totalKgCo2e: total, byCommodity };
}
