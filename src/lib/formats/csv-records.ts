/**
 * A push-based CSV record reader: feed it chunks (bytes or text, any size, split anywhere) and
 * it hands complete records to a handler together with the file line each record starts on.
 * Platform-neutral: papaparse's core `Parser` does the field splitting (RFC 4180 quoting),
 * `TextDecoder` (global in browsers, workers and Node) decodes bytes strictly, and nothing here
 * imports node: modules. `readCsvInput` drives it from a string, bytes, or any async iterable
 * of chunks — a Node `Readable`, a web `ReadableStream` or `File.stream()`.
 *
 * Line rule: a record's line is the physical line where it starts; the header is line 1 when
 * the file starts with it. A quoted field that spans lines moves the next record's line on by
 * the line breaks inside it. Blank lines count as lines and are reported as empty records.
 */
import Papa, { type ParseResult, type Parser } from 'papaparse';
import { type CsvDelimiter, type CsvNewline, detectDelimiter, detectNewline } from './csv-dialect';
import { firstInvalidUtf8, SNIFF_BYTES, sniffBytes, sniffText } from './file-sniff';
import { type FileFailure, fileFailure } from './problems';

export interface CsvDialect {
  delimiter: CsvDelimiter;
  newline: CsvNewline;
}

export interface CsvRecordHandler {
  /** The first non-blank record. Return a failure to stop reading the file. */
  onHeader(cells: string[], line: number, dialect: CsvDialect): FileFailure | null;
  onRecord(cells: string[], line: number): void;
  onEmpty(line: number): void;
  /** A record whose quoting is broken; it is not passed to onRecord. */
  onSyntaxError(line: number, message: string): void;
}

export interface CsvReaderOptions {
  /** Field separator; detected from the first lines when absent. */
  delimiter?: CsvDelimiter | undefined;
  /** Refuse input larger than this many bytes (characters for text input). Default 50 MB. */
  maxBytes?: number | undefined;
}

export type CsvReadResult = { ok: true; dialect: CsvDialect; lines: number } | FileFailure;
/** Chunks a reader accepts; Node Buffers are Uint8Arrays. */
export type CsvInput = string | Uint8Array | ArrayBuffer | AsyncIterable<string | Uint8Array>;

/** Default upload limit: 50 MB (issue 3, "Bad input"). */
export const DEFAULT_MAX_BYTES = 50 * 1024 * 1024;
/** A single record longer than this means a quote was never closed. */
const MAX_RECORD_CHARS = 1024 * 1024;
const DIALECT_SAMPLE_CHARS = 65536;

const QUOTE_MESSAGES: Record<string, string> = {
  MissingQuotes: 'A quoted field that starts on this line is never closed.',
  InvalidQuotes: 'A quote inside a field is not doubled (write "" for a quote), so the field boundaries are unclear.',
};

function newlinesIn(cells: readonly string[], mark: string): number {
  let n = 0;
  for (const cell of cells) {
    let at = cell.indexOf(mark);
    while (at >= 0) {
      n++;
      at = cell.indexOf(mark, at + 1);
    }
  }
  return n;
}

function isBlankRecord(cells: readonly string[]): boolean {
  for (const cell of cells) if (cell.trim() !== '') return false;
  return true;
}

export class CsvRecordReader {
  private failure: FileFailure | null = null;
  private size = 0;
  private headBytes: Uint8Array[] = [];
  private headLength = 0;
  private decoder: TextDecoder | null = null;
  private decodedLines = 0;
  private pendingText = '';
  private dialect: CsvDialect | null = null;
  private parser: Parser | null = null;
  private partial = '';
  private nextLine = 1;
  private lineMark = '\n';
  private headerSeen = false;
  /** True when the caller hands over decoded text, which is then sniffed as text. */
  private textInput = false;

  constructor(
    private readonly handler: CsvRecordHandler,
    private readonly options: CsvReaderOptions = {},
  ) {}

  /** Feeds one chunk; returns the failure that stopped reading, if any. */
  push(chunk: string | Uint8Array): FileFailure | null {
    if (this.failure !== null) return this.failure;
    this.size += chunk.length;
    if (this.size > (this.options.maxBytes ?? DEFAULT_MAX_BYTES)) {
      const mb = Math.round((this.options.maxBytes ?? DEFAULT_MAX_BYTES) / 1048576);
      return this.fail(fileFailure('too-large', `The file is larger than the ${mb} MB limit.`));
    }
    if (chunk.length === 0) return null;
    if (typeof chunk === 'string') {
      if (this.decoder === null && this.headLength === 0) this.textInput = true;
      this.feedText(chunk, false);
    } else if (this.decoder === null) {
      this.headBytes.push(chunk);
      this.headLength += chunk.length;
      if (this.headLength >= SNIFF_BYTES) this.startDecoding();
    } else {
      this.decodeChunk(chunk);
    }
    return this.failure;
  }

  /** Ends the input and reports how the file was read. */
  end(): CsvReadResult {
    if (this.failure === null && this.decoder === null && this.headLength > 0) this.startDecoding();
    if (this.failure === null && this.decoder !== null) {
      try {
        this.feedText(this.decoder.decode(), false);
      } catch {
        this.fail(fileFailure('invalid-utf8', 'The file ends in the middle of a character: it is not valid text.'));
      }
    }
    if (this.failure === null) this.feedText('', true);
    if (this.failure !== null) return this.failure;
    if (!this.headerSeen || this.dialect === null) return fileFailure('empty-file', 'The file is empty (no rows).');
    return { ok: true, dialect: this.dialect, lines: this.nextLine - 1 };
  }

  private fail(failure: FileFailure): FileFailure {
    this.failure = failure;
    return failure;
  }

  private startDecoding(): void {
    const head = new Uint8Array(this.headLength);
    let at = 0;
    for (const part of this.headBytes) {
      head.set(part, at);
      at += part.length;
    }
    this.headBytes = [];
    const sniffed = sniffBytes(head);
    if (!sniffed.ok) {
      this.fail(sniffed);
      return;
    }
    this.decoder = new TextDecoder(sniffed.encoding, { fatal: true });
    this.decodeChunk(head);
  }

  private decodeChunk(bytes: Uint8Array): void {
    const decoder = this.decoder;
    if (decoder === null) return;
    let text: string;
    try {
      text = decoder.decode(bytes, { stream: true });
    } catch {
      const offset = firstInvalidUtf8(bytes);
      let line = this.decodedLines + 1;
      for (let i = 0; i < offset; i++) if (bytes[i] === 10) line++;
      const where = offset >= 0 ? ` (byte 0x${(bytes[offset] ?? 0).toString(16).toUpperCase()} on line ${line})` : '';
      this.fail(
        fileFailure(
          'invalid-utf8',
          `The file is not valid UTF-8 text${where}. Save it as "CSV UTF-8 (comma delimited)" and upload it again.`,
        ),
      );
      return;
    }
    let at = text.indexOf('\n');
    while (at >= 0) {
      this.decodedLines++;
      at = text.indexOf('\n', at + 1);
    }
    this.feedText(text, false);
  }

  private feedText(text: string, final: boolean): void {
    if (this.parser === null) {
      this.pendingText += text;
      if (!final && this.pendingText.length < DIALECT_SAMPLE_CHARS) return;
      let sample = this.pendingText;
      this.pendingText = '';
      if (sample.charCodeAt(0) === 0xfeff) sample = sample.slice(1);
      if (this.textInput && sample !== '') {
        const sniffed = sniffText(sample);
        if (sniffed !== null) {
          this.fail(sniffed);
          return;
        }
      }
      this.dialect = {
        delimiter: this.options.delimiter ?? detectDelimiter(sample, final),
        newline: detectNewline(sample),
      };
      this.lineMark = this.dialect.newline === '\r' ? '\r' : '\n';
      this.parser = new Papa.Parser({ delimiter: this.dialect.delimiter, newline: this.dialect.newline, quoteChar: '"' });
      text = sample;
    }
    if (text !== '') this.parse(this.partial + text, false);
    if (final && this.failure === null && this.partial !== '') this.parse(this.partial, true);
  }

  private parse(aggregate: string, last: boolean): void {
    const parser = this.parser;
    if (parser === null || aggregate === '') return;
    const results = parser.parse(aggregate, 0, !last) as ParseResult<string[]>;
    const rows = results.data;
    this.partial = last ? '' : aggregate.substring(results.meta.cursor);
    const broken = new Map<number, string>();
    for (const error of results.errors) {
      if (error.row !== undefined && error.row < rows.length) {
        broken.set(error.row, QUOTE_MESSAGES[error.code] ?? error.message);
      }
    }
    for (let i = 0; i < rows.length && this.failure === null; i++) {
      const cells = rows[i] ?? [];
      const line = this.nextLine;
      this.nextLine += 1 + newlinesIn(cells, this.lineMark);
      this.deliver(cells, line, broken.get(i));
    }
    if (this.partial.length > MAX_RECORD_CHARS) {
      this.fail(
        fileFailure(
          'record-too-long',
          `The record starting on line ${this.nextLine} is longer than 1 MB: a quote is probably never closed.`,
        ),
      );
    }
  }

  private deliver(cells: string[], line: number, syntaxError: string | undefined): void {
    if (syntaxError === undefined && isBlankRecord(cells)) {
      this.handler.onEmpty(line);
      return;
    }
    if (!this.headerSeen && this.dialect !== null) {
      this.headerSeen = true;
      const first = cells[0];
      if (first !== undefined && first.charCodeAt(0) === 0xfeff) cells[0] = first.slice(1);
      const failure = this.handler.onHeader(cells, line, this.dialect);
      if (failure !== null) this.fail(failure);
      return;
    }
    if (syntaxError !== undefined) this.handler.onSyntaxError(line, syntaxError);
    else this.handler.onRecord(cells, line);
  }
}

function isAsyncIterable(input: unknown): input is AsyncIterable<string | Uint8Array> {
  return typeof input === 'object' && input !== null && Symbol.asyncIterator in input;
}

/** Anything that takes chunks: a CsvRecordReader or a reader built on one. */
export interface ChunkSink {
  push(chunk: string | Uint8Array): FileFailure | null;
}

/**
 * Pushes a whole string, bytes, or an async iterable of chunks into a sink; the caller then
 * calls the sink's `end()`. Reading stops at the first file-level failure (an async iterator is
 * then closed, which destroys a Node stream). An error thrown by the iterable (I/O) becomes a
 * `read-error` failure value.
 */
export async function readCsvInput(input: CsvInput, sink: ChunkSink): Promise<FileFailure | null> {
  if (typeof input === 'string' || input instanceof Uint8Array) return sink.push(input);
  if (input instanceof ArrayBuffer) return sink.push(new Uint8Array(input));
  if (!isAsyncIterable(input)) return fileFailure('read-error', 'The upload could not be read.');
  try {
    for await (const chunk of input) {
      const failure = sink.push(chunk);
      if (failure !== null) return failure;
    }
  } catch (error) {
    return fileFailure('read-error', `The upload could not be read: ${error instanceof Error ? error.message : String(error)}`);
  }
  return null;
}
