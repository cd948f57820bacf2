/**
 * The bill CSV pipeline: bytes or text in, normalized bill rows and problems out, one record at a
 * time so a 50 MB file never sits in memory as rows. It sniffs the file (encoding, not-CSV
 * signatures), detects the separator and line break, finds the header (the first non-blank
 * record), resolves the column mapping (given, or suggested from the headers), then validates
 * each record with validateBillRow.
 *
 * Three ways in, all platform-neutral (no node: imports):
 * - `parseBillCsvText(text)` — synchronous, for a string already in memory;
 * - `parseBillCsvStream(input)` — a string, bytes, or any async iterable of chunks: a Node
 *   `Readable` (fs.createReadStream, a multipart file part), a web `ReadableStream`, `File.stream()`;
 * - `createBillCsvReader()` — push chunks yourself (`push(chunk)`, then `end()`).
 * A failure part-way (an undecodable byte on line 40,000) still returns a failure: the caller
 * must treat rows already handed to `onRow` as void, which an all-or-nothing import does anyway.
 */
import { type BillMapping, parseBillMapping, resolveBillMapping, type ResolvedBillMapping } from './bill-csv-mapping';
import { type BillRowContext, type MeterInfo, type NormalizedBillRow, validateBillRow } from './bill-csv-row';
import { suggestBillMapping } from './bill-csv-suggest';
import type { DecimalMark } from './cell-number';
import type { CsvDelimiter } from './csv-dialect';
import { type CsvDialect, type CsvInput, CsvRecordReader, readCsvInput } from './csv-records';
import { type FileFailure, fileFailure, type RowProblem } from './problems';
import type { Unit } from '../domain';

export interface BillCsvOptions {
  /** Field -> header (validated here). Without it the suggested mapping is used if it is complete. */
  mapping?: unknown;
  meters?: ReadonlyMap<string, MeterInfo> | undefined;
  today?: string | undefined;
  defaultUnit?: Unit | undefined;
  twoDigitYearPivot?: number | undefined;
  /** Default: `auto` for `;`-separated files, `point` otherwise (see cell-number.ts). */
  decimalMark?: DecimalMark | undefined;
  delimiter?: CsvDelimiter | undefined;
  maxBytes?: number | undefined;
  /** Receives each valid row; without it valid rows are collected in the result. */
  onRow?: ((row: NormalizedBillRow, line: number) => void) | undefined;
  /** Receives each problem; without it problems are collected in the result. */
  onProblem?: ((problem: RowProblem) => void) | undefined;
}

export interface BillCsvCounts {
  /** Records after the header, blank ones excluded. */
  rows: number;
  valid: number;
  rejected: number;
  emptyRows: number;
  errors: number;
  warnings: number;
}

export interface BillCsvSummary {
  ok: true;
  dialect: CsvDialect & { decimalMark: DecimalMark };
  headers: string[];
  mapping: BillMapping;
  counts: BillCsvCounts;
  /** Filled only when no onRow callback was given. */
  rows: NormalizedBillRow[];
  /** Filled only when no onProblem callback was given. */
  problems: RowProblem[];
}

export type BillCsvResult = BillCsvSummary | FileFailure;

export interface BillCsvReader {
  push(chunk: string | Uint8Array): FileFailure | null;
  end(): BillCsvResult;
}

function chooseMapping(headers: string[], given: BillMapping | null): BillMapping | FileFailure {
  if (given !== null) return given;
  const suggestion = suggestBillMapping(headers);
  if (suggestion.matches.length === 0) {
    return fileFailure('no-mappable-columns', `None of the headers (${headers.map((h) => `"${h.trim()}"`).join(', ')}) looks like a bill column.`);
  }
  if (suggestion.missing.length > 0) {
    return fileFailure('missing-columns', `No column was recognised for: ${suggestion.missing.join(', ')}. Map the columns by hand.`);
  }
  return suggestion.mapping as BillMapping;
}

/**
 * A push reader for bill CSVs.
 * @example const r = createBillCsvReader({ mapping }); r.push(chunk1); r.push(chunk2); const result = r.end();
 */
export function createBillCsvReader(options: BillCsvOptions = {}): BillCsvReader {
  let early: FileFailure | null = null;
  let given: BillMapping | null = null;
  if (options.mapping !== undefined) {
    const parsed = parseBillMapping(options.mapping);
    if (parsed.ok) given = parsed.mapping;
    else early = parsed;
  }
  const counts: BillCsvCounts = { rows: 0, valid: 0, rejected: 0, emptyRows: 0, errors: 0, warnings: 0 };
  const rows: NormalizedBillRow[] = [];
  const problems: RowProblem[] = [];
  let headers: string[] = [];
  let used: BillMapping | null = null;
  let resolved: ResolvedBillMapping | null = null;
  let ctx: BillRowContext = { decimalMark: 'point' };
  let dialect: BillCsvSummary['dialect'] | null = null;

  const report = (p: RowProblem): void => {
    if (p.severity === 'error') counts.errors++;
    else counts.warnings++;
    if (options.onProblem !== undefined) options.onProblem(p);
    else problems.push(p);
  };

  const records = new CsvRecordReader(
    {
      onHeader(cells, _line, d) {
        headers = cells.map((h) => h.trim());
        const mapping = chooseMapping(headers, given);
        if ('ok' in mapping) return mapping;
        const r = resolveBillMapping(cells, mapping);
        if (!r.ok) return r;
        used = mapping;
        resolved = r.mapping;
        const decimalMark = options.decimalMark ?? (d.delimiter === ';' ? 'auto' : 'point');
        dialect = { ...d, decimalMark };
        ctx = {
          decimalMark,
          twoDigitYearPivot: options.twoDigitYearPivot,
          today: options.today,
          meters: options.meters,
          defaultUnit: options.defaultUnit,
        };
        return null;
      },
      onRecord(cells, line) {
        if (resolved === null) return;
        counts.rows++;
        const result = validateBillRow(cells, resolved, line, ctx);
        if (result.ok) {
          counts.valid++;
          if (options.onRow !== undefined) options.onRow(result.row, line);
          else rows.push(result.row);
          for (const w of result.warnings) report(w);
        } else {
          counts.rejected++;
          for (const p of result.problems) report(p);
        }
      },
      onEmpty() {
        counts.emptyRows++;
      },
      onSyntaxError(line, message) {
        counts.rows++;
        counts.rejected++;
        report({ row: line, column: null, code: 'csv-syntax', message, severity: 'error' });
      },
    },
    { delimiter: options.delimiter, maxBytes: options.maxBytes },
  );

  return {
    push(chunk) {
      return early ?? records.push(chunk);
    },
    end() {
      if (early !== null) return early;
      const read = records.end();
      if (!read.ok) return read;
      if (used === null || dialect === null) return fileFailure('no-header', 'The file has no header row.');
      return { ok: true, dialect, headers, mapping: used, counts, rows, problems };
    },
  };
}

/** Parses a bill CSV held in a string (synchronous). */
export function parseBillCsvText(text: string, options: BillCsvOptions = {}): BillCsvResult {
  const reader = createBillCsvReader(options);
  return reader.push(text) ?? reader.end();
}

/**
 * Parses a bill CSV from a string, bytes, or an async iterable of chunks (a Node Readable, a web
 * ReadableStream). Stops at the first file-level failure.
 * @example await parseBillCsvStream(fs.createReadStream(path), { mapping, onRow, onProblem })
 */
export async function parseBillCsvStream(input: CsvInput, options: BillCsvOptions = {}): Promise<BillCsvResult> {
  const reader = createBillCsvReader(options);
  return (await readCsvInput(input, reader)) ?? reader.end();
}
