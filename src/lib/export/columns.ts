/**
 * Column definitions of a tabular export and the typed value of each cell.
 *
 * A column is 'text', 'number' or 'date'. The column type, not the value, decides how a cell is
 * written, and an unexpected value falls back to the safe side: a string in a number column is
 * written as (neutralized) text, never as a raw value a spreadsheet could evaluate.
 */
import { z } from 'zod';
import { neutralizeText } from './neutralize';

export const columnTypeSchema = z.enum(['text', 'number', 'date']);
export type ColumnType = z.infer<typeof columnTypeSchema>;

export const exportColumnSchema = z.object({
  key: z.string().min(1),
  header: z.string(),
  type: columnTypeSchema,
});

export interface ExportColumn<R> {
  /** Property of the row to read. */
  readonly key: Extract<keyof R, string>;
  readonly header: string;
  readonly type: ColumnType;
}

/** A cell after typing and neutralization, ready for a CSV or XLSX writer. */
export type ExportCell =
  | { readonly kind: 'empty' }
  | { readonly kind: 'number'; readonly value: number }
  | { readonly kind: 'date'; readonly iso: string; readonly utcMs: number }
  | { readonly kind: 'text'; readonly value: string };

const EMPTY: ExportCell = { kind: 'empty' };
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

function dateCell(value: unknown): ExportCell | null {
  if (value instanceof Date) {
    const ms = value.getTime();
    if (Number.isNaN(ms)) return EMPTY;
    const day = Date.UTC(value.getUTCFullYear(), value.getUTCMonth(), value.getUTCDate());
    return { kind: 'date', iso: new Date(day).toISOString().slice(0, 10), utcMs: day };
  }
  if (typeof value === 'string') {
    const m = ISO_DATE.exec(value);
    if (!m) return null;
    const ms = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
    // Reject impossible dates such as 2023-02-30 rather than letting Date roll them over.
    if (new Date(ms).toISOString().slice(0, 10) !== value) return null;
    return { kind: 'date', iso: value, utcMs: ms };
  }
  return null;
}

function textOf(value: unknown): string {
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean' || typeof value === 'bigint') {
    return String(value);
  }
  if (value instanceof Date) return Number.isNaN(value.getTime()) ? '' : value.toISOString();
  return JSON.stringify(value) ?? '';
}

/**
 * Type and neutralize one cell.
 * - number column: a finite JS number stays a number (negative included); NaN/±Infinity → empty;
 * - date column: a Date or a valid 'YYYY-MM-DD' string → a date (UTC day);
 * - anything else, and every text column: text, neutralized per OWASP (./neutralize.ts);
 * - null and undefined → empty.
 * @example exportCell(-12.5, 'number') // { kind: 'number', value: -12.5 }
 * @example exportCell('-12.5', 'text') // { kind: 'text', value: "'-12.5" }
 */
export function exportCell(value: unknown, type: ColumnType): ExportCell {
  if (value === null || value === undefined) return EMPTY;
  if (type === 'number' && typeof value === 'number') {
    return Number.isFinite(value) ? { kind: 'number', value } : EMPTY;
  }
  if (type === 'date') {
    const d = dateCell(value);
    if (d !== null) return d;
  }
  return { kind: 'text', value: neutralizeText(textOf(value)) };
}
