import { readFileSync } from 'node:fs';
import { createReadStream } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseBillCsvStream, parseBillCsvText } from '../../../src/lib/formats/bill-csv-stream';

// Constructed fixture (invented meters and values): tests/fixtures/imports/messy-bills.csv.
// It has a UTF-8 BOM, CRLF line breaks, `;` separators, quoted fields (one spanning two lines),
// European and US thousands separators, `$` and accounting parentheses, US, ISO, dd-Mon-yyyy and
// m/d/yy dates, blank and all-separator lines, and mixed-case headers in an unusual order.
const path = fileURLToPath(new URL('../../fixtures/imports/messy-bills.csv', import.meta.url));
const bytes = readFileSync(path);

const mapping = {
  meter: 'meter',
  periodStart: 'PERIOD START',
  periodEnd: 'Period End',
  quantity: 'Usage',
  unit: 'Unit',
  cost: 'total cost',
  estimated: 'Est?',
};

// Derived by reading the fixture line by line (the header is line 1; the record on line 4 runs
// on to line 5 inside a quoted note, so the next record is line 6):
//  7  period END "2/30/2024": February 2024 has 29 days            -> error, row rejected
//  8  USAGE "-45": negative use                                     -> warning, row kept
//  9  USAGE "2,500" in a ;-file: one comma then 3 digits, ambiguous -> warning, read as 2.5
// 10  USAGE blank while Total Cost is "$88,00"                      -> error, row rejected
// 11  unit "furlongs"                                               -> error, row rejected
const expectedProblems = [
  { row: 7, column: 'period END', code: 'impossible-date', severity: 'error', names: '"2/30/2024"' },
  { row: 8, column: 'USAGE', code: 'negative-quantity', severity: 'warning', names: '"-45"' },
  { row: 9, column: 'USAGE', code: 'ambiguous-number', severity: 'warning', names: '"2,500"' },
  { row: 10, column: 'USAGE', code: 'cost-without-quantity', severity: 'error', names: '"$88,00"' },
  { row: 11, column: 'unit', code: 'unknown-unit', severity: 'error', names: '"furlongs"' },
];

// Valid rows as read by hand: "1.234,5" and "$1.234,56" use a decimal comma (the later mark is
// the decimal mark), "1,180.25" a decimal point, "1 020" groups with a space, "($52,10)" is -52.10.
const expectedRows = [
  { meterCode: 'B-101-E', periodStart: '2024-01-01', periodEnd: '2024-01-31', quantity: 1234.5, unit: 'kWh', cost: 1234.56, estimated: false },
  { meterCode: 'B-101-E', periodStart: '2024-02-01', periodEnd: '2024-02-29', quantity: 1180.25, unit: 'kWh', cost: 1102.1, estimated: false },
  { meterCode: 'B-101-E', periodStart: '2024-03-01', periodEnd: '2024-03-31', quantity: 990, unit: 'kWh', cost: 951, estimated: true },
  { meterCode: 'B-101-E', periodStart: '2024-04-01', periodEnd: '2024-04-30', quantity: 1020, unit: 'kWh', cost: 978.4, estimated: false },
  { meterCode: 'B-205-G', periodStart: '2024-03-01', periodEnd: '2024-03-31', quantity: -45, unit: 'therm', cost: -52.1, estimated: false },
  { meterCode: 'B-205-G', periodStart: '2024-04-01', periodEnd: '2024-04-30', quantity: 2.5, unit: 'therm', cost: 301.75, estimated: false },
  { meterCode: 'B-310-W', periodStart: '2024-03-01', periodEnd: '2024-03-31', quantity: 13.9, unit: 'kgal', cost: 90.1, estimated: true },
];

describe('messy bill file', () => {
  it('lists exactly the expected problems with their file lines and columns', async () => {
    const result = await parseBillCsvStream(new Uint8Array(bytes), { mapping });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.problems.map(({ row, column, code, severity }) => ({ row, column, code, severity }))).toEqual(
      expectedProblems.map(({ names: _names, ...p }) => p),
    );
    result.problems.forEach((p, i) => expect(p.message).toContain(expectedProblems[i]?.names));
  });

  it('detects the dialect and counts rows, rejections and blank lines', async () => {
    const result = await parseBillCsvStream(new Uint8Array(bytes), { mapping });
    if (!result.ok) throw new Error(result.message);
    expect(result.dialect).toEqual({ delimiter: ';', newline: '\r\n', decimalMark: 'auto' });
    expect(result.headers[0]).toBe('USAGE'); // BOM stripped
    // Lines 12, 14 (only separators) and 15 are blank; 10 records remain after the header.
    expect(result.counts).toEqual({ rows: 10, valid: 7, rejected: 3, emptyRows: 3, errors: 3, warnings: 2 });
  });

  it('normalizes the valid rows to the values read by hand', async () => {
    const result = await parseBillCsvStream(new Uint8Array(bytes), { mapping });
    if (!result.ok) throw new Error(result.message);
    expect(result.rows).toEqual(expectedRows.map((r) => ({ ...r, demandKw: undefined })));
  });

  it('gives the same answer from a Node stream in tiny chunks and from a decoded string', async () => {
    const streamed = await parseBillCsvStream(createReadStream(path, { highWaterMark: 7 }), { mapping });
    const text = parseBillCsvText(bytes.toString('utf8'), { mapping });
    const whole = await parseBillCsvStream(new Uint8Array(bytes), { mapping });
    expect(streamed).toEqual(whole);
    expect(text).toEqual(whole);
  });

  it('delivers rows and problems through callbacks with their lines', async () => {
    const lines: number[] = [];
    const problemLines: number[] = [];
    const result = await parseBillCsvStream(new Uint8Array(bytes), {
      mapping,
      onRow: (_row, line) => lines.push(line),
      onProblem: (p) => problemLines.push(p.row),
    });
    expect(lines).toEqual([2, 3, 4, 6, 8, 9, 13]);
    expect(problemLines).toEqual([7, 8, 9, 10, 11]);
    if (!result.ok) throw new Error(result.message);
    expect(result.rows).toEqual([]);
    expect(result.problems).toEqual([]);
  });
});
