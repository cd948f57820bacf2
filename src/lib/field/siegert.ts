/**
 * Flue-gas loss by the Siegert formula, the legal formula of the German 1. BImSchV
 * (Anlage 2 Nr. 3.4.1): qA = (tA − tL) · (A / (21 − O2) + B), in % of the fuel's net calorific
 * value (§2 Nr. 1: relative to the Heizwert), so the combustion efficiency 100 − qA is on a net
 * (LHV) basis. tA flue-gas temperature and tL combustion-air temperature in °C, O2 in % of dry
 * flue gas.
 *
 * @example
 * siegertFlueGasLossPercent('natural_gas', 150, 20, 3) // 5.94
 */

export const SIEGERT_FUELS = ['natural_gas', 'fuel_oil_2', 'propane'] as const;
export type SiegertFuel = (typeof SIEGERT_FUELS)[number];

/** Fuel constants A and B of 1. BImSchV Anlage 2 Nr. 3.4.1. */
export const SIEGERT_CONSTANTS: Record<SiegertFuel, { A: number; B: number; regulationFuel: string }> = {
  // "Gase der öffentlichen Gasversorgung": gases of the public supply
  natural_gas: { A: 0.66, B: 0.009, regulationFuel: 'gases of the public gas supply' },
  // "Heizöl EL": light fuel oil, close to No. 2 oil
  fuel_oil_2: { A: 0.68, B: 0.007, regulationFuel: 'Heizöl EL (light fuel oil)' },
  // "Flüssiggas und Flüssiggas-Luft-Gemische": LPG
  propane: { A: 0.63, B: 0.008, regulationFuel: 'LPG and LPG–air mixtures' },
};

/** Flue-gas loss qA in percent (net basis). O2 must be below 21 %. */
export function siegertFlueGasLossPercent(fuel: SiegertFuel, flueGasTempC: number, combustionAirTempC: number, o2PercentDry: number): number {
  const { A, B } = SIEGERT_CONSTANTS[fuel];
  return (flueGasTempC - combustionAirTempC) * (A / (21 - o2PercentDry) + B);
}

/**
 * 1. BImSchV §10(1) limit on the flue-gas loss of oil and gas firing by rated heat output:
 * 4–25 kW 11 %, over 25–50 kW 10 %, over 50 kW 9 %. Null below 4 kW (not covered).
 * German law, shown for reference only.
 */
export function siegertLossLimitPercent(ratedOutputKw: number): number | null {
  if (ratedOutputKw < 4) return null;
  if (ratedOutputKw <= 25) return 11;
  if (ratedOutputKw <= 50) return 10;
  return 9;
}
