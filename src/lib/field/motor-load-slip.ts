/**
 * Motor load by the slip method, from a stroboscope or tachometer reading of shaft speed.
 *
 * Method (DOE/GO-10097-517, "Determining Electric Motor Load and Efficiency"):
 * synchronous speed Ns = 120·f/P; load = (Ns − N_measured) / (Ns − N_nameplate), and with the
 * voltage correction load = (Ns − N_measured) / [(Ns − N_nameplate)·(V_rated/V_measured)²];
 * output ≈ load × nameplate hp.
 *
 * The result is an estimate: NEMA allows a tolerance on the nameplate full-load speed, and a 1 rpm
 * reading error on a motor with 14 rpm rated slip is about 7 % load. Prefer measured kW.
 *
 * @example
 * motorLoadSlip.run({ synchronousSpeedRpm: 1800, nameplateRpm: 1750, measuredRpm: 1770, nameplateHp: 25 })
 * // load 0.60, output 15 hp
 */
import { z } from 'zod';
import { defineCalculator, failure, optionalStep, success } from './calculator';
import { numberField } from './inputs';
import { DOE_MOTOR_FACT_SHEET, UCONN_ITAC_TRAINING } from './sources';

/** Synchronous speed in rpm of an AC machine: Ns = 120·f/P. */
export function synchronousSpeedRpm(frequencyHz: number, poles: number): number {
  return (120 * frequencyHz) / poles;
}

export const motorLoadSlipInputSchema = z
  .object({
    synchronousSpeedRpm: numberField('Synchronous speed (rpm)', { gt: 0 }).optional(),
    poles: numberField('Number of poles', { int: true, min: 2, max: 48 })
      .refine((p) => p % 2 === 0, { error: 'Number of poles must be even' })
      .optional(),
    frequencyHz: numberField('Supply frequency (Hz)', { gt: 0, max: 400 }).default(60),
    nameplateRpm: numberField('Nameplate full-load speed (rpm)', { gt: 0 }),
    measuredRpm: numberField('Measured speed (rpm)', { gt: 0 }),
    nameplateHp: numberField('Nameplate horsepower', { gt: 0 }).optional(),
    ratedVoltageV: numberField('Rated voltage (V)', { gt: 0 }).optional(),
    measuredVoltageV: numberField('Measured voltage (V)', { gt: 0 }).optional(),
  })
  .refine((v) => v.synchronousSpeedRpm !== undefined || v.poles !== undefined, {
    error: 'Synchronous speed: give the synchronous speed or the number of poles',
    path: ['synchronousSpeedRpm'],
  })
  .refine((v) => (v.ratedVoltageV === undefined) === (v.measuredVoltageV === undefined), {
    error: 'Voltage correction: give both the rated and the measured voltage, or neither',
    path: ['ratedVoltageV'],
  });
export type MotorLoadSlipInput = z.output<typeof motorLoadSlipInputSchema>;

export interface MotorLoadSlipResult {
  synchronousSpeedRpm: number;
  slipRpm: number;
  ratedSlipRpm: number;
  /** (V_rated / V_measured)², 1 without the voltage correction. */
  voltageCorrection: number;
  loadFraction: number;
  outputHp: number | null;
}

export function computeMotorLoadSlip(input: MotorLoadSlipInput) {
  const ns = input.synchronousSpeedRpm ?? synchronousSpeedRpm(input.frequencyHz, input.poles as number);
  if (input.nameplateRpm >= ns) {
    return failure('nameplate-speed-not-below-synchronous', `Nameplate speed ${input.nameplateRpm} rpm must be below the synchronous speed ${ns} rpm: check the pole count.`);
  }
  if (input.measuredRpm > ns) {
    return failure('measured-speed-above-synchronous', `Measured speed ${input.measuredRpm} rpm is above the synchronous speed ${ns} rpm: check the reading and the pole count.`);
  }
  const slip = ns - input.measuredRpm;
  const ratedSlip = ns - input.nameplateRpm;
  const correction =
    input.ratedVoltageV !== undefined && input.measuredVoltageV !== undefined ? (input.ratedVoltageV / input.measuredVoltageV) ** 2 : 1;
  const load = slip / (ratedSlip * correction);
  const value: MotorLoadSlipResult = {
    synchronousSpeedRpm: ns,
    slipRpm: slip,
    ratedSlipRpm: ratedSlip,
    voltageCorrection: correction,
    loadFraction: load,
    outputHp: input.nameplateHp === undefined ? null : load * input.nameplateHp,
  };
  const notes = ['Slip-method load is an estimate: the nameplate speed has a manufacturing tolerance. Prefer measured kW where a power meter is available.'];
  if (load > 1) notes.push('Load above nameplate rating.');
  return success(
    value,
    [
      { label: 'Synchronous speed', value: ns, unit: 'rpm' },
      { label: 'Slip', value: slip, unit: 'rpm' },
      { label: 'Rated slip', value: ratedSlip, unit: 'rpm' },
      { label: 'Voltage correction (V_rated/V)²', value: correction, unit: '' },
      { label: 'Load', value: load * 100, unit: '%' },
      ...optionalStep('Output', value.outputHp, 'hp'),
    ],
    notes,
  );
}

export const motorLoadSlip = defineCalculator(
  {
    id: 'motor-load-slip',
    title: 'Motor load by the slip method',
    summary: 'Part load of an induction motor from its measured shaft speed.',
    formulas: [
      'Ns = 120 × f ÷ poles',
      'load = (Ns − N measured) ÷ [(Ns − N nameplate) × (V rated ÷ V measured)²]',
      'output hp = load × nameplate hp',
    ],
    inputs: [
      { name: 'synchronousSpeedRpm', label: 'Synchronous speed (or give poles)', unit: 'rpm', kind: 'number', required: false },
      { name: 'poles', label: 'Number of poles', unit: null, kind: 'number', required: false },
      { name: 'frequencyHz', label: 'Supply frequency', unit: 'Hz', kind: 'number', required: false },
      { name: 'nameplateRpm', label: 'Nameplate full-load speed', unit: 'rpm', kind: 'number', required: true },
      { name: 'measuredRpm', label: 'Measured shaft speed', unit: 'rpm', kind: 'number', required: true },
      { name: 'nameplateHp', label: 'Nameplate horsepower', unit: 'hp', kind: 'number', required: false },
      { name: 'ratedVoltageV', label: 'Rated voltage (for the voltage correction)', unit: 'V', kind: 'number', required: false },
      { name: 'measuredVoltageV', label: 'Measured voltage', unit: 'V', kind: 'number', required: false },
    ],
    sources: [DOE_MOTOR_FACT_SHEET, UCONN_ITAC_TRAINING],
    instruments: ['stroboscope'],
    limitations: ['An estimate only: nameplate speed tolerance and a 1 rpm reading error can each move the load by several percent.'],
  },
  motorLoadSlipInputSchema,
  computeMotorLoadSlip,
);
