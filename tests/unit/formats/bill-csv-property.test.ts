import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Unit } from '../../../src/lib/domain';
import { parseBillCsvStream, parseBillCsvText } from '../../../src/lib/formats/bill-csv-stream';

// Property tests. Oracles are outside the code under test: Intl.NumberFormat and
// Intl.DateTimeFormat (ICU/CLDR) write the cells, Date (ECMA-262) gives the ISO dates, and line
// numbers are counted directly in the generated text.
const DAY_MS = 86_400_000;
const mapping = { meter: 'Meter', periodStart: 'Start', periodEnd: 'End', quantity: 'Usage', unit: 'Unit', cost: 'Cost', estimated: 'Est' };

async function* chunked(bytes: Uint8Array, sizes: number[]): AsyncGenerator<Uint8Array> {
  let at = 0;
  let i = 0;
  while (at < bytes.length) {
    const size = Math.max(1, sizes[i++ % sizes.length] ?? 1);
    yield bytes.subarray(at, at + size);
    at += size;
  }
}

describe('robustness', () => {
  it('never throws on random bytes, in any chunking; answers are ok or a typed failure', async () => {
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 600 }), fc.array(fc.integer({ min: 1, max: 64 }), { minLength: 1, maxLength: 5 }), async (bytes, sizes) => {
        const r = await parseBillCsvStream(chunked(bytes, sizes), { mapping });
        if (r.ok) {
          expect(r.counts.valid + r.counts.rejected).toBe(r.counts.rows);
          for (const p of r.problems) expect(p.row).toBeGreaterThanOrEqual(2);
        } else expect(typeof r.message).toBe('string');
      }),
      { numRuns: 300 },
    );
  });

  it('never throws on random CSV-ish text, with or without a mapping', () => {
    const pieces = ['Meter', 'Start', 'End', 'Usage', 'Unit', 'Cost', 'Est', ',', ';', '\t', '"', '\r', '\n', '\r\n', '1/31/2024',
      '2024-02-30', '$', '1,234.5', '1.234,5', '(', ')', '-', 'kWh', 'therm', ' ', 'é', '\ufeff', '\u0000', 'E', 'x'];
    const text = fc.array(fc.constantFrom(...pieces), { maxLength: 80 }).map((p) => p.join(''));
    fc.assert(
      fc.property(text, fc.boolean(), (t, withMapping) => {
        const r = parseBillCsvText(t, withMapping ? { mapping } : {});
        expect(r.ok === true || typeof r.reason === 'string').toBe(true);
      }),
      { numRuns: 500 },
    );
  });
});

interface GeneratedRow {
  meter: string;
  startDay: number;
  days: number;
  milli: number; // quantity in thousandths
  cents: number;
  unit: readonly [string, Unit];
  estimated: readonly [string, boolean];
  dateStyle: 'iso' | 'us' | 'us2' | 'mon';
}

const rowArb: fc.Arbitrary<GeneratedRow> = fc.record({
  meter: fc.stringMatching(/^[A-Z]{1,3}-[0-9]{1,4}$/),
  startDay: fc.integer({ min: Date.UTC(1970, 0, 1) / DAY_MS, max: Date.UTC(2060, 0, 1) / DAY_MS }),
  days: fc.integer({ min: 0, max: 40 }),
  milli: fc.integer({ min: -5_000_000, max: 9_999_999_999 }),
  cents: fc.integer({ min: -999_999_99, max: 999_999_99 }),
  unit: fc.constantFrom(['kWh', 'kWh'], ['KWH', 'kWh'], ['Therms', 'therm'], ['HCF', 'ccf'], ['m³', 'm3'], ['Gallons', 'gal'], ['MWh', 'MWh']),
  estimated: fc.constantFrom(['Y', true], ['N', false], ['E', true], ['A', false], ['true', true], ['0', false], ['', false]),
  dateStyle: fc.constantFrom('iso', 'us', 'us2', 'mon'),
});

const QTY_US = new Intl.NumberFormat('en-US', { minimumFractionDigits: 3, maximumFractionDigits: 3 });
const QTY_DE = new Intl.NumberFormat('de-DE', { minimumFractionDigits: 3, maximumFractionDigits: 3 });
const USD_US = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', currencySign: 'accounting' });
const EUR_DE = new Intl.NumberFormat('de-DE', { style: 'currency', currency: 'EUR' });
const DATE_GB = new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', day: '2-digit', month: 'short', year: 'numeric' });
const DATE_US = new Intl.DateTimeFormat('en-US', { timeZone: 'UTC' });

function formatDate(day: number, style: GeneratedRow['dateStyle']): string {
  const d = new Date(day * DAY_MS);
  if (style === 'iso') return d.toISOString().slice(0, 10);
  if (style === 'mon') {
    return DATE_GB.format(d)
      .replaceAll(' ', '-')
      .replace('Sept', 'Sep');
  }
  const [m, dd, y] = DATE_US.format(d).split('/');
  // m/d/yy only within the POSIX pivot window 1969-2068.
  return style === 'us2' && Number(y) <= 2068 ? `${m}/${dd}/${String(y).slice(2)}` : `${m}/${dd}/${y}`;
}

describe('round trip of generated valid rows', () => {
  it('normalizes to the values the rows were generated from, for , ; and tab files', () => {
    fc.assert(
      fc.property(
        fc.array(rowArb, { minLength: 1, maxLength: 12 }),
        fc.constantFrom(',', ';', '\t'),
        fc.constantFrom('\n', '\r\n'),
        fc.boolean(),
        (rows, sep, nl, quoteAll) => {
          const european = sep === ';';
          const qty = european ? QTY_DE : QTY_US;
          const money = european ? EUR_DE : USD_US;
          const cell = (v: string): string => (quoteAll || v.includes(sep) ? `"${v}"` : v);
          const header = ['eSt', 'COST', 'unit', 'usage', 'END', 'start', 'Meter'];
          const lines = [header.join(sep)];
          for (const r of rows) {
            lines.push([r.estimated[0], money.format(r.cents / 100), r.unit[0], qty.format(r.milli / 1000),
              formatDate(r.startDay + r.days, r.dateStyle), formatDate(r.startDay, r.dateStyle), r.meter].map(cell).join(sep));
          }
          const result = parseBillCsvText(`\ufeff${lines.join(nl)}${nl}`, { mapping });
          expect(result.ok).toBe(true);
          if (!result.ok) return;
          expect(result.problems.filter((p) => p.severity === 'error')).toEqual([]);
          expect(result.rows).toEqual(
            rows.map((r) => ({
              meterCode: r.meter,
              periodStart: new Date(r.startDay * DAY_MS).toISOString().slice(0, 10),
              periodEnd: new Date((r.startDay + r.days) * DAY_MS).toISOString().slice(0, 10),
              quantity: r.milli / 1000,
              unit: r.unit[1],
              cost: r.cents / 100,
              demandKw: undefined,
              estimated: r.estimated[1],
            })),
          );
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('line numbers with quoted multi-line fields', () => {
  it('gives each record the physical line it starts on, whole or streamed in pieces', async () => {
    const recordArb = fc.record({
      breaks: fc.array(fc.constantFrom('\n', '\r\n'), { maxLength: 3 }),
      blankBefore: fc.integer({ min: 0, max: 2 }),
    });
    await fc.assert(
      fc.asyncProperty(fc.array(recordArb, { minLength: 1, maxLength: 10 }), fc.constantFrom('\n', '\r\n'), fc.array(fc.integer({ min: 1, max: 50 }), { minLength: 1, maxLength: 4 }), async (records, nl, sizes) => {
        let text = `Meter,Start,End,Usage,Unit,Notes${nl}`;
        const expectedLines: number[] = [];
        records.forEach((r, i) => {
          text += nl.repeat(r.blankBefore);
          // Oracle: the record's line is 1 + the line feeds before its first character.
          expectedLines.push(1 + (text.match(/\n/g) ?? []).length);
          const note = `"note ${i}${r.breaks.map((b, k) => `${b}part ${k}`).join('')}"`;
          text += `M-${i},1/1/2024,1/31/2024,${i},kWh,${note}${nl}`;
        });
        const lines: number[] = [];
        const whole = parseBillCsvText(text, { mapping: { ...mapping, cost: undefined, estimated: undefined }, onRow: (_r, line) => lines.push(line) });
        expect(whole.ok).toBe(true);
        expect(lines).toEqual(expectedLines);
        const streamedLines: number[] = [];
        await parseBillCsvStream(chunked(new TextEncoder().encode(text), sizes), {
          mapping: { ...mapping, cost: undefined, estimated: undefined },
          onRow: (_r, line) => streamedLines.push(line),
        });
        expect(streamedLines).toEqual(expectedLines);
      }),
      { numRuns: 200 },
    );
  });
});
