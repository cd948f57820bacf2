/**
 * `npm run bench:import`: 1,000,000 generated bill rows imported through the same code path as
 * the API (parse, check, classify, one transaction) into a fresh PGlite, against a bare PGlite
 * COPY of the same rows into the same table. Ends with one JSON line:
 * {"rows","rowsPerSec","copyRatio","copyRatioCsv","peakRssMb"} (copyRatio = import time / bare binary COPY
 * time of the same rows, the format the import uses; copyRatioCsv against a bare CSV COPY).
 * Targets: >= 50,000 rows/s, copyRatio <= 1.5, peak RSS <= 400 MB.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const ROWS = Number(process.env.BENCH_ROWS ?? 1_000_000);

const dir = mkdtempSync(join(tmpdir(), 'plumbline-bench-import-'));
process.env.PLUMBLINE_DATA_DIR = dir;
process.env.PLUMBLINE_DEMO = '0';
process.env.PLUMBLINE_JOBS = '0';
// A million bills in this CSV shape is about 57 MB, over the default 50 MB upload limit.
process.env.PLUMBLINE_MAX_UPLOAD_MB = '100';
process.env.BETTER_AUTH_SECRET ??= 'bench-secret-0123456789abcdef0123456789';

// A fresh database is created and migrated, and the bill file written, by a child process
// (scripts/bench/lib/import-setup.ts): initdb and the generation of the test file then do not
// count in this process's memory, which holds only what an import holds.
const { spawnSync } = await import('node:child_process');
const { readFileSync } = await import('node:fs');
const file = join(dir, 'bills.csv');
const setup = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/bench/lib/import-setup.ts', file], {
  env: { ...process.env, BENCH_ROWS: String(ROWS) },
  encoding: 'utf8',
  stdio: ['ignore', 'pipe', 'inherit'],
});
if (setup.status !== 0) throw new Error('setting up the fresh database failed');
const { rows, meters, installationId } = JSON.parse(setup.stdout.trim().split('\n').pop()!) as { rows: number; meters: number; installationId: string };
const baseRssMb = Math.round(process.memoryUsage().rss / 1024 / 1024);
const { getDb, getDatabase, closeDatabase } = await import('../../src/db/client');
const { importBills } = await import('../../src/server/imports/bills');
const { encodeBinaryCopy } = await import('../../src/db/binary-copy');
const { sql } = await import('drizzle-orm');

const db = await getDb();
console.log(`RSS: ${baseRssMb} MB before the database, ${Math.round(process.memoryUsage().rss / 1024 / 1024)} MB with PGlite open`);
const bytes = new Uint8Array(readFileSync(file));
console.log(`file: ${rows.toLocaleString('en-US')} rows, ${(bytes.length / 1024 / 1024).toFixed(1)} MB, ${meters.toLocaleString('en-US')} meters`);

const actor = { id: 'bench', email: 'bench@example.test', name: 'bench', role: 'admin' as const, installationIds: [], scoped: false };
const timings: Record<string, number> = {};
const t0 = performance.now();
const report = await importBills(actor, {
  timings,
  installation: { id: installationId, code: 'BENCH' },
  fileName: 'bench.csv',
  bytes,
  mapping: { meter: 'Meter', periodStart: 'Start Date', periodEnd: 'End Date', quantity: 'Usage', unit: 'Unit', cost: 'Amount', demand: 'Peak kW', estimated: 'Estimated' },
  dryRun: false,
  today: '2026-11-30',
});
const importMs = performance.now() - t0;
if (report.counts.new !== rows) throw new Error(`expected ${rows} new rows, got ${JSON.stringify(report.counts)} ${JSON.stringify(report.failure ?? report.problems.slice(0, 3))}`);
console.log(`import: ${(importMs / 1000).toFixed(2)} s (${report.counts.new.toLocaleString('en-US')} new, ${report.problemCount} problems); phases ms ${JSON.stringify(timings)}`);

// Bare COPY of the same rows into the same (emptied) table, from CSV already in memory.
const importRssMb = Math.round(process.resourceUsage().maxRSS / 1024);
const handle = await getDatabase();
const pg = handle.raw as import('@electric-sql/pglite').PGlite;
// The stored rows with every column the import wrote, in stored order, for two bare COPYs:
// binary (the format the import itself uses, so copyRatio measures only our own work) and CSV.
const columnNames = ['meter_id', 'period_start', 'period_end', 'quantity', 'unit', 'cost', 'demand_kw', 'estimated', 'import_id', 'created_import_id'];
const columnList = columnNames.join(', ');
const binary: Uint8Array[] = [];
const csvParts: string[] = [];
let stored = 0;
for (let after = 0; ; ) {
  const chunk = await pg.query<Record<string, string | number | boolean | null>>(
    `select id, meter_id, (period_start - date '1970-01-01') as s, (period_end - date '1970-01-01') as e,
            quantity, unit, cost, demand_kw, estimated, import_id, created_import_id,
            concat_ws(',', ${columnList}) as line
       from bill where id > $1 order by id limit 100000`,
    [after],
  );
  if (chunk.rows.length === 0) break;
  const colOf = (k: string) => chunk.rows.map((r) => r[k]);
  binary.push(
    encodeBinaryCopy(
      [
        { name: 'meter_id', type: 'uuid', values: colOf('meter_id') },
        { name: 'period_start', type: 'date', values: colOf('s') },
        { name: 'period_end', type: 'date', values: colOf('e') },
        { name: 'quantity', type: 'float8', values: colOf('quantity') },
        { name: 'unit', type: 'text', values: colOf('unit') },
        { name: 'cost', type: 'float8', values: colOf('cost') },
        { name: 'demand_kw', type: 'float8', values: colOf('demand_kw') },
        { name: 'estimated', type: 'bool', values: colOf('estimated') },
        { name: 'import_id', type: 'uuid', values: colOf('import_id') },
        { name: 'created_import_id', type: 'uuid', values: colOf('created_import_id') },
      ],
      chunk.rows.length,
    ),
  );
  csvParts.push(colOf('line').join('\n') + '\n');
  stored += chunk.rows.length;
  after = Number(chunk.rows[chunk.rows.length - 1]!.id);
}
const copyText = csvParts.join('');
csvParts.length = 0;

await db.execute(sql`truncate bill`);
const t1 = performance.now();
for (const chunk of binary) await pg.query(`copy bill (${columnList}) from '/dev/blob' with (format binary)`, [], { blob: new Blob([chunk as Uint8Array<ArrayBuffer>]) });
const copyMs = performance.now() - t1;
binary.length = 0;
await db.execute(sql`truncate bill`);
const t2 = performance.now();
await pg.query(`copy bill (${columnList}) from '/dev/blob' with (format csv)`, [], { blob: new Blob([copyText]) });
const csvCopyMs = performance.now() - t2;
console.log(`bare COPY of the ${stored.toLocaleString('en-US')} stored rows: binary ${(copyMs / 1000).toFixed(2)} s, CSV ${(csvCopyMs / 1000).toFixed(2)} s`);

await closeDatabase();
rmSync(dir, { recursive: true, force: true });
const peakRssMb = importRssMb;
const figures = { rows, rowsPerSec: Math.round(rows / (importMs / 1000)), copyRatio: Number((importMs / copyMs).toFixed(2)), copyRatioCsv: Number((importMs / csvCopyMs).toFixed(2)), peakRssMb };
console.log(`targets: >= 50,000 rows/s ${figures.rowsPerSec >= 50_000 ? 'met' : 'MISSED'}; copyRatio <= 1.5 ${figures.copyRatio <= 1.5 ? 'met' : 'MISSED'}; peak RSS during the import <= 400 MB ${peakRssMb <= 400 ? 'met' : 'MISSED'} (the file itself is held in memory, as an upload is)`);
console.log(JSON.stringify(figures));
