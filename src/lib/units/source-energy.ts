/**
 * Source (primary) energy from site energy with source-to-site ratios the user can edit.
 * Two published sets are offered as defaults: ANSI/ASHRAE Standard 105-2021 Table K-2 (the
 * default) and the U.S. DOE 2015 zero-energy-building definition. Both were transcribed from
 * a public open-source library that cites them (see tests/fixtures/units/source-site.csv):
 * re-check against the documents before publishing figures.
 */
import { z } from 'zod';
import type { Commodity } from '../domain';
import { ENERGY_COMMODITIES, type EnergyCommodity, type SiteKbtuByCommodity, siteEnergyEntries } from './site-energy';

export const sourceSiteRatiosSchema = z.object({
  /** Where the ratios come from, shown next to every source-energy figure. */
  source: z.string().min(1),
  ratios: z.record(z.enum(ENERGY_COMMODITIES), z.number().positive()),
});
export type SourceSiteRatios = z.infer<typeof sourceSiteRatiosSchema>;

/** ANSI/ASHRAE Standard 105-2021, Table K-2 (captured-energy-efficiency approach). */
export const ASHRAE_105_2021_RATIOS: SourceSiteRatios = {
  source: 'ANSI/ASHRAE Standard 105-2021, Table K-2',
  ratios: {
    electricity: 2.74, // Source: ASHRAE 105-2021 Table K-2, electricity (grid)
    natural_gas: 1.09, // Source: ASHRAE 105-2021 Table K-2, natural gas
    fuel_oil_2: 1.19, // Source: ASHRAE 105-2021 Table K-2, fuel oil (No. 1-6, diesel, kerosene)
    fuel_oil_6: 1.19, // Source: ASHRAE 105-2021 Table K-2, fuel oil (No. 1-6, diesel, kerosene)
    propane: 1.15, // Source: ASHRAE 105-2021 Table K-2, propane / LPG
    kerosene: 1.19, // Source: ASHRAE 105-2021 Table K-2, fuel oil (No. 1-6, diesel, kerosene)
    diesel: 1.19, // Source: ASHRAE 105-2021 Table K-2, fuel oil (No. 1-6, diesel, kerosene)
    district_steam: 1.83, // Source: ASHRAE 105-2021 Table K-2, district steam
    chilled_water: 0.67, // Source: ASHRAE 105-2021 Table K-2, district chilled water
  },
};

/** U.S. DOE, A Common Definition for Zero Energy Buildings (Sept 2015), national averages. */
export const DOE_2015_RATIOS: SourceSiteRatios = {
  source: 'U.S. DOE, A Common Definition for Zero Energy Buildings (2015)',
  ratios: {
    electricity: 3.15, // Source: DOE 2015 ZEB definition, electricity (grid)
    natural_gas: 1.09, // Source: DOE 2015 ZEB definition, natural gas
    fuel_oil_2: 1.19, // Source: DOE 2015 ZEB definition, fuel oil (No. 1-6, diesel, kerosene)
    fuel_oil_6: 1.19, // Source: DOE 2015 ZEB definition, fuel oil (No. 1-6, diesel, kerosene)
    propane: 1.15, // Source: DOE 2015 ZEB definition, propane / LPG
    kerosene: 1.19, // Source: DOE 2015 ZEB definition, fuel oil (No. 1-6, diesel, kerosene)
    diesel: 1.19, // Source: DOE 2015 ZEB definition, fuel oil (No. 1-6, diesel, kerosene)
    district_steam: 1.45, // Source: DOE 2015 ZEB definition, district steam
    chilled_water: 1.04, // Source: DOE 2015 ZEB definition, district chilled water
  },
};

export type SourceEnergyResult =
  | { ok: true; totalKbtu: number; byCommodity: Partial<Record<EnergyCommodity, number>>; source: string }
  | { ok: false; reason: 'not-energy' | 'invalid-quantity' | 'invalid-ratio'; commodity: Commodity };

/**
 * Source energy = Σ site kBtu × source-site ratio, per commodity and in total.
 * @example sourceKbtu({ electricity: 1000 }, ASHRAE_105_2021_RATIOS).totalKbtu // 2740
 */
export function sourceKbtu(siteKbtuByCommodity: SiteKbtuByCommodity, ratios: SourceSiteRatios): SourceEnergyResult {
  const site = siteEnergyEntries(siteKbtuByCommodity);
  if (!site.ok) return site;
  const byCommodity: Partial<Record<EnergyCommodity, number>> = {};
  let total = 0;
  for (const [c, kbtu] of site.entries) {
    const ratio = ratios.ratios[c];
    if (!Number.isFinite(ratio) || ratio <= 0) return { ok: false, reason: 'invalid-ratio', commodity: c };
    byCommodity[c] = kbtu * ratio;
    total += kbtu * ratio;
  }
  return { ok: true, totalKbtu: total, byCommodity, source: ratios.source };
}
