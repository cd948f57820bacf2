/**
 * The building page's field work: its walkthroughs, and the verified savings of its implemented
 * measures — per measure and meter, the reporting period, avoided use against the baseline, its
 * share of the baseline and its uncertainty at 68 % and 90 %, with a chart of what the baseline
 * predicted against what was metered and the same as a table. Short reporting periods and
 * baselines that fail their criteria are said plainly.
 */
import { useQuery } from '@tanstack/react-query';
import { LinePath, Circle } from '@visx/shape';
import { scaleLinear, scaleTime } from '@visx/scale';
import { COMMODITY_LABELS } from '../../lib/domain';
import { formatDate, formatNumber, formatPercent } from '../../lib/format';
import type { VerifiedSavings } from '../../lib/savings/verified-savings';
import { CHART_MARGIN, ChartFrame } from '../ui/ChartFrame';
import type { VerifiedLine } from '../../server/measures/verified-savings';
import { api } from '../ui/api';
import { QueryProvider } from '../ui/query';
import { WALKTHROUGH_BADGE } from './labels';

type Line = VerifiedLine;

const REASONS: Record<string, string> = {
  'no-reporting-bills': 'No bills since the implementation date yet: savings can be verified once the months after it are billed.',
  'no-baseline-bills': 'No bill ends before the implementation date: there is no baseline to compare with.',
  'baseline-failed': 'No baseline could be fitted on the bills before the implementation date',
  'no-reporting-periods': 'The bills after the date have no usable periods (too few days with a temperature).',
};

type Period = Extract<VerifiedSavings, { ok: true }>['reporting']['periods'][number];

function PredictedVsActual({ periods, unit, id }: { periods: Period[]; unit: string; id: string }) {
  const W = 640;
  const H = 280;
  const mid = (p: Period) => new Date((Date.parse(p.start) + Date.parse(p.end)) / 2);
  const ys = periods.flatMap((p) => [p.predictedUse, p.actualUse]);
  const x = scaleTime({ domain: [new Date(Date.parse(periods[0]!.start)), new Date(Date.parse(periods[periods.length - 1]!.end))], range: [0, W - CHART_MARGIN.left - CHART_MARGIN.right] });
  const y = scaleLinear({ domain: [Math.min(0, ...ys), Math.max(...ys) * 1.08], range: [H - CHART_MARGIN.top - CHART_MARGIN.bottom, 0], nice: true });
  return (
    <figure className="space-y-1">
      <ChartFrame width={W} height={H} x={x} y={y} xLabel="Bill period" yLabel={`Use per period (${unit})`} title={`verified-${id}`} description={`What the baseline predicted at each period's actual weather (dashed) against the metered use (solid), for ${periods.length} reporting periods. The table below gives the same figures.`} xTickFormat={(v) => (v instanceof Date ? v.toISOString().slice(0, 7) : String(v))}>
        <LinePath data={periods} x={(p) => x(mid(p))} y={(p) => y(p.predictedUse)} stroke="#b45309" strokeWidth={2} strokeDasharray="6 4" />
        <LinePath data={periods} x={(p) => x(mid(p))} y={(p) => y(p.actualUse)} stroke="#0b5e54" strokeWidth={2} />
        {periods.map((p) => (
          <Circle key={p.start} cx={x(mid(p))} cy={y(p.actualUse)} r={3.5} fill="#0b5e54">
            <title>{`${p.start} to ${p.end}: metered ${formatNumber(p.actualUse)} ${unit}, baseline ${formatNumber(p.predictedUse)} ${unit}`}</title>
          </Circle>
        ))}
      </ChartFrame>
      <figcaption className="flex flex-wrap gap-4 text-xs text-ink-700">
        <span>— — baseline at actual weather</span>
        <span>——— metered</span>
      </figcaption>
    </figure>
  );
}

function LineView({ l }: { l: Line }) {
  const r = l.result;
  const head = (
    <h3 className="font-semibold">
      {l.measureTitle} <span className="text-sm font-normal text-ink-600">· {COMMODITY_LABELS[l.commodity]}, meter <span className="figure">{l.meterCode}</span> · implemented {formatDate(l.implementedOn)}</span>
    </h3>
  );
  if (!r.ok) {
    return (
      <div className="space-y-1 rounded-md border border-ink-200 p-3" data-testid="verified-line">
        {head}
        <p className="notice-info">{REASONS[r.reason] ?? r.reason}{r.reason === 'baseline-failed' ? ` (${r.detail}).` : ''}</p>
      </div>
    );
  }
  const u68 = r.uncertainty.find((u) => u.confidence === 0.68);
  const u90 = r.uncertainty.find((u) => u.confidence === 0.9);
  const months = r.reporting.months;
  const expected = l.estimatedAnnual !== null ? (l.estimatedAnnual * months) / 12 : null;
  const crit = r.baseline.acceptance;
  const unc = (u: typeof u68) => (u && u.plusMinus !== null ? `± ${formatNumber(u.plusMinus)} ${l.unit} (± ${formatPercent(u.fsu, 0)} of the savings)` : `not available (${u?.reason ?? 'no estimate'})`);
  return (
    <div className="space-y-3 rounded-md border border-ink-200 p-3" data-testid="verified-line">
      {head}
      {r.caveats.includes('short-reporting-period') && <p className="notice-warn">Only {r.reporting.periods.length} reporting period{r.reporting.periods.length === 1 ? '' : 's'} so far: too short to judge. Wait for at least three, better a full year; the figures below are provisional.</p>}
      {r.caveats.includes('baseline-fails-criteria') && <p className="notice-warn">The baseline does not meet its acceptance criteria (CV(RMSE) {formatPercent(crit.cvrmse.value, 1)}, limit {formatPercent(crit.cvrmse.threshold, 0)}): treat these savings as indicative only.</p>}
      {r.caveats.includes('baseline-insufficient-data') && <p className="notice-warn">The baseline has fewer periods or days than its criteria ask ({crit.periods.value} of {crit.periods.threshold} periods): treat these savings as indicative only.</p>}
      <dl className="grid gap-3 text-sm sm:grid-cols-2 lg:grid-cols-4">
        <div><dt className="text-ink-500">Reporting period</dt><dd>{formatDate(r.reporting.start)} – {formatDate(r.reporting.end)}</dd><dd className="text-xs text-ink-500">{r.reporting.periods.length} bills, {formatNumber(months, 1)} months</dd></div>
        <div><dt className="text-ink-500">Avoided use</dt><dd className="figure text-xl">{formatNumber(r.avoidedUse)} {l.unit}</dd><dd className="text-xs text-ink-500">{formatPercent(r.savingsFraction, 1)} of the baseline ({formatNumber(r.adjustedBaseline)} {l.unit})</dd></div>
        <div><dt className="text-ink-500">Uncertainty, 68 %</dt><dd className="figure">{unc(u68)}</dd></div>
        <div><dt className="text-ink-500">Uncertainty, 90 %</dt><dd className="figure">{unc(u90)}</dd></div>
      </dl>
      <p className="text-xs text-ink-600">
        Baseline: {r.baseline.source === 'stored' ? 'the stored fit' : 'refitted on the bills before the implementation date'}, {formatDate(r.baseline.periodStart)} – {formatDate(r.baseline.periodEnd)}, {r.baseline.periods} periods, {r.baseline.shape} model, CV(RMSE) {formatPercent(r.baseline.cvrmse, 1)}
        {r.blackoutBills > 0 && `; ${r.blackoutBills} bill spanning the implementation date left out`}. Avoided use = Σ days × (baseline − metered) per bill (CalTRACK 2.0 §3.6); uncertainty per CalTRACK 2.0 §4.3.2.4.
        {expected !== null && ` The measure's own estimate for these ${formatNumber(months, 1)} months: ${formatNumber(expected)} ${l.unit}${l.metersOfCommodity > 1 ? ` over all ${l.metersOfCommodity} meters of this commodity` : ''}.`}
        {' '}Whole-meter savings include every other change at the meter since the date.
      </p>
      <PredictedVsActual periods={r.reporting.periods} unit={l.unit} id={`${l.measureId}-${l.meterId}`} />
      <details className="text-sm">
        <summary className="cursor-pointer text-line-700">As a table</summary>
        <table className="data-table mt-2">
          <caption className="sr-only">Baseline-predicted and metered use per reporting period, {l.meterCode}</caption>
          <thead><tr><th scope="col">Period</th><th scope="col" className="text-right">Days</th><th scope="col" className="text-right">Baseline ({l.unit})</th><th scope="col" className="text-right">Metered</th><th scope="col" className="text-right">Avoided</th></tr></thead>
          <tbody>
            {r.reporting.periods.map((p) => (
              <tr key={p.start}>
                <th scope="row" className="font-normal">{formatDate(p.start)} – {formatDate(p.end)}</th>
                <td className="figure text-right">{p.days}</td>
                <td className="figure text-right">{formatNumber(p.predictedUse)}</td>
                <td className="figure text-right">{formatNumber(p.actualUse)}</td>
                <td className="figure text-right">{formatNumber(p.avoidedUse)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </div>
  );
}

function FieldWork({ buildingId }: { buildingId: string }) {
  const walks = useQuery({ queryKey: ['walkthroughs', buildingId], queryFn: () => api<{ items: { id: string; title: string; plannedOn: string; status: keyof typeof WALKTHROUGH_BADGE; findings: number; measures: number; auditor: { name: string } | null }[] }>(`/api/walkthroughs?building=${buildingId}`) });
  const verified = useQuery({ queryKey: ['verified', buildingId], queryFn: () => api<{ lines: Line[]; measuresWithoutCommodity: { id: string; title: string }[]; noWeather: boolean }>(`/api/measures/verified?building=${buildingId}`) });
  return (
    <div className="space-y-6">
      <section className="card space-y-3" aria-labelledby="walks-h">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="walks-h">Walkthroughs</h2>
        </div>
        {walks.isPending && <p role="status">Loading…</p>}
        {walks.isError && <p className="notice-error" role="alert">{(walks.error as Error).message}</p>}
        {walks.data && walks.data.items.length === 0 && <p className="text-sm text-ink-600">No walkthrough of this building yet.</p>}
        {walks.data && walks.data.items.length > 0 && (
          <ul className="space-y-1 text-sm">
            {walks.data.items.map((w) => (
              <li key={w.id}>
                <a href={`/walkthroughs/${w.id}`}>{w.title}</a> · {formatDate(w.plannedOn)} · {w.auditor?.name ?? 'no auditor'} · {w.findings} findings, {w.measures} measures <span className={`badge ${WALKTHROUGH_BADGE[w.status].cls}`}>{WALKTHROUGH_BADGE[w.status].label}</span>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section className="card space-y-3" aria-labelledby="verified-h" data-testid="verified-savings">
        <h2 id="verified-h">Verified savings</h2>
        {verified.isPending && <p role="status">Comparing the bills with the baselines…</p>}
        {verified.isError && <p className="notice-error" role="alert">{(verified.error as Error).message}</p>}
        {verified.data && verified.data.lines.length === 0 && verified.data.measuresWithoutCommodity.length === 0 && <p className="text-sm text-ink-600">No measure of this building is implemented yet. Once one is, its savings are measured here against the building’s baseline.</p>}
        {verified.data?.noWeather && <p className="notice-warn">This installation has no weather station with temperatures: savings cannot be weather-normalized.</p>}
        {verified.data && verified.data.measuresWithoutCommodity.length > 0 && <p className="text-sm text-ink-600">Implemented without savings per commodity, so not verified here: {verified.data.measuresWithoutCommodity.map((m) => m.title).join(', ')}.</p>}
        {verified.data?.lines.map((l) => <LineView key={`${l.measureId}-${l.meterId}`} l={l} />)}
      </section>
    </div>
  );
}

export default function BuildingFieldWork(props: { buildingId: string }) {
  return (
    <QueryProvider>
      <FieldWork {...props} />
    </QueryProvider>
  );
}
