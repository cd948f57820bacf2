/**
 * A kit's instruments: what each is, its calibration and condition in words, the hazards it
 * brings, its history on request; for custodians, edit and retire.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { formatDate } from '../../lib/format';
import { INSTRUMENT_LABELS, type InstrumentType } from '../../lib/field/instruments';
import { hazardsForInstrument } from '../../lib/field/safety';
import { api, ApiError } from '../ui/api';
import { CalibrationBadge, ConditionBadge } from './Badges';
import { InstrumentForm } from './InstrumentForm';
import type { HistoryEntry, Instrument } from './types';

function History({ id }: { id: string }) {
  const q = useQuery({ queryKey: ['instrument', id], queryFn: () => api<{ history: HistoryEntry[] }>(`/api/instruments/${id}`) });
  if (q.isPending) return <p role="status" className="text-sm">Loading the history…</p>;
  if (q.isError) return <p className="field-error" role="alert">{(q.error as Error).message}</p>;
  if (q.data.history.length === 0) return <p className="text-sm text-ink-600">Nothing recorded yet.</p>;
  return (
    <ol className="mt-2 space-y-1 border-l-2 border-ink-200 pl-3 text-sm" aria-label="History, newest first" data-testid="instrument-history">
      {q.data.history.map((h, k) => (
        <li key={k}>
          <time dateTime={h.at} className="figure text-xs text-ink-500">{formatDate(h.at)}</time> {h.text}
          {h.by && <span className="text-xs text-ink-500"> — {h.by}</span>}
        </li>
      ))}
    </ol>
  );
}

function Retire({ instrument, onClose }: { instrument: Instrument; onClose: () => void }) {
  const qc = useQueryClient();
  const retire = useMutation({
    mutationFn: () => api(`/api/instruments/${instrument.id}`, { method: 'PATCH', body: { condition: 'retired', kitId: null } }),
    onSuccess: async () => {
      await qc.invalidateQueries();
      onClose();
    },
  });
  return (
    <div className="mt-2 space-y-2 rounded-md border border-brick-600/30 bg-brick-soft p-3 text-sm" role="group" aria-label="Retire the instrument">
      <p>Retire it and take it out of the kit? It stays in the records with its history.</p>
      {retire.isError && <p className="field-error" role="alert">{retire.error instanceof ApiError ? retire.error.message : String(retire.error)}</p>}
      <div className="flex gap-2">
        <button type="button" className="btn-danger" autoFocus disabled={retire.isPending} onClick={() => retire.mutate()}>Retire</button>
        <button type="button" className="btn-secondary" onClick={onClose}>Keep it</button>
      </div>
    </div>
  );
}

function Row({ instrument: i, canManage }: { instrument: Instrument; canManage: boolean }) {
  const [mode, setMode] = useState<'none' | 'history' | 'edit' | 'retire'>('none');
  const label = INSTRUMENT_LABELS[i.type as InstrumentType] ?? i.type;
  const hazards = hazardsForInstrument(i.type as InstrumentType);
  const toggle = (m: typeof mode) => setMode(mode === m ? 'none' : m);
  return (
    <li className="py-3" data-testid="instrument">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0">
          <p className="font-medium">{label} {hazards.length > 0 && <a href="#kit-safety" className="badge border border-amber-400 bg-amber-soft text-amber-ink no-underline" title={hazards.map((h) => h.title).join('; ')}><span aria-hidden="true">⚠&nbsp;</span>cautions</a>}</p>
          <p className="text-sm text-ink-600">{i.model || 'Model not recorded'} · serial <span className="figure">{i.serial}</span></p>
          {i.notes && <p className="text-sm text-ink-600">{i.notes}</p>}
        </div>
        <div className="flex flex-wrap gap-1">
          <CalibrationBadge due={i.calibrationDue} status={i.calibration} />
          <ConditionBadge condition={i.condition} />
        </div>
      </div>
      <div className="mt-1 flex flex-wrap gap-3 text-sm">
        <button type="button" className="text-line-700 underline" aria-expanded={mode === 'history'} onClick={() => toggle('history')}>History<span className="sr-only"> of {label} {i.serial}</span></button>
        {canManage && <button type="button" className="text-line-700 underline" aria-expanded={mode === 'edit'} onClick={() => toggle('edit')}>Edit<span className="sr-only"> {label} {i.serial}</span></button>}
        {canManage && i.condition !== 'retired' && <button type="button" className="text-brick-ink underline" aria-expanded={mode === 'retire'} onClick={() => toggle('retire')}>Retire<span className="sr-only"> {label} {i.serial}</span></button>}
      </div>
      {mode === 'history' && <History id={i.id} />}
      {mode === 'edit' && <InstrumentForm instrument={i} kitId={i.kitId} onDone={() => setMode('none')} onCancel={() => setMode('none')} />}
      {mode === 'retire' && <Retire instrument={i} onClose={() => setMode('none')} />}
    </li>
  );
}

export function InstrumentList({ instruments, canManage, kitId }: { instruments: Instrument[]; canManage: boolean; kitId: string }) {
  const [adding, setAdding] = useState(false);
  return (
    <div>
      {instruments.length === 0 ? (
        <p className="text-sm text-ink-600">No instruments in this kit yet.{canManage ? ' Add the first one below.' : ''}</p>
      ) : (
        <ul className="divide-y divide-ink-100" aria-label="Instruments in the kit">
          {instruments.map((i) => <Row key={i.id} instrument={i} canManage={canManage} />)}
        </ul>
      )}
      {canManage && (adding ? <InstrumentForm instrument={null} kitId={kitId} onDone={() => setAdding(false)} onCancel={() => setAdding(false)} /> : <button type="button" className="btn-secondary mt-3" onClick={() => setAdding(true)}>Add an instrument</button>)}
    </div>
  );
}
