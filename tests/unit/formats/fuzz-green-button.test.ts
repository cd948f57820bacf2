/**
 * Fuzzing the Green Button (ESPI) parser: mutated copies of the sample feed
 * tests/fixtures/schemas/greenbutton-dmd-example.xml (synthetic, see that folder's README) and
 * arbitrary input. The parser must never throw: an unreadable feed is a typed failure, and what
 * it does return are real bill periods. Oracles: the ISO 8601 calendar (Date, ECMA-262) and
 * finiteness of every quantity and cost.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { COMMODITY_UNITS } from '../../../src/lib/domain';
import { greenButtonBillRows, type GreenButtonResult, parseGreenButton } from '../../../src/lib/formats';
import { arbitraryBytes, decodeLoose, malformedBytes } from '../../support/fuzz-inputs';

const example = readFileSync(fileURLToPath(new URL('../../fixtures/schemas/greenbutton-dmd-example.xml', import.meta.url)), 'utf8');
const RUNS = 300;

function isIsoDay(s: string): boolean {
  return /^\d{4}-\d{2}-\d{2}$/.test(s) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s);
}

function checkResult(r: GreenButtonResult): void {
  if (!r.ok) {
    expect(r.reason).toMatch(/^[a-z0-9-]+$/);
    expect(r.message.length).toBeGreaterThan(0);
    return;
  }
  expect(r.series.length).toBeGreaterThan(0);
  for (const n of r.notes) {
    expect(n.code).toMatch(/^[a-z0-9-]+$/);
    expect(n.message.length).toBeGreaterThan(0);
  }
  for (const s of r.series) {
    expect(COMMODITY_UNITS[s.commodity]).toContain(s.unit);
    for (const p of s.periods) {
      expect(isIsoDay(p.periodStart) && isIsoDay(p.periodEnd)).toBe(true);
      expect(p.periodStart <= p.periodEnd).toBe(true);
      expect(Number.isFinite(p.quantity)).toBe(true);
      if (p.cost !== undefined) expect(Number.isFinite(p.cost)).toBe(true);
      expect(Number.isInteger(p.readings) && p.readings >= 0).toBe(true);
    }
    const rows = greenButtonBillRows(s, 'M-1');
    expect(rows.length).toBe(s.periods.length);
  }
}

describe('Green Button parser under malformed input', () => {
  it('the sample feed itself parses (the base the mutations start from)', () => {
    const r = parseGreenButton(example);
    expect(r.ok).toBe(true);
    checkResult(r);
  });

  it(`mutated feeds (${RUNS} runs): never throws, failures are typed, periods are real`, () => {
    fc.assert(
      fc.property(malformedBytes(example), (bytes) => checkResult(parseGreenButton(decodeLoose(bytes)))),
      { numRuns: RUNS },
    );
  });

  it(`arbitrary strings (${RUNS} runs): never throws`, () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ unit: 'binary', maxLength: 400 }), arbitraryBytes(example).map(decodeLoose)), (text) => checkResult(parseGreenButton(text))),
      { numRuns: RUNS },
    );
  });
});

describe('characters XML does not allow', () => {
  // Source: W3C XML 1.0 (5th ed.) §2.2, production [2] Char: #x9 | #xA | #xD | [#x20-#xD7FF] |
  // [#xE000-#xFFFD] | [#x10000-#x10FFFF]. U+0000 also cannot be stored by PostgreSQL (docs §8.3).
  it.each([['\u0000', 'U+0000'], ['\u0001', 'U+0001'], ['\u001b', 'U+001B'], ['\uffff', 'U+FFFF']])('a title holding %j is malformed XML, with the line and column', (ch, code) => {
    const xml = example.replace('<title>Building 101 - electric service</title>', `<title>Building 101${ch}</title>`);
    const line = xml.slice(0, xml.indexOf(ch)).split('\n').length;
    const r = parseGreenButton(xml);
    expect(r).toMatchObject({ ok: false, reason: 'malformed-xml' });
    if (!r.ok) expect(r.message).toContain(`${code}, which XML does not allow (line ${line}, column `);
  });

  it('tab, line feed and carriage return stay allowed', () => {
    expect(parseGreenButton(example.replace('<title>Building 101 - electric service</title>', '<title>Building\t101\r\n</title>')).ok).toBe(true);
  });
});
