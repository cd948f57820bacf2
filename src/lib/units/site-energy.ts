/**
 * Site energy per commodity, the input of the source-energy and emission calculations, and the
 * one check both share: only energy commodities, only finite amounts.
 */
import { COMMODITIES, type Commodity } from '../domain';

/** Commodities with site energy (everything except water). */
export type EnergyCommodity = Exclude<Commodity, 'water'>;
export const ENERGY_COMMODITIES = COMMODITIES.filter((c): c is EnergyCommodity => c !== 'water') as [
  EnergyCommodity,
  ...EnergyCommodity[],
];

/** Site energy in kBtu per commodity; absent commodities are left out. */
export type SiteKbtuByCommodity = Partial<Record<Commodity, number>>;

export type SiteEnergyEntries =
  | { ok: true; entries: [EnergyCommodity, number][] }
  | { ok: false; reason: 'not-energy' | 'invalid-quantity'; commodity: Commodity };

/** The given commodities in vocabulary order; fails on water or a non-finite amount. */
export function siteEnergyEntries(siteKbtuByCommodity: SiteKbtuByCommodity): SiteEnergyEntries {
  const entries: [EnergyCommodity, number][] = [];
  for (const c of COMMODITIES) {
    const site = siteKbtuByCommodity[c];
    if (site === undefined) continue;
    if (c === 'water') return { ok: false, reason: 'not-energy', commodity: c };
    if (!Number.isFinite(site)) return { ok: false, reason: 'invalid-quantity', commodity: c };
    entries.push([c, site]);
  }
  return { ok: true, entries };
}
