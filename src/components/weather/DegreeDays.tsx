/** Degree days of a station at any base, °F or °C: a period, and a year month by month beside the normal year. */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { formatNumber } from '../../lib/format';
import { api } from '../ui/api';
import { QueryProvider } from '../ui/query';

interface Period {
  days: number;
  coverage: number;
  sufficient: boolean;
  hdd: { total: number | null; perDay: number | null };
  cdd: { total: number | null; perDay: number | null };
  normalYear: { hdd: number | null; cdd: number | null; years: number; firstYear: number | null; lastYear: number | null };
}
interface Monthly {
  months: { month: number; hdd: number | null; cdd: number | null; coverage: number }[];
  normal: { hdd: number; cdd: number; years: number[]; fewYears: boolean; months: { month: number; hdd: number; cdd: number }[] | null } | null;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

function Panel({ station, defaultStart, defaultEnd, defaultYear }: { station: string; defaultStart: string; defaultEnd: string; defaultYear: number }) {
  const [unit, setUnit] = useState<'F' | 'C'>('F');
  const [base, setBase] = useState('65');
  const [start, setStart] = useState(defaultStart);
  const [end, setEnd] = useState(defaultEnd);
  const [year, setYear] = useState(defaultYear);
  const baseNum = Number(base);
  const valid = base.trim() !== '' && Number.isFinite(baseNum) && start <= end;
  const period = useQuery({
    queryKey: ['dd', station, start, end, base, unit],
    enabled: valid,
    queryFn: () => api<Period>(`/api/weather/degree-days?station=${station}&start=${start}&end=${end}&base=${baseNum}&unit=${unit}`),
  });
  const monthly = useQuery({
    queryKey: ['ddm', station, year, base, unit],
    enabled: valid,
    queryFn: () => api<Monthly>(`/api/weather/degree-days?station=${station}&year=${year}&base=${baseNum}&unit=${unit}`),
  });
  const dd = `°${unit}·days`;
  return (
    <section className="card space-y-4" aria-labelledby="dd-heading">
      <h2 id="dd-heading">Degree days</h2>
      <div className="flex flex-wrap items-end gap-3">
        <div><label htmlFor="dd-base" className="field-label">Base temperature</label><input id="dd-base" inputMode="decimal" className="field-input w-24 figure" value={base} onChange={(e) => setBase(e.target.value)} aria-invalid={!valid} /></div>
        <fieldset className="flex gap-3 pb-2 text-sm"><legend className="sr-only">Unit</legend>
          <label className="flex items-center gap-1"><input type="radio" name="dd-unit" checked={unit === 'F'} onChange={() => { setUnit('F'); setBase('65'); }} /> °F</label>
          <label className="flex items-center gap-1"><input type="radio" name="dd-unit" checked={unit === 'C'} onChange={() => { setUnit('C'); setBase('18.3'); }} /> °C</label>
        </fieldset>
        <div><label htmlFor="dd-start" className="field-label">Period from</label><input id="dd-start" type="date" className="field-input" value={start} onChange={(e) => setStart(e.target.value)} /></div>
        <div><label htmlFor="dd-end" className="field-label">to</label><input id="dd-end" type="date" className="field-input" value={end} onChange={(e) => setEnd(e.target.value)} /></div>
      </div>
      <p className="field-hint">Daily mean = (Tmax + Tmin) / 2; HDD = max(0, base − mean), CDD = max(0, mean − base). Per day = total ÷ days in the period. US convention: base 65 °F (18.3 °C).</p>
      {!valid && <p className="field-error">Enter a base temperature and a period whose end is not before its start.</p>}
      {period.isPending && valid && <p role="status">Computing…</p>}
      {period.isError && <p className="notice-error" role="alert">{(period.error as Error).message}</p>}
      {period.data && (
        <dl className="grid gap-3 sm:grid-cols-4" aria-live="polite">
          <div className="rounded-md border border-ink-200 p-3"><dt className="text-xs text-ink-500">HDD in the period</dt><dd className="figure text-xl">{formatNumber(period.data.hdd.total, 1)}</dd><dd className="figure text-xs text-ink-500">{formatNumber(period.data.hdd.perDay, 2)} per day</dd></div>
          <div className="rounded-md border border-ink-200 p-3"><dt className="text-xs text-ink-500">CDD in the period</dt><dd className="figure text-xl">{formatNumber(period.data.cdd.total, 1)}</dd><dd className="figure text-xs text-ink-500">{formatNumber(period.data.cdd.perDay, 2)} per day</dd></div>
          <div className="rounded-md border border-ink-200 p-3"><dt className="text-xs text-ink-500">Days with temperature</dt><dd className="figure text-xl">{formatNumber(period.data.coverage * 100, 1)} %</dd><dd className="text-xs text-ink-500">{period.data.sufficient ? 'enough for a bill period (≥ 90 %)' : 'below the 90 % a bill period needs'}</dd></div>
          <div className="rounded-md border border-ink-200 p-3"><dt className="text-xs text-ink-500">Normal year</dt><dd className="figure text-xl">{formatNumber(period.data.normalYear.hdd, 0)} HDD</dd><dd className="figure text-xs text-ink-500">{formatNumber(period.data.normalYear.cdd, 0)} CDD · {period.data.normalYear.years} complete years{period.data.normalYear.years ? ` (${period.data.normalYear.firstYear}–${period.data.normalYear.lastYear})` : ''}</dd></div>
        </dl>
      )}
      <div className="flex items-end gap-2">
        <div><label htmlFor="dd-year" className="field-label">Month by month, year</label><input id="dd-year" type="number" className="field-input w-28 figure" value={year} min={1900} max={2100} onChange={(e) => setYear(Number(e.target.value))} /></div>
      </div>
      {monthly.data && (
        <div className="overflow-x-auto">
          <table className="data-table">
            <caption className="sr-only">Degree days per month of {year} at base {base} °{unit}, beside the normal year</caption>
            <thead><tr><th scope="col">Month</th><th scope="col" className="text-right">HDD {year}</th><th scope="col" className="text-right">HDD normal</th><th scope="col" className="text-right">CDD {year}</th><th scope="col" className="text-right">CDD normal</th><th scope="col" className="text-right">Days with data</th></tr></thead>
            <tbody>
              {monthly.data.months.map((m) => {
                const n = monthly.data.normal?.months?.[m.month - 1];
                return (
                  <tr key={m.month}>
                    <th scope="row" className="font-normal">{MONTHS[m.month - 1]}</th>
                    <td className="figure text-right">{formatNumber(m.hdd, 0)}</td>
                    <td className="figure text-right text-ink-500">{formatNumber(n?.hdd, 0)}</td>
                    <td className="figure text-right">{formatNumber(m.cdd, 0)}</td>
                    <td className="figure text-right text-ink-500">{formatNumber(n?.cdd, 0)}</td>
                    <td className="figure text-right">{formatNumber(m.coverage * 100, 0)} %</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <p className="mt-1 text-xs text-ink-500">Units: {dd}. {monthly.data.normal?.fewYears ? 'The normal year rests on fewer than 10 complete years.' : ''}</p>
        </div>
      )}
    </section>
  );
}

export default function DegreeDays(props: { station: string; defaultStart: string; defaultEnd: string; defaultYear: number }) {
  return (
    <QueryProvider>
      <Panel {...props} />
    </QueryProvider>
  );
}
