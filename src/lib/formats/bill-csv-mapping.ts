/**
 * The column mapping of a bill CSV: which header holds each bill field. The user picks it in
 * the intake screen (or a script sends it as JSON), it is saved per installation, and it is
 * resolved once per file into column indexes so that each row is read by position.
 *
 * Headers match in any case and order, trimmed, with runs of spaces collapsed and a byte order
 * mark removed.
 */
import { z } from 'zod';
import { type FileFailure, fileFailure } from './problems';

export const BILL_FIELDS = ['meter', 'periodStart', 'periodEnd', 'quantity', 'unit', 'cost', 'demand', 'estimated'] as const;
export type BillField = (typeof BILL_FIELDS)[number];
export const REQUIRED_BILL_FIELDS: readonly BillField[] = ['meter', 'periodStart', 'periodEnd', 'quantity'];

export const BILL_FIELD_LABELS: Record<BillField, string> = {
  meter: 'Meter',
  periodStart: 'Period start',
  periodEnd: 'Period end',
  quantity: 'Quantity',
  unit: 'Unit',
  cost: 'Cost',
  demand: 'Demand',
  estimated: 'Estimated',
};

const headerName = z
  .string({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be a header name') })
  .trim()
  .min(1, 'must be a header name')
  .max(200);

/**
 * Field -> header name. `unit` may be left out when every meter in the file has a default unit
 * (or the caller states one unit for the whole file).
 */
export const billMappingSchema = z
  .object({
    meter: headerName,
    periodStart: headerName,
    periodEnd: headerName,
    quantity: headerName,
    unit: headerName.optional(),
    cost: headerName.optional(),
    demand: headerName.optional(),
    estimated: headerName.optional(),
  })
  .strict()
  .superRefine((mapping, ctx) => {
    const seen = new Map<string, string>();
    for (const field of BILL_FIELDS) {
      const header = mapping[field];
      if (header === undefined) continue;
      const key = normalizeHeader(header);
      const other = seen.get(key);
      if (other !== undefined) {
        ctx.addIssue({ code: 'custom', path: [field], message: `"${header}" is already mapped to ${other}` });
      }
      seen.set(key, field);
    }
  });
export type BillMapping = z.infer<typeof billMappingSchema>;

/** A mapping resolved against one file's header row: column index per field (-1 when unmapped). */
export interface ResolvedBillMapping {
  readonly index: Readonly<Record<BillField, number>>;
  /** The header of each mapped field as the file spells it (trimmed), for problem reports. */
  readonly header: Readonly<Record<BillField, string>>;
  readonly columnCount: number;
}

/** Trimmed, lower-case, single-spaced, without a byte order mark. */
export function normalizeHeader(raw: string): string {
  const s = raw.charCodeAt(0) === 0xfeff ? raw.slice(1) : raw;
  return s.trim().replace(/\s+/g, ' ').toLowerCase();
}

/** Trimmed header text without a byte order mark: how a header is shown in problems. */
export function displayHeader(raw: string): string {
  return (raw.charCodeAt(0) === 0xfeff ? raw.slice(1) : raw).trim();
}

/**
 * Resolves a mapping against a file's headers.
 * @example resolveBillMapping(['METER ID', 'From', 'To', 'kWh'],
 *   { meter: 'Meter ID', periodStart: 'from', periodEnd: 'to', quantity: 'KWH' }) // ok, index.meter = 0
 */
export function resolveBillMapping(
  headers: readonly string[],
  mapping: BillMapping,
): { ok: true; mapping: ResolvedBillMapping } | FileFailure {
  const byName = new Map<string, number[]>();
  headers.forEach((h, i) => {
    const key = normalizeHeader(h);
    if (key === '') return;
    const list = byName.get(key);
    if (list === undefined) byName.set(key, [i]);
    else list.push(i);
  });
  const index = {} as Record<BillField, number>;
  const header = {} as Record<BillField, string>;
  const missing: string[] = [];
  for (const field of BILL_FIELDS) {
    const wanted = mapping[field];
    index[field] = -1;
    header[field] = wanted ?? BILL_FIELD_LABELS[field];
    if (wanted === undefined) continue;
    const found = byName.get(normalizeHeader(wanted));
    if (found === undefined) {
      missing.push(`${BILL_FIELD_LABELS[field]} → "${wanted}"`);
      continue;
    }
    if (found.length > 1) {
      return fileFailure(
        'duplicate-columns',
        `The header "${wanted}" appears ${found.length} times (columns ${found.map((i) => i + 1).join(', ')}); rename one of them.`,
      );
    }
    const at = found[0] ?? -1;
    index[field] = at;
    header[field] = displayHeader(headers[at] ?? wanted);
  }
  if (missing.length > 0) {
    const mapped = BILL_FIELDS.filter((f) => mapping[f] !== undefined).length;
    const reason = missing.length === mapped ? 'no-mappable-columns' : 'missing-columns';
    return fileFailure(
      reason,
      `The file has no column for ${missing.join('; ')}. Its headers are: ${headers.map((h) => `"${displayHeader(h)}"`).join(', ')}.`,
    );
  }
  return { ok: true, mapping: { index, header, columnCount: headers.length } };
}

/** Validates an untrusted mapping (JSON from a form or a script) into a BillMapping. */
export function parseBillMapping(input: unknown): { ok: true; mapping: BillMapping } | FileFailure {
  const parsed = billMappingSchema.safeParse(input);
  if (parsed.success) return { ok: true, mapping: parsed.data };
  const detail = parsed.error.issues
    .map((issue) => {
      const field = issue.path[0];
      const label = typeof field === 'string' && field in BILL_FIELD_LABELS ? BILL_FIELD_LABELS[field as BillField] : String(field ?? 'mapping');
      return `${label}: ${issue.message}`;
    })
    .join('; ');
  return fileFailure('mapping-invalid', `The column mapping is not usable: ${detail}.`);
}
