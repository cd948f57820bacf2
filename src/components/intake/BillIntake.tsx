/**
 * The Bill intake screen: choose a file, see its first rows, map its columns (or, for a Green
 * Button feed, its usage points to meters), run the dry run, read every problem, commit, and
 * undo from the history.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import Papa from 'papaparse';
import { useEffect, useState } from 'react';
import { BILL_FIELDS, BILL_FIELD_LABELS, REQUIRED_BILL_FIELDS, type BillField } from '../../lib/formats/bill-csv-mapping';
import { suggestBillMapping } from '../../lib/formats/bill-csv-suggest';
import { parseGreenButton, type GreenButtonSeries } from '../../lib/formats/green-button';
import { COMMODITY_LABELS, type Commodity } from '../../lib/domain';
import { formatNumber } from '../../lib/format';
import { api, ApiError } from '../ui/api';
import { QueryProvider } from '../ui/query';
import { ImportHistory } from './ImportHistory';
import { ProblemTable, type Problem } from './ProblemTable';
import { newProgressKey, uploadForm, type UploadProgress } from './upload';

interface Report {
  id: string;
  dryRun: boolean;
  status: string;
  kind: 'bills-csv' | 'green-button';
  counts: { rows: number; new: number; changed: number; unchanged: number; rejected: number; warnings: number };
  problems: Problem[];
  truncated: boolean;
  problemCount: number;
}

interface Preview {
  kind: 'csv' | 'xml';
  headers: string[];
  rows: string[][];
  series: GreenButtonSeries[];
  error: string | null;
}

interface MeterRow {
  id: string;
  code: string;
  commodity: Commodity;
  unit: string;
  buildingNumber: string;
}

const seriesKey = (s: GreenButtonSeries) => s.usagePoint.title || s.usagePoint.href || s.commodity;

async function readPreview(file: File): Promise<Preview> {
  const head = new Uint8Array(await file.slice(0, 512).arrayBuffer());
  let i = head[0] === 0xef ? 3 : 0;
  while (i < head.length && (head[i] === 0x20 || head[i] === 0x0a || head[i] === 0x0d || head[i] === 0x09)) i++;
  if (head[i] === 0x3c) {
    if (file.size > 20 * 1024 * 1024) return { kind: 'xml', headers: [], rows: [], series: [], error: 'This feed is too large to preview here; it can still be imported.' };
    const feed = parseGreenButton(await file.text());
    return feed.ok ? { kind: 'xml', headers: [], rows: [], series: feed.series, error: null } : { kind: 'xml', headers: [], rows: [], series: [], error: feed.message };
  }
  return new Promise((resolve) => {
    Papa.parse<string[]>(file, {
      preview: 11,
      skipEmptyLines: 'greedy',
      complete: (r) => {
        const [header = [], ...rows] = r.data;
        const headers = header.map((h, k) => (k === 0 ? h.replace(/^\uFEFF/, '') : h).trim());
        resolve({ kind: 'csv', headers, rows, series: [], error: headers.length < 2 ? 'This does not look like a CSV file with a header row.' : null });
      },
      error: (e) => resolve({ kind: 'csv', headers: [], rows: [], series: [], error: `The file could not be read: ${e.message}` }),
    });
  });
}

function Counts({ r }: { r: Report }) {
  const tiles: [string, number, string][] = [
    ['rows read', r.counts.rows, 'text-ink-800'],
    ['new bills', r.counts.new, 'text-line-700'],
    ['changed', r.counts.changed, 'text-amber-ink'],
    ['unchanged', r.counts.unchanged, 'text-ink-600'],
    ['rejected', r.counts.rejected, 'text-brick-ink'],
    ['warnings', r.counts.warnings, 'text-amber-ink'],
  ];
  return (
    <dl className="grid grid-cols-3 gap-3 sm:grid-cols-6">
      {tiles.map(([label, n, cls]) => (
        <div key={label} className="rounded-md border border-ink-200 bg-white p-3">
          <dt className="text-xs text-ink-500">{label}</dt>
          <dd className={`figure text-xl ${cls}`}>{formatNumber(n)}</dd>
        </div>
      ))}
    </dl>
  );
}

function ProgressBar({ p }: { p: UploadProgress }) {
  const server = p.server;
  let label = `Uploading ${formatNumber(p.sent / 1024)} of ${formatNumber(p.total / 1024)} kB`;
  let value = p.total ? p.sent / p.total : 0;
  if (server && p.sent >= p.total) {
    if (server.phase === 'reading') {
      label = `Checking rows: ${formatNumber(server.rowsValidated)} read`;
      value = server.bytesTotal ? server.bytesRead / server.bytesTotal : 0;
    } else if (server.phase === 'checking') {
      label = `Comparing ${formatNumber(server.rowsValidated)} rows with the bills already stored`;
      value = 1;
    } else if (server.phase === 'storing') {
      label = `Storing: ${formatNumber(server.rowsStored)} of ${formatNumber(server.rowsToStore)} bills`;
      value = server.rowsToStore ? server.rowsStored / server.rowsToStore : 1;
    }
  }
  return (
    <div role="status" aria-live="polite" className="space-y-1">
      <p className="text-sm text-ink-700">{label}</p>
      <progress className="h-2 w-full" max={1} value={value} aria-label={label} />
    </div>
  );
}

function Intake({ installations, initialInstallation }: { installations: { code: string; name: string }[]; initialInstallation: string }) {
  const qc = useQueryClient();
  const [installation, setInstallation] = useState(initialInstallation);
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [mapping, setMapping] = useState<Partial<Record<BillField, string>>>({});
  const [gbMapping, setGbMapping] = useState<Record<string, string>>({});
  const [report, setReport] = useState<Report | null>(null);
  const [reportFor, setReportFor] = useState<string>('');
  const [committed, setCommitted] = useState<Report | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [mappingName, setMappingName] = useState('');

  const meters = useQuery({ queryKey: ['meters', installation], queryFn: () => api<{ items: MeterRow[] }>(`/api/meters?installation=${installation}`) });
  const saved = useQuery({ queryKey: ['mappings', installation], queryFn: () => api<{ items: { id: string; name: string; mapping: Record<string, string> }[] }>(`/api/mappings?installation=${installation}`) });
  const saveMapping = useMutation({
    mutationFn: () => api('/api/mappings', { method: 'POST', body: { installation, name: mappingName, mapping } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['mappings', installation] }),
  });

  useEffect(() => {
    setReport(null);
    setCommitted(null);
    setError(null);
    if (!file) return setPreview(null);
    void readPreview(file).then((p) => {
      setPreview(p);
      if (p.kind === 'csv') setMapping(suggestBillMapping(p.headers).mapping);
      else setGbMapping({});
    });
  }, [file]);

  const activeMapping: Record<string, string> = preview?.kind === 'xml' ? gbMapping : (Object.fromEntries(Object.entries(mapping).filter(([, v]) => v)) as Record<string, string>);
  const signature = `${installation}|${file?.name}|${file?.size}|${file?.lastModified}|${JSON.stringify(activeMapping)}`;
  const missing = preview?.kind === 'csv' ? REQUIRED_BILL_FIELDS.filter((f) => !mapping[f]) : [];
  const ready = !!file && !!preview && !preview.error && missing.length === 0;

  async function send(dryRun: boolean) {
    if (!file) return;
    setBusy(true);
    setError(null);
    const key = newProgressKey();
    const form = new FormData();
    form.set('file', file);
    form.set('installation', installation);
    form.set('mapping', JSON.stringify(activeMapping));
    form.set('dryRun', String(dryRun));
    form.set('progressKey', key);
    setProgress({ sent: 0, total: file.size, server: null });
    try {
      const r = await uploadForm<Report>('/api/imports', form, `/api/imports/progress/${key}`, setProgress);
      if (dryRun) {
        setReport(r);
        setReportFor(signature);
      } else {
        setCommitted(r);
        setReport(null);
        await qc.invalidateQueries({ queryKey: ['imports', installation] });
      }
    } catch (e) {
      setError(e instanceof ApiError ? e.message : String(e));
    } finally {
      setBusy(false);
      setProgress(null);
    }
  }

  const canCommit = report && reportFor === signature && report.counts.new + report.counts.changed > 0 && !busy;
  const headerOptions = preview?.headers ?? [];

  return (
    <div className="space-y-6">
      <section className="card space-y-4" aria-labelledby="step-file">
        <h2 id="step-file">1. The file</h2>
        <div className="grid gap-4 sm:grid-cols-2">
          <div>
            <label htmlFor="intake-installation" className="field-label">Installation</label>
            <select id="intake-installation" className="field-input" value={installation} onChange={(e) => { setInstallation(e.target.value); setReport(null); }}>
              {installations.map((i) => <option key={i.code} value={i.code}>{i.code} — {i.name}</option>)}
            </select>
          </div>
          <div>
            <label htmlFor="intake-file" className="field-label">Bill file (CSV, or Green Button XML)</label>
            <input id="intake-file" type="file" accept=".csv,.txt,.tsv,.xml,text/csv,application/xml,text/xml" className="field-input" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
            <p className="field-hint">Any column order and header spelling; comma, semicolon or tab separated; US or ISO dates. <a href="/api/imports/template">Download a template</a>.</p>
          </div>
        </div>
        {preview?.error && <p className="notice-error" role="alert">{preview.error}</p>}
        {preview?.kind === 'csv' && preview.rows.length > 0 && (
          <div className="overflow-x-auto">
            <table className="data-table">
              <caption className="mb-1 text-left text-sm text-ink-600">The first {preview.rows.length} rows of {file?.name}</caption>
              <thead><tr>{preview.headers.map((h, k) => <th key={k} scope="col">{h}</th>)}</tr></thead>
              <tbody>{preview.rows.map((r, i) => <tr key={i}>{preview.headers.map((_, k) => <td key={k} className="whitespace-nowrap">{r[k] ?? ''}</td>)}</tr>)}</tbody>
            </table>
          </div>
        )}
      </section>

      {preview?.kind === 'csv' && !preview.error && (
        <section className="card space-y-4" aria-labelledby="step-map">
          <h2 id="step-map">2. Which column is what</h2>
          {saved.data && saved.data.items.length > 0 && (
            <div className="flex flex-wrap items-center gap-2 text-sm">
              <span>Saved mappings:</span>
              {saved.data.items.map((m) => (
                <button key={m.id} type="button" className="btn-secondary" onClick={() => setMapping(m.mapping as Partial<Record<BillField, string>>)}>{m.name}</button>
              ))}
            </div>
          )}
          <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
            {BILL_FIELDS.map((f) => (
              <div key={f}>
                <label htmlFor={`map-${f}`} className="field-label">
                  {BILL_FIELD_LABELS[f]}{REQUIRED_BILL_FIELDS.includes(f) && <span className="text-brick-ink" aria-hidden="true"> *</span>}
                </label>
                <select id={`map-${f}`} className="field-input" value={mapping[f] ?? ''} aria-invalid={REQUIRED_BILL_FIELDS.includes(f) && !mapping[f]} onChange={(e) => setMapping({ ...mapping, [f]: e.target.value || undefined })}>
                  <option value="">{REQUIRED_BILL_FIELDS.includes(f) ? '— choose a column —' : '— not in this file —'}</option>
                  {headerOptions.map((h) => <option key={h} value={h}>{h}</option>)}
                </select>
              </div>
            ))}
          </div>
          {missing.length > 0 && <p className="field-error">Choose a column for: {missing.map((f) => BILL_FIELD_LABELS[f]).join(', ')}.</p>}
          <p className="field-hint">Without a unit column, each bill is taken in its meter's billing unit.</p>
          <div className="flex flex-wrap items-end gap-2">
            <div>
              <label htmlFor="mapping-name" className="field-label">Save this mapping for {installation} as</label>
              <input id="mapping-name" className="field-input" value={mappingName} maxLength={80} onChange={(e) => setMappingName(e.target.value)} placeholder="e.g. Utility portal export" />
            </div>
            <button type="button" className="btn-secondary" disabled={!mappingName.trim() || missing.length > 0 || saveMapping.isPending} onClick={() => saveMapping.mutate()}>Save mapping</button>
            {saveMapping.isSuccess && <span role="status" className="text-sm text-line-700">Saved.</span>}
            {saveMapping.isError && <span role="alert" className="field-error">{(saveMapping.error as Error).message}</span>}
          </div>
        </section>
      )}

      {preview?.kind === 'xml' && !preview.error && (
        <section className="card space-y-4" aria-labelledby="step-gb">
          <h2 id="step-gb">2. Green Button usage points → meters</h2>
          {meters.isPending && <p role="status">Loading meters…</p>}
          {preview.series.map((s) => {
            const k = seriesKey(s);
            const fitting = (meters.data?.items ?? []).filter((m) => m.commodity === s.commodity);
            return (
              <div key={k} className="grid items-end gap-3 sm:grid-cols-2">
                <div className="text-sm">
                  <p className="font-medium">{s.usagePoint.title || s.usagePoint.href || 'Usage point'}</p>
                  <p className="text-ink-600">{COMMODITY_LABELS[s.commodity]} · {s.periods.length} periods in {s.unit} · from {s.source === 'usage-summary' ? 'bill summaries' : 'interval readings, summed by month'}</p>
                </div>
                <div>
                  <label htmlFor={`gb-${k}`} className="field-label">Meter</label>
                  <select id={`gb-${k}`} className="field-input" value={gbMapping[k] ?? ''} onChange={(e) => setGbMapping({ ...gbMapping, [k]: e.target.value })}>
                    <option value="">— leave out —</option>
                    {fitting.map((m) => <option key={m.id} value={m.code}>{m.code} (building {m.buildingNumber})</option>)}
                  </select>
                </div>
              </div>
            );
          })}
        </section>
      )}

      {preview && !preview.error && (
        <section className="card space-y-4" aria-labelledby="step-check">
          <h2 id="step-check">3. Check, then commit</h2>
          <p className="text-sm text-ink-600">The check reads every row and compares it with the bills already stored. It stores nothing. Committing writes all valid rows in one step, keeps the original file, and can be undone from the history below.</p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary" disabled={!ready || busy} onClick={() => void send(true)}>Check the file</button>
            <button type="button" className="btn-secondary" disabled={!canCommit} onClick={() => {
              if (report && report.counts.rejected > 0 && !window.confirm(`${report.counts.rejected} rows have errors and will be left out. Commit the other ${report.counts.new + report.counts.changed} bills?`)) return;
              void send(false);
            }}>
              Commit {report ? `${formatNumber(report.counts.new + report.counts.changed)} bills` : ''}
            </button>
          </div>
          {report && reportFor !== signature && <p className="notice-warn">The file, installation or mapping changed since the check: check again before committing.</p>}
          {progress && <ProgressBar p={progress} />}
          {error && <p className="notice-error" role="alert">{error}</p>}
          {report && (
            <div className="space-y-3" data-testid="dry-run-report">
              <h3 className="font-semibold">Check result {report.counts.rejected > 0 ? '— some rows will be left out' : report.counts.new + report.counts.changed === 0 ? '— nothing to change' : '— ready to commit'}</h3>
              <Counts r={report} />
              {report.truncated && <p className="notice-warn">Showing the first {formatNumber(report.problems.length)} of {formatNumber(report.problemCount)} problems.</p>}
              <ProblemTable problems={report.problems} />
              <p className="text-sm"><a href={`/api/imports/${report.id}/report`}>Download the problem report (CSV)</a></p>
            </div>
          )}
          {committed && (
            <div className="notice-info space-y-2" role="status" data-testid="commit-result">
              <p className="font-medium">Committed: {formatNumber(committed.counts.new)} new and {formatNumber(committed.counts.changed)} changed bills{committed.counts.rejected > 0 ? `; ${formatNumber(committed.counts.rejected)} rows left out` : ''}.</p>
            </div>
          )}
        </section>
      )}

      <ImportHistory installation={installation} />
    </div>
  );
}

export default function BillIntake(props: { installations: { code: string; name: string }[]; initialInstallation: string }) {
  return (
    <QueryProvider>
      <Intake {...props} />
    </QueryProvider>
  );
}
