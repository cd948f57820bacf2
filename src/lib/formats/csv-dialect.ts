/**
 * Detects a CSV file's dialect from its first lines: the line break and the field separator.
 * Quote-aware (RFC 4180 §2: a quoted field may hold separators and line breaks).
 *
 * Separator rule: among `,` `;` tab `|`, prefer one that appears in the header line and the
 * same number of times in each of the next lines (up to ten); among those the most frequent in
 * the header; without a consistent one, the most frequent in the header; with none, `,`.
 */

export type CsvDelimiter = ',' | ';' | '\t' | '|';
export type CsvNewline = '\r\n' | '\n' | '\r';

export const CSV_DELIMITERS: readonly CsvDelimiter[] = [',', ';', '\t', '|'];
const SAMPLE_LINES = 10;
const SAMPLE_CHARS = 65536;

/** First line break outside quotes; `\n` when the sample has none. */
export function detectNewline(sample: string): CsvNewline {
  let inQuotes = false;
  const n = Math.min(sample.length, SAMPLE_CHARS);
  for (let i = 0; i < n; i++) {
    const c = sample.charCodeAt(i);
    if (c === 34) inQuotes = !inQuotes;
    else if (!inQuotes && c === 13) return sample.charCodeAt(i + 1) === 10 ? '\r\n' : '\r';
    else if (!inQuotes && c === 10) return '\n';
  }
  return '\n';
}

/**
 * Chooses the separator from the first lines of the file.
 * @param complete true when `sample` is the whole file (its last line is then complete too)
 * @example detectDelimiter('Meter;Start;Usage\nA;1/1/2024;1,5\n', true) // ';'
 */
export function detectDelimiter(sample: string, complete: boolean): CsvDelimiter {
  const lines: number[][] = [];
  let counts = [0, 0, 0, 0];
  let nonBlank = false;
  let inQuotes = false;
  const n = Math.min(sample.length, SAMPLE_CHARS);
  const endLine = (): void => {
    if (nonBlank) lines.push(counts);
    counts = [0, 0, 0, 0];
    nonBlank = false;
  };
  for (let i = 0; i < n && lines.length < SAMPLE_LINES; i++) {
    const c = sample.charCodeAt(i);
    if (c === 34) {
      inQuotes = !inQuotes;
      nonBlank = true;
    } else if (inQuotes) continue;
    else if (c === 10 || c === 13) endLine();
    else {
      const k = c === 44 ? 0 : c === 59 ? 1 : c === 9 ? 2 : c === 124 ? 3 : -1;
      if (k >= 0) counts[k] = (counts[k] ?? 0) + 1;
      if (c !== 32) nonBlank = true;
    }
  }
  if (complete && n === sample.length) endLine();
  const header = lines[0];
  if (header === undefined) return ',';
  let best = -1;
  let bestConsistent = false;
  for (let k = 0; k < CSV_DELIMITERS.length; k++) {
    const h = header[k] ?? 0;
    if (h === 0) continue;
    const consistent = lines.every((line) => line[k] === h);
    const better =
      best < 0 ||
      (consistent && !bestConsistent) ||
      (consistent === bestConsistent && h > (header[best] ?? 0));
    if (better) {
      best = k;
      bestConsistent = consistent;
    }
  }
  return best < 0 ? ',' : (CSV_DELIMITERS[best] ?? ',');
}
