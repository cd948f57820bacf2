/**
 * Combustion efficiency from a combustion-analyzer reading: flue-gas O2, stack temperature and
 * combustion-air temperature, per fuel; excess air from O2; air-free CO.
 *
 * Two methods are reported side by side and never mixed, each labelled with its heating-value basis:
 * - Siegert formula of the 1. BImSchV (net / LHV basis), for natural gas, No. 2 oil and propane;
 * - the U.S. DOE natural-gas table of Steam Tip Sheet #4 (gross / HHV basis [memory]), natural
 *   gas only, within O2 2–10 % and net stack temperature 200–600 °F.
 * At 2 % O2 and 300 °F net, the two give 92.7 % (net) and 83.1 % (gross) for the same boiler.
 *
 * @example
 * combustionEfficiency.run({ fuel: 'natural_gas', o2PercentDry: 7, stackTempF: 470, combustionAirTempF: 70 })
 * // DOE table 78.2 % (HHV); Siegert 87.5 % (LHV); excess air 45.0 %
 */
import { z } from 'zod';
import { defineCalculator, failure, optionalStep, success } from './calculator';
import { CO_APPLIANCE_TYPES, checkCoAirFree, coAirFreePpm, type CoCheck } from './co-air-free';
import { doeNaturalGasCombustionEfficiency } from './doe-combustion-table';
import { excessAirPercent } from './excess-air';
import { choiceField, exactlyOneOf, numberField } from './inputs';
import { SIEGERT_FUELS, siegertFlueGasLossPercent } from './siegert';
import { ANSI_Z21_CO_AIR_FREE, BIMSCHV_1_SIEGERT, DOE_STEAM_TIP_4, GANAPATHY_EXCESS_AIR } from './sources';
import { celsiusToFahrenheit, deltaFahrenheitToKelvin } from './units';

export const combustionEfficiencyInputSchema = z
  .object({
    fuel: choiceField('Fuel', SIEGERT_FUELS),
    o2PercentDry: numberField('Flue-gas O2 (%)', { min: 0, lt: 20.9 }),
    stackTempF: numberField('Stack temperature (°F)', { min: -40, max: 2000 }).optional(),
    stackTempC: numberField('Stack temperature (°C)', { min: -40, max: 1100 }).optional(),
    combustionAirTempF: numberField('Combustion-air temperature (°F)', { min: -60, max: 200 }).optional(),
    combustionAirTempC: numberField('Combustion-air temperature (°C)', { min: -50, max: 95 }).optional(),
    coPpm: numberField('Flue-gas CO as measured (ppm)', { min: 0 }).optional(),
    applianceType: choiceField('Appliance type', CO_APPLIANCE_TYPES).default('vented_heating'),
  })
  .refine(...exactlyOneOf(['stackTempF', 'stackTempC'], 'Stack temperature'))
  .refine(...exactlyOneOf(['combustionAirTempF', 'combustionAirTempC'], 'Combustion-air temperature'));
export type CombustionEfficiencyInput = z.output<typeof combustionEfficiencyInputSchema>;

export interface EfficiencyEstimate {
  method: 'siegert-1-bimschv' | 'doe-steam-tip-4-table';
  basis: 'LHV (net)' | 'HHV (gross)';
  basisConfidence: 'primary' | 'memory';
  efficiencyPercent: number;
  /** Flue-gas loss where the method gives it (Siegert). */
  lossPercent: number | null;
  interpolated: boolean;
}

export interface CombustionEfficiencyResult {
  netStackTempF: number;
  netStackTempK: number;
  excessAirPercent: number | null;
  estimates: EfficiencyEstimate[];
  unavailable: { method: EfficiencyEstimate['method']; reason: string }[];
  co: { measuredPpm: number; airFreePpm: number; check: CoCheck } | null;
}

export function computeCombustionEfficiency(input: CombustionEfficiencyInput) {
  const stackF = input.stackTempF ?? celsiusToFahrenheit(input.stackTempC as number);
  const airF = input.combustionAirTempF ?? celsiusToFahrenheit(input.combustionAirTempC as number);
  const netF = stackF - airF;
  if (netF <= 0) {
    return failure('stack-not-above-combustion-air', 'The stack temperature must be above the combustion-air temperature: check the probe positions.');
  }
  const netK = deltaFahrenheitToKelvin(netF);
  // Siegert takes tA − tL; a difference in kelvin equals the difference in °C.
  const loss = siegertFlueGasLossPercent(input.fuel, netK, 0, input.o2PercentDry);
  const estimates: EfficiencyEstimate[] = [
    { method: 'siegert-1-bimschv', basis: 'LHV (net)', basisConfidence: 'primary', efficiencyPercent: 100 - loss, lossPercent: loss, interpolated: false },
  ];
  const unavailable: CombustionEfficiencyResult['unavailable'] = [];
  if (input.fuel === 'natural_gas') {
    const doe = doeNaturalGasCombustionEfficiency(input.o2PercentDry, netF);
    if (doe.ok) {
      estimates.push({ method: 'doe-steam-tip-4-table', basis: 'HHV (gross)', basisConfidence: 'memory', efficiencyPercent: doe.efficiencyPercent, lossPercent: null, interpolated: doe.interpolated });
    } else {
      unavailable.push({ method: 'doe-steam-tip-4-table', reason: doe.message });
    }
  } else {
    unavailable.push({ method: 'doe-steam-tip-4-table', reason: 'The DOE table covers natural gas only.' });
  }
  const airFree = input.coPpm === undefined ? null : coAirFreePpm(input.coPpm, input.o2PercentDry);
  const value: CombustionEfficiencyResult = {
    netStackTempF: netF,
    netStackTempK: netK,
    excessAirPercent: excessAirPercent(input.fuel, input.o2PercentDry),
    estimates,
    unavailable,
    co: airFree === null ? null : { measuredPpm: input.coPpm as number, airFreePpm: airFree, check: checkCoAirFree(airFree, input.applianceType) },
  };
  const notes = ['Net (LHV) and gross (HHV) efficiencies differ by the latent heat of the water vapour: compare like with like.'];
  if (value.co?.check.exceedsLimit) {
    notes.push(`Air-free CO ${Math.round(airFree as number)} ppm is above the ${value.co.check.limitPpm} ppm appliance limit: refer the appliance to a licensed service technician.`);
  }
  return success(
    value,
    [
      { label: 'Net stack temperature', value: netF, unit: '°F' },
      ...optionalStep('Excess air', value.excessAirPercent, '%'),
      ...estimates.map((e) => ({ label: `Combustion efficiency, ${e.basis}`, value: e.efficiencyPercent, unit: '%' })),
      ...optionalStep('CO air-free', airFree, 'ppm'),
    ],
    notes,
  );
}

export const combustionEfficiency = defineCalculator(
  {
    id: 'combustion-efficiency',
    title: 'Combustion efficiency, excess air and air-free CO',
    summary: 'Efficiency from flue-gas O2 and net stack temperature, labelled net (LHV) or gross (HHV).',
    formulas: [
      'net stack temperature = stack − combustion air',
      'Siegert (LHV): loss % = ΔT(K) × (A ÷ (21 − O2) + B); efficiency = 100 − loss',
      'DOE table (HHV): efficiency by O2 and net stack °F, interpolated',
      'excess air % = K × O2 ÷ (21 − O2), K = 90 natural gas',
      'CO air-free = CO × 20.9 ÷ (20.9 − O2)',
    ],
    inputs: [
      { name: 'fuel', label: 'Fuel', unit: null, kind: 'choice', required: true, choices: [{ value: 'natural_gas', label: 'Natural gas' }, { value: 'fuel_oil_2', label: 'No. 2 fuel oil' }, { value: 'propane', label: 'Propane' }] },
      { name: 'o2PercentDry', label: 'Flue-gas O2 (dry)', unit: '%', kind: 'number', required: true },
      { name: 'stackTempF', label: 'Stack temperature (°F)', unit: '°F', kind: 'number', required: false },
      { name: 'stackTempC', label: 'Stack temperature (°C)', unit: '°C', kind: 'number', required: false },
      { name: 'combustionAirTempF', label: 'Combustion-air temperature (°F)', unit: '°F', kind: 'number', required: false },
      { name: 'combustionAirTempC', label: 'Combustion-air temperature (°C)', unit: '°C', kind: 'number', required: false },
      { name: 'coPpm', label: 'Flue-gas CO as measured', unit: 'ppm', kind: 'number', required: false },
      { name: 'applianceType', label: 'Appliance type (for the CO limit)', unit: null, kind: 'choice', required: false, choices: [{ value: 'vented_heating', label: 'Vented heating equipment' }, { value: 'unvented_or_residential_water_heater', label: 'Unvented appliance or residential water heater' }, { value: 'unvented_oven', label: 'Unvented gas oven' }] },
    ],
    sources: [BIMSCHV_1_SIEGERT, DOE_STEAM_TIP_4, GANAPATHY_EXCESS_AIR, ANSI_Z21_CO_AIR_FREE],
    instruments: ['combustion_analyzer'],
    limitations: [
      'Assumes complete combustion; average O2 and temperature over about 30 s at the same point.',
      'Condensing appliances fall outside both methods.',
    ],
  },
  combustionEfficiencyInputSchema,
  computeCombustionEfficiency,
);
