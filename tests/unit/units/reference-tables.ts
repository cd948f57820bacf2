/** Reads the reference CSVs in tests/fixtures/units (see its README for their sources). */
import { readFileSync } from 'node:fs';
import Papa from 'papaparse';

export function readReferenceCsv(name: string): Record<string, string>[] {
  const text = readFileSync(new URL(`../../fixtures/units/${name}`, import.meta.url), 'utf8');
  const body = text
    .split(/\r?\n/)
    .filter((line) => !line.startsWith('#'))
    .join('\n');
  const parsed = Papa.parse<Record<string, string>>(body, { header: true, skipEmptyLines: true });
  if (parsed.errors.length > 0) throw new Error(`${name}: ${parsed.errors[0]?.message}`);
  return parsed.data;
}

/** The single row whose `column` starts with `prefix` (and, if given, whose unit matches). */
export function referenceRow(
  rows: Record<string, string>[],
  column: string,
  prefix: string,
  where: (row: Record<string, string>) => boolean = () => true,
): Record<string, string> {
  const hits = rows.filter((r) => (r[column] ?? '').startsWith(prefix) && where(r));
  if (hits.length !== 1) throw new Error(`expected one row for ${column}=${prefix}*, found ${hits.length}`);
  return hits[0] as Record<string, string>;
}
