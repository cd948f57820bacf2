/**
 * Annual water use of a flowing fixture before and after a change, with water-and-sewer cost and
 * the water-heating energy that goes with the hot share.
 *
 * Method: gal/yr = gpm × minutes per use × uses per person per day × people × days (EPA WaterSense
 * at Work Eq. 3-5 and 3-7; IAPMO Green Plumbing Supplement L 701.2). Default durations and uses per
 * day are the IAPMO L 701.2 baseline table. Heater input energy = hot gallons saved × 8.34
 * Btu/(gal·°F) × temperature rise ÷ heater efficiency (common practice).
 *
 * @example
 * fixtureWaterUse.run({ useType: 'showerhead', existingFlowGpm: 2.5, proposedFlowGpm: 2.0,
 *   people: 10, daysPerYear: 250 })
 * // 8 min × 1 use: 50,000 → 40,000 gal/yr, 10,000 gal/yr saved
 */
import { z } from 'zod';
import { defineCalculator, optionalStep, success } from './calculator';
import { choiceField, numberField } from './inputs';
import { IAPMO_GREEN_PLUMBING_L701, WATERSENSE_AT_WORK } from './sources';
import { BTU_PER_GAL_DEG_F } from './units';

export const WATER_USE_TYPES = ['showerhead', 'lavatory_faucet_private', 'lavatory_faucet_public', 'kitchen_faucet'] as const;
export type WaterUseType = (typeof WATER_USE_TYPES)[number];

/** IAPMO Green Plumbing Supplement L 701.2 baseline: duration per use and uses per person per day. */
export const BASELINE_USE: Record<WaterUseType, { label: string; minutesPerUse: number; usesPerPersonPerDay: number }> = {
  showerhead: { label: 'Showerhead', minutesPerUse: 8, usesPerPersonPerDay: 1 },
  lavatory_faucet_private: { label: 'Private lavatory faucet', minutesPerUse: 0.25, usesPerPersonPerDay: 4 },
  lavatory_faucet_public: { label: 'Non-residential lavatory faucet', minutesPerUse: 0.25, usesPerPersonPerDay: 4 },
  kitchen_faucet: { label: 'Residential kitchen faucet', minutesPerUse: 4, usesPerPersonPerDay: 1 },
};

export const fixtureWaterUseInputSchema = z
  .object({
    useType: choiceField('Fixture use', WATER_USE_TYPES),
    existingFlowGpm: numberField('Existing flow (gpm)', { gt: 0 }),
    proposedFlowGpm: numberField('Proposed flow (gpm)', { min: 0 }),
    people: numberField('People using the fixture each day', { gt: 0 }),
    daysPerYear: numberField('Days per year', { gt: 0, max: 366 }),
    minutesPerUse: numberField('Minutes per use', { gt: 0 }).optional(),
    usesPerPersonPerDay: numberField('Uses per person per day', { gt: 0 }).optional(),
    waterSewerUsdPerKgal: numberField('Water and sewer price ($/kgal)', { min: 0 }).optional(),
    hotWaterPercent: numberField('Hot-water share', { min: 0, max: 100 }).default(0),
    temperatureRiseF: numberField('Water-heater temperature rise (°F)', { gt: 0 }).optional(),
    waterHeaterEfficiencyPercent: numberField('Water-heater efficiency (%)', { gt: 0, max: 100 }).optional(),
  })
  .refine((v) => v.hotWaterPercent === 0 || (v.temperatureRiseF !== undefined && v.waterHeaterEfficiencyPercent !== undefined), {
    error: 'Hot-water share: give the temperature rise and the water-heater efficiency too',
    path: ['hotWaterPercent'],
  });
export type FixtureWaterUseInput = z.output<typeof fixtureWaterUseInputSchema>;

export interface FixtureWaterUseResult {
  minutesPerUse: number;
  usesPerPersonPerDay: number;
  existingGalPerYear: number;
  proposedGalPerYear: number;
  galSavedPerYear: number;
  usdSavedPerYear: number | null;
  hotGalSavedPerYear: number;
  /** Water-heater input energy saved; 0 without a hot-water share. */
  heaterInputBtuSavedPerYear: number;
}

/** Gallons per year at a flow, a duration per use and a use rate (WaterSense at Work Eq. 3-5, 3-7). */
export function annualFixtureGallons(flowGpm: number, minutesPerUse: number, usesPerPersonPerDay: number, people: number, daysPerYear: number): number {
  return flowGpm * minutesPerUse * usesPerPersonPerDay * people * daysPerYear;
}

/** Heat a water heater must supply to warm `gallons` by `riseF`, at an efficiency (fraction). */
export function waterHeatingInputBtu(gallons: number, riseF: number, efficiency: number): number {
  return (gallons * BTU_PER_GAL_DEG_F * riseF) / efficiency;
}

export function computeFixtureWaterUse(input: FixtureWaterUseInput) {
  const baseline = BASELINE_USE[input.useType];
  const minutes = input.minutesPerUse ?? baseline.minutesPerUse;
  const uses = input.usesPerPersonPerDay ?? baseline.usesPerPersonPerDay;
  const existing = annualFixtureGallons(input.existingFlowGpm, minutes, uses, input.people, input.daysPerYear);
  const proposed = annualFixtureGallons(input.proposedFlowGpm, minutes, uses, input.people, input.daysPerYear);
  const saved = existing - proposed;
  const hotSaved = (saved * input.hotWaterPercent) / 100;
  const heaterBtu =
    hotSaved === 0 ? 0 : waterHeatingInputBtu(hotSaved, input.temperatureRiseF as number, (input.waterHeaterEfficiencyPercent as number) / 100);
  const value: FixtureWaterUseResult = {
    minutesPerUse: minutes,
    usesPerPersonPerDay: uses,
    existingGalPerYear: existing,
    proposedGalPerYear: proposed,
    galSavedPerYear: saved,
    usdSavedPerYear: input.waterSewerUsdPerKgal === undefined ? null : (saved / 1000) * input.waterSewerUsdPerKgal,
    hotGalSavedPerYear: hotSaved,
    heaterInputBtuSavedPerYear: heaterBtu,
  };
  const notes: string[] = [];
  if (input.minutesPerUse === undefined || input.usesPerPersonPerDay === undefined) {
    notes.push('Durations or uses per day not given were taken from the IAPMO L 701.2 baseline table.');
  }
  return success(
    value,
    [
      { label: 'Minutes per use', value: minutes, unit: 'min' },
      { label: 'Uses per person per day', value: uses, unit: '' },
      { label: 'Existing use', value: existing, unit: 'gal/yr' },
      { label: 'Proposed use', value: proposed, unit: 'gal/yr' },
      { label: 'Water saved', value: saved, unit: 'gal/yr' },
      ...optionalStep('Water and sewer cost saved', value.usdSavedPerYear, '$/yr'),
      ...(heaterBtu === 0 ? [] : [{ label: 'Water-heater input saved', value: heaterBtu / 1e6, unit: 'MMBtu/yr' }]),
    ],
    notes,
  );
}

export const fixtureWaterUse = defineCalculator(
  {
    id: 'fixture-water-use',
    title: 'Fixture water use and savings',
    summary: 'Annual water, cost and water-heating energy before and after a flow change.',
    formulas: [
      'gal/yr = gpm × minutes per use × uses per person per day × people × days per year',
      '$/yr = gal/yr saved ÷ 1000 × $/kgal',
      'heater Btu/yr = hot gal/yr saved × 8.34 Btu/(gal·°F) × temperature rise ÷ heater efficiency',
    ],
    inputs: [
      {
        name: 'useType',
        label: 'Fixture use',
        unit: null,
        kind: 'choice',
        required: true,
        choices: WATER_USE_TYPES.map((t) => ({ value: t, label: BASELINE_USE[t].label })),
      },
      { name: 'existingFlowGpm', label: 'Existing flow (from the flow test)', unit: 'gpm', kind: 'number', required: true },
      { name: 'proposedFlowGpm', label: 'Proposed flow', unit: 'gpm', kind: 'number', required: true },
      { name: 'people', label: 'People using the fixture each day', unit: 'people', kind: 'number', required: true },
      { name: 'daysPerYear', label: 'Days per year', unit: 'days/yr', kind: 'number', required: true },
      { name: 'minutesPerUse', label: 'Minutes per use (blank = baseline table)', unit: 'min', kind: 'number', required: false },
      { name: 'usesPerPersonPerDay', label: 'Uses per person per day (blank = baseline table)', unit: 'uses/day', kind: 'number', required: false },
      { name: 'waterSewerUsdPerKgal', label: 'Water and sewer price', unit: '$/kgal', kind: 'number', required: false },
      { name: 'hotWaterPercent', label: 'Hot-water share of the flow', unit: '%', kind: 'number', required: false },
      { name: 'temperatureRiseF', label: 'Water-heater temperature rise', unit: '°F', kind: 'number', required: false },
      { name: 'waterHeaterEfficiencyPercent', label: 'Water-heater efficiency', unit: '%', kind: 'number', required: false },
    ],
    sources: [WATERSENSE_AT_WORK, IAPMO_GREEN_PLUMBING_L701],
    instruments: ['flow_test_bags'],
    limitations: ['Use counts and durations drive the result; prefer site observations to the baseline table.'],
  },
  fixtureWaterUseInputSchema,
  computeFixtureWaterUse,
);
