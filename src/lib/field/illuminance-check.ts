/**
 * Measured illuminance against a recommended or required level for the space.
 *
 * Method: convert the reading to foot-candles (1 fc = 10.7639 lx), then compare it with the
 * chosen reference (see illuminance-levels.ts): below a required minimum; below, within or above a
 * recommended IES range; or within a target ± tolerance.
 *
 * @example
 * illuminanceCheck.run({ referenceId: 'federal-work-area', measuredLux: 250 })
 * // measuredFc 23.2, status 'below' (30 fc required)
 */
import { z } from 'zod';
import { defineCalculator, success } from './calculator';
import { choiceField, exactlyOneOf, numberField } from './inputs';
import {
  ILLUMINANCE_REFERENCE_IDS,
  ILLUMINANCE_REFERENCES,
  findIlluminanceReference,
  type IlluminanceReference,
} from './illuminance-levels';
import { footCandlesToLux, luxToFootCandles } from './units';

const readingFields = ['measuredFc', 'measuredLux'] as const;

export const illuminanceCheckInputSchema = z
  .object({
    referenceId: choiceField('Space type or category', ILLUMINANCE_REFERENCE_IDS),
    measuredFc: numberField('Measured illuminance (fc)', { min: 0 }).optional(),
    measuredLux: numberField('Measured illuminance (lx)', { min: 0 }).optional(),
  })
  .refine(...exactlyOneOf(readingFields, 'Measured illuminance'));
export type IlluminanceCheckInput = z.output<typeof illuminanceCheckInputSchema>;

export type IlluminanceStatus = 'below' | 'meets' | 'within' | 'above';

export interface IlluminanceCheckResult {
  measuredFc: number;
  measuredLux: number;
  reference: IlluminanceReference;
  /** The level the reading is compared with: the minimum, or the target of a range or tolerance. */
  referenceFc: number;
  ratioToReference: number;
  status: IlluminanceStatus;
}

function classify(fc: number, ref: IlluminanceReference): { referenceFc: number; status: IlluminanceStatus } {
  switch (ref.kind) {
    case 'minimum':
      return { referenceFc: ref.minimumFc, status: fc < ref.minimumFc ? 'below' : 'meets' };
    case 'range':
      return { referenceFc: ref.targetFc, status: fc < ref.lowFc ? 'below' : fc > ref.highFc ? 'above' : 'within' };
    case 'tolerance': {
      const band = (ref.targetFc * ref.tolerancePercent) / 100;
      const status = fc < ref.targetFc - band ? 'below' : fc > ref.targetFc + band ? 'above' : 'within';
      return { referenceFc: ref.targetFc, status };
    }
  }
}

export function computeIlluminanceCheck(input: IlluminanceCheckInput) {
  // The schema guarantees the id exists and exactly one reading is present.
  const reference = findIlluminanceReference(input.referenceId) as IlluminanceReference;
  const measuredFc = input.measuredFc ?? luxToFootCandles(input.measuredLux as number);
  const { referenceFc, status } = classify(measuredFc, reference);
  const value: IlluminanceCheckResult = {
    measuredFc,
    measuredLux: input.measuredLux ?? footCandlesToLux(measuredFc),
    reference,
    referenceFc,
    ratioToReference: referenceFc > 0 ? measuredFc / referenceFc : 0,
    status,
  };
  const notes = [`Take the reading ${reference.measurement}.`];
  if (status === 'above' || (status === 'meets' && measuredFc > 1.5 * referenceFc)) {
    notes.push('Well above the reference level: a possible delamping or lower-wattage opportunity (common practice).');
  }
  return success(
    value,
    [
      { label: 'Measured', value: measuredFc, unit: 'fc' },
      { label: 'Measured', value: value.measuredLux, unit: 'lx' },
      { label: 'Reference level', value: referenceFc, unit: 'fc' },
      { label: 'Measured ÷ reference', value: value.ratioToReference, unit: '' },
    ],
    notes,
  );
}

export const illuminanceCheck = defineCalculator(
  {
    id: 'illuminance-check',
    title: 'Measured illuminance against recommended levels',
    summary: 'Compares a light-meter reading with the level required or recommended for the space.',
    formulas: ['fc = lx ÷ 10.7639', 'ratio = measured fc ÷ reference fc'],
    inputs: [
      {
        name: 'referenceId',
        label: 'Space type or IES category',
        unit: null,
        kind: 'choice',
        required: true,
        choices: ILLUMINANCE_REFERENCES.map((r) => ({ value: r.id, label: r.label })),
      },
      { name: 'measuredFc', label: 'Measured illuminance (foot-candles)', unit: 'fc', kind: 'number', required: false },
      { name: 'measuredLux', label: 'Measured illuminance (lux)', unit: 'lx', kind: 'number', required: false, help: 'Give fc or lux, not both.' },
    ],
    sources: [...new Set(ILLUMINANCE_REFERENCES.map((r) => r.source))],
    instruments: ['light_meter', 'light_occupancy_logger'],
    limitations: [
      'One reading is a spot check; average several points across the space.',
      'Current IES practice (ANSI/IES RP series) sets age-weighted targets; the categories here are the older handbook system.',
    ],
  },
  illuminanceCheckInputSchema,
  computeIlluminanceCheck,
);
