/**
 * Rows in PostgreSQL's binary COPY format (PostgreSQL documentation, "COPY", section "Binary
 * Format"): the 11-byte signature, flags and header-extension words, then per row a 16-bit field
 * count and each field as a 32-bit length (−1 for NULL) followed by its bytes in network order;
 * a 16-bit −1 ends the data. Dates are days since 2000-01-01; float8 is IEEE 754 big-endian;
 * uuid is its 16 bytes; text is UTF-8; bool one byte.
 */

export type CopyType = 'uuid' | 'date' | 'float8' | 'text' | 'bool';

export interface CopyColumn {
  name: string;
  type: CopyType;
  /**
   * Values by row: uuid as text, date as a day number since 1970-01-01, float8 as a number
   * (NaN = NULL), text as a string, bool as 0/1 or a boolean; null or undefined = NULL.
   */
  values: ArrayLike<unknown>;
}

const SIGNATURE = [0x50, 0x47, 0x43, 0x4f, 0x50, 0x59, 0x0a, 0xff, 0x0d, 0x0a, 0x00];
const PG_EPOCH_DAY = 10_957; // 2000-01-01 as days since 1970-01-01
const encoder = new TextEncoder();

/** The 16 bytes of a UUID written as text. */
export function uuidBytes(u: string): Uint8Array {
  const out = new Uint8Array(16);
  let k = 0;
  for (let i = 0; i < u.length && k < 16; i++) {
    if (u.charCodeAt(i) === 45) continue; // '-'
    out[k++] = parseInt(u.slice(i, i + 2), 16);
    i++;
  }
  return out;
}

/** Appends binary COPY rows field by field into a growing buffer. */
export class BinaryCopyWriter {
  private buf: Uint8Array;
  private view: DataView;
  private o: number;

  constructor(expectedBytes = 1 << 16) {
    this.buf = new Uint8Array(Math.max(64, expectedBytes));
    this.view = new DataView(this.buf.buffer);
    this.buf.set(SIGNATURE, 0);
    this.o = SIGNATURE.length + 8; // flags and header extension stay 0
  }

  private room(n: number): void {
    if (this.o + n <= this.buf.length) return;
    const next = new Uint8Array(Math.max(this.buf.length * 2, this.o + n));
    next.set(this.buf.subarray(0, this.o));
    this.buf = next;
    this.view = new DataView(next.buffer);
  }

  row(fields: number): void {
    this.room(2);
    this.view.setInt16(this.o, fields);
    this.o += 2;
  }

  null(): void {
    this.room(4);
    this.view.setInt32(this.o, -1);
    this.o += 4;
  }

  /** A uuid given as its 16 bytes (see uuidBytes). */
  uuid(bytes: Uint8Array): void {
    this.room(20);
    this.view.setInt32(this.o, 16);
    this.buf.set(bytes, this.o + 4);
    this.o += 20;
  }

  /** A date given as days since 1970-01-01. */
  date(day: number): void {
    this.room(8);
    this.view.setInt32(this.o, 4);
    this.view.setInt32(this.o + 4, day - PG_EPOCH_DAY);
    this.o += 8;
  }

  /** A float8; NaN writes NULL. */
  float8(x: number): void {
    if (Number.isNaN(x)) return this.null();
    this.room(12);
    this.view.setInt32(this.o, 8);
    this.view.setFloat64(this.o + 4, x);
    this.o += 12;
  }

  /** Text given as its UTF-8 bytes. */
  text(bytes: Uint8Array): void {
    this.room(4 + bytes.length);
    this.view.setInt32(this.o, bytes.length);
    this.buf.set(bytes, this.o + 4);
    this.o += 4 + bytes.length;
  }

  bool(b: boolean): void {
    this.room(5);
    this.view.setInt32(this.o, 1);
    this.buf[this.o + 4] = b ? 1 : 0;
    this.o += 5;
  }

  /** The finished data (with the trailer). The writer must not be used afterwards. */
  finish(): Uint8Array {
    this.room(2);
    this.view.setInt16(this.o, -1);
    return this.buf.subarray(0, this.o + 2);
  }
}

/** Encodes `rows` rows of the given columns (column-wise input; see CopyColumn). */
export function encodeBinaryCopy(columns: readonly CopyColumn[], rows: number): Uint8Array {
  const uuids = new Map<string, Uint8Array>();
  const texts = new Map<string, Uint8Array>();
  const w = new BinaryCopyWriter(rows * columns.length * 12 + 64);
  for (let r = 0; r < rows; r++) {
    w.row(columns.length);
    for (const c of columns) {
      const v = c.values[r];
      if (v === null || v === undefined) {
        w.null();
        continue;
      }
      switch (c.type) {
        case 'uuid': {
          let b = uuids.get(v as string);
          if (!b) uuids.set(v as string, (b = uuidBytes(v as string)));
          w.uuid(b);
          break;
        }
        case 'date':
          w.date(v as number);
          break;
        case 'float8':
          w.float8(v as number);
          break;
        case 'bool':
          w.bool(Boolean(v));
          break;
        case 'text': {
          let b = texts.get(v as string);
          if (!b) texts.set(v as string, (b = encoder.encode(v as string)));
          w.text(b);
          break;
        }
      }
    }
  }
  return w.finish();
}
