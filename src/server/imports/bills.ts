/**
 * Bill import: a CSV (with a column mapping) or a Green Button XML feed, checked row by row and
 * against the bills already stored. A dry run stores nothing but the report; a commit writes
 * every valid row in one transaction, keeps the original file, and can be undone.
 */
import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';
import { eq } from 'drizzle-orm';
import { COMMODITY_UNITS, type Commodity, type Unit } from '../../lib/domain';
import { parseBillCsvStream, parseGreenButton, greenButtonBillRows, type MeterInfo, type NormalizedBillRow } from '../../lib/formats';
import { dayFromIso } from '../../lib/weather/day-number';
import { getDb } from '../../db/client';
import { rawTransaction } from '../../db/raw-tx';
import { importRun, meter as meterTable } from '../../db/schema';
import { logActivity } from '../activity';
import { maxUploadBytes } from '../config';
import type { Actor } from '../authz';
import { analyzeRows, type Analysis, type ImportMeter, type ImportProblem } from './analyze';
import { startProgress, touch, type ImportProgress } from './progress';
import { BillRowStore, DateMemo } from './row-store';
import { dataChanged } from '../baselines/run';
import { loadExisting, writeImport } from './write';

const gzipAsync = promisify(gzip);

/** Problems kept with an import record and returned in one answer. */
export const MAX_PROBLEMS_KEPT = 10_000;

export interface ImportCounts {
  rows: number;
  new: number;
  changed: number;
  unchanged: number;
  rejected: number;
  warnings: number;
}

export interface ImportReport {
  id: string;
  dryRun: boolean;
  status: 'dry-run' | 'committed' | 'failed';
  kind: 'bills-csv' | 'green-button';
  counts: ImportCounts;
  problems: ImportProblem[];
  /** True when more problems exist than are listed. */
  truncated: boolean;
  problemCount: number;
  /** For a file that could not be read at all. */
  failure: { reason: string; message: string } | null;
}

export interface BillImportRequest {
  installation: { id: string; code: string };
  fileName: string;
  bytes: Uint8Array;
  /** CSV: field → header. Green Button: usage point (title, href or commodity) → meter code. */
  mapping: Record<string, string> | undefined;
  dryRun: boolean;
  progressKey?: string | undefined;
  today?: string;
  /** Filled with milliseconds per phase (for the benchmark). */
  timings?: Record<string, number>;
}

function looksLikeXml(bytes: Uint8Array): boolean {
  let i = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  while (i < bytes.length && (bytes[i] === 0x20 || bytes[i] === 0x09 || bytes[i] === 0x0a || bytes[i] === 0x0d)) i++;
  return bytes[i] === 0x3c; // '<'
}

/** The bytes in 64 KB slices, yielding to the event loop between them so the server stays responsive. */
async function* slices(bytes: Uint8Array, progress: ImportProgress): AsyncGenerator<Uint8Array> {
  const step = 1 << 16;
  for (let off = 0; off < bytes.length; off += step) {
    yield bytes.subarray(off, Math.min(bytes.length, off + step));
    touch(progress, { bytesRead: Math.min(bytes.length, off + step) });
    await new Promise((r) => setImmediate(r));
  }
}

async function installationMeters(installationId: string) {
  const db = await getDb();
  const rows = await db
    .select({ id: meterTable.id, code: meterTable.code, commodity: meterTable.commodity, unit: meterTable.unit })
    .from(meterTable)
    .where(eq(meterTable.installationId, installationId));
  const meters: (ImportMeter & { unit: Unit })[] = rows.map((r) => ({ id: r.id, code: r.code, commodity: r.commodity as Commodity, unit: r.unit as Unit }));
  return meters;
}

interface Parsed {
  kind: ImportReport['kind'];
  rows: BillRowStore;
  records: number;
  rejected: number;
  problems: ImportProblem[];
  failure: { reason: string; message: string } | null;
  mappingUsed: Record<string, string> | null;
}

async function parseFile(req: BillImportRequest, meters: (ImportMeter & { unit: Unit })[], progress: ImportProgress, dates: DateMemo): Promise<Parsed> {
  const index = new Map(meters.map((m, i) => [m.code, i]));
  const rows = new BillRowStore();
  const problems: ImportProblem[] = [];
  const push = (r: NormalizedBillRow, line: number) => {
    const m = index.get(r.meterCode)!;
    rows.push({
      meter: m,
      start: dates.day(r.periodStart),
      end: dates.day(r.periodEnd),
      line,
      quantity: r.quantity,
      cost: r.cost,
      demand: r.demandKw,
      unit: r.unit ?? meters[m]!.unit,
      estimated: r.estimated,
    });
    if ((rows.length & 0x3fff) === 0) touch(progress, { rowsValidated: rows.length });
  };

  if (looksLikeXml(req.bytes)) {
    const xml = new TextDecoder('utf-8', { fatal: false }).decode(req.bytes);
    const feed = parseGreenButton(xml);
    if (!feed.ok) return { kind: 'green-button', rows, records: 0, rejected: 0, problems, failure: { reason: feed.reason, message: feed.message }, mappingUsed: null };
    const mapping = req.mapping ?? {};
    let records = 0;
    let rejected = 0;
    let line = 0;
    for (const s of feed.series) {
      const keys = [s.usagePoint.title, s.usagePoint.href ?? '', s.commodity].filter(Boolean);
      const code = keys.map((k) => mapping[k]).find((c) => c !== undefined);
      const m = code === undefined ? undefined : index.get(code);
      for (const p of greenButtonBillRows(s, code ?? '')) {
        line++;
        records++;
        const label = `Usage point "${s.usagePoint.title || s.usagePoint.href || s.commodity}"`;
        if (m === undefined) {
          rejected++;
          problems.push({ row: line, column: null, code: code === undefined ? 'unmapped-usage-point' : 'unknown-meter', message: code === undefined ? `${label} is not mapped to a meter of ${req.installation.code}.` : `Meter ${code} is not a meter of ${req.installation.code}.`, severity: 'error' });
          continue;
        }
        const meter = meters[m]!;
        if (!COMMODITY_UNITS[meter.commodity].includes(p.unit!)) {
          rejected++;
          problems.push({ row: line, column: null, code: 'unit-not-valid-for-meter', message: `${label} is in ${p.unit}, which does not fit meter ${meter.code} (${meter.commodity}).`, severity: 'error' });
          continue;
        }
        push(p, line);
      }
    }
    return { kind: 'green-button', rows, records, rejected, problems, failure: null, mappingUsed: mapping };
  }

  const meterInfo = new Map<string, MeterInfo>(meters.map((m) => [m.code, { commodity: m.commodity, defaultUnit: m.unit }]));
  const result = await parseBillCsvStream(slices(req.bytes, progress), {
    mapping: req.mapping,
    maxBytes: maxUploadBytes(),
    meters: meterInfo,
    today: req.today,
    onRow: push,
    onProblem: (p) => {
      if (problems.length < MAX_PROBLEMS_KEPT * 2) problems.push(p);
    },
  });
  if (!result.ok) return { kind: 'bills-csv', rows, records: 0, rejected: 0, problems: [], failure: { reason: result.reason, message: result.message }, mappingUsed: null };
  return { kind: 'bills-csv', rows, records: result.counts.rows, rejected: result.counts.rejected, problems, failure: null, mappingUsed: result.mapping as Record<string, string> };
}

function sortProblems(list: ImportProblem[]): ImportProblem[] {
  return list.sort((a, b) => a.row - b.row || (a.severity === b.severity ? 0 : a.severity === 'error' ? -1 : 1));
}

/** Runs an import (dry run or commit) and records it. Never throws for bad input: the report says what is wrong. */
export async function importBills(actor: Actor, req: BillImportRequest, ip = ''): Promise<ImportReport> {
  const progress = startProgress(req.progressKey, req.bytes.length);
  let lapStart = performance.now();
  const lap = (phase: string) => {
    const now = performance.now();
    if (req.timings) {
      req.timings[phase] = Math.round(now - lapStart);
      req.timings[`${phase}RssMb`] = Math.round(process.memoryUsage().rss / 1024 / 1024);
    }
    lapStart = now;
  };
  const today = req.today ?? new Date().toISOString().slice(0, 10);
  const todayDay = dayFromIso(today)!;
  const dates = new DateMemo(dayFromIso);
  const meters = await installationMeters(req.installation.id);
  // The original is compressed on libuv's thread pool while this thread parses.
  const original = req.dryRun ? null : gzipAsync(req.bytes, { level: 1 });
  original?.catch(() => undefined);
  const parsed = await parseFile({ ...req, today }, meters, progress, dates);
  lap('parse');
  touch(progress, { phase: 'checking', rowsValidated: parsed.rows.length, bytesRead: req.bytes.length });
  const sha = createHash('sha256').update(req.bytes).digest('hex');
  const db = await getDb();

  const report = (id: string, status: ImportReport['status'], analysis: Analysis | null): ImportReport => {
    const problems = sortProblems([...parsed.problems, ...(analysis?.problems ?? [])]);
    const counts: ImportCounts = {
      rows: parsed.records,
      new: analysis?.counts.new ?? 0,
      changed: analysis?.counts.changed ?? 0,
      unchanged: (analysis?.counts.unchanged ?? 0) + (analysis?.counts.repeats ?? 0),
      rejected: parsed.rejected + (analysis?.counts.conflicts ?? 0),
      warnings: problems.filter((p) => p.severity === 'warning').length,
    };
    return {
      id,
      dryRun: req.dryRun,
      status,
      kind: parsed.kind,
      counts,
      problems: problems.slice(0, MAX_PROBLEMS_KEPT),
      truncated: problems.length > MAX_PROBLEMS_KEPT,
      problemCount: problems.length,
      failure: parsed.failure,
    };
  };

  const record = {
    installationId: req.installation.id,
    kind: parsed.kind,
    fileName: req.fileName.slice(0, 255),
    fileSha256: sha,
    fileBytes: req.bytes.length,
    mapping: parsed.mappingUsed,
    uploadedBy: actor.id,
    uploadedByEmail: actor.email,
  };

  if (parsed.failure || req.dryRun) {
    const analysis = parsed.failure
      ? null
      : await rawTransaction(async (tx) => {
          const index = new Map(meters.map((m, i) => [m.id, i]));
          return analyzeRows(parsed.rows, meters, await loadExisting(tx, meters, index), todayDay);
        });
    const status = parsed.failure ? 'failed' : 'dry-run';
    const draft = report('', status, analysis);
    const [row] = await db
      .insert(importRun)
      .values({ ...record, status, counts: draft.counts, problems: draft.problems, problemCount: draft.problemCount })
      .returning({ id: importRun.id });
    touch(progress, { phase: parsed.failure ? 'failed' : 'done', message: parsed.failure?.message ?? '' });
    await logActivity({ action: parsed.failure ? 'import.refused' : 'import.dry-run', userId: actor.id, actor: actor.email, entityType: 'import', entityId: row!.id, installationId: req.installation.id, ip, details: { file: req.fileName, counts: draft.counts, reason: parsed.failure?.reason } });
    return { ...draft, id: row!.id };
  }

  const compressed = await original!;
  lap('keep-original');
  touch(progress, { phase: 'storing' });
  const result = await rawTransaction(async (tx) => {
    const index = new Map(meters.map((m, i) => [m.id, i]));
    const existing = await loadExisting(tx, meters, index);
    lap('load-existing');
    const analysis = analyzeRows(parsed.rows, meters, existing, todayDay);
    lap('analyze');
    touch(progress, { rowsToStore: analysis.counts.new + analysis.counts.changed });
    const draft = report('', 'committed', analysis);
    const [run] = await tx.query<{ id: string }>(
      `insert into import_run (installation_id, kind, status, file_name, file_sha256, file_bytes, mapping, counts, problems, problem_count, uploaded_by, uploaded_by_email, committed_at)
       values ($1, $2, 'committed', $3, $4, $5, $6, $7, $8, $9, $10, $11, now()) returning id`,
      [record.installationId, record.kind, record.fileName, sha, record.fileBytes, JSON.stringify(record.mapping), JSON.stringify(draft.counts), JSON.stringify(draft.problems), draft.problemCount, actor.id, actor.email],
    );
    await tx.insertBytes('import_file', 'import_id', 'content', run!.id, compressed);
    lap('record');
    await writeImport(tx, { importId: run!.id, rows: parsed.rows, meters, analysis, progress });
    lap('write');
    return { ...draft, id: run!.id };
  });
  lap('commit');
  touch(progress, { phase: 'done' });
  if (result.counts.new + result.counts.changed > 0) await dataChanged([req.installation.id], 'bills imported');
  await logActivity({ action: 'import.commit', userId: actor.id, actor: actor.email, entityType: 'import', entityId: result.id, installationId: req.installation.id, ip, details: { file: req.fileName, counts: result.counts } });
  return result;
}
