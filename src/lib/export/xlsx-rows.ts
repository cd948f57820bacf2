/**
 * Rows prepared for an XLSX writer (the workbook itself is written server-side with exceljs).
 *
 * Text cells get the same formula neutralization as CSV (OWASP "CSV Injection"; OWASP ASVS 5.0
 * 1.2.10 names XLSX exports too): a workbook is often re-saved as CSV, and a text cell that starts
 * with `=` must not turn into a formula on the way. Numbers stay JS numbers (negative included),
 * dates become Date objects at UTC midnight with a date number format, empty cells are null.
 */
import { exportCell, type ColumnType, type ExportColumn } from './columns';
import { neutralizeText } from './neutralize';

/** A value exceljs writes as a typed cell: string → text, number → number, Date → date. */
export type XlsxCellValue = string | number | Date | null;

export interface XlsxColumn {
  readonly key: string;
  readonly header: string;
  readonly type: ColumnType;
  /** Excel number format for the column, when it needs one. */
  readonly numFmt: string | null;
}

export interface XlsxSheetData {
  readonly columns: readonly XlsxColumn[];
  readonly rows: readonly (readonly XlsxCellValue[])[];
}

/** ISO 8601 calendar date display for date columns. */
const DATE_FORMAT = 'yyyy-mm-dd';

/**
 * Typed, neutralized cell values for each row, in column order.
 * @example
 * xlsxRows([{ key: 'note', header: 'Note', type: 'text' }], [{ note: '@SUM(A1)' }]).rows[0]
 * // ["'@SUM(A1)"]
 */
export function xlsxRows<R extends object>(
  columns: readonly ExportColumn<R>[],
  rows: readonly R[],
): XlsxSheetData {
  const cols: XlsxColumn[] = columns.map((c) => ({
    key: c.key,
    header: neutralizeText(c.header),
    type: c.type,
    numFmt: c.type === 'date' ? DATE_FORMAT : null,
  }));
  const out = rows.map((row) =>
    columns.map((c): XlsxCellValue => {
      const cell = exportCell(row[c.key], c.type);
      switch (cell.kind) {
        case 'empty':
          return null;
        case 'number':
          return cell.value;
        case 'date':
          return new Date(cell.utcMs);
        case 'text':
          return cell.value;
      }
    }),
  );
  return { columns: cols, rows: out };
}
