/**
 * For custodians: instruments that need something done — calibration past or due within 30 days,
 * waiting for repair — and instruments on the shelf in no kit; each can be edited here (a new
 * calibration date, a repair done, put in a kit).
 */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { INSTRUMENT_LABELS, type InstrumentType } from '../../lib/field/instruments';
import { api } from '../ui/api';
import { CalibrationBadge, ConditionBadge } from './Badges';
import { InstrumentForm } from './InstrumentForm';
import type { InstrumentListed } from './types';

function Row({ i }: { i: InstrumentListed }) {
  const [editing, setEditing] = useState(false);
  const label = INSTRUMENT_LABELS[i.type as InstrumentType] ?? i.type;
  return (
    <li className="py-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <span>
          <span className="font-medium">{label}</span> <span className="text-ink-600">{i.model} · <span className="figure">{i.serial}</span></span>
          {' · '}{i.kitId ? <a href={`/kits/${i.kitId}`} className="underline">kit {i.kitCode}</a> : <span className="text-ink-600">in no kit</span>}
        </span>
        <span className="flex flex-wrap items-center gap-1">
          <CalibrationBadge due={i.calibrationDue} status={i.calibration} />
          {i.condition !== 'good' && <ConditionBadge condition={i.condition} />}
          <button type="button" className="ml-1 text-line-700 underline" aria-expanded={editing} onClick={() => setEditing(!editing)}>Edit<span className="sr-only"> {label} {i.serial}</span></button>
        </span>
      </div>
      {editing && <InstrumentForm instrument={i} kitId={i.kitId} onDone={() => setEditing(false)} onCancel={() => setEditing(false)} />}
    </li>
  );
}

const Rows = ({ items }: { items: InstrumentListed[] }) => <ul className="divide-y divide-ink-100 text-sm">{items.map((i) => <Row key={i.id} i={i} />)}</ul>;

export function AttentionPanel() {
  const [adding, setAdding] = useState(false);
  const q = useQuery({ queryKey: ['instruments'], queryFn: () => api<{ items: InstrumentListed[] }>('/api/instruments') });
  if (q.isPending) return <p role="status" className="card">Loading instruments…</p>;
  if (q.isError) return <p className="notice-error" role="alert">{(q.error as Error).message}</p>;
  const attention = q.data.items.filter((i) => i.calibration.state === 'past-due' || i.calibration.state === 'due-soon' || i.condition === 'needs-repair');
  const shelf = q.data.items.filter((i) => !i.kitId);
  return (
    <section className="card space-y-3" aria-labelledby="attention-heading" data-testid="attention">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="attention-heading">Calibration and repairs</h2>
        {!adding && <button type="button" className="btn-secondary" onClick={() => setAdding(true)}>Add an instrument</button>}
      </div>
      {adding && <InstrumentForm instrument={null} kitId={null} onDone={() => setAdding(false)} onCancel={() => setAdding(false)} />}
      {q.data.items.length === 0 ? (
        <p className="text-sm text-ink-600">No instruments in the library yet.</p>
      ) : attention.length === 0 ? (
        <p className="text-sm text-ink-600">Every instrument is within calibration for the next 30 days, and none waits for repair.</p>
      ) : (
        <Rows items={attention} />
      )}
      {shelf.length > 0 && (
        <details>
          <summary className="cursor-pointer font-medium">On the shelf, in no kit ({shelf.length})</summary>
          <Rows items={shelf} />
        </details>
      )}
    </section>
  );
}
