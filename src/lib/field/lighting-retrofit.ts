/**
 * Lighting retrofit savings: demand (kW), energy (kWh/yr) and cost ($/yr) from fixture counts,
 * input watts per fixture and operating hours, with an optional reduction of the proposed hours
 * by controls (occupancy or daylight sensors).
 *
 * Method: ΔkW = (N₁·W₁ − N₂·W₂)/1000 and ΔkWh = kW × hours, the energy arithmetic of DOE Energy
 * Saver ("wattage × hours per day × days per year ÷ 1000"). Use fixture input watts (lamps plus
 * ballast or driver), not lamp watts.
 *
 * @example
 * lightingRetrofit.run({ existingFixtureCount: 1, existingWattsPerFixture: 200,
 *   proposedWattsPerFixture: 0, hoursPerDay: 4, daysPerYear: 120, priceUsdPerKwh: 0.085 })
 * // existingKwhPerYear 96, existingUsdPerYear 8.16
 */
import { z } from 'zod';
import { defineCalculator, optionalStep, success } from './calculator';
import { numberField } from './inputs';
import { DOE_ENERGY_SAVER_APPLIANCE_USE } from './sources';
import { annualHours } from './units';

export const lightingRetrofitInputSchema = z.object({
  existingFixtureCount: numberField('Existing fixtures', { int: true, min: 0 }),
  existingWattsPerFixture: numberField('Existing input watts per fixture', { min: 0 }),
  /** Defaults to the existing count (one-for-one replacement). */
  proposedFixtureCount: numberField('Proposed fixtures', { int: true, min: 0 }).optional(),
  proposedWattsPerFixture: numberField('Proposed input watts per fixture', { min: 0 }),
  hoursPerDay: numberField('Hours per day', { gt: 0, max: 24 }),
  daysPerYear: numberField('Days per year', { gt: 0, max: 366 }),
  controlsReductionPercent: numberField('Hours reduced by controls', { min: 0, max: 100 }).default(0),
  priceUsdPerKwh: numberField('Electricity price', { min: 0 }).optional(),
});
export type LightingRetrofitInput = z.output<typeof lightingRetrofitInputSchema>;

export interface LightingRetrofitResult {
  annualHoursExisting: number;
  annualHoursProposed: number;
  existingKw: number;
  proposedKw: number;
  kwReduction: number;
  existingKwhPerYear: number;
  proposedKwhPerYear: number;
  kwhSavedPerYear: number;
  existingUsdPerYear: number | null;
  proposedUsdPerYear: number | null;
  usdSavedPerYear: number | null;
}

export function computeLightingRetrofit(input: LightingRetrofitInput) {
  const proposedCount = input.proposedFixtureCount ?? input.existingFixtureCount;
  const hoursExisting = annualHours(input.hoursPerDay, input.daysPerYear);
  const hoursProposed = hoursExisting * (1 - input.controlsReductionPercent / 100);
  const existingKw = (input.existingFixtureCount * input.existingWattsPerFixture) / 1000;
  const proposedKw = (proposedCount * input.proposedWattsPerFixture) / 1000;
  const existingKwh = existingKw * hoursExisting;
  const proposedKwh = proposedKw * hoursProposed;
  const price = input.priceUsdPerKwh;
  const value: LightingRetrofitResult = {
    annualHoursExisting: hoursExisting,
    annualHoursProposed: hoursProposed,
    existingKw,
    proposedKw,
    kwReduction: existingKw - proposedKw,
    existingKwhPerYear: existingKwh,
    proposedKwhPerYear: proposedKwh,
    kwhSavedPerYear: existingKwh - proposedKwh,
    existingUsdPerYear: price === undefined ? null : existingKwh * price,
    proposedUsdPerYear: price === undefined ? null : proposedKwh * price,
    usdSavedPerYear: price === undefined ? null : (existingKwh - proposedKwh) * price,
  };
  const notes: string[] = [];
  if (value.kwhSavedPerYear < 0) notes.push('The proposed lighting uses more energy than the existing lighting.');
  if (input.controlsReductionPercent > 0) {
    notes.push('The controls reduction is an estimate entered by the auditor; a light/occupancy logger can measure it.');
  }
  return success(
    value,
    [
      { label: 'Annual hours, existing', value: hoursExisting, unit: 'h/yr' },
      { label: 'Annual hours, proposed', value: hoursProposed, unit: 'h/yr' },
      { label: 'Demand reduction', value: value.kwReduction, unit: 'kW' },
      { label: 'Energy saved', value: value.kwhSavedPerYear, unit: 'kWh/yr' },
      ...optionalStep('Cost saved', value.usdSavedPerYear, '$/yr'),
    ],
    notes,
  );
}

export const lightingRetrofit = defineCalculator(
  {
    id: 'lighting-retrofit',
    title: 'Lighting retrofit savings',
    summary: 'Demand, energy and cost saved by replacing fixtures, with optional controls.',
    formulas: [
      'hours = hours per day × days per year',
      'kW = fixtures × input watts per fixture ÷ 1000',
      'proposed hours = hours × (1 − controls reduction %)',
      'kWh/yr saved = kW existing × hours − kW proposed × proposed hours',
      '$/yr saved = kWh/yr saved × $/kWh',
    ],
    inputs: [
      { name: 'existingFixtureCount', label: 'Existing fixtures', unit: 'fixtures', kind: 'number', required: true },
      { name: 'existingWattsPerFixture', label: 'Existing input watts per fixture (lamps + ballast)', unit: 'W', kind: 'number', required: true },
      { name: 'proposedFixtureCount', label: 'Proposed fixtures (blank = same count)', unit: 'fixtures', kind: 'number', required: false },
      { name: 'proposedWattsPerFixture', label: 'Proposed input watts per fixture', unit: 'W', kind: 'number', required: true },
      { name: 'hoursPerDay', label: 'Hours on per day', unit: 'h/day', kind: 'number', required: true },
      { name: 'daysPerYear', label: 'Days on per year', unit: 'days/yr', kind: 'number', required: true },
      { name: 'controlsReductionPercent', label: 'Hours reduced by new controls', unit: '%', kind: 'number', required: false },
      { name: 'priceUsdPerKwh', label: 'Electricity price', unit: '$/kWh', kind: 'number', required: false },
    ],
    sources: [DOE_ENERGY_SAVER_APPLIANCE_USE],
    instruments: ['light_occupancy_logger', 'plug_in_power_meter', 'flashlight', 'camera'],
    limitations: [
      'Use fixture input watts from the ballast or driver label, not the lamp watts.',
      'Demand savings on the bill depend on whether the lights are on at the monthly peak.',
    ],
  },
  lightingRetrofitInputSchema,
  computeLightingRetrofit,
);
