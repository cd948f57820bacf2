/**
 * Fixture flow test with a marked bag or container: volume collected and seconds → gpm, compared
 * with the federal maximum and the WaterSense label level for the fixture type.
 *
 * Method: gpm = gallons ÷ seconds × 60 (New Hampshire DES: "60 seconds / # of seconds recorded ×
 * 1 gallon"); EPA's WaterSense home checklist passes a showerhead that fills no more than 0.5 gal
 * (64 oz) in 15 s, i.e. 2.0 gpm.
 *
 * @example
 * fixtureFlowTest.run({ fixtureType: 'showerhead', volumeGal: 1, durationS: 20 })
 * // flowGpm 3.0, exceeds the 2.5 gpm federal maximum
 */
import { z } from 'zod';
import { defineCalculator, success } from './calculator';
import { choiceField, exactlyOneOf, numberField } from './inputs';
import { FLOW_FIXTURE_LABELS, FLOW_FIXTURE_TYPES, FLOW_LIMITS, type FlowLimit } from './fixture-standards';
import { BAG_FILL_METHOD, CFR_10_430_32, WATERSENSE_AT_WORK, WATERSENSE_SPECIFICATIONS } from './sources';
import { FL_OZ_PER_GAL, LITERS_PER_GAL } from './units';

const volumeFields = ['volumeGal', 'volumeLiters', 'volumeFlOz'] as const;

export const fixtureFlowTestInputSchema = z
  .object({
    fixtureType: choiceField('Fixture type', FLOW_FIXTURE_TYPES),
    volumeGal: numberField('Volume collected (gal)', { gt: 0 }).optional(),
    volumeLiters: numberField('Volume collected (L)', { gt: 0 }).optional(),
    volumeFlOz: numberField('Volume collected (fl oz)', { gt: 0 }).optional(),
    durationS: numberField('Fill time (s)', { gt: 0 }),
  })
  .refine(...exactlyOneOf(volumeFields, 'Volume collected'));
export type FixtureFlowTestInput = z.output<typeof fixtureFlowTestInputSchema>;

export interface FlowComparison {
  limit: FlowLimit;
  exceeds: boolean;
  /** Positive when the measured flow is below the limit. */
  marginGpm: number;
}

export interface FixtureFlowTestResult {
  volumeGal: number;
  flowGpm: number;
  flowLitersPerMin: number;
  comparisons: FlowComparison[];
  exceedsFederalMaximum: boolean;
  /** null where the fixture type has no WaterSense label (kitchen faucets). */
  meetsWaterSense: boolean | null;
}

function gallonsCollected(input: FixtureFlowTestInput): number {
  if (input.volumeGal !== undefined) return input.volumeGal;
  if (input.volumeLiters !== undefined) return input.volumeLiters / LITERS_PER_GAL;
  return (input.volumeFlOz as number) / FL_OZ_PER_GAL;
}

/** Flow in gallons per minute from a volume in gallons and a fill time in seconds. */
export function bagFillFlowGpm(volumeGal: number, durationS: number): number {
  return (volumeGal / durationS) * 60;
}

export function computeFixtureFlowTest(input: FixtureFlowTestInput) {
  const volumeGal = gallonsCollected(input);
  const flowGpm = bagFillFlowGpm(volumeGal, input.durationS);
  const flowLitersPerMin =
    input.volumeLiters !== undefined ? (input.volumeLiters / input.durationS) * 60 : flowGpm * LITERS_PER_GAL;
  const comparisons = FLOW_LIMITS[input.fixtureType].map((limit) => ({
    limit,
    exceeds: flowGpm > limit.maxGpm,
    marginGpm: limit.maxGpm - flowGpm,
  }));
  const federal = comparisons.find((c) => c.limit.id === 'federal-maximum');
  const waterSense = comparisons.find((c) => c.limit.id === 'watersense-maximum');
  const value: FixtureFlowTestResult = {
    volumeGal,
    flowGpm,
    flowLitersPerMin,
    comparisons,
    exceedsFederalMaximum: federal?.exceeds ?? false,
    meetsWaterSense: waterSense === undefined ? null : !waterSense.exceeds,
  };
  return success(
    value,
    [
      { label: 'Volume collected', value: volumeGal, unit: 'gal' },
      { label: 'Fill time', value: input.durationS, unit: 's' },
      { label: 'Flow', value: flowGpm, unit: 'gpm' },
      { label: 'Flow', value: flowLitersPerMin, unit: 'L/min' },
      ...comparisons.map((c) => ({ label: c.limit.label, value: c.limit.maxGpm, unit: 'gpm' })),
    ],
    [
      `Limits are rated at ${comparisons[0]?.limit.ratedPressurePsi ?? 60} psi; a bag test reads the flow at the building's own pressure.`,
    ],
  );
}

export const fixtureFlowTest = defineCalculator(
  {
    id: 'fixture-flow-test',
    title: 'Fixture flow test',
    summary: 'Flow from a timed bag fill, against the federal maximum and the WaterSense label level.',
    formulas: ['gpm = gallons collected ÷ seconds × 60', 'L/min = litres collected ÷ seconds × 60', '1 gal = 128 fl oz = 3.785 L'],
    inputs: [
      {
        name: 'fixtureType',
        label: 'Fixture',
        unit: null,
        kind: 'choice',
        required: true,
        choices: FLOW_FIXTURE_TYPES.map((t) => ({ value: t, label: FLOW_FIXTURE_LABELS[t] })),
      },
      { name: 'volumeGal', label: 'Volume collected (gallons)', unit: 'gal', kind: 'number', required: false },
      { name: 'volumeLiters', label: 'Volume collected (litres)', unit: 'L', kind: 'number', required: false },
      { name: 'volumeFlOz', label: 'Volume collected (fluid ounces)', unit: 'fl oz', kind: 'number', required: false, help: 'Give one volume.' },
      { name: 'durationS', label: 'Fill time', unit: 's', kind: 'number', required: true },
    ],
    sources: [BAG_FILL_METHOD, CFR_10_430_32, WATERSENSE_SPECIFICATIONS, WATERSENSE_AT_WORK],
    instruments: ['flow_test_bags'],
    limitations: [
      'Start timing when water reaches the bag; run the fixture fully open; average two or three trials.',
    ],
  },
  fixtureFlowTestInputSchema,
  computeFixtureFlowTest,
);
