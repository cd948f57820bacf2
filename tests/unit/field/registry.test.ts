import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { CALCULATOR_IDS, FIELD_CALCULATORS, INSTRUMENT_TYPES, SAFETY_DEFERRAL, getFieldCalculator, runFieldCalculator } from '../../../src/lib/field/index';
import { okValue } from './expect-helpers';

/** The schema under .optional() / .default() wrappers. */
function inner(schema: z.ZodType): z.ZodType {
  let s = schema as z.ZodType & { unwrap?: () => z.ZodType };
  while (typeof s.unwrap === 'function') s = s.unwrap() as typeof s;
  return s;
}

describe('field calculator registry', () => {
  it('lists every calculator id exactly once', () => {
    const ids = FIELD_CALCULATORS.map((c) => c.meta.id);
    expect([...ids].sort()).toEqual([...CALCULATOR_IDS].sort());
  });

  it.each(FIELD_CALCULATORS.map((c) => [c.meta.id, c] as const))('%s: metadata inputs match the schema', (_id, calc) => {
    const shape = calc.schema.shape as Record<string, z.ZodType>;
    expect(calc.meta.inputs.map((i) => i.name).sort()).toEqual(Object.keys(shape).sort());
    for (const input of calc.meta.inputs) {
      const field = shape[input.name] as z.ZodType;
      // required in the metadata ⇔ the schema refuses a missing value
      expect(field.safeParse(undefined).success, `${input.name} required flag`).toBe(!input.required);
      if (input.kind === 'choice') {
        const options = (inner(field) as unknown as { options: string[] }).options;
        expect(input.choices?.map((c) => c.value).sort()).toEqual([...options].sort());
      }
    }
  });

  it.each(FIELD_CALCULATORS.map((c) => [c.meta.id, c] as const))('%s: has formulas and cites a source or says it has none', (_id, calc) => {
    expect(calc.meta.title.length).toBeGreaterThan(0);
    expect(calc.meta.formulas.length).toBeGreaterThan(0);
    const unsourced = calc.meta.limitations.some((l) => l.includes('not a published method'));
    expect(calc.meta.sources.length > 0 || unsourced).toBe(true);
    for (const instrument of calc.meta.instruments) expect(INSTRUMENT_TYPES).toContain(instrument);
  });

  it('attaches the cautions the brief requires to the hazardous measurements', () => {
    const hazardIds = (id: (typeof CALCULATOR_IDS)[number]) => getFieldCalculator(id).hazards.map((h) => h.id);
    expect(hazardIds('clamp-meter-power')).toContain('energized-electrical');
    expect(hazardIds('motor-load-input-power')).toContain('energized-electrical');
    expect(hazardIds('motor-load-slip')).toContain('rotating-machinery');
    expect(hazardIds('combustion-efficiency')).toEqual(expect.arrayContaining(['combustion-testing', 'measure-do-not-adjust']));
    expect(hazardIds('pump-efficiency')).toContain('mechanical-rooms');
    expect(hazardIds('fixture-flow-test')).toEqual([]);
    expect(getFieldCalculator('clamp-meter-power').safetyDeferral).toBe(SAFETY_DEFERRAL);
    expect(getFieldCalculator('fixture-flow-test').safetyDeferral).toBeNull();
  });

  it('runs a calculator by id from untrusted input', () => {
    // Source: DOE/GO-10097-517 slip example (load 60 %)
    const r = okValue(runFieldCalculator('motor-load-slip', { synchronousSpeedRpm: 1800, nameplateRpm: 1750, measuredRpm: 1770 })) as { loadFraction: number };
    expect(r.loadFraction).toBeCloseTo(0.6, 12);
    expect(runFieldCalculator('motor-load-slip', 'not an object')).toMatchObject({ ok: false, reason: 'invalid-input' });
  });
});
