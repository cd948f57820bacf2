/**
 * Excess air from flue-gas O2: EA % = K · O2 / (21 − O2), O2 in % of dry flue gas. K = 90 for
 * natural gas (V. Ganapathy, in Handbook of Energy Engineering Calculations, p. 56: 3 % O2 gives
 * 15 % excess air). The generic O2/(20.9 − O2) form over-states excess air for natural gas.
 *
 * @example
 * excessAirPercent('natural_gas', 3) // 15
 */
import type { SiegertFuel } from './siegert';

export const EXCESS_AIR_K: Record<SiegertFuel, { k: number; confidence: 'secondary' | 'memory' } | null> = {
  // Ganapathy, natural gas (methane): K = 90
  natural_gas: { k: 90, confidence: 'secondary' },
  // oil K ≈ 94 [memory, unconfirmed]
  fuel_oil_2: { k: 94, confidence: 'memory' },
  // no sourced K for propane
  propane: null,
};

/** Excess air in percent, or null where no K is known for the fuel. O2 must be below 21 %. */
export function excessAirPercent(fuel: SiegertFuel, o2PercentDry: number): number | null {
  const entry = EXCESS_AIR_K[fuel];
  return entry === null ? null : (entry.k * o2PercentDry) / (21 - o2PercentDry);
}
