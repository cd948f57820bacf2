/**
 * Motor load from measured electrical input power.
 *
 * Method (DOE/GO-10097-517): Eq. 1 Pi = V·I·PF·√3/1000 (mean line-to-line volts, mean amps, mean
 * PF); Eq. 2 Pir = hp × 0.7457 / η_fl, the input at full rated load; Eq. 3 load = Pi / Pir.
 * Output ≈ load × nameplate hp (an approximation: efficiency at part load differs from η_fl).
 *
 * @example
 * motorLoadInputPower.run({ voltageV: 469.7, currentA: 37, powerFactor: 0.763,
 *   nameplateHp: 40, fullLoadEfficiencyPercent: 90 })
 * // input 22.97 kW, rated input 33.1 kW, load 0.69
 */
import { z } from 'zod';
import { defineCalculator, success } from './calculator';
import { realPowerKw } from './clamp-meter-power';
import { numberField } from './inputs';
import { DOE_MOTOR_FACT_SHEET } from './sources';
import { KW_PER_HP } from './units';

export const motorLoadInputPowerInputSchema = z.object({
  voltageV: numberField('Mean line-to-line voltage (V)', { gt: 0 }),
  currentA: numberField('Mean line current (A)', { min: 0 }),
  powerFactor: numberField('Power factor', { gt: 0, max: 1 }),
  nameplateHp: numberField('Nameplate horsepower', { gt: 0 }),
  fullLoadEfficiencyPercent: numberField('Nameplate full-load efficiency (%)', { gt: 0, max: 100 }),
});
export type MotorLoadInputPowerInput = z.output<typeof motorLoadInputPowerInputSchema>;

export interface MotorLoadInputPowerResult {
  inputKw: number;
  ratedInputKw: number;
  loadFraction: number;
  approximateOutputHp: number;
}

/** Input power at full rated load, kW (fact-sheet Eq. 2). */
export function ratedInputKw(nameplateHp: number, fullLoadEfficiency: number): number {
  return (nameplateHp * KW_PER_HP) / fullLoadEfficiency;
}

export function computeMotorLoadInputPower(input: MotorLoadInputPowerInput) {
  const pi = realPowerKw('three', input.voltageV, input.currentA, input.powerFactor);
  const pir = ratedInputKw(input.nameplateHp, input.fullLoadEfficiencyPercent / 100);
  const load = pi / pir;
  const value: MotorLoadInputPowerResult = {
    inputKw: pi,
    ratedInputKw: pir,
    loadFraction: load,
    approximateOutputHp: load * input.nameplateHp,
  };
  return success(
    value,
    [
      { label: 'Input power', value: pi, unit: 'kW' },
      { label: 'Input at full rated load', value: pir, unit: 'kW' },
      { label: 'Load', value: load * 100, unit: '%' },
      { label: 'Output (approximate)', value: value.approximateOutputHp, unit: 'hp' },
    ],
    load > 1 ? ['Load above nameplate rating.'] : [],
  );
}

export const motorLoadInputPower = defineCalculator(
  {
    id: 'motor-load-input-power',
    title: 'Motor load from input power',
    summary: 'Part load of a three-phase motor from measured volts, amps and power factor.',
    formulas: [
      'Pi = V × I × PF × √3 ÷ 1000',
      'Pir = nameplate hp × 0.7457 ÷ full-load efficiency',
      'load = Pi ÷ Pir',
    ],
    inputs: [
      { name: 'voltageV', label: 'Mean line-to-line voltage', unit: 'V', kind: 'number', required: true },
      { name: 'currentA', label: 'Mean line current', unit: 'A', kind: 'number', required: true },
      { name: 'powerFactor', label: 'Mean power factor', unit: null, kind: 'number', required: true },
      { name: 'nameplateHp', label: 'Nameplate horsepower', unit: 'hp', kind: 'number', required: true },
      { name: 'fullLoadEfficiencyPercent', label: 'Nameplate full-load efficiency', unit: '%', kind: 'number', required: true },
    ],
    sources: [DOE_MOTOR_FACT_SHEET],
    instruments: ['three_phase_power_logger', 'clamp_ammeter', 'power_logger'],
    limitations: ['Output hp is approximate: part-load efficiency differs from the full-load nameplate value.'],
  },
  motorLoadInputPowerInputSchema,
  computeMotorLoadInputPower,
);
