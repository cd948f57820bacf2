import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import type { ExportColumn } from '../../../src/lib/export/columns';
import { xlsxRows } from '../../../src/lib/export/xlsx-rows';

interface Row {
  name: string;
  kbtu: number | null;
  billed: string | null;
}
const columns: ExportColumn<Row>[] = [
  { key: 'name', header: 'Building', type: 'text' },
  { key: 'kbtu', header: 'kBtu', type: 'number' },
  { key: 'billed', header: 'Billed', type: 'date' },
];

describe('xlsxRows', () => {
  const data = xlsxRows(columns, [
    { name: '=HYPERLINK("http://x","y")', kbtu: -250.5, billed: '2024-06-30' },
    { name: 'Barracks 7', kbtu: null, billed: null },
  ]);

  it('neutralizes text cells (OWASP CSV Injection; ASVS 5.0 1.2.10 names XLSX exports)', () => {
    expect(data.rows[0]![0]).toBe(`'=HYPERLINK("http://x","y")`);
    expect(data.rows[1]![0]).toBe('Barracks 7');
  });

  it('keeps numbers as numbers, negative included, and dates as UTC dates', () => {
    expect(data.rows[0]![1]).toBe(-250.5);
    expect(data.rows[0]![2]).toEqual(new Date(Date.UTC(2024, 5, 30)));
    expect(data.rows[1]).toEqual(['Barracks 7', null, null]);
    expect(data.columns.map((c) => c.numFmt)).toEqual([null, null, 'yyyy-mm-dd']);
  });

  it('survives a round trip through exceljs as text, number and date cells', async () => {
    // Reference library: exceljs writes and reads the workbook; the cell types are checked.
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('Shortlist');
    ws.addRow(data.columns.map((c) => c.header));
    for (const r of data.rows) ws.addRow([...r]);
    const buf = await wb.xlsx.writeBuffer();
    const back = new ExcelJS.Workbook();
    await back.xlsx.load(buf);
    const row = back.getWorksheet('Shortlist')!.getRow(2);
    expect(row.getCell(1).type).toBe(ExcelJS.ValueType.String);
    expect(row.getCell(1).value).toBe(`'=HYPERLINK("http://x","y")`);
    expect(row.getCell(2).type).toBe(ExcelJS.ValueType.Number);
    expect(row.getCell(2).value).toBe(-250.5);
    expect(row.getCell(3).type).toBe(ExcelJS.ValueType.Date);
    expect((row.getCell(3).value as Date).toISOString()).toBe('2024-06-30T00:00:00.000Z');
  });
});
