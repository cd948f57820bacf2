/**
 * The shapes every intake parser reports in: a problem tied to a file line and column, and a
 * file-level failure that stops an import before any row is read. Problems are values, never
 * exceptions; the import report and the `POST /api/imports` answer list them as they are.
 */

export type Severity = 'error' | 'warning';

/** Codes of row-level problems found by the format parsers (bill CSV, weather CSV/JSON). */
export type RowProblemCode =
  | 'csv-syntax'
  | 'missing-value'
  | 'bad-date'
  | 'impossible-date'
  | 'date-out-of-range'
  | 'future-date'
  | 'period-reversed'
  | 'bad-number'
  | 'ambiguous-number'
  | 'negative-quantity'
  | 'zero-electricity'
  | 'cost-without-quantity'
  | 'negative-demand'
  | 'unknown-unit'
  | 'missing-unit'
  | 'demand-unit-as-quantity'
  | 'unit-not-valid-for-meter'
  | 'unknown-meter'
  | 'bad-estimated-flag'
  | 'other-station'
  | 'duplicate-date'
  | 'tmin-above-tmax'
  | 'temperature-out-of-range'
  | 'temperature-suspect'
  | 'qc-flagged';

/**
 * One problem with one row. `row` is the file line where the record starts (the header is
 * line 1; a quoted field that spans lines does not move the row's number). For JSON input
 * `row` is the 1-based position of the record in the array. `column` is the header as the file
 * spells it (trimmed), or null for a problem with the whole record.
 */
export interface RowProblem {
  row: number;
  column: string | null;
  code: RowProblemCode;
  message: string;
  severity: Severity;
}

/** Reasons a whole file is refused before (or while) its rows are read. */
export type FileFailureReason =
  | 'empty-file'
  | 'too-large'
  | 'not-csv'
  | 'binary-file'
  | 'utf16-without-bom'
  | 'unsupported-encoding'
  | 'invalid-utf8'
  | 'no-header'
  | 'mapping-invalid'
  | 'options-invalid'
  | 'no-mappable-columns'
  | 'missing-columns'
  | 'duplicate-columns'
  | 'record-too-long'
  | 'malformed-json'
  | 'malformed-xml'
  | 'dtd-not-allowed'
  | 'not-green-button'
  | 'no-usage'
  | 'read-error';

/** A file-level refusal: nothing from the file may be stored. */
export interface FileFailure {
  ok: false;
  reason: FileFailureReason;
  message: string;
}

export function fileFailure(reason: FileFailureReason, message: string): FileFailure {
  return { ok: false, reason, message };
}

/** Shortens a cell for a message so one wild value cannot flood the report. */
export function quoteValue(raw: string): string {
  const shown = raw.length > 40 ? `${raw.slice(0, 37)}...` : raw;
  return `"${shown}"`;
}
