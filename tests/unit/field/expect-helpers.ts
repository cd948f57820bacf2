/** Small assertions shared by the field and economics tests. */
import { expect } from 'vitest';
import type { CalcFailure, CalcOutcome } from '../../../src/lib/field/calculator';

/** |actual − expected| ≤ tolerance, with both numbers in the failure message. */
export function expectWithin(actual: number | null | undefined, expected: number, tolerance: number): void {
  expect(actual, `expected ${expected} ± ${tolerance}`).not.toBeNull();
  expect(actual, `expected ${expected} ± ${tolerance}`).not.toBeUndefined();
  const diff = Math.abs((actual as number) - expected);
  expect(diff, `${actual} is not within ${tolerance} of ${expected}`).toBeLessThanOrEqual(tolerance);
}

/** Relative closeness for "exact" vectors (1e-9 relative). */
export function expectExact(actual: number | null | undefined, expected: number): void {
  expectWithin(actual, expected, Math.max(1e-12, Math.abs(expected) * 1e-9));
}

/** The value of a successful outcome; fails the test with the reason otherwise. */
export function okValue<R>(outcome: CalcOutcome<R>): R {
  if (!outcome.ok) throw new Error(`expected success, got ${outcome.reason}: ${outcome.message}`);
  return outcome.value;
}

/** The failure of an outcome; fails the test if it succeeded. */
export function failureOf<R>(outcome: CalcOutcome<R>): CalcFailure {
  if (outcome.ok) throw new Error('expected a failure, got success');
  return outcome;
}

/** Asserts an invalid-input failure with an issue on `field` whose message contains `words`. */
export function expectInvalidField<R>(outcome: CalcOutcome<R>, field: string, words: string): void {
  const failure = failureOf(outcome);
  expect(failure.reason).toBe('invalid-input');
  const issue = failure.issues?.find((i) => i.field === field);
  expect(issue, `no issue on ${field}: ${failure.message}`).toBeDefined();
  expect(issue?.message).toContain(words);
  expect(failure.message).toContain(field);
}
