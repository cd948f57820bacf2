/**
 * Power from clamp-meter readings: single-phase P = V·I·PF/1000 and three-phase
 * P = V·I·PF·√3/1000 (DOE motor fact sheet Eq. 1, V the mean line-to-line voltage, I the mean line
 * current), apparent power kVA = V·I(·√3)/1000, and annual kWh at the operating hours.
 *
 * A clamp ammeter alone gives volt-amperes. Without a measured power factor the calculator uses
 * PF = 1 and says the result is an upper bound.
 *
 * @example
 * clampMeterPower.run({ phase: 'three', voltageV: 469.7, currentA: 37, powerFactor: 0.763 })
 * // kW 22.97 (the DOE fact sheet prints 22.9)
 */
import { z } from 'zod';
import { defineCalculator, optionalStep, success } from './calculator';
import { choiceField, numberField } from './inputs';
import { DOE_MOTOR_FACT_SHEET, UCONN_ITAC_TRAINING } from './sources';

export const PHASES = ['single', 'three'] as const;
export type Phase = (typeof PHASES)[number];

export const clampMeterPowerInputSchema = z.object({
  phase: choiceField('Phase', PHASES),
  voltageV: numberField('Voltage (V)', { gt: 0 }),
  currentA: numberField('Current (A)', { min: 0 }),
  powerFactor: numberField('Power factor', { gt: 0, max: 1 }).optional(),
  hoursPerYear: numberField('Operating hours per year', { min: 0, max: 8784 }).optional(),
  priceUsdPerKwh: numberField('Electricity price', { min: 0 }).optional(),
});
export type ClampMeterPowerInput = z.output<typeof clampMeterPowerInputSchema>;

export interface ClampMeterPowerResult {
  kva: number;
  kw: number;
  powerFactorUsed: number;
  powerFactorAssumed: boolean;
  kwhPerYear: number | null;
  usdPerYear: number | null;
}

/** Apparent power in kVA. */
export function apparentPowerKva(phase: Phase, voltageV: number, currentA: number): number {
  return (voltageV * currentA * (phase === 'three' ? Math.sqrt(3) : 1)) / 1000;
}

/** Real power in kW: kVA × PF (DOE/GO-10097-517 Eq. 1 for three-phase). */
export function realPowerKw(phase: Phase, voltageV: number, currentA: number, powerFactor: number): number {
  return apparentPowerKva(phase, voltageV, currentA) * powerFactor;
}

export function computeClampMeterPower(input: ClampMeterPowerInput) {
  const pf = input.powerFactor ?? 1;
  const kva = apparentPowerKva(input.phase, input.voltageV, input.currentA);
  const kw = kva * pf;
  const kwh = input.hoursPerYear === undefined ? null : kw * input.hoursPerYear;
  const value: ClampMeterPowerResult = {
    kva,
    kw,
    powerFactorUsed: pf,
    powerFactorAssumed: input.powerFactor === undefined,
    kwhPerYear: kwh,
    usdPerYear: kwh === null || input.priceUsdPerKwh === undefined ? null : kwh * input.priceUsdPerKwh,
  };
  const notes: string[] = [];
  if (value.powerFactorAssumed) {
    notes.push('No power factor given: PF = 1 assumed, so kW is an upper bound. A power meter reads true kW.');
  }
  if (input.phase === 'three') notes.push('Three-phase: use the mean line-to-line voltage and the mean of the three line currents.');
  return success(
    value,
    [
      { label: 'Apparent power', value: kva, unit: 'kVA' },
      { label: 'Power factor used', value: pf, unit: '' },
      { label: 'Real power', value: kw, unit: 'kW' },
      ...optionalStep('Annual energy', kwh, 'kWh/yr'),
      ...optionalStep('Annual cost', value.usdPerYear, '$/yr'),
    ],
    notes,
  );
}

export const clampMeterPower = defineCalculator(
  {
    id: 'clamp-meter-power',
    title: 'Clamp-meter power',
    summary: 'Real and apparent power from volts, amps and power factor, single- or three-phase.',
    formulas: [
      'single-phase: kVA = V × I ÷ 1000',
      'three-phase: kVA = V × I × √3 ÷ 1000 (V line-to-line)',
      'kW = kVA × PF',
      'kWh/yr = kW × hours per year',
    ],
    inputs: [
      { name: 'phase', label: 'Phase', unit: null, kind: 'choice', required: true, choices: [{ value: 'single', label: 'Single-phase' }, { value: 'three', label: 'Three-phase' }] },
      { name: 'voltageV', label: 'Voltage (mean line-to-line for three-phase)', unit: 'V', kind: 'number', required: true },
      { name: 'currentA', label: 'Current (mean of the lines for three-phase)', unit: 'A', kind: 'number', required: true },
      { name: 'powerFactor', label: 'Power factor (blank = 1, upper bound)', unit: null, kind: 'number', required: false },
      { name: 'hoursPerYear', label: 'Operating hours per year', unit: 'h/yr', kind: 'number', required: false },
      { name: 'priceUsdPerKwh', label: 'Electricity price', unit: '$/kWh', kind: 'number', required: false },
    ],
    sources: [DOE_MOTOR_FACT_SHEET, UCONN_ITAC_TRAINING],
    instruments: ['clamp_ammeter', 'power_logger', 'three_phase_power_logger', 'plug_in_power_meter'],
    limitations: ['Readings are a snapshot; a logger over a week captures cycling loads.'],
  },
  clampMeterPowerInputSchema,
  computeClampMeterPower,
);
