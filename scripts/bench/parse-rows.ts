/**
 * Micro-benchmark of the bill CSV row layer: `npx tsx scripts/bench/parse-rows.ts [rows]`.
 * 1. validateBillRow alone on pre-split records (100,000 distinct generated records, cycled);
 * 2. the whole pipeline (sniffing, UTF-8 decoding, papaparse splitting, line counting,
 *    validation) on a generated CSV (about 59 MB, generated before timing) pushed in 64 KB chunks.
 * Prints rows/s for each and one JSON line of figures at the end.
 */
import { resolveBillMapping } from '../../src/lib/formats/bill-csv-mapping';
import { type BillRowContext, validateBillRow } from '../../src/lib/formats/bill-csv-row';
import { createBillCsvReader } from '../../src/lib/formats/bill-csv-stream';

const ROWS = Number(process.argv[2] ?? 1_000_000);
const DISTINCT = Math.min(ROWS, 100_000);
const HEADERS = ['Meter', 'Start', 'End', 'Usage', 'Unit', 'Cost', 'Peak kW', 'Est'];
const mapping = { meter: 'Meter', periodStart: 'Start', periodEnd: 'End', quantity: 'Usage', unit: 'Unit', cost: 'Cost', demand: 'Peak kW', estimated: 'Est' };

let peakRss = process.memoryUsage().rss;
const sampleRss = (): void => {
  peakRss = Math.max(peakRss, process.memoryUsage().rss);
};

/** A deterministic generated record: US dates, grouped quantities, $ costs. */
function record(i: number): string[] {
  const month = (i % 12) + 1;
  const year = 2000 + (Math.floor(i / 12) % 25);
  const end = month === 2 ? 28 : 30;
  const qty = ((i * 7919) % 900_000) + 1000;
  return [
    `B-${i % 5000}`,
    `${month}/1/${year}`,
    `${month}/${end}/${year}`,
    `${Math.floor(qty / 1000)},${String(qty % 1000).padStart(3, '0')}.${i % 10}`,
    i % 3 === 0 ? 'kWh' : 'KWH',
    `$${(qty / 10).toFixed(2)}`,
    String((i % 500) / 2),
    i % 17 === 0 ? 'E' : 'A',
  ];
}

function benchValidate(): number {
  const resolved = resolveBillMapping(HEADERS, mapping);
  if (!resolved.ok) throw new Error(resolved.message);
  const records = Array.from({ length: DISTINCT }, (_, i) => record(i));
  const ctx: BillRowContext = { decimalMark: 'point', today: '2030-01-01' };
  let valid = 0;
  for (let i = 0; i < 20_000; i++) validateBillRow(records[i % DISTINCT] ?? [], resolved.mapping, i + 2, ctx); // warm-up
  const t0 = performance.now();
  for (let i = 0; i < ROWS; i++) {
    const r = validateBillRow(records[i % DISTINCT] ?? [], resolved.mapping, i + 2, ctx);
    if (r.ok) valid++;
  }
  const seconds = (performance.now() - t0) / 1000;
  sampleRss();
  if (valid !== ROWS) throw new Error(`expected every generated row to be valid, got ${valid}`);
  return ROWS / seconds;
}

function generateChunks(): Uint8Array[] {
  const enc = new TextEncoder();
  const chunks: Uint8Array[] = [];
  let chunk = `${HEADERS.join(',')}\r\n`;
  for (let i = 0; i < ROWS; i++) {
    const r = record(i);
    chunk += `${r[0]},${r[1]},${r[2]},"${r[3]}",${r[4]},"${r[5]}",${r[6]},${r[7]}\r\n`;
    if (chunk.length >= 65536) {
      chunks.push(enc.encode(chunk));
      chunk = '';
    }
  }
  chunks.push(enc.encode(chunk));
  return chunks;
}

function benchPipeline(): { rowsPerSec: number; mb: number } {
  const chunks = generateChunks();
  const bytes = chunks.reduce((n, c) => n + c.length, 0);
  const reader = createBillCsvReader({
    mapping,
    today: '2030-01-01',
    maxBytes: Number.POSITIVE_INFINITY,
    onRow: () => {},
    onProblem: (p) => {
      throw new Error(p.message);
    },
  });
  const t0 = performance.now();
  for (let i = 0; i < chunks.length; i++) {
    const failure = reader.push(chunks[i] ?? new Uint8Array(0));
    if (failure !== null) throw new Error(failure.message);
    if (i % 100 === 0) sampleRss();
  }
  const result = reader.end();
  const seconds = (performance.now() - t0) / 1000;
  sampleRss();
  if (!result.ok || result.counts.valid !== ROWS) throw new Error('pipeline did not read every row');
  return { rowsPerSec: ROWS / seconds, mb: bytes / 1048576 };
}

const validateRate = benchValidate();
console.log(`validateBillRow: ${ROWS.toLocaleString('en-US')} rows at ${Math.round(validateRate).toLocaleString('en-US')} rows/s`);
const pipeline = benchPipeline();
console.log(
  `CSV pipeline (UTF-8 bytes in 64 KB chunks -> decoded, split, validated rows): ${ROWS.toLocaleString('en-US')} rows (${pipeline.mb.toFixed(1)} MB) at ${Math.round(pipeline.rowsPerSec).toLocaleString('en-US')} rows/s`,
);
console.log(
  JSON.stringify({
    rows: ROWS,
    validateRowsPerSec: Math.round(validateRate),
    pipelineRowsPerSec: Math.round(pipeline.rowsPerSec),
    peakRssMb: Math.round(peakRss / 1048576),
  }),
);
