/**
 * Fuzzing the bill CSV parser: mutated copies of the messy fixture (constructed, see
 * tests/fixtures/imports/README.md) and arbitrary input. The parser must never throw: a file it
 * cannot read is a typed failure, a bad row is a problem value with its line, column, code and
 * message, and the counts add up. Oracles are the result's own bookkeeping checked against the
 * rows and problems it lists, plus the ISO 8601 calendar (Date, ECMA-262) for the dates it emits.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { type BillCsvResult, type MeterInfo, parseBillCsvStream, parseBillCsvText } from '../../../src/lib/formats';
import { arbitraryBytes, decodeLoose, malformedBytes } from '../../support/fuzz-inputs';

const fixture = readFileSync(fileURLToPath(new URL('../../fixtures/imports/messy-bills.csv', import.meta.url)), 'utf8');
const mapping = { meter: 'Meter', periodStart: 'Period Start', periodEnd: 'period END', quantity: 'USAGE', unit: 'unit', cost: 'Total Cost', estimated: 'EST?' };
const meters = new Map<string, MeterInfo>([
  ['B-101-E', { commodity: 'electricity', defaultUnit: 'kWh' }],
  ['B-205-G', { commodity: 'natural_gas', defaultUnit: 'therm' }],
  ['B-310-W', { commodity: 'water', defaultUnit: 'kgal' }],
]);
const RUNS = 300;

function isIsoDay(s: string): boolean {
  return /^\d{4}-\d{2}-\d{2}$/.test(s) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s);
}

/** The invariants every answer keeps, whatever the input. */
function checkResult(r: BillCsvResult, withMeters: boolean): void {
  if (!r.ok) {
    expect(r.reason).toMatch(/^[a-z0-9-]+$/);
    expect(r.message.length).toBeGreaterThan(0);
    return;
  }
  const { counts, rows, problems } = r;
  expect(counts.valid + counts.rejected).toBe(counts.rows);
  expect(rows.length).toBe(counts.valid);
  expect(problems.length).toBe(counts.errors + counts.warnings);
  for (const p of problems) {
    expect(Number.isInteger(p.row) && p.row >= 2).toBe(true);
    expect(p.column === null || typeof p.column === 'string').toBe(true);
    expect(p.code).toMatch(/^[a-z0-9-]+$/);
    expect(typeof p.message === 'string' && p.message.length > 0).toBe(true);
    expect(['error', 'warning']).toContain(p.severity);
  }
  // A rejected record is one with at least one error; a valid one has none.
  expect(new Set(problems.filter((p) => p.severity === 'error').map((p) => p.row)).size).toBe(counts.rejected);
  for (const row of rows) {
    expect(row.meterCode.length).toBeGreaterThan(0);
    if (withMeters) expect(meters.has(row.meterCode)).toBe(true);
    expect(isIsoDay(row.periodStart) && isIsoDay(row.periodEnd)).toBe(true);
    expect(row.periodStart <= row.periodEnd).toBe(true);
    expect(Number.isFinite(row.quantity)).toBe(true);
    if (row.cost !== undefined) expect(Number.isFinite(row.cost)).toBe(true);
    if (row.demandKw !== undefined) expect(Number.isFinite(row.demandKw)).toBe(true);
  }
}

describe('bill CSV parser under malformed input', () => {
  it('the valid fixture itself parses (the base the mutations start from)', () => {
    const r = parseBillCsvText(fixture, { mapping, meters });
    expect(r.ok).toBe(true);
    checkResult(r, true);
  });

  it(`mutated fixtures (${RUNS} runs, bytes): never throws, problems are values, counts add up`, async () => {
    await fc.assert(
      fc.asyncProperty(malformedBytes(fixture), fc.boolean(), async (bytes, withMapping) => {
        const r = await parseBillCsvStream(bytes, { mapping: withMapping ? mapping : undefined, meters, today: '2026-11-30' });
        checkResult(r, true);
      }),
      { numRuns: RUNS },
    );
  });

  it(`arbitrary strings (${RUNS} runs, text): never throws, problems are values, counts add up`, () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ unit: 'binary', maxLength: 400 }), arbitraryBytes(fixture).map(decodeLoose)), fc.boolean(), (text, withMapping) => {
        const r = parseBillCsvText(text, withMapping ? { mapping } : {});
        checkResult(r, false);
      }),
      { numRuns: RUNS },
    );
  });
});
