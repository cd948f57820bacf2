/**
 * The analyst's view of one meter's baseline: the model against the data, residuals over time,
 * the statistics against the criteria, a second shape side by side, the baseline period, and
 * the decision (accept or choose another shape) with its required note and history.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { COMMODITY_LABELS, type Commodity } from '../../lib/domain';
import { formatDate, formatNumber, formatPercent } from '../../lib/format';
import { api, ApiError } from '../ui/api';
import { QueryProvider } from '../ui/query';
import { ResidualChart, ScatterChart, type ModelLine, type PeriodRow } from './charts';
import { REASON_LABELS, SHAPE_LABELS, STATUS_LABELS } from './labels';

interface Coefficient { name: string; estimate: number; standardError: number; t: number | null; pValue: number }
interface Quality { n: number; totalDays: number; parameterCount: number; r2: number; adjR2: number; cvrmse: number | null; nmbe: number | null; cvrmseCaltrack: number | null; rmse: number | null; meanUsePerDay: number; lag1Autocorrelation: number | null }
interface FittedModel extends ModelLine { coefficients: Coefficient[]; dfResidual: number; quality: Quality }
interface Check { value: number | null; threshold: number; pass: boolean }
interface Fit {
  ok: boolean;
  reason?: string;
  detail?: string;
  selected?: FittedModel;
  acceptance?: { status: string; periods: Check; days: Check; cvrmse: Check };
  shapes?: Record<string, { ok: boolean; adjR2?: number; model?: FittedModel | null; reason?: string }>;
  periods?: { used: number; rows: PeriodRow[] | null; dropped: { start: string; end: string; reason: string }[] };
  notes?: Record<string, number>;
}
interface Decision { id: string; action: string; shape: string | null; note: string; actor: string; at: string }
interface Baseline {
  meterId: string;
  meterCode: string;
  buildingId: string;
  buildingNumber: string;
  buildingName: string;
  installationCode: string;
  commodity: string;
  unit: string;
  status: string;
  shape: string | null;
  overrideShape: string | null;
  reason: string | null;
  nac: number | null;
  nacConverted: number | null;
  periodStart: string | null;
  periodEnd: string | null;
  periodChosen: boolean;
  fittedAt: string;
  stale: boolean;
  note: string;
  fit: Fit;
  decisions: Decision[];
}

const COEF: Record<string, string> = { intercept: 'Base use per day (μ)', heatingSlope: 'Heating slope (per HDD)', coolingSlope: 'Cooling slope (per CDD)', slope: 'Slope (per °F)' };
const ACTIONS: Record<string, string> = { accept: 'accepted', override: 'chose another shape', reopen: 'reopened', period: 'set the baseline period' };

function ModelCard({ title, m, unit }: { title: string; m: FittedModel; unit: string }) {
  const q = m.quality;
  return (
    <div className="space-y-2 rounded-md border border-ink-200 p-3">
      <h4 className="font-medium">{title}</h4>
      <p className="text-sm text-ink-600">
        {SHAPE_LABELS[m.shape]}
        {m.heatingBalanceF !== null && <> · heating balance point <span className="figure">{m.heatingBalanceF} °F</span></>}
        {m.coolingBalanceF !== null && <> · cooling balance point <span className="figure">{m.coolingBalanceF} °F</span></>}
      </p>
      <table className="data-table">
        <caption className="sr-only">Coefficients of the {m.shape} model</caption>
        <thead><tr><th scope="col">Coefficient</th><th scope="col" className="text-right">Estimate</th><th scope="col" className="text-right">Std. error</th><th scope="col" className="text-right">t</th><th scope="col" className="text-right">p</th></tr></thead>
        <tbody>
          {m.coefficients.map((c) => (
            <tr key={c.name}>
              <th scope="row" className="font-normal">{COEF[c.name] ?? c.name}</th>
              <td className="figure text-right">{formatNumber(c.estimate, 3)}</td>
              <td className="figure text-right">{formatNumber(c.standardError, 3)}</td>
              <td className="figure text-right">{c.t === null ? '—' : formatNumber(c.t, 2)}</td>
              <td className="figure text-right">{c.pValue < 0.0001 ? '< 0.0001' : formatNumber(c.pValue, 4)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <dl className="grid grid-cols-3 gap-2 text-sm">
        <div><dt className="text-ink-500">R²</dt><dd className="figure">{formatNumber(q.r2, 4)}</dd></div>
        <div><dt className="text-ink-500">Adjusted R²</dt><dd className="figure">{formatNumber(q.adjR2, 4)}</dd></div>
        <div><dt className="text-ink-500">CV(RMSE)</dt><dd className="figure">{formatPercent(q.cvrmse, 1)}</dd></div>
        <div><dt className="text-ink-500">NMBE</dt><dd className="figure">{formatPercent(q.nmbe, 2)}</dd></div>
        <div><dt className="text-ink-500">RMSE</dt><dd className="figure">{formatNumber(q.rmse, 2)} {unit}/d</dd></div>
        <div><dt className="text-ink-500">Lag-1 autocorr.</dt><dd className="figure">{formatNumber(q.lag1Autocorrelation, 2)}</dd></div>
      </dl>
    </div>
  );
}

function Review({ meterId, canDecide }: { meterId: string; canDecide: boolean }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ['baseline', meterId], queryFn: () => api<Baseline>(`/api/baselines/meter/${meterId}`) });
  const [compare, setCompare] = useState<string>('');
  const [note, setNote] = useState('');
  const [noteError, setNoteError] = useState<string | null>(null);
  const [period, setPeriod] = useState<{ start: string; end: string } | null>(null);
  const decide = useMutation({
    mutationFn: (body: Record<string, unknown>) => api<Baseline>(body.start ? '/api/baseline-periods' : '/api/baseline-decisions', { method: 'POST', body }),
    onSuccess: (b) => {
      qc.setQueryData(['baseline', meterId], b);
      setNote('');
      setPeriod(null);
    },
  });
  if (q.isPending) return <p role="status">Loading the baseline…</p>;
  if (q.isError) return <p className="notice-error" role="alert">{(q.error as Error).message}</p>;
  const b = q.data;
  const fit = b.fit;
  const rows = fit.periods?.rows ?? [];
  const sel = fit.selected;
  const others = Object.entries(fit.shapes ?? {}).filter(([s, o]) => o.ok && o.model && s !== b.shape);
  const compareShape = compare || others.sort((a, z) => (z[1].adjR2 ?? 0) - (a[1].adjR2 ?? 0))[0]?.[0] || '';
  const cmp = fit.shapes?.[compareShape]?.model ?? null;
  const st = STATUS_LABELS[b.status];
  const submit = (body: Record<string, unknown>) => {
    if (note.trim().length < 3) {
      setNoteError('Write a note first: say why, in a few words.');
      return;
    }
    setNoteError(null);
    decide.mutate({ meterId, note, ...body });
  };
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-sm text-ink-500"><a href={`/buildings/${b.buildingId}`}>{b.installationCode} {b.buildingNumber} · {b.buildingName}</a></p>
          <h1>Baseline of meter <span className="figure">{b.meterCode}</span></h1>
          <p className="text-sm text-ink-600">{COMMODITY_LABELS[b.commodity as Commodity] ?? b.commodity} in {b.unit} · baseline period {formatDate(b.periodStart)} – {formatDate(b.periodEnd)}{b.periodChosen ? ' (chosen by an analyst)' : ' (the last three years of bills)'} · fitted {b.fittedAt.slice(0, 16).replace('T', ' ')} UTC</p>
        </div>
        <span className={`badge text-sm ${st?.cls}`} data-testid="baseline-status">{st?.label}</span>
      </div>
      {b.stale && <p className="notice-warn">Bills or weather changed since this fit: a refit is on its way.</p>}
      {!fit.ok && <p className="notice-error">{REASON_LABELS[fit.reason ?? ''] ?? fit.detail}</p>}

      {sel && (
        <>
          <section className="card space-y-3" aria-labelledby="model-heading">
            <h2 id="model-heading">The model against the bills</h2>
            <div className="flex flex-wrap items-end gap-3">
              <div>
                <label htmlFor="compare-shape" className="field-label">Compare with</label>
                <select id="compare-shape" className="field-input" value={compareShape} onChange={(e) => setCompare(e.target.value)}>
                  <option value="">— no other shape —</option>
                  {others.map(([s, o]) => <option key={s} value={s}>{SHAPE_LABELS[s]} (adj. R² {formatNumber(o.adjR2, 3)})</option>)}
                </select>
              </div>
              <p className="pb-2 text-xs text-ink-500">Solid: the model in use. Dashed: the compared shape.</p>
            </div>
            <ScatterChart rows={rows} unit={b.unit} models={[{ model: sel, label: 'in use' }, ...(cmp ? [{ model: cmp, label: 'compared', dashed: true }] : [])]} />
            <ResidualChart rows={rows} unit={b.unit} />
            <details>
              <summary className="cursor-pointer text-sm text-line-700">The same as a table ({rows.length} periods)</summary>
              <div className="mt-2 overflow-x-auto">
                <table className="data-table">
                  <thead><tr><th scope="col">From</th><th scope="col">To</th><th scope="col" className="text-right">Days</th><th scope="col" className="text-right">Mean °F</th><th scope="col" className="text-right">Use/day</th><th scope="col" className="text-right">Model</th><th scope="col" className="text-right">Residual</th></tr></thead>
                  <tbody>
                    {rows.map((r) => (
                      <tr key={r.start}>
                        <td>{r.start}</td><td>{r.end}</td><td className="figure text-right">{r.days}</td><td className="figure text-right">{formatNumber(r.meanTempF, 1)}</td>
                        <td className="figure text-right">{formatNumber(r.usePerDay, 2)}</td><td className="figure text-right">{formatNumber(r.predictedUsePerDay, 2)}</td><td className="figure text-right">{formatNumber(r.usePerDay - r.predictedUsePerDay, 2)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </details>
          </section>

          <section className="card space-y-3" aria-labelledby="criteria-heading">
            <h2 id="criteria-heading">Against the criteria</h2>
            {fit.acceptance && (
              <ul className="space-y-1 text-sm">
                {(
                  [
                    ['CV(RMSE)', fit.acceptance.cvrmse, (v: number | null) => formatPercent(v, 1), `at most ${formatPercent(fit.acceptance.cvrmse.threshold, 0)} (ASHRAE Guideline 14, monthly energy)`],
                    ['Bill periods', fit.acceptance.periods, (v: number | null) => formatNumber(v), `at least ${fit.acceptance.periods.threshold} (CalTRACK 2.0 §2.2.1.1)`],
                    ['Days covered', fit.acceptance.days, (v: number | null) => formatNumber(v), `at least ${fit.acceptance.days.threshold} (CalTRACK 2.0 §2.2.1.1)`],
                  ] as const
                ).map(([name, c, fmt, rule]) => (
                  <li key={name} className="flex items-center gap-2">
                    <span className={`badge ${c.pass ? 'bg-line-50 text-line-800' : 'bg-brick-soft text-brick-ink'}`}>{c.pass ? 'meets' : 'fails'}</span>
                    <span>{name} <span className="figure">{fmt(c.value)}</span> — {rule}</span>
                  </li>
                ))}
              </ul>
            )}
            <p className="text-sm text-ink-600">Normal-year use: <span className="figure">{formatNumber(b.nac)} {b.unit}</span>{b.nacConverted !== null && <> (<span className="figure">{formatNumber(b.nacConverted)}</span> {b.commodity === 'water' ? 'gal' : 'kBtu'})</>}.</p>
            {fit.notes && Object.values(fit.notes).some((v) => v > 0) && (
              <p className="text-xs text-ink-500">Bills prepared: {Object.entries(fit.notes).filter(([, v]) => v > 0).map(([k, v]) => `${v} ${k.replace(/([A-Z])/g, ' $1').toLowerCase()}`).join(', ')}.</p>
            )}
            <div className="grid gap-4 lg:grid-cols-2">
              <ModelCard title="In use" m={sel} unit={b.unit} />
              {cmp && <ModelCard title="Compared" m={cmp} unit={b.unit} />}
            </div>
          </section>
        </>
      )}

      {canDecide && (
        <section className="card space-y-3" aria-labelledby="decide-heading">
          <h2 id="decide-heading">Decision</h2>
          <div>
            <label htmlFor="decision-note" className="field-label">Note (required)</label>
            <textarea id="decision-note" rows={3} className="field-input" value={note} onChange={(e) => setNote(e.target.value)} aria-invalid={!!noteError} aria-describedby={noteError ? 'decision-note-error' : undefined} />
            {noteError && <p id="decision-note-error" className="field-error" role="alert">{noteError}</p>}
          </div>
          <div className="flex flex-wrap gap-2">
            {sel && <button type="button" className="btn-primary" disabled={decide.isPending} onClick={() => submit({ action: 'accept' })}>Accept this model</button>}
            {cmp && <button type="button" className="btn-secondary" disabled={decide.isPending} onClick={() => submit({ action: 'override', shape: compareShape })}>Use the compared shape instead</button>}
            {(b.status === 'accepted' || b.overrideShape) && <button type="button" className="btn-secondary" disabled={decide.isPending} onClick={() => submit({ action: 'reopen' })}>Reopen</button>}
          </div>
          <details className="rounded-md border border-ink-200 p-3" open={period !== null}>
            <summary className="cursor-pointer text-sm">Choose the baseline period</summary>
            <div className="mt-2 flex flex-wrap items-end gap-2">
              <div><label htmlFor="bp-start" className="field-label">From</label><input id="bp-start" type="date" className="field-input" value={period?.start ?? b.periodStart ?? ''} onChange={(e) => setPeriod({ start: e.target.value, end: period?.end ?? b.periodEnd ?? '' })} /></div>
              <div><label htmlFor="bp-end" className="field-label">To</label><input id="bp-end" type="date" className="field-input" value={period?.end ?? b.periodEnd ?? ''} onChange={(e) => setPeriod({ start: period?.start ?? b.periodStart ?? '', end: e.target.value })} /></div>
              <button type="button" className="btn-secondary" disabled={!period || decide.isPending} onClick={() => period && submit({ start: period.start, end: period.end })}>Refit on this period</button>
            </div>
            <p className="field-hint">At least 12 months. The note above explains the choice (e.g. the year before a retrofit).</p>
          </details>
          {decide.isPending && <p role="status">Saving…</p>}
          {decide.isError && <p className="notice-error" role="alert">{decide.error instanceof ApiError ? decide.error.message : String(decide.error)}</p>}
        </section>
      )}

      <section className="card space-y-2" aria-labelledby="history-heading">
        <h2 id="history-heading">Decisions</h2>
        {b.decisions.length === 0 ? <p className="text-sm text-ink-600">None yet.</p> : (
          <ol className="space-y-2 text-sm" data-testid="baseline-decisions">
            {b.decisions.map((d) => (
              <li key={d.id} className="border-l-2 border-line-200 pl-3">
                <p><span className="font-medium">{d.actor}</span> {ACTIONS[d.action] ?? d.action}{d.shape ? ` (${SHAPE_LABELS[d.shape]})` : ''} <span className="text-xs text-ink-500">{d.at.slice(0, 16).replace('T', ' ')} UTC</span></p>
                <p className="text-ink-700">{d.note}</p>
              </li>
            ))}
          </ol>
        )}
      </section>
    </div>
  );
}

export default function BaselineReview(props: { meterId: string; canDecide: boolean }) {
  return (
    <QueryProvider>
      <Review {...props} />
    </QueryProvider>
  );
}
