/**
 * zod builders for calculator inputs whose error messages name the field in plain words, so that
 * "powerFactor: Power factor must be at most 1" reaches the user instead of a generic message.
 * zod 4 rejects NaN and ±Infinity for z.number(), so every number that passes is finite.
 */
import { z } from 'zod';

export interface NumberBounds {
  /** Inclusive lower bound. */
  min?: number;
  /** Exclusive lower bound. */
  gt?: number;
  /** Inclusive upper bound. */
  max?: number;
  /** Exclusive upper bound. */
  lt?: number;
  int?: boolean;
}

/** A finite number with bounds; `label` is the plain name used in every message. */
export function numberField(label: string, bounds: NumberBounds = {}) {
  let schema = z.number({
    error: (issue) => (issue.input === undefined ? `${label} is required` : `${label} must be a number`),
  });
  if (bounds.int === true) schema = schema.int({ error: `${label} must be a whole number` });
  if (bounds.min !== undefined) schema = schema.gte(bounds.min, { error: `${label} must be at least ${bounds.min}` });
  if (bounds.gt !== undefined) schema = schema.gt(bounds.gt, { error: `${label} must be greater than ${bounds.gt}` });
  if (bounds.max !== undefined) schema = schema.lte(bounds.max, { error: `${label} must be at most ${bounds.max}` });
  if (bounds.lt !== undefined) schema = schema.lt(bounds.lt, { error: `${label} must be less than ${bounds.lt}` });
  return schema;
}

/** A choice among fixed codes, with a message listing them. */
export function choiceField<const T extends readonly [string, ...string[]]>(label: string, values: T) {
  return z.enum(values, {
    error: (issue) =>
      issue.input === undefined ? `${label} is required` : `${label} must be one of: ${values.join(', ')}`,
  });
}

/**
 * Refinement for "give exactly one of these fields" (a volume in gallons or litres or fluid
 * ounces; a temperature in °F or °C). The issue is reported on the first field of the group.
 * Use as `.refine(...exactlyOneOf(['tempF', 'tempC'], 'Temperature'))`.
 */
export function exactlyOneOf(fields: readonly [string, ...string[]], label: string) {
  const check = (value: Record<string, unknown>) => fields.filter((f) => value[f] !== undefined).length === 1;
  const params = { error: `${label}: give exactly one of ${fields.join(', ')}`, path: [fields[0]] };
  return [check, params] as const;
}
