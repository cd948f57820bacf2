/**
 * The Kit library page: find a kit free for given dates (and holding a given instrument), the
 * kits with their instruments and calibration, loans (the custodian's queue, the viewer's own),
 * and for custodians a new kit and the instruments that need attention.
 */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { INSTRUMENT_LABELS, INSTRUMENT_TYPES } from '../../lib/field/instruments';
import { checkLoanDates } from '../../lib/kits/loan-dates';
import { api } from '../ui/api';
import { QueryProvider } from '../ui/query';
import { AttentionPanel } from './AttentionPanel';
import { KitCards } from './KitCards';
import { KitForm } from './KitForm';
import { LoanBoard } from './LoanBoard';
import type { KitSummary, Viewer } from './types';

function Library({ viewer }: { viewer: Viewer }) {
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const [type, setType] = useState('');
  const [creating, setCreating] = useState(false);
  const range = from && to ? checkLoanDates({ start: from, end: to }, viewer.today, false) : null;
  const usable = range?.ok === true;
  const query = useQuery({
    queryKey: ['kits', usable ? `${from}..${to}` : ''],
    queryFn: () => api<{ items: KitSummary[] }>(`/api/kits${usable ? `?from=${from}&to=${to}` : ''}`),
  });
  const kits = (query.data?.items ?? []).filter((k) => !type || k.instrumentTypes.includes(type));
  const free = kits.filter((k) => k.available).length;

  return (
    <div className="space-y-6">
      <section className="card space-y-3" aria-labelledby="find-heading">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="find-heading">Find a kit</h2>
          {viewer.canManageKits && !creating && <button type="button" className="btn-primary" onClick={() => setCreating(true)}>New kit</button>}
        </div>
        {creating && (
          <div className="rounded-md border border-ink-200 bg-ink-50 p-4">
            <h3 className="mb-2 font-semibold">New kit</h3>
            <KitForm kit={null} onDone={(k) => (window.location.href = `/kits/${k.id}`)} onCancel={() => setCreating(false)} />
          </div>
        )}
        <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Kits free for dates">
          <div>
            <label htmlFor="find-from" className="field-label">Needed from</label>
            <input id="find-from" type="date" className="field-input figure" value={from} onChange={(e) => setFrom(e.target.value)} />
          </div>
          <div>
            <label htmlFor="find-to" className="field-label">to (inclusive)</label>
            <input id="find-to" type="date" className="field-input figure" min={from || undefined} value={to} aria-invalid={range?.ok === false} aria-describedby={range?.ok === false ? 'find-error' : undefined} onChange={(e) => setTo(e.target.value)} />
          </div>
          <div>
            <label htmlFor="find-type" className="field-label">With an instrument</label>
            <select id="find-type" className="field-input" value={type} onChange={(e) => setType(e.target.value)}>
              <option value="">Any</option>
              {INSTRUMENT_TYPES.map((t) => <option key={t} value={t}>{INSTRUMENT_LABELS[t]}</option>)}
            </select>
          </div>
          {(from || to || type) && <button type="button" className="btn-secondary" onClick={() => { setFrom(''); setTo(''); setType(''); }}>Clear</button>}
        </div>
        {range && !range.ok && <p id="find-error" className="field-error" role="alert">{range.message}</p>}
        {usable && query.data && <p className="text-sm text-ink-700" role="status">{free} of {kits.length} kit{kits.length === 1 ? '' : 's'} free for these dates.</p>}
      </section>

      <section aria-labelledby="kits-heading" className="space-y-3">
        <h2 id="kits-heading">Kits</h2>
        {query.isPending && <p role="status" className="card">Loading the kits…</p>}
        {query.isError && <p className="notice-error" role="alert">{(query.error as Error).message}</p>}
        {query.data && query.data.items.length === 0 && (
          <p className="notice-info">The library has no kits yet.{viewer.canManageKits ? ' Create the first with “New kit”, then add its instruments.' : ' The kit custodian adds them.'}</p>
        )}
        {query.data && query.data.items.length > 0 && kits.length === 0 && <p className="notice-info">No kit holds that instrument.</p>}
        {kits.length > 0 && <KitCards kits={kits} today={viewer.today} />}
      </section>

      <LoanBoard viewer={viewer} />
      {viewer.canManageKits && <AttentionPanel />}
    </div>
  );
}

export default function KitLibrary({ viewer }: { viewer: Viewer }) {
  return (
    <QueryProvider>
      <Library viewer={viewer} />
    </QueryProvider>
  );
}
