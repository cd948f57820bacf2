/**
 * The walkthroughs page: the list filtered by status and installation, the roll-up of measures per
 * installation, the discount rate, and the field calculators on their own.
 */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { COMMODITY_LABELS } from '../../lib/domain';
import { WALKTHROUGH_STATUSES } from '../../lib/field/walkthrough-form';
import { formatDate, formatMoney, formatNumber } from '../../lib/format';
import CalculatorsPanel from '../calculators/CalculatorsPanel';
import type { InstallationRollup } from '../../server/measures/rollup';
import type { WalkthroughListItem } from '../../server/walkthroughs/service';
import { api } from '../ui/api';
import { QueryProvider } from '../ui/query';
import { DiscountRateCard } from './DiscountRate';
import { MEASURE_BADGE, WALKTHROUGH_BADGE } from './labels';

type Item = WalkthroughListItem;
type Rollup = InstallationRollup;

const STATUS_FILTERS = [
  { value: 'planned,in-progress', label: 'Planned or in progress' },
  { value: '', label: 'All' },
  ...WALKTHROUGH_STATUSES.map((s) => ({ value: s, label: WALKTHROUGH_BADGE[s].label.replace(/^./, (c) => c.toUpperCase()) })),
];

function Rollups({ installation }: { installation: string }) {
  const q = useQuery({ queryKey: ['rollup', installation], queryFn: () => api<{ items: Rollup[] }>(`/api/measures/rollup${installation ? `?installation=${installation}` : ''}`) });
  if (q.isPending) return <p role="status">Adding up the measures…</p>;
  if (q.isError) return <p className="notice-error" role="alert">{(q.error as Error).message}</p>;
  const rows = q.data.items.filter((r) => r.measures.count > 0 || Object.values(r.walkthroughs).some((n) => n > 0));
  if (rows.length === 0) return <p className="text-sm text-ink-600">No walkthroughs yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="data-table" data-testid="rollup">
        <caption className="sr-only">Walkthroughs and measures per installation</caption>
        <thead>
          <tr>
            <th scope="col">Installation</th>
            <th scope="col">Walkthroughs</th>
            <th scope="col">Measures</th>
            <th scope="col" className="text-right">Savings $/yr</th>
            <th scope="col" className="text-right">Net cost</th>
            <th scope="col" className="text-right">Payback</th>
            <th scope="col">Saves per year</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.installationCode}>
              <th scope="row" className="figure font-normal">{r.installationCode}</th>
              <td className="text-xs">{WALKTHROUGH_STATUSES.filter((s) => r.walkthroughs[s] > 0).map((s) => `${r.walkthroughs[s]} ${WALKTHROUGH_BADGE[s].label}`).join(', ') || '—'}</td>
              <td className="text-xs">{(['proposed', 'approved', 'implemented', 'rejected'] as const).filter((s) => r.measures.byStatus[s] > 0).map((s) => `${r.measures.byStatus[s]} ${MEASURE_BADGE[s].label}`).join(', ') || '—'}</td>
              <td className="figure text-right">{formatMoney(r.measures.inPlay.annualCostSavings.total)}</td>
              <td className="figure text-right">{formatMoney(r.measures.inPlay.netInvestment)}</td>
              <td className="figure text-right">{r.measures.inPlay.simplePaybackYears === null ? '—' : `${formatNumber(r.measures.inPlay.simplePaybackYears, 1)} yr`}</td>
              <td className="text-xs">{r.measures.inPlay.savings.map((l) => `${formatNumber(l.quantity)} ${l.unit} ${COMMODITY_LABELS[l.commodity].toLowerCase()}`).join(', ') || '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-ink-500">Totals of proposed, approved and implemented measures; payback = net cost ÷ annual savings, undiscounted (10 CFR 436.23).</p>
    </div>
  );
}

function Desk({ installations, canPlan, canEditRate }: { installations: { code: string; name: string }[]; canPlan: boolean; canEditRate: boolean }) {
  const [status, setStatus] = useState('planned,in-progress');
  const [installation, setInstallation] = useState('');
  const params = new URLSearchParams();
  if (status) params.set('status', status);
  if (installation) params.set('installation', installation);
  const list = useQuery({ queryKey: ['walkthroughs', params.toString()], queryFn: () => api<{ items: Item[] }>(`/api/walkthroughs?${params}`) });
  return (
    <div className="space-y-6">
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        <section className="card space-y-4 p-4 sm:p-5" aria-labelledby="list-h">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h2 id="list-h">Walkthroughs</h2>
            {canPlan && <a className="btn-primary min-h-11" href="/walkthroughs/new">Plan a walkthrough</a>}
          </div>
          <div className="flex flex-wrap gap-3" role="search">
            <div>
              <label htmlFor="f-status" className="field-label">Status</label>
              <select id="f-status" className="field-input min-h-11" value={status} onChange={(e) => setStatus(e.target.value)}>
                {STATUS_FILTERS.map((s) => <option key={s.value} value={s.value}>{s.label}</option>)}
              </select>
            </div>
            {installations.length > 1 && (
              <div>
                <label htmlFor="f-inst" className="field-label">Installation</label>
                <select id="f-inst" className="field-input min-h-11" value={installation} onChange={(e) => setInstallation(e.target.value)}>
                  <option value="">All</option>
                  {installations.map((i) => <option key={i.code} value={i.code}>{i.code} · {i.name}</option>)}
                </select>
              </div>
            )}
          </div>
          {list.isPending && <p role="status">Loading the walkthroughs…</p>}
          {list.isError && <p className="notice-error" role="alert">{(list.error as Error).message}</p>}
          {list.data && list.data.items.length === 0 && <p className="notice-info">No walkthrough matches.{canPlan ? ' Plan one from a flagged building.' : ''}</p>}
          {list.data && list.data.items.length > 0 && (
            <ul className="divide-y divide-ink-100" data-testid="walkthrough-list">
              {list.data.items.map((w) => (
                <li key={w.id} className="py-3">
                  <div className="flex flex-wrap items-start justify-between gap-2">
                    <div className="min-w-0">
                      <a href={`/walkthroughs/${w.id}`} className="font-medium">{w.title}</a>
                      <p className="text-sm text-ink-600">
                        <span className="figure">{w.installationCode} {w.buildingNumber}</span> {w.buildingName} · {formatDate(w.plannedOn)} · {w.auditor?.name ?? 'no auditor yet'}
                      </p>
                      <p className="text-xs text-ink-500">
                        {w.progress.completed}/{w.progress.total} sections · {w.findings} finding{w.findings === 1 ? '' : 's'} · {w.measures} measure{w.measures === 1 ? '' : 's'}
                        {w.loan && <> · kit <span className="figure">{w.loan.kitCode}</span> ({w.loan.status})</>}
                      </p>
                    </div>
                    <span className={`badge ${WALKTHROUGH_BADGE[w.status].cls}`}>{WALKTHROUGH_BADGE[w.status].label}</span>
                  </div>
                </li>
              ))}
            </ul>
          )}
        </section>
        <DiscountRateCard canEdit={canEditRate} />
      </div>
      <section className="card space-y-3 p-4 sm:p-5" aria-labelledby="rollup-h">
        <h2 id="rollup-h">Measures by installation</h2>
        <Rollups installation={installation} />
      </section>
      <CalculatorsPanel />
    </div>
  );
}

export default function WalkthroughDesk(props: { installations: { code: string; name: string }[]; canPlan: boolean; canEditRate: boolean }) {
  return (
    <QueryProvider>
      <Desk {...props} />
    </QueryProvider>
  );
}
