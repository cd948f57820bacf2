/**
 * File-level sniffing before any row is read: is this text at all, in which encoding, and is
 * it perhaps another kind of file (PDF, ZIP/XLSX, old Excel, XML, images)? Looks at the first
 * bytes only (magic numbers, BOMs, NUL and control-byte counts), so it is cheap on any size.
 *
 * Signatures: PDF `%PDF-` (ISO 32000-1 §7.5.2), ZIP `PK\x03\x04` (PKWARE APPNOTE 4.3.7; XLSX is
 * a ZIP package, ISO/IEC 29500-2), OLE2 compound file `D0 CF 11 E0 A1 B1 1A E1` (old .xls),
 * gzip `1F 8B` (RFC 1952 §2.3.1), PNG, JPEG and GIF headers; UTF-8/UTF-16/UTF-32 byte order
 * marks (The Unicode Standard, §23.8).
 */
import { type FileFailure, fileFailure } from './problems';

/** Text encodings this layer decodes. UTF-16 is accepted only with a byte order mark. */
export type TextEncodingName = 'utf-8' | 'utf-16le' | 'utf-16be';

export type ByteSniff = { ok: true; encoding: TextEncodingName } | FileFailure;

/** Bytes worth looking at before deciding (more is ignored). */
export const SNIFF_BYTES = 8192;

const SAVE_AS_CSV = 'Export or save it as "CSV UTF-8 (comma delimited)" and upload that file.';

function startsWith(bytes: Uint8Array, sig: readonly number[], at = 0): boolean {
  if (bytes.length < at + sig.length) return false;
  for (let i = 0; i < sig.length; i++) if (bytes[at + i] !== sig[i]) return false;
  return true;
}

function firstNonSpace(bytes: Uint8Array, from: number): number {
  let i = from;
  while (i < bytes.length && (bytes[i] === 0x20 || bytes[i] === 0x09 || bytes[i] === 0x0a || bytes[i] === 0x0d)) i++;
  return i;
}

function signatureFailure(bytes: Uint8Array, from: number): FileFailure | null {
  if (startsWith(bytes, [0x25, 0x50, 0x44, 0x46, 0x2d], from)) {
    return fileFailure('not-csv', `This is a PDF document, not a CSV file. ${SAVE_AS_CSV}`);
  }
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04], from) || startsWith(bytes, [0x50, 0x4b, 0x05, 0x06], from)) {
    return fileFailure('not-csv', `This is a ZIP archive (an .xlsx workbook is one), not a CSV file. ${SAVE_AS_CSV}`);
  }
  if (startsWith(bytes, [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1], from)) {
    return fileFailure('not-csv', `This is an old-style Excel (.xls) or Office file, not a CSV file. ${SAVE_AS_CSV}`);
  }
  if (startsWith(bytes, [0x1f, 0x8b], from)) {
    return fileFailure('not-csv', 'This is a gzip-compressed file. Unpack it and upload the CSV inside.');
  }
  if (
    startsWith(bytes, [0x89, 0x50, 0x4e, 0x47], from) ||
    startsWith(bytes, [0xff, 0xd8, 0xff], from) ||
    startsWith(bytes, [0x47, 0x49, 0x46, 0x38], from)
  ) {
    return fileFailure('not-csv', 'This is an image, not a CSV file. Upload the bill data as CSV.');
  }
  const lead = firstNonSpace(bytes, from);
  if (bytes[lead] === 0x3c) {
    return fileFailure(
      'not-csv',
      'This looks like an XML or HTML document, not a CSV file. A Green Button XML file goes through the Green Button import.',
    );
  }
  return null;
}

/** Share of zero bytes at even and odd offsets: UTF-16 text without a BOM has one side mostly zero. */
function nulFailure(bytes: Uint8Array, from: number, to: number): FileFailure | null {
  let even = 0;
  let odd = 0;
  for (let i = from; i < to; i++) {
    if (bytes[i] === 0) {
      if ((i - from) % 2 === 0) even++;
      else odd++;
    }
  }
  if (even + odd === 0) return null;
  const half = (to - from) / 2;
  if (half >= 2 && (even >= half * 0.3 || odd >= half * 0.3) && Math.min(even, odd) <= half * 0.05) {
    return fileFailure(
      'utf16-without-bom',
      `The file looks like UTF-16 text without a byte order mark, which cannot be read safely. ${SAVE_AS_CSV}`,
    );
  }
  return fileFailure('binary-file', `The file contains binary data (zero bytes), not text. ${SAVE_AS_CSV}`);
}

/** Control bytes other than tab, line feed, form feed and carriage return. */
function controlFailure(bytes: Uint8Array, from: number, to: number): FileFailure | null {
  let controls = 0;
  for (let i = from; i < to; i++) {
    const b = bytes[i] ?? 0;
    if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0c && b !== 0x0d) controls++;
  }
  return controls >= 2 && controls * 100 >= to - from
    ? fileFailure('binary-file', `The file contains binary control bytes, not text. ${SAVE_AS_CSV}`)
    : null;
}

/**
 * Decides how to decode a byte file from its first bytes (`head`, at most SNIFF_BYTES are read).
 * @example sniffBytes(new TextEncoder().encode('Meter,Start\n')) // { ok: true, encoding: 'utf-8' }
 */
export function sniffBytes(head: Uint8Array): ByteSniff {
  const to = Math.min(head.length, SNIFF_BYTES);
  if (to === 0) return fileFailure('empty-file', 'The file is empty.');
  if (startsWith(head, [0xff, 0xfe, 0x00, 0x00]) || startsWith(head, [0x00, 0x00, 0xfe, 0xff])) {
    return fileFailure('unsupported-encoding', `The file is UTF-32 text, which is not supported. ${SAVE_AS_CSV}`);
  }
  if (startsWith(head, [0xff, 0xfe])) return { ok: true, encoding: 'utf-16le' };
  if (startsWith(head, [0xfe, 0xff])) return { ok: true, encoding: 'utf-16be' };
  const from = startsWith(head, [0xef, 0xbb, 0xbf]) ? 3 : 0;
  return (
    signatureFailure(head, from) ?? nulFailure(head, from, to) ?? controlFailure(head, from, to) ?? { ok: true, encoding: 'utf-8' }
  );
}

/**
 * The same checks for text that was already decoded by the caller: signatures, NUL and control
 * characters, and U+FFFD replacement characters, which show that an earlier decoding lost bytes.
 */
export function sniffText(head: string): FileFailure | null {
  const sample = (head.charCodeAt(0) === 0xfeff ? head.slice(1) : head).slice(0, SNIFF_BYTES);
  if (sample === '') return fileFailure('empty-file', 'The file is empty.');
  const bytes = new Uint8Array(sample.length);
  let replacement = false;
  for (let i = 0; i < sample.length; i++) {
    const c = sample.charCodeAt(i);
    bytes[i] = c < 0x100 ? c : 0x41;
    if (c === 0xfffd) replacement = true;
  }
  const failure = signatureFailure(bytes, 0) ?? nulFailure(bytes, 0, bytes.length) ?? controlFailure(bytes, 0, bytes.length);
  if (failure !== null) return failure;
  return replacement
    ? fileFailure('invalid-utf8', `The file's text contains characters that could not be decoded (U+FFFD). ${SAVE_AS_CSV}`)
    : null;
}

/**
 * Finds the first byte of `bytes` that breaks UTF-8 (RFC 3629 §4), skipping up to three leading
 * continuation bytes that may finish a character begun in an earlier chunk. Returns -1 if none.
 */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  while (i < 3 && i < bytes.length && ((bytes[i] ?? 0) & 0xc0) === 0x80) i++;
  while (i < bytes.length) {
    const b = bytes[i] ?? 0;
    const need = b < 0x80 ? 0 : b >= 0xc2 && b <= 0xdf ? 1 : b >= 0xe0 && b <= 0xef ? 2 : b >= 0xf0 && b <= 0xf4 ? 3 : -1;
    if (need < 0) return i;
    for (let k = 1; k <= need; k++) {
      if (i + k >= bytes.length) return -1; // the character continues in the next chunk
      if (((bytes[i + k] ?? 0) & 0xc0) !== 0x80) return i;
    }
    i += need + 1;
  }
  return -1;
}
