/** The Baselines charts: use per day against temperature with the model, and residuals over time. */
import { Bar, Circle, LinePath } from '@visx/shape';
import { scaleLinear, scaleTime } from '@visx/scale';
import { extent } from 'd3-array';
import { CHART_MARGIN, ChartFrame } from '../ui/ChartFrame';
import type { PeriodRow } from '../../lib/baseline/engine';
import type { BaselineModel } from '../../lib/baseline/model';

export type { PeriodRow };
/** A fitted model as the API sends it (the shape as plain text). */
export type ModelLine = Omit<BaselineModel, 'shape'> & { shape: string };

/**
 * Use per day of a period whose every day has mean temperature T: the model's curve. (Fitted on
 * period-average degree days, so a period with mixed days sits a little off this curve.)
 */
export function modelAt(m: ModelLine, t: number): number {
  const h = m.heatingSlope && m.heatingBalanceF !== null ? m.heatingSlope * Math.max(0, m.heatingBalanceF - t) : 0;
  const c = m.coolingSlope && m.coolingBalanceF !== null ? m.coolingSlope * Math.max(0, t - m.coolingBalanceF) : 0;
  return m.intercept + h + c + (m.slope ?? 0) * t;
}

const W = 640;
const H = 320;

export function ScatterChart({ rows, models, unit }: { rows: PeriodRow[]; models: { model: ModelLine; label: string; dashed?: boolean }[]; unit: string }) {
  const [t0 = 0, t1 = 100] = extent(rows, (r) => r.meanTempF);
  const lo = Math.floor(t0 - 5);
  const hi = Math.ceil(t1 + 5);
  const temps = Array.from({ length: (hi - lo) * 2 + 1 }, (_, i) => lo + i / 2);
  const ys = [...rows.map((r) => r.usePerDay), ...models.flatMap((m) => temps.map((t) => modelAt(m.model, t)))];
  const x = scaleLinear({ domain: [lo, hi], range: [0, W - CHART_MARGIN.left - CHART_MARGIN.right] });
  const y = scaleLinear({ domain: [Math.min(0, ...ys), Math.max(...ys) * 1.05], range: [H - CHART_MARGIN.top - CHART_MARGIN.bottom, 0], nice: true });
  return (
    <ChartFrame
      width={W}
      height={H}
      x={x}
      y={y}
      xLabel="Mean outdoor temperature of the period (°F)"
      yLabel={`Use per day (${unit})`}
      title="use-vs-temperature"
      description={`Use per day of ${rows.length} bill periods against their mean outdoor temperature, with the fitted model${models.length > 1 ? 's' : ''}.`}
    >
      {models.map((m) => (
        <LinePath key={m.label} data={temps} x={(t) => x(t)} y={(t) => y(modelAt(m.model, t))} stroke={m.dashed ? '#b45309' : '#0b5e54'} strokeWidth={2} strokeDasharray={m.dashed ? '6 4' : undefined} />
      ))}
      {rows.map((r) => (
        <Circle key={r.start} cx={x(r.meanTempF)} cy={y(r.usePerDay)} r={4} fill="#17202c" fillOpacity={0.75}>
          <title>{`${r.start} to ${r.end}: ${r.usePerDay.toFixed(1)} ${unit}/day at ${r.meanTempF.toFixed(1)} °F`}</title>
        </Circle>
      ))}
    </ChartFrame>
  );
}

export function ResidualChart({ rows, unit }: { rows: PeriodRow[]; unit: string }) {
  const mid = (r: PeriodRow) => new Date((Date.parse(r.start) + Date.parse(r.end)) / 2);
  const res = rows.map((r) => r.usePerDay - r.predictedUsePerDay);
  const bound = Math.max(1e-9, ...res.map(Math.abs));
  const first = Date.parse(rows[0]?.start ?? '2020-01-01');
  const last = Date.parse(rows[rows.length - 1]?.end ?? '2021-01-01');
  const x = scaleTime({ domain: [new Date(first), new Date(last)], range: [0, W - CHART_MARGIN.left - CHART_MARGIN.right] });
  const y = scaleLinear({ domain: [-bound * 1.1, bound * 1.1], range: [H - CHART_MARGIN.top - CHART_MARGIN.bottom, 0], nice: true });
  const barW = Math.max(2, (W - CHART_MARGIN.left - CHART_MARGIN.right) / Math.max(rows.length, 1) - 3);
  return (
    <ChartFrame
      width={W}
      height={H}
      x={x}
      y={y}
      xLabel="Bill period"
      yLabel={`Actual − model (${unit}/day)`}
      title="residuals-over-time"
      description="How far each period's use per day sits above (positive) or below (negative) the model, in time order."
      xTickFormat={(v) => (v instanceof Date ? v.toISOString().slice(0, 7) : String(v))}
    >
      {rows.map((r, i) => {
        const v = res[i]!;
        return (
          <Bar key={r.start} x={x(mid(r)) - barW / 2} width={barW} y={v >= 0 ? y(v) : y(0)} height={Math.abs(y(v) - y(0))} fill={v >= 0 ? '#b4321f' : '#178f80'}>
            <title>{`${r.start} to ${r.end}: ${v >= 0 ? '+' : ''}${v.toFixed(1)} ${unit}/day`}</title>
          </Bar>
        );
      })}
      <LinePath data={[first, last]} x={(d) => x(new Date(d))} y={() => y(0)} stroke="#7b8ca0" />
    </ChartFrame>
  );
}
