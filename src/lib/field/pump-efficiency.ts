/**
 * Pump hydraulic power and efficiency from flow and differential pressure.
 *
 * Method (Hydraulic Institute form, as in Merkley & Allen, Utah State University, Lecture 11):
 * head H = 2.31 · p / SG (ft, p in psi); water horsepower WHP = Q · H · SG / 3960 (Q in gpm).
 * Pump efficiency = WHP / shaft (brake) hp. From a measured electrical input: wire-to-water
 * efficiency η_ww = WHP · 0.7457 / kW_in, and pump efficiency = η_ww / (η_motor · η_drive).
 *
 * @example
 * pumpEfficiency.run({ flowGpm: 300, headFt: 60, shaftPowerHp: 5 }) // pump efficiency 0.909
 */
import { z } from 'zod';
import { defineCalculator, failure, optionalStep, success } from './calculator';
import { exactlyOneOf, numberField } from './inputs';
import { HYDRAULIC_INSTITUTE_WHP, UCONN_ITAC_TRAINING } from './sources';
import { KW_PER_HP } from './units';

/** gpm·ft per hp for water: 33,000 ft·lbf/(min·hp) ÷ (62.4 lb/ft³ ÷ 7.48 gal/ft³) ≈ 3956, rounded to 3960 in practice. */
export const WHP_DIVISOR = 3960;
/** ft of water per psi: 144 in²/ft² ÷ 62.4 lb/ft³ ≈ 2.31 (water near 70 °F). */
export const FT_PER_PSI = 2.31;
/** psi per ft of water: 0.433. */
export const PSI_PER_FT = 0.433;

export function psiToFeetOfHead(psi: number, specificGravity = 1): number {
  return (FT_PER_PSI * psi) / specificGravity;
}

export function feetOfHeadToPsi(headFt: number, specificGravity = 1): number {
  return PSI_PER_FT * headFt * specificGravity;
}

/** Water (hydraulic) horsepower. */
export function waterHorsepower(flowGpm: number, headFt: number, specificGravity = 1): number {
  return (flowGpm * headFt * specificGravity) / WHP_DIVISOR;
}

export const pumpEfficiencyInputSchema = z
  .object({
    flowGpm: numberField('Flow (gpm)', { gt: 0 }),
    differentialPressurePsi: numberField('Differential pressure, discharge − suction (psi)', { gt: 0 }).optional(),
    headFt: numberField('Total head (ft)', { gt: 0 }).optional(),
    specificGravity: numberField('Specific gravity', { gt: 0, max: 3 }).default(1),
    shaftPowerHp: numberField('Shaft (brake) power (hp)', { gt: 0 }).optional(),
    electricalInputKw: numberField('Electrical input (kW)', { gt: 0 }).optional(),
    motorEfficiencyPercent: numberField('Motor efficiency at this load (%)', { gt: 0, max: 100 }).optional(),
    driveEfficiencyPercent: numberField('Drive efficiency (%)', { gt: 0, max: 100 }).default(100),
  })
  .refine(...exactlyOneOf(['differentialPressurePsi', 'headFt'], 'Pump head'));
export type PumpEfficiencyInput = z.output<typeof pumpEfficiencyInputSchema>;

export interface PumpEfficiencyResult {
  headFt: number;
  waterHp: number;
  waterKw: number;
  wireToWaterEfficiency: number | null;
  pumpEfficiency: number | null;
  pumpEfficiencyFrom: 'shaft-power' | 'electrical-input-and-motor-efficiency' | null;
}

export function computePumpEfficiency(input: PumpEfficiencyInput) {
  const headFt = input.headFt ?? psiToFeetOfHead(input.differentialPressurePsi as number, input.specificGravity);
  const whp = waterHorsepower(input.flowGpm, headFt, input.specificGravity);
  const wireToWater = input.electricalInputKw === undefined ? null : (whp * KW_PER_HP) / input.electricalInputKw;
  let pumpEff: number | null = null;
  let from: PumpEfficiencyResult['pumpEfficiencyFrom'] = null;
  if (input.shaftPowerHp !== undefined) {
    pumpEff = whp / input.shaftPowerHp;
    from = 'shaft-power';
  } else if (wireToWater !== null && input.motorEfficiencyPercent !== undefined) {
    pumpEff = wireToWater / ((input.motorEfficiencyPercent / 100) * (input.driveEfficiencyPercent / 100));
    from = 'electrical-input-and-motor-efficiency';
  }
  if ((pumpEff !== null && pumpEff > 1) || (wireToWater !== null && wireToWater > 1)) {
    return failure('efficiency-above-100-percent', 'The readings give an efficiency above 100 %: check the flow, the gauges and the power reading.');
  }
  const value: PumpEfficiencyResult = {
    headFt,
    waterHp: whp,
    waterKw: whp * KW_PER_HP,
    wireToWaterEfficiency: wireToWater,
    pumpEfficiency: pumpEff,
    pumpEfficiencyFrom: from,
  };
  return success(
    value,
    [
      { label: 'Head', value: headFt, unit: 'ft' },
      { label: 'Water horsepower', value: whp, unit: 'hp' },
      ...optionalStep('Wire-to-water efficiency', wireToWater, '%', 100),
      ...optionalStep('Pump efficiency', pumpEff, '%', 100),
    ],
    ['Use the differential pressure (discharge − suction), both gauges corrected to the pump centreline.'],
  );
}

export const pumpEfficiency = defineCalculator(
  {
    id: 'pump-efficiency',
    title: 'Pump hydraulic power and efficiency',
    summary: 'Water horsepower from flow and head; pump and wire-to-water efficiency from shaft or electrical power.',
    formulas: [
      'head ft = 2.31 × psi ÷ SG',
      'WHP = gpm × head ft × SG ÷ 3960',
      'pump efficiency = WHP ÷ shaft hp',
      'wire-to-water efficiency = WHP × 0.7457 ÷ kW input',
      'pump efficiency = wire-to-water ÷ (motor efficiency × drive efficiency)',
    ],
    inputs: [
      { name: 'flowGpm', label: 'Flow', unit: 'gpm', kind: 'number', required: true },
      { name: 'differentialPressurePsi', label: 'Differential pressure (discharge − suction)', unit: 'psi', kind: 'number', required: false },
      { name: 'headFt', label: 'Total head (instead of pressure)', unit: 'ft', kind: 'number', required: false },
      { name: 'specificGravity', label: 'Specific gravity (water = 1)', unit: null, kind: 'number', required: false },
      { name: 'shaftPowerHp', label: 'Shaft (brake) power, if known', unit: 'hp', kind: 'number', required: false },
      { name: 'electricalInputKw', label: 'Measured electrical input', unit: 'kW', kind: 'number', required: false },
      { name: 'motorEfficiencyPercent', label: 'Motor efficiency at this load', unit: '%', kind: 'number', required: false },
      { name: 'driveEfficiencyPercent', label: 'Drive efficiency (VFD, belt)', unit: '%', kind: 'number', required: false },
    ],
    sources: [HYDRAULIC_INSTITUTE_WHP, UCONN_ITAC_TRAINING],
    instruments: ['ultrasonic_flow_meter', 'three_phase_power_logger', 'clamp_ammeter'],
    limitations: ['Velocity head is ignored; it is usually small but not always.'],
  },
  pumpEfficiencyInputSchema,
  computePumpEfficiency,
);
