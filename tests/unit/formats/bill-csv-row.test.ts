import { describe, expect, it } from 'vitest';
import { resolveBillMapping, type ResolvedBillMapping } from '../../../src/lib/formats/bill-csv-mapping';
import { type BillRowContext, type MeterInfo, validateBillRow } from '../../../src/lib/formats/bill-csv-row';
import { suggestBillMapping } from '../../../src/lib/formats/bill-csv-suggest';

// Constructed rows (invented meters). Each expectation follows from the row's own cells.
const headers = ['Meter', 'Start', 'End', 'Usage', 'Unit', 'Cost', 'Peak kW', 'Est'];
const resolved = resolveBillMapping(headers, {
  meter: 'meter',
  periodStart: 'start',
  periodEnd: 'end',
  quantity: 'usage',
  unit: 'unit',
  cost: 'cost',
  demand: 'peak kw',
  estimated: 'est',
});
if (!resolved.ok) throw new Error(resolved.message);
const m: ResolvedBillMapping = resolved.mapping;

const meters = new Map<string, MeterInfo>([
  ['E-1', { commodity: 'electricity', defaultUnit: 'kWh', units: ['kWh', 'MWh'] }],
  ['G-1', { commodity: 'natural_gas', units: ['therm', 'ccf'] }],
  ['W-1', { commodity: 'water', defaultUnit: 'kgal' }],
]);
const ctx: BillRowContext = { decimalMark: 'point', meters, today: '2025-06-30' };

function codes(record: string[], context: BillRowContext = ctx): string[] {
  const r = validateBillRow(record, m, 5, context);
  return (r.ok ? r.warnings : r.problems).map((p) => `${p.column}:${p.code}:${p.severity}`);
}

describe('validateBillRow', () => {
  it('normalizes a clean row', () => {
    expect(validateBillRow(['E-1', '1/1/2024', '1/31/2024', '12,345.6', 'kwh', '$1,500.25', '42.5', 'A'], m, 2, ctx)).toEqual({
      ok: true,
      row: { meterCode: 'E-1', periodStart: '2024-01-01', periodEnd: '2024-01-31', quantity: 12345.6, unit: 'kWh', cost: 1500.25, demandKw: 42.5, estimated: false },
      warnings: [],
    });
  });

  it('takes the meter default unit, then the file unit, when the row has none', () => {
    const r = validateBillRow(['E-1', '2024-01-01', '2024-01-31', '5', '', '', '', ''], m, 2, ctx);
    expect(r).toMatchObject({ ok: true, row: { unit: 'kWh' } });
    expect(codes(['G-1', '2024-01-01', '2024-01-31', '5', '', '', '', ''])).toEqual(['Unit:missing-unit:error']);
    const withFileUnit = validateBillRow(['G-1', '2024-01-01', '2024-01-31', '5', '', '', '', ''], m, 2, { ...ctx, defaultUnit: 'therm' });
    expect(withFileUnit).toMatchObject({ ok: true, row: { unit: 'therm' } });
    // Without a meter list the unit stays open for the caller to resolve.
    expect(validateBillRow(['X', '2024-01-01', '2024-01-31', '5', '', '', '', ''], m, 2, { decimalMark: 'point' })).toMatchObject({
      ok: true,
      row: { unit: undefined },
    });
  });

  it('refuses unknown meters, units that do not fit the meter and kW as a use unit', () => {
    expect(codes(['Z-9', '2024-01-01', '2024-01-31', '5', 'kWh', '', '', ''])).toEqual(['Meter:unknown-meter:error']);
    expect(codes(['G-1', '2024-01-01', '2024-01-31', '5', 'kWh', '', '', ''])).toEqual(['Unit:unit-not-valid-for-meter:error']);
    expect(codes(['E-1', '2024-01-01', '2024-01-31', '5', 'kW', '', '', ''])).toEqual(['Unit:demand-unit-as-quantity:error']);
    // Without a unit list the meter's commodity decides (the shared COMMODITY_UNITS table).
    expect(codes(['W-1', '2024-01-01', '2024-01-31', '5', 'kWh', '', '', ''])).toEqual(['Unit:unit-not-valid-for-meter:error']);
    expect(codes(['W-1', '2024-01-01', '2024-01-31', '5', 'HCF', '', '', ''])).toEqual([]);
  });

  it('refuses reversed periods and periods ending after today', () => {
    expect(codes(['E-1', '2024-01-31', '2024-01-01', '5', '', '', '', ''])).toEqual(['End:period-reversed:error']);
    expect(codes(['E-1', '2025-06-01', '2025-07-01', '5', '', '', '', ''])).toEqual(['End:future-date:error']);
    expect(codes(['E-1', '2025-06-01', '2025-06-30', '5', '', '', '', ''])).toEqual([]);
  });

  it('flags zero electricity as a warning', () => {
    // Source: CalTRACK 2.0 §2.2.1.3, zero electricity use is treated as missing data.
    expect(codes(['E-1', '2024-01-01', '2024-01-31', '0', '', '', '', ''])).toEqual(['Usage:zero-electricity:warning']);
    expect(codes(['G-1', '2024-01-01', '2024-01-31', '0', 'therm', '', '', ''])).toEqual([]);
  });

  it('reports every problem of a bad row, each naming its value', () => {
    const r = validateBillRow(['', '2/30/2023', 'next week', 'lots', 'furlong', '12,34', '-3', 'maybe'], m, 9, ctx);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems.map((p) => [p.row, p.column, p.code])).toEqual([
      [9, 'Meter', 'missing-value'],
      [9, 'Start', 'impossible-date'],
      [9, 'End', 'bad-date'],
      [9, 'Usage', 'bad-number'],
      [9, 'Unit', 'unknown-unit'],
      [9, 'Cost', 'bad-number'],
      [9, 'Peak kW', 'negative-demand'],
      [9, 'Est', 'bad-estimated-flag'],
    ]);
    for (const value of ['2/30/2023', 'next week', 'lots', 'furlong', '12,34', '-3', 'maybe']) {
      expect(r.problems.some((p) => p.message.includes(`"${value}"`))).toBe(true);
    }
  });

  it('reads every listed estimated flag', () => {
    const flag = (v: string): boolean | null => {
      const r = validateBillRow(['E-1', '2024-01-01', '2024-01-31', '5', '', '', '', v], m, 2, ctx);
      return r.ok && r.warnings.length === 0 ? r.row.estimated : null;
    };
    expect(['Y', 'yes', 'TRUE', '1', 'E', 'Estimated'].map(flag)).toEqual([true, true, true, true, true, true]);
    expect(['N', 'no', 'false', '0', 'A', 'Actual', ''].map(flag)).toEqual([false, false, false, false, false, false, false]);
  });
});

describe('suggestBillMapping', () => {
  it('maps the usual header spellings with a confidence', () => {
    const s = suggestBillMapping(['Account/Meter', 'Start Date', 'Read Date', 'Consumption', 'Amount', 'Peak kW', 'Est?', 'Notes']);
    expect(s.mapping).toEqual({
      meter: 'Account/Meter',
      periodStart: 'Start Date',
      periodEnd: 'Read Date',
      quantity: 'Consumption',
      cost: 'Amount',
      demand: 'Peak kW',
      estimated: 'Est?',
    });
    expect(s.missing).toEqual([]);
    for (const match of s.matches) expect(match.confidence).toBeGreaterThan(0.5);
    expect(s.matches.find((x) => x.field === 'periodStart')?.confidence).toBeGreaterThan(
      s.matches.find((x) => x.field === 'periodEnd')?.confidence ?? 1,
    );
  });

  it('reads a unit named by the quantity header and keeps kW apart from kWh', () => {
    const s = suggestBillMapping(['Meter ID', 'From', 'To', 'kWh', 'kW', 'Total Charges']);
    expect(s.mapping).toMatchObject({ meter: 'Meter ID', periodStart: 'From', periodEnd: 'To', quantity: 'kWh', demand: 'kW', cost: 'Total Charges' });
    expect(s.impliedUnit).toBe('kWh');
    expect(suggestBillMapping(['Meter', 'Usage (Therms)', 'Start', 'End']).impliedUnit).toBe('therm');
  });

  it('lists the required fields it could not find', () => {
    expect(suggestBillMapping(['Meter', 'Usage']).missing).toEqual(['periodStart', 'periodEnd']);
    expect(suggestBillMapping(['Colour']).matches).toEqual([]);
  });
});
