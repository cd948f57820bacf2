import { describe, expect, it } from 'vitest';
import { parseBillCsvStream, parseBillCsvText } from '../../../src/lib/formats/bill-csv-stream';
import { detectDelimiter } from '../../../src/lib/formats/csv-dialect';

// Constructed inputs. File signatures: PDF "%PDF-" (ISO 32000-1:2008 §7.5.2), ZIP local file
// header "PK\x03\x04" (PKWARE APPNOTE.TXT §4.3.7), OLE2 compound file D0 CF 11 E0 A1 B1 1A E1
// ([MS-CFB] §2.2), UTF-16 byte order marks FF FE / FE FF (The Unicode Standard §23.8).
const mapping = { meter: 'Meter', periodStart: 'Start', periodEnd: 'End', quantity: 'Usage', unit: 'Unit' };
const good = 'Meter,Start,End,Usage,Unit\nM-1,1/1/2024,1/31/2024,100,kWh\nM-1,2/1/2024,2/29/2024,90,kWh\n';
const enc = new TextEncoder();

async function reasonOf(input: Uint8Array | string, options: Record<string, unknown> = { mapping }): Promise<string> {
  const r = await parseBillCsvStream(input, options);
  return r.ok ? 'ok' : r.reason;
}

function utf16le(text: string, bom: boolean): Uint8Array {
  const out = new Uint8Array(text.length * 2 + (bom ? 2 : 0));
  let at = 0;
  if (bom) (out[at++] = 0xff), (out[at++] = 0xfe);
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    out[at++] = c & 0xff;
    out[at++] = c >> 8;
  }
  return out;
}

function concat(a: Uint8Array, tail: number[]): Uint8Array {
  const out = new Uint8Array(a.length + tail.length);
  out.set(a);
  out.set(tail, a.length);
  return out;
}

async function* chunks(bytes: Uint8Array, size: number): AsyncGenerator<Uint8Array> {
  for (let i = 0; i < bytes.length; i += size) yield bytes.subarray(i, i + size);
}

describe('file-level refusals', () => {
  it('refuses empty files and files of blank lines', async () => {
    expect(await reasonOf(new Uint8Array(0))).toBe('empty-file');
    expect(await reasonOf(enc.encode('\r\n\r\n  \r\n'))).toBe('empty-file');
    expect(await reasonOf(new Uint8Array([0xef, 0xbb, 0xbf]))).toBe('empty-file');
    expect(await reasonOf('')).toBe('empty-file');
  });

  it('recognises PDF, ZIP/XLSX, old Excel, XML and gzip by their signatures', async () => {
    const pdf = await parseBillCsvStream(enc.encode('%PDF-1.7\n%âãÏÓ\n1 0 obj'), { mapping });
    expect(pdf).toMatchObject({ ok: false, reason: 'not-csv', message: expect.stringContaining('PDF') });
    expect(await reasonOf(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0, 6, 0]))).toBe('not-csv');
    expect(await reasonOf(new Uint8Array([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, 0, 0]))).toBe('not-csv');
    expect(await reasonOf(enc.encode('<?xml version="1.0"?><feed/>'))).toBe('not-csv');
    expect(await reasonOf(new Uint8Array([0x1f, 0x8b, 8, 0]))).toBe('not-csv');
    expect(await reasonOf('%PDF-1.4 as text')).toBe('not-csv');
    async function* textPieces(): AsyncGenerator<string> {
      yield '%';
      yield 'PDF-1.4 split into text chunks';
    }
    expect(await parseBillCsvStream(textPieces(), { mapping })).toMatchObject({ ok: false, reason: 'not-csv' });
  });

  it('refuses UTF-16 without a byte order mark but reads it with one', async () => {
    expect(await reasonOf(utf16le(good, false))).toBe('utf16-without-bom');
    const withBom = await parseBillCsvStream(utf16le(good, true), { mapping });
    expect(withBom).toEqual(parseBillCsvText(good, { mapping }));
  });

  it('refuses binary content', async () => {
    const binary = new Uint8Array(256).map((_, i) => (i * 37) % 32);
    expect(await reasonOf(binary)).toBe('binary-file');
  });

  it('refuses invalid UTF-8 and names the line, also deep inside a stream', async () => {
    const latin1 = concat(enc.encode(`${good}M-2,3/1/2024,3/31/2024,5,kWh,Caf`), [0xe9, 0x0a]);
    const r = await parseBillCsvStream(latin1, { mapping });
    expect(r).toMatchObject({ ok: false, reason: 'invalid-utf8', message: expect.stringContaining('byte 0xE9 on line 4') });

    const rows = Array.from({ length: 20_000 }, (_, i) => `M-1,1/1/2024,1/31/2024,${i},kWh`).join('\n');
    const big = concat(enc.encode(`Meter,Start,End,Usage,Unit\n${rows}\nM-1,1/1/2024,1/31/2024,1,`), [0xff, 0x0a]);
    const streamed = await parseBillCsvStream(chunks(big, 4096), { mapping });
    expect(streamed).toMatchObject({ ok: false, reason: 'invalid-utf8', message: expect.stringContaining('on line 20002') });
  });

  it('keeps a multi-byte character split across chunks intact', async () => {
    const text = 'Meter,Start,End,Usage,Unit\nMÜ-1,1/1/2024,1/31/2024,1,m³\n';
    const bytes = enc.encode(text);
    for (const size of [1, 2, 3, 5]) {
      const r = await parseBillCsvStream(chunks(bytes, size), { mapping });
      expect(r).toMatchObject({ ok: true, rows: [{ meterCode: 'MÜ-1', unit: 'm3' }] });
    }
  });

  it('refuses files larger than the limit', async () => {
    expect(await reasonOf(enc.encode(good), { mapping, maxBytes: 50 })).toBe('too-large');
  });

  it('reports an I/O error of the stream as a failure value', async () => {
    async function* broken(): AsyncGenerator<Uint8Array> {
      yield enc.encode('Meter,Start');
      throw new Error('connection reset');
    }
    expect(await parseBillCsvStream(broken(), { mapping })).toMatchObject({ ok: false, reason: 'read-error' });
  });
});

describe('mapping against the header', () => {
  it('refuses a file with no mappable columns', async () => {
    expect(await reasonOf('Colour,Shape\nred,round\n', {})).toBe('no-mappable-columns');
    expect(await reasonOf('Colour,Shape\nred,round\n', { mapping })).toBe('no-mappable-columns');
  });

  it('names the mapped headers that are missing', async () => {
    const r = parseBillCsvText('Meter,Start,End,Consumption\nM,1/1/2024,1/2/2024,3\n', { mapping });
    expect(r).toMatchObject({ ok: false, reason: 'missing-columns', message: expect.stringContaining('Quantity → "Usage"') });
  });

  it('refuses a mapped header that appears twice', () => {
    const r = parseBillCsvText('Meter,Start,End,Usage,Usage\nM,1/1/2024,1/2/2024,3,4\n', { mapping });
    expect(r).toMatchObject({ ok: false, reason: 'duplicate-columns', message: expect.stringContaining('columns 4, 5') });
  });

  it('refuses an invalid mapping before reading', () => {
    const r = parseBillCsvText(good, { mapping: { periodStart: 'Start', periodEnd: 'End', quantity: 'Usage', colour: 'x' } });
    expect(r).toMatchObject({ ok: false, reason: 'mapping-invalid', message: expect.stringContaining('Meter: is required') });
    const twice = parseBillCsvText(good, { mapping: { ...mapping, cost: 'usage' } });
    expect(twice).toMatchObject({ ok: false, reason: 'mapping-invalid', message: expect.stringContaining('already mapped') });
  });

  it('uses the suggested mapping when none is given', () => {
    const r = parseBillCsvText('Account/Meter\tFrom\tRead Date\tkWh\tTotal Charges\tEst?\nA-1\t1/1/2024\t1/31/2024\t1,200\t$150.00\tE\n');
    expect(r).toMatchObject({
      ok: true,
      dialect: { delimiter: '\t' },
      rows: [{ meterCode: 'A-1', periodStart: '2024-01-01', periodEnd: '2024-01-31', quantity: 1200, cost: 150, estimated: true }],
    });
  });
});

describe('quoting and separators', () => {
  it('reports a never-closed quote on the line where its record starts', () => {
    const r = parseBillCsvText(`${good}M-1,3/1/2024,3/31/2024,"80,kWh\nM-1,4/1/2024,4/30/2024,70,kWh\n`, { mapping });
    expect(r).toMatchObject({ ok: true, counts: { rows: 3, valid: 2, rejected: 1 } });
    if (r.ok) expect(r.problems).toEqual([{ row: 4, column: null, code: 'csv-syntax', severity: 'error', message: expect.stringContaining('never closed') }]);
  });

  it('stops at a record longer than 1 MB (a quote never closed in a large file)', async () => {
    const tail = Array.from({ length: 40_000 }, () => 'M-1,1/1/2024,1/31/2024,100,kWh').join('\n');
    const r = await parseBillCsvStream(chunks(enc.encode(`${good}"M-1,${tail}`), 65536), { mapping });
    expect(r).toMatchObject({ ok: false, reason: 'record-too-long', message: expect.stringContaining('line 4') });
  });

  it('detects the separator from consistent counts, ignoring quoted marks', () => {
    // Source for the shapes: RFC 4180 §2 (quoted fields may contain separators).
    expect(detectDelimiter('Meter,Cost\n"A","1,234.50"\n"B","2,000.00"\n', true)).toBe(',');
    expect(detectDelimiter('Meter;Cost, USD, with tax\nA;1,5\nB;2\n', true)).toBe(';');
    expect(detectDelimiter('Meter|Cost\nA|1\n', true)).toBe('|');
    expect(detectDelimiter('Meter\tStart\tUsage\nA\t1/1/2024\t3\n', true)).toBe('\t');
    expect(detectDelimiter('Meter\nA\n', true)).toBe(',');
  });

  it('reads a comma file with quoted thousands separators and a lone CR line break', () => {
    const r = parseBillCsvText('Meter,Start,End,Usage,Unit\r"M-1","1/1/2024","1/31/2024","1,234.50","kWh"\r', { mapping });
    expect(r).toMatchObject({ ok: true, dialect: { delimiter: ',', newline: '\r' }, rows: [{ quantity: 1234.5 }] });
  });
});
