/**
 * The Shortlist screen: buildings ranked by audit priority with the reasons, the weights of the
 * terms (editable by the regional manager), filters, a sortable list that stays smooth with
 * 10,000 rows, and "flag for a walkthrough".
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useVirtualizer } from '@tanstack/react-virtual';
import { useMemo, useRef, useState } from 'react';
import { PRIORITY_TERMS, PRIORITY_TERM_LABELS, type PriorityTerm } from '../../lib/benchmark/priority-weights';
import type { PriorityBreakdown } from '../../lib/benchmark/priority-breakdown';
import type { ShortlistItem } from '../../lib/benchmark/shortlist-item';
import { COMMODITIES, COMMODITY_LABELS, USE_TYPES, USE_TYPE_LABELS, type UseType } from '../../lib/domain';
import { formatDate, formatMoney, formatNumber } from '../../lib/format';
import { api, ApiError } from '../ui/api';
import { QueryProvider } from '../ui/query';
import { ShortlistChart } from './ShortlistChart';

type Weights = Record<PriorityTerm, number>;
type Item = ShortlistItem;
type Term = PriorityBreakdown['terms'][number];
interface Answer { items: Item[]; total: number; weights: Weights; asOf: string }

type SortKey = 'rank' | 'euiNormalized' | 'excessKbtu' | 'excessCost' | 'wui' | 'areaFt2' | 'lastEvaluatedOn';
const SORTS: [SortKey, string][] = [
  ['rank', 'Rank'],
  ['euiNormalized', 'Normalized EUI'],
  ['excessKbtu', 'Excess kBtu/yr'],
  ['excessCost', 'Excess $/yr'],
  ['wui', 'WUI'],
  ['areaFt2', 'Floor area'],
  ['lastEvaluatedOn', 'Last evaluated'],
];

function WeightsPanel({ weights, editable, onSaved }: { weights: Weights; editable: boolean; onSaved: () => void }) {
  const [draft, setDraft] = useState<Weights>(weights);
  const [error, setError] = useState<string | null>(null);
  const save = useMutation({
    mutationFn: () => api('/api/shortlist/weights', { method: 'PUT', body: draft }),
    onSuccess: onSaved,
    onError: (e) => setError(e instanceof ApiError ? e.message : String(e)),
  });
  const total = PRIORITY_TERMS.reduce((s, t) => s + (draft[t] || 0), 0);
  return (
    <section className="card space-y-3" aria-labelledby="weights-heading">
      <h2 id="weights-heading">Weights</h2>
      <p className="text-xs text-ink-600">Each term is scaled 0–1 across the buildings, then weighted; a score is out of 100. Weights are shares of their sum.</p>
      <div className="space-y-2">
        {PRIORITY_TERMS.map((t) => (
          <div key={t} className="grid grid-cols-[1fr_5rem] items-center gap-2">
            <label htmlFor={`w-${t}`} className="text-sm">{PRIORITY_TERM_LABELS[t]} <span className="figure text-xs text-ink-500">{total > 0 ? `${formatNumber((100 * (draft[t] || 0)) / total, 0)} %` : ''}</span></label>
            <input id={`w-${t}`} type="number" min={0} max={1000} step={1} className="field-input figure" disabled={!editable} value={draft[t]} onChange={(e) => setDraft({ ...draft, [t]: Number(e.target.value) })} />
          </div>
        ))}
      </div>
      {editable && (
        <div className="flex gap-2">
          <button type="button" className="btn-primary" disabled={save.isPending || total <= 0} onClick={() => { setError(null); save.mutate(); }}>Save weights</button>
          <button type="button" className="btn-secondary" onClick={() => setDraft(weights)}>Undo changes</button>
        </div>
      )}
      {total <= 0 && <p className="field-error">At least one weight must be above zero.</p>}
      {error && <p className="field-error" role="alert">{error}</p>}
    </section>
  );
}

function FlagDialog({ item, onClose, onDone }: { item: Item; onClose: () => void; onDone: (notified: string[]) => void }) {
  const [reason, setReason] = useState('');
  const flag = useMutation({
    mutationFn: () => api<{ notified: string[] }>('/api/flags', { method: 'POST', body: { buildingId: item.buildingId, reason } }),
    onSuccess: (r) => onDone(r.notified),
  });
  return (
    <div role="dialog" aria-modal="true" aria-labelledby="flag-title" className="fixed inset-0 z-40 flex items-center justify-center bg-ink-900/40 p-4" onKeyDown={(e) => e.key === 'Escape' && onClose()}>
      <div className="card w-full max-w-lg space-y-3">
        <h2 id="flag-title">Flag {item.installationCode} {item.buildingNumber} for a walkthrough</h2>
        <p className="text-sm text-ink-600">The installation's energy staff get a mail with your reason and a link to the building.</p>
        <label htmlFor="flag-reason" className="field-label">Reason</label>
        <textarea id="flag-reason" autoFocus rows={3} className="field-input" value={reason} onChange={(e) => setReason(e.target.value)} />
        {flag.isError && <p className="field-error" role="alert">{(flag.error as Error).message}</p>}
        <div className="flex gap-2">
          <button type="button" className="btn-primary" disabled={reason.trim().length < 5 || flag.isPending} onClick={() => flag.mutate()}>Flag it</button>
          <button type="button" className="btn-secondary" onClick={onClose}>Cancel</button>
        </div>
      </div>
    </div>
  );
}

function Desk({ installations, canWeights, canFlag, canPlan }: { installations: { code: string; name: string }[]; canWeights: boolean; canFlag: boolean; canPlan: boolean }) {
  const qc = useQueryClient();
  const [filters, setFilters] = useState({ installation: '', useType: '', commodity: '', minAreaFt2: '', maxAreaFt2: '' });
  const [sort, setSort] = useState<{ key: SortKey; desc: boolean }>({ key: 'rank', desc: false });
  const [open, setOpen] = useState<string | null>(null);
  const [flagging, setFlagging] = useState<Item | null>(null);
  const [notice, setNotice] = useState<{ text: string; buildingId: string } | null>(null);
  const params = new URLSearchParams({ limit: '20000', explain: '25' });
  for (const [k, v] of Object.entries(filters)) if (v) params.set(k, v);
  const query = useQuery({ queryKey: ['shortlist', params.toString()], queryFn: () => api<Answer>(`/api/shortlist?${params}`) });
  const detail = useQuery({
    queryKey: ['shortlist-entry', open],
    enabled: !!open,
    queryFn: () => api<{ rank: number; of: number; score: number; breakdown: { terms: Term[]; explanation: string[] } }>(`/api/shortlist/${open}`),
  });
  const rows = useMemo(() => {
    const items = [...(query.data?.items ?? [])];
    const val = (i: Item) => (sort.key === 'lastEvaluatedOn' ? (i.lastEvaluatedOn ?? '0000') : (i[sort.key] ?? -Infinity));
    items.sort((a, b) => (val(a) < val(b) ? -1 : val(a) > val(b) ? 1 : a.rank - b.rank) * (sort.desc ? -1 : 1));
    return items;
  }, [query.data, sort]);
  const parent = useRef<HTMLDivElement>(null);
  const v = useVirtualizer({ count: rows.length, getScrollElement: () => parent.current, estimateSize: () => 48, overscan: 10 });
  const top = (query.data?.items ?? []).slice(0, 20).map((i) => ({
    label: `${i.installationCode} ${i.buildingNumber}`,
    score: i.score,
    points: Object.fromEntries((i.breakdown?.terms ?? []).map((t) => [t.term, t.points])) as Partial<Record<PriorityTerm, number>>,
  }));
  const refresh = () => qc.invalidateQueries({ queryKey: ['shortlist'] });

  return (
    <div className="space-y-6">
      <div className="grid gap-6 xl:grid-cols-[1fr_20rem]">
        <section className="card space-y-3" aria-labelledby="top-heading">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h2 id="top-heading">Top of the list</h2>
            <div className="flex gap-3 text-sm">
              <a href={`/api/shortlist?${new URLSearchParams({ ...Object.fromEntries(params), format: 'csv' })}`}>CSV</a>
              <a href={`/api/shortlist?${new URLSearchParams({ ...Object.fromEntries(params), format: 'xlsx' })}`}>XLSX</a>
              <a href={`/shortlist/print?${new URLSearchParams(Object.fromEntries([...params].filter(([k]) => k in filters)))}`}>Printable report</a>
            </div>
          </div>
          {query.isPending && <p role="status">Ranking…</p>}
          {query.isError && <p className="notice-error" role="alert">{(query.error as Error).message}</p>}
          {query.data && (query.data.items.length === 0 ? <p className="notice-info">No building matches these filters.</p> : <ShortlistChart rows={top} />)}
        </section>
        {query.data && <WeightsPanel key={JSON.stringify(query.data.weights)} weights={query.data.weights} editable={canWeights} onSaved={refresh} />}
      </div>

      <section className="card space-y-3" aria-labelledby="list-heading">
        <h2 id="list-heading">All buildings {query.data && <span className="text-sm font-normal text-ink-600">({formatNumber(query.data.total)})</span>}</h2>
        <div className="flex flex-wrap items-end gap-3" role="search">
          <div><label htmlFor="f-i" className="field-label">Installation</label><select id="f-i" className="field-input" value={filters.installation} onChange={(e) => setFilters({ ...filters, installation: e.target.value })}><option value="">All</option>{installations.map((i) => <option key={i.code} value={i.code}>{i.code}</option>)}</select></div>
          <div><label htmlFor="f-u" className="field-label">Use type</label><select id="f-u" className="field-input" value={filters.useType} onChange={(e) => setFilters({ ...filters, useType: e.target.value })}><option value="">All</option>{USE_TYPES.map((u) => <option key={u} value={u}>{USE_TYPE_LABELS[u]}</option>)}</select></div>
          <div><label htmlFor="f-c" className="field-label">Has commodity</label><select id="f-c" className="field-input" value={filters.commodity} onChange={(e) => setFilters({ ...filters, commodity: e.target.value })}><option value="">Any</option>{COMMODITIES.map((c) => <option key={c} value={c}>{COMMODITY_LABELS[c]}</option>)}</select></div>
          <div><label htmlFor="f-min" className="field-label">Area from (ft²)</label><input id="f-min" inputMode="numeric" className="field-input w-28 figure" value={filters.minAreaFt2} onChange={(e) => setFilters({ ...filters, minAreaFt2: e.target.value.replace(/[^0-9]/g, '') })} /></div>
          <div><label htmlFor="f-max" className="field-label">to (ft²)</label><input id="f-max" inputMode="numeric" className="field-input w-28 figure" value={filters.maxAreaFt2} onChange={(e) => setFilters({ ...filters, maxAreaFt2: e.target.value.replace(/[^0-9]/g, '') })} /></div>
          <div><label htmlFor="f-s" className="field-label">Sort by</label><select id="f-s" className="field-input" value={`${sort.key}:${sort.desc}`} onChange={(e) => { const [k, d] = e.target.value.split(':'); setSort({ key: k as SortKey, desc: d === 'true' }); }}>{SORTS.flatMap(([k, l]) => [<option key={`${k}a`} value={`${k}:false`}>{l} ↑</option>, <option key={`${k}d`} value={`${k}:true`}>{l} ↓</option>])}</select></div>
        </div>
        {notice && <p className="notice-info" role="status">{notice.text}{canPlan && <> <a href={`/walkthroughs/new?building=${notice.buildingId}`}>Plan the walkthrough now</a>.</>}</p>}
        <div role="table" aria-label="Buildings by audit priority" aria-rowcount={rows.length} className="rounded-md border border-ink-200 text-sm">
          <div role="row" className="grid grid-cols-[3.5rem_4rem_1fr_7rem_7rem_8rem_7rem_7rem] gap-x-2 border-b border-ink-200 bg-ink-50 px-3 py-2 text-xs font-semibold uppercase tracking-wide text-ink-600">
            <span role="columnheader">Rank</span><span role="columnheader">Score</span><span role="columnheader">Building</span><span role="columnheader" className="text-right">EUI / peer</span><span role="columnheader" className="text-right">Excess kBtu</span><span role="columnheader" className="text-right">Excess $/yr</span><span role="columnheader">Evaluated</span><span role="columnheader"><span className="sr-only">Actions</span></span>
          </div>
          <div ref={parent} role="rowgroup" className="max-h-[32rem] overflow-auto" tabIndex={0} aria-label="Ranked buildings (scrolls)">
            <div role="presentation" style={{ height: v.getTotalSize(), position: 'relative' }}>
              {v.getVirtualItems().map((vi) => {
                const i = rows[vi.index]!;
                return (
                  <div key={i.buildingId} data-index={vi.index} ref={v.measureElement} role="row" aria-rowindex={vi.index + 1} className="absolute left-0 w-full border-b border-ink-100" style={{ transform: `translateY(${vi.start}px)` }} data-testid="shortlist-row">
                    <div className="grid grid-cols-[3.5rem_4rem_1fr_7rem_7rem_8rem_7rem_7rem] items-center gap-x-2 px-3 py-2">
                      <span role="cell" className="figure">{i.rank}</span>
                      <span role="cell" className="figure">{formatNumber(i.score, 1)}</span>
                      <span role="cell" className="min-w-0">
                        <a href={`/buildings/${i.buildingId}`} className="figure">{i.installationCode} {i.buildingNumber}</a> <span className="text-ink-600">{i.name}</span>
                        <span className="block text-xs text-ink-500">{USE_TYPE_LABELS[i.useType as UseType] ?? i.useType} · {formatNumber(i.areaFt2)} ft²{i.flag && <span className="badge ml-1 bg-brick-soft text-brick-ink">flagged</span>}</span>
                      </span>
                      <span role="cell" className="figure text-right">{formatNumber(i.euiNormalized ?? i.siteEui, 0)}<span className="text-ink-500"> / {formatNumber(i.peerMedian, 0)}</span>{i.euiBasis === 'actual' && <span className="block text-xs text-ink-500">actual</span>}</span>
                      <span role="cell" className="figure text-right">{formatNumber(i.excessKbtu)}</span>
                      <span role="cell" className="figure text-right">{formatMoney(i.excessCost)}</span>
                      <span role="cell">{i.lastEvaluatedOn ? formatDate(i.lastEvaluatedOn).replace(/^\d+ /, '') : 'never'}</span>
                      <span role="cell" className="flex gap-2">
                        <button type="button" className="text-line-700 underline" aria-expanded={open === i.buildingId} onClick={() => setOpen(open === i.buildingId ? null : i.buildingId)}>why<span className="sr-only"> {i.buildingNumber}</span></button>
                        {canFlag && !i.flag && <button type="button" className="text-brick-ink underline" onClick={() => setFlagging(i)}>flag<span className="sr-only"> {i.buildingNumber}</span></button>}
                        {canPlan && i.flag && <a href={`/walkthroughs/new?building=${i.buildingId}`}>plan<span className="sr-only"> a walkthrough of {i.buildingNumber}</span></a>}
                      </span>
                    </div>
                    {open === i.buildingId && (
                      <div className="bg-ink-50 px-3 py-2 text-sm" data-testid="shortlist-why">
                        {detail.isPending && <p role="status">…</p>}
                        {detail.data && (
                          <>
                            <ul className="list-inside list-disc space-y-0.5">{detail.data.breakdown.explanation.map((e) => <li key={e}>{e}</li>)}</ul>
                            <p className="mt-1 text-xs text-ink-500">{detail.data.breakdown.terms.filter((t) => t.points > 0).map((t) => `${PRIORITY_TERM_LABELS[t.term]} ${formatNumber(t.points, 1)} pts`).join(' · ')}</p>
                          </>
                        )}
                      </div>
                    )}
                  </div>
                );
              })}
            </div>
          </div>
        </div>
      </section>
      {flagging && (
        <FlagDialog
          item={flagging}
          onClose={() => setFlagging(null)}
          onDone={(notified) => {
            setNotice({ text: `Building ${flagging.buildingNumber} is flagged. ${notified.length ? `Mail sent to ${notified.join(', ')}.` : 'No installation staff to notify.'}`, buildingId: flagging.buildingId });
            setFlagging(null);
            void refresh();
          }}
        />
      )}
    </div>
  );
}

export default function ShortlistDesk(props: { installations: { code: string; name: string }[]; canWeights: boolean; canFlag: boolean; canPlan?: boolean }) {
  return (
    <QueryProvider>
      <Desk {...props} canPlan={props.canPlan ?? false} />
    </QueryProvider>
  );
}
