/**
 * Generators of malformed intake files for the fuzz tests (unit and API): mutations of a valid
 * file at the byte level (flips, truncation, deletion, duplication, inserted quotes, separators,
 * BOMs, line breaks, NULs, random unicode, XML markup) and at the cell level (a number replaced
 * by a huge or non-finite one, a date by an impossible one). All cases are constructed.
 */
import fc from 'fast-check';

const encoder = new TextEncoder();

/** Tokens that break CSV and XML structure, or stress number and date parsing. */
export const HOSTILE_TOKENS = [
  '"', '""', ',', ';', '\t', '\ufeff', '\r\n', '\r', '\n', '\u0000', '\u2028', '\ufffd', '\ud83d\ude00',
  '9'.repeat(400), '1e309', '-1e309', 'NaN', 'Infinity', '-0', '0x1F', '1,2,3.4.5', '(((1)))', '$-', '€ 1.234.567,891',
  '2024-02-30', '13/45/2024', '0000-00-00', '99999-01-01', '31-Feb-2024', '2/29/2023', '1/1/-5', '20241399',
  '<', '>', '&', '&amp', '&#0;', '&#x110000;', ']]>', '<![CDATA[', '<!--', '<!DOCTYPE x [<!ENTITY a "b">]>', '<?xml version="1.0"?>',
  '</entry>', '<entry>', '<content>', 'xmlns="urn:x"', '<espi:value>', '</espi:value>',
] as const;

/** Replacements for a number in the file. */
const HOSTILE_NUMBERS = ['9'.repeat(40), '9'.repeat(400), '1e309', '-1e309', '-9007199254740993', '0.0000000000000000001', 'NaN', '', '-', '1.2.3', '1,,2', '١٢٣'];
/** Replacements for a date in the file. */
const HOSTILE_DATES = ['2024-02-30', '2023-02-29', '13/13/2024', '00/00/0000', '31-Foo-2024', '9999-12-31', '0001-01-01', '1/1/1', '2024-1-1T25:61', ''];

type Mutation =
  | { kind: 'flip'; at: number; bit: number }
  | { kind: 'truncate'; at: number }
  | { kind: 'delete'; at: number; length: number }
  | { kind: 'duplicate'; at: number; length: number }
  | { kind: 'insert'; at: number; text: string }
  | { kind: 'number'; which: number; text: string }
  | { kind: 'date'; which: number; text: string };

const at = fc.nat({ max: 1_000_000 });

const mutationArb: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ kind: fc.constant('flip' as const), at, bit: fc.integer({ min: 0, max: 7 }) }),
  fc.record({ kind: fc.constant('truncate' as const), at }),
  fc.record({ kind: fc.constant('delete' as const), at, length: fc.integer({ min: 1, max: 80 }) }),
  fc.record({ kind: fc.constant('duplicate' as const), at, length: fc.integer({ min: 1, max: 200 }) }),
  fc.record({ kind: fc.constant('insert' as const), at, text: fc.oneof(fc.constantFrom(...HOSTILE_TOKENS), fc.string({ unit: 'binary', maxLength: 12 })) }),
  fc.record({ kind: fc.constant('number' as const), which: fc.nat(), text: fc.constantFrom(...HOSTILE_NUMBERS) }),
  fc.record({ kind: fc.constant('date' as const), which: fc.nat(), text: fc.constantFrom(...HOSTILE_DATES) }),
);

function concat(...parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let off = 0;
  for (const p of parts) {
    out.set(p, off);
    off += p.length;
  }
  return out;
}

function replaceNth(bytes: Uint8Array, pattern: RegExp, which: number, text: string): Uint8Array {
  const source = new TextDecoder('utf-8', { fatal: false }).decode(bytes);
  const matches = [...source.matchAll(pattern)];
  if (matches.length === 0) return bytes;
  const m = matches[which % matches.length]!;
  return encoder.encode(source.slice(0, m.index) + text + source.slice(m.index + m[0].length));
}

/** Applies one mutation; positions wrap around the current length. */
export function applyMutation(bytes: Uint8Array, m: Mutation): Uint8Array {
  const pos = bytes.length === 0 ? 0 : 'at' in m ? m.at % (bytes.length + 1) : 0;
  switch (m.kind) {
    case 'flip': {
      if (bytes.length === 0) return bytes;
      const out = bytes.slice();
      const i = pos % bytes.length;
      out[i] = out[i]! ^ (1 << m.bit);
      return out;
    }
    case 'truncate':
      return bytes.slice(0, pos);
    case 'delete':
      return concat(bytes.subarray(0, pos), bytes.subarray(pos + m.length));
    case 'duplicate':
      return concat(bytes.subarray(0, pos + m.length), bytes.subarray(pos));
    case 'insert':
      return concat(bytes.subarray(0, pos), encoder.encode(m.text), bytes.subarray(pos));
    case 'number':
      return replaceNth(bytes, /\d+(?:[.,]\d+)*/g, m.which, m.text);
    case 'date':
      return replaceNth(bytes, /\d{1,4}[-/.]\d{1,2}[-/.]\d{1,4}|\d{1,2}-[A-Za-z]{3}-\d{4}/g, m.which, m.text);
  }
}

/** A valid file with one to five mutations applied, as bytes. */
export function mutatedBytes(valid: string | Uint8Array): fc.Arbitrary<Uint8Array> {
  const base = typeof valid === 'string' ? encoder.encode(valid) : valid;
  return fc.array(mutationArb, { minLength: 1, maxLength: 5 }).map((ms) => ms.reduce(applyMutation, base));
}

/** Arbitrary input: random bytes, random unicode text, or text assembled from hostile tokens and fragments of the file. */
export function arbitraryBytes(valid: string): fc.Arbitrary<Uint8Array> {
  const fragments = valid.split(/(?<=[\s;,<>"])/).filter((s) => s.length > 0).slice(0, 400);
  return fc.oneof(
    fc.uint8Array({ maxLength: 800 }),
    fc.string({ unit: 'grapheme', maxLength: 300 }).map((s) => encoder.encode(s)),
    fc.array(fc.oneof(fc.constantFrom(...HOSTILE_TOKENS), fc.constantFrom(...fragments)), { maxLength: 60 }).map((p) => encoder.encode(p.join(''))),
  );
}

/** Malformed input of either kind, mostly mutations of the valid file. */
export function malformedBytes(valid: string): fc.Arbitrary<Uint8Array> {
  return fc.oneof({ arbitrary: mutatedBytes(valid), weight: 3 }, { arbitrary: arbitraryBytes(valid), weight: 1 });
}

export function decodeLoose(bytes: Uint8Array): string {
  return new TextDecoder('utf-8', { fatal: false }).decode(bytes);
}
