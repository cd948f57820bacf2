/**
 * CSV export safe to open in a spreadsheet.
 *
 * - RFC 4180: records end in CRLF; a field holding a comma, a double quote, CR or LF is enclosed
 *   in double quotes and its quotes are doubled (papaparse's `unparse` does the quoting).
 * - OWASP "CSV Injection": text cells that begin with = + - @ tab CR LF (or NUL) get a leading
 *   single quote (./neutralize.ts), and every text field is enclosed in double quotes so a separator
 *   inside the text can never start a new cell. Number cells are written as plain numbers, never
 *   quoted or prefixed, so -12.5 stays a number.
 * - Dates are written as ISO 8601 calendar dates (YYYY-MM-DD).
 */
import Papa from 'papaparse';
import { exportCell, type ExportColumn } from './columns';
import { neutralizeText } from './neutralize';

/** UTF-8 byte order mark; lets some spreadsheet programs detect the encoding. */
export const UTF8_BOM = '\uFEFF';

export interface CsvOptions {
  /** Prefix a UTF-8 byte order mark. Off by default (RFC 4180 has none). */
  readonly bom?: boolean;
}

/**
 * Rows as a CSV document with a header record.
 * @example
 * toCsv([{ key: 'name', header: 'Name', type: 'text' }, { key: 'kbtu', header: 'kBtu', type: 'number' }],
 *       [{ name: '=cmd', kbtu: -5 }])
 * // '"Name",kBtu\r\n"\'=cmd",-5'
 */
export function toCsv<R extends object>(
  columns: readonly ExportColumn<R>[],
  rows: readonly R[],
  options: CsvOptions = {},
): string {
  const fields = columns.map((c) => neutralizeText(c.header));
  const data = rows.map((row) =>
    columns.map((c): string | number => {
      const cell = exportCell(row[c.key], c.type);
      switch (cell.kind) {
        case 'empty':
          return '';
        case 'number':
          return cell.value;
        case 'date':
          return cell.iso;
        case 'text':
          return cell.value;
      }
    }),
  );
  // The header goes in as the first data record: given `fields` with no rows, unparse would
  // append an empty record.
  const csv = Papa.unparse([fields, ...data], {
    quotes: columns.map((c) => c.type === 'text'),
    escapeFormulae: false, // done above, by column type, so numbers are never prefixed
    newline: '\r\n',
  });
  return options.bom === true ? UTF8_BOM + csv : csv;
}
