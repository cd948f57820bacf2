/**
 * The shape every walkthrough field calculator shares: a zod input schema whose field names carry
 * their units, a pure compute function, and metadata (title, formula as text, inputs with units and
 * plain labels, published sources) so that the UI can render any calculator generically. Which
 * hazards apply to a calculator is kept in one place, safety.ts; the registry joins the two.
 *
 * Expected failures are values: invalid input gives `{ ok: false, reason: 'invalid-input', issues }`
 * with one issue per field, and a physically impossible combination of readings gives its own
 * reason (for example `measured-speed-above-synchronous`). Nothing here returns NaN.
 */
import { z } from 'zod';
import type { InstrumentType } from './instruments';

/** Every calculator in the registry (src/lib/field/index.ts). */
export const CALCULATOR_IDS = [
  'lighting-retrofit',
  'illuminance-check',
  'fixture-flow-test',
  'fixture-water-use',
  'clamp-meter-power',
  'motor-load-slip',
  'motor-load-input-power',
  'lamp-type-hint',
  'combustion-efficiency',
  'pump-efficiency',
] as const;
export type CalculatorId = (typeof CALCULATOR_IDS)[number];

/** Hazards with cautions in src/lib/field/safety.ts. */
export const HAZARD_IDS = [
  'energized-electrical',
  'combustion-testing',
  'rotating-machinery',
  'hot-surfaces',
  'ladders',
  'mechanical-rooms',
  'measure-do-not-adjust',
] as const;
export type HazardId = (typeof HAZARD_IDS)[number];

/**
 * A published source. `confidence` says how the text was known when this was written:
 * `primary` (the regulation or publication itself), `secondary` (a reproduction or a third party
 * quoting it) or `memory` (unconfirmed; shown to the user as such).
 */
export interface SourceCitation {
  title: string;
  publisher: string;
  kind: 'regulation' | 'government' | 'standards-body' | 'university' | 'trade-press' | 'handbook';
  confidence: 'primary' | 'secondary' | 'memory';
  detail?: string;
}

export interface CalculatorInput {
  /** Key in the calculator's zod schema. */
  name: string;
  label: string;
  /** Unit as shown to the user; null for choices and dimensionless numbers. */
  unit: string | null;
  kind: 'number' | 'choice';
  required: boolean;
  choices?: readonly { value: string; label: string }[];
  help?: string;
}

export interface CalculatorMeta {
  id: CalculatorId;
  title: string;
  summary: string;
  /** Formulas as plain text, in the order they are applied. */
  formulas: readonly string[];
  inputs: readonly CalculatorInput[];
  sources: readonly SourceCitation[];
  instruments: readonly InstrumentType[];
  /** Limits of the method the user must see beside the result. */
  limitations: readonly string[];
}

/** One displayed line of a result: an input as used, an intermediate value or the answer. */
export interface Quantity {
  label: string;
  value: number;
  unit: string;
}

export interface FieldIssue {
  field: string;
  message: string;
}

export interface CalcSuccess<R> {
  ok: true;
  value: R;
  steps: Quantity[];
  notes: string[];
}

export interface CalcFailure {
  ok: false;
  reason: string;
  message: string;
  issues?: FieldIssue[];
}

export type CalcOutcome<R> = CalcSuccess<R> | CalcFailure;

export interface FieldCalculator<S extends z.ZodObject, R> {
  meta: CalculatorMeta;
  schema: S;
  /** Computes from already-parsed input. */
  compute: (input: z.output<S>) => CalcOutcome<R>;
  /** Parses untrusted input with the schema, then computes. */
  run: (raw: unknown) => CalcOutcome<R>;
}

/** What the registry keeps: enough to list, render and run a calculator without its types. */
export interface AnyFieldCalculator {
  meta: CalculatorMeta;
  schema: z.ZodObject;
  run: (raw: unknown) => CalcOutcome<unknown>;
}

export function success<R>(value: R, steps: Quantity[], notes: string[] = []): CalcSuccess<R> {
  return { ok: true, value, steps, notes };
}

/** A displayed line only when the value exists; `scale` turns a fraction into a percent. */
export function optionalStep(label: string, value: number | null, unit: string, scale = 1): Quantity[] {
  return value === null ? [] : [{ label, value: value * scale, unit }];
}

export function failure(reason: string, message: string): CalcFailure {
  return { ok: false, reason, message };
}

/** Turns zod issues into one issue per field, each message naming the field. */
export function invalidInput(error: z.ZodError): CalcFailure {
  const issues = error.issues.map((issue) => ({
    field: issue.path.length > 0 ? issue.path.map(String).join('.') : '(input)',
    message: issue.message,
  }));
  return {
    ok: false,
    reason: 'invalid-input',
    message: issues.map((i) => `${i.field}: ${i.message}`).join('; '),
    issues,
  };
}

export function parseWith<S extends z.ZodType>(
  schema: S,
  raw: unknown,
): { ok: true; data: z.output<S> } | CalcFailure {
  const parsed = schema.safeParse(raw);
  return parsed.success ? { ok: true, data: parsed.data } : invalidInput(parsed.error);
}

/** Parse untrusted input with `schema`, then compute; invalid input comes back as a failure value. */
export function parseThenCompute<S extends z.ZodType, R>(
  schema: S,
  compute: (input: z.output<S>) => CalcOutcome<R>,
): (raw: unknown) => CalcOutcome<R> {
  return (raw) => {
    const parsed = parseWith(schema, raw);
    return parsed.ok ? compute(parsed.data) : parsed;
  };
}

export function defineCalculator<S extends z.ZodObject, R>(
  meta: CalculatorMeta,
  schema: S,
  compute: (input: z.output<S>) => CalcOutcome<R>,
): FieldCalculator<S, R> {
  return { meta, schema, compute, run: parseThenCompute(schema, compute) };
}
