/** Monthly site energy by commodity (stacked bars), what the baselines expected, and cost, with a table. */
import { scaleBand, scaleLinear } from '@visx/scale';
import { AxisBottom, AxisLeft } from '@visx/axis';
import { Group } from '@visx/group';
import { LinePath } from '@visx/shape';
import { COMMODITY_LABELS, type Commodity } from '../../lib/domain';

interface MonthRow {
  month: string;
  byCommodity: Partial<Record<Commodity, number>>;
  costUsd: number;
  expectedKbtu: number | null;
}

const COLORS: Partial<Record<Commodity, string>> = {
  electricity: '#0b5e54',
  natural_gas: '#b45309',
  fuel_oil_2: '#7a4b00',
  fuel_oil_6: '#5b3a00',
  propane: '#9b2c1c',
  district_steam: '#465669',
  chilled_water: '#178f80',
};

export default function MonthlyChart({ months }: { months: MonthRow[] }) {
  const energy = (Object.keys(COLORS) as Commodity[]).filter((c) => months.some((m) => (m.byCommodity[c] ?? 0) > 0));
  const W = 760;
  const H = 300;
  const mg = { top: 10, right: 16, bottom: 40, left: 70 };
  const total = (m: MonthRow) => energy.reduce((s, c) => s + (m.byCommodity[c] ?? 0), 0) / 1000;
  const max = Math.max(1, ...months.map((m) => Math.max(total(m), (m.expectedKbtu ?? 0) / 1000)));
  const x = scaleBand({ domain: months.map((m) => m.month), range: [0, W - mg.left - mg.right], padding: 0.15 });
  const y = scaleLinear({ domain: [0, max * 1.05], range: [H - mg.top - mg.bottom, 0], nice: true });
  const expected = months.filter((m) => m.expectedKbtu !== null);
  return (
    <figure className="space-y-2">
      <svg width="100%" viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="monthly-t monthly-d">
        <title id="monthly-t">Monthly site energy</title>
        <desc id="monthly-d">Site energy per calendar month in MMBtu, stacked by commodity, with the use the baselines expected for each month's weather as a line. The table below gives the same figures and the cost.</desc>
        <Group left={mg.left} top={mg.top}>
          {months.map((m) => {
            let y0 = 0;
            return energy.map((c) => {
              const v = (m.byCommodity[c] ?? 0) / 1000;
              const rect = <rect key={`${m.month}-${c}`} x={x(m.month)} y={y(y0 + v)} width={x.bandwidth()} height={Math.max(0, y(y0) - y(y0 + v))} fill={COLORS[c]}><title>{`${m.month} ${COMMODITY_LABELS[c]}: ${v.toFixed(1)} MMBtu`}</title></rect>;
              y0 += v;
              return rect;
            });
          })}
          {expected.length > 1 && <LinePath data={expected} x={(m) => (x(m.month) ?? 0) + x.bandwidth() / 2} y={(m) => y((m.expectedKbtu ?? 0) / 1000)} stroke="#17202c" strokeWidth={1.5} strokeDasharray="5 3" />}
          <AxisLeft scale={y} numTicks={5} label="MMBtu per month" labelOffset={50} stroke="#a6b3c2" tickStroke="#a6b3c2" tickLabelProps={{ fill: '#465669', fontSize: 11 }} labelProps={{ fill: '#364353', fontSize: 12 }} />
          <AxisBottom top={H - mg.top - mg.bottom} scale={x} stroke="#a6b3c2" tickStroke="#a6b3c2" tickValues={months.filter((_, i) => i % 6 === 0).map((m) => m.month)} tickLabelProps={{ fill: '#465669', fontSize: 11 }} />
        </Group>
      </svg>
      <figcaption className="flex flex-wrap gap-3 text-xs text-ink-700">
        {energy.map((c) => <span key={c} className="flex items-center gap-1"><span aria-hidden="true" className="inline-block h-3 w-3 rounded-sm" style={{ background: COLORS[c] }} />{COMMODITY_LABELS[c]}</span>)}
        <span>— — what the baselines expected for the month's weather</span>
      </figcaption>
      <details className="text-sm">
        <summary className="cursor-pointer text-line-700">As a table</summary>
        <div className="mt-2 max-h-80 overflow-auto">
          <table className="data-table">
            <thead><tr><th scope="col">Month</th>{energy.map((c) => <th key={c} scope="col" className="text-right">{COMMODITY_LABELS[c]} (kBtu)</th>)}<th scope="col" className="text-right">Expected (kBtu)</th><th scope="col" className="text-right">Water (gal)</th><th scope="col" className="text-right">Cost ($)</th></tr></thead>
            <tbody>
              {months.map((m) => (
                <tr key={m.month}>
                  <th scope="row" className="figure">{m.month}</th>
                  {energy.map((c) => <td key={c} className="figure text-right">{Math.round(m.byCommodity[c] ?? 0).toLocaleString('en-US')}</td>)}
                  <td className="figure text-right">{m.expectedKbtu === null ? '—' : Math.round(m.expectedKbtu).toLocaleString('en-US')}</td>
                  <td className="figure text-right">{Math.round(m.byCommodity.water ?? 0).toLocaleString('en-US')}</td>
                  <td className="figure text-right">{Math.round(m.costUsd).toLocaleString('en-US')}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
