/** Tables as spreadsheet downloads: CSV (RFC 4180) and XLSX (exceljs), formula-safe per OWASP. */
import { toCsv } from '../lib/export/to-csv';
import { xlsxRows } from '../lib/export/xlsx-rows';
import type { ExportColumn } from '../lib/export/columns';

function safeName(name: string): string {
  return name.replace(/[^A-Za-z0-9_.-]+/g, '_').slice(0, 80) || 'export';
}

export function csvResponse<R extends object>(name: string, columns: readonly ExportColumn<R>[], rows: readonly R[]): Response {
  return new Response(toCsv(columns, rows, { bom: true }), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${safeName(name)}.csv"`,
      'cache-control': 'no-store',
    },
  });
}

export async function xlsxResponse<R extends object>(name: string, sheet: string, columns: readonly ExportColumn<R>[], rows: readonly R[], note?: string): Promise<Response> {
  const data = xlsxRows(columns, rows);
  // Loaded on the first spreadsheet asked for, not with every route that can export one.
  const { default: ExcelJS } = await import('exceljs');
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Plumbline';
  const ws = wb.addWorksheet(sheet.slice(0, 31));
  ws.columns = data.columns.map((c) => ({ header: c.header, key: c.key, width: Math.max(10, Math.min(40, c.header.length + 4)), style: c.numFmt ? { numFmt: c.numFmt } : {} }));
  ws.getRow(1).font = { bold: true };
  for (const r of data.rows) ws.addRow([...r]);
  if (note) {
    const info = wb.addWorksheet('About');
    info.addRow([note]);
  }
  const buf = await wb.xlsx.writeBuffer();
  return new Response(new Uint8Array(buf as ArrayBuffer), {
    headers: {
      'content-type': 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
      'content-disposition': `attachment; filename="${safeName(name)}.xlsx"`,
      'cache-control': 'no-store',
    },
  });
}
