/** The top of the shortlist as stacked bars: each building's score split into the points of each term. */
import { Group } from '@visx/group';
import { scaleBand, scaleLinear } from '@visx/scale';
import { AxisBottom, AxisLeft } from '@visx/axis';
import { PRIORITY_TERMS, PRIORITY_TERM_LABELS, type PriorityTerm } from '../../lib/benchmark/priority-weights';

export const TERM_COLORS: Record<PriorityTerm, string> = {
  excessEnergy: '#0b5e54',
  excessCost: '#178f80',
  yoyIncrease: '#b4321f',
  anomalies: '#b45309',
  evaluationAge: '#5b6d82',
  manualFlag: '#17202c',
};

export interface ChartRow {
  label: string;
  points: Partial<Record<PriorityTerm, number>>;
  score: number;
}

export function ShortlistChart({ rows }: { rows: ChartRow[] }) {
  const W = 720;
  const rowH = 22;
  const m = { top: 8, right: 16, bottom: 36, left: 150 };
  const H = m.top + m.bottom + rows.length * rowH;
  const x = scaleLinear({ domain: [0, 100], range: [0, W - m.left - m.right] });
  const y = scaleBand({ domain: rows.map((r) => r.label), range: [0, rows.length * rowH], padding: 0.2 });
  return (
    <div className="space-y-2">
      <svg width="100%" viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="sl-chart-t sl-chart-d">
        <title id="sl-chart-t">Audit priority of the top {rows.length} buildings</title>
        <desc id="sl-chart-d">Each bar is a building's score out of 100, split into the points each term adds. The table below lists the same figures.</desc>
        <Group left={m.left} top={m.top}>
          {rows.map((r) => {
            let x0 = 0;
            return (
              <g key={r.label}>
                {PRIORITY_TERMS.map((t) => {
                  const w = x(r.points[t] ?? 0);
                  const rect = <rect key={t} x={x0} y={y(r.label)} width={Math.max(0, w)} height={y.bandwidth()} fill={TERM_COLORS[t]}><title>{`${r.label}: ${PRIORITY_TERM_LABELS[t]} ${(r.points[t] ?? 0).toFixed(1)} points`}</title></rect>;
                  x0 += w;
                  return rect;
                })}
                <text x={x0 + 4} y={(y(r.label) ?? 0) + y.bandwidth() / 2} dominantBaseline="middle" fontSize={11} fill="#364353" fontFamily="Noto Sans Mono, monospace">{r.score.toFixed(1)}</text>
              </g>
            );
          })}
          <AxisLeft scale={y} tickValues={rows.map((r) => r.label)} stroke="#a6b3c2" tickStroke="transparent" tickLabelProps={{ fill: '#364353', fontSize: 11, textAnchor: 'end', dx: -4 }} />
          <AxisBottom top={rows.length * rowH} scale={x} numTicks={5} stroke="#a6b3c2" tickStroke="#a6b3c2" label="Score (points out of 100)" tickLabelProps={{ fill: '#465669', fontSize: 11 }} labelProps={{ fill: '#364353', fontSize: 12 }} />
        </Group>
      </svg>
      <ul className="flex flex-wrap gap-3 text-xs text-ink-700" aria-label="Legend">
        {PRIORITY_TERMS.map((t) => (
          <li key={t} className="flex items-center gap-1"><span aria-hidden="true" className="inline-block h-3 w-3 rounded-sm" style={{ background: TERM_COLORS[t] }} />{PRIORITY_TERM_LABELS[t]}</li>
        ))}
      </ul>
    </div>
  );
}
