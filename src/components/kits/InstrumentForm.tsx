/**
 * Adding or editing an instrument (custodians): type, model, serial, calibration due date,
 * condition, notes and the kit it lives in. Checked with the API's own schema before sending;
 * the server's answer (a serial already in the library, a kit out on loan) shows in place.
 */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { INSTRUMENT_LABELS, INSTRUMENT_TYPES } from '../../lib/field/instruments';
import { CONDITION_LABELS, INSTRUMENT_CONDITIONS } from '../../lib/kits/kit-readiness';
import { instrumentInputSchema } from '../../lib/kits/schemas';
import { api } from '../ui/api';
import { Field, FormError } from '../ui/Field';
import type { Instrument, KitSummary } from './types';
import { useCheckedSave } from './use-checked-save';

type Values = { kitId: string; type: string; model: string; serial: string; calibrationDue: string; condition: string; notes: string };

const fromInstrument = (i: Instrument | null, kitId: string | null): Values => ({
  kitId: i ? (i.kitId ?? '') : (kitId ?? ''),
  type: i?.type ?? '',
  model: i?.model ?? '',
  serial: i?.serial ?? '',
  calibrationDue: i?.calibrationDue ?? '',
  condition: i?.condition ?? 'good',
  notes: i?.notes ?? '',
});

export function InstrumentForm({ instrument, kitId, onDone, onCancel }: { instrument: Instrument | null; kitId: string | null; onDone: () => void; onCancel: () => void }) {
  const [v, setV] = useState<Values>(() => fromInstrument(instrument, kitId));
  const kits = useQuery({ queryKey: ['kits'], queryFn: () => api<{ items: KitSummary[] }>('/api/kits') });
  const body = { ...v, kitId: v.kitId || null, calibrationDue: v.calibrationDue || null };
  const { fieldErrors, error, submit, pending } = useCheckedSave(
    instrumentInputSchema,
    body,
    () => {
      if (!instrument) return api('/api/instruments', { method: 'POST', body });
      const before = fromInstrument(instrument, null);
      const patch = Object.fromEntries(Object.entries(body).filter(([k]) => v[k as keyof Values] !== before[k as keyof Values]));
      return Object.keys(patch).length ? api(`/api/instruments/${instrument.id}`, { method: 'PATCH', body: patch }) : Promise.resolve(null);
    },
    onDone,
  );
  const set = (k: keyof Values) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) => setV({ ...v, [k]: e.target.value });
  const title = instrument ? `Edit ${INSTRUMENT_LABELS[instrument.type as keyof typeof INSTRUMENT_LABELS] ?? instrument.type} ${instrument.serial}` : 'Add an instrument';
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md border border-ink-200 bg-ink-50 p-4" aria-label={title} onKeyDown={(e) => e.key === 'Escape' && onCancel()}>
      <h3 className="font-semibold">{title}</h3>
      <FormError message={error} />
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Field label="Type" required error={fieldErrors.type}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" value={v.type} onChange={set('type')} aria-describedby={describedBy} aria-invalid={invalid} autoFocus>
              <option value="">Choose…</option>
              {INSTRUMENT_TYPES.map((t) => <option key={t} value={t}>{INSTRUMENT_LABELS[t]}</option>)}
            </select>
          )}
        </Field>
        <Field label="Model" error={fieldErrors.model}>
          {({ id, describedBy, invalid }) => <input id={id} className="field-input" value={v.model} onChange={set('model')} aria-describedby={describedBy} aria-invalid={invalid} maxLength={120} />}
        </Field>
        <Field label="Serial number" required error={fieldErrors.serial}>
          {({ id, describedBy, invalid }) => <input id={id} className="field-input figure" value={v.serial} onChange={set('serial')} aria-describedby={describedBy} aria-invalid={invalid} maxLength={60} />}
        </Field>
        <Field label="Calibration due" error={fieldErrors.calibrationDue} hint="The last day it may be used; leave empty for instruments without calibration.">
          {({ id, describedBy, invalid }) => <input id={id} type="date" className="field-input figure" value={v.calibrationDue} onChange={set('calibrationDue')} aria-describedby={describedBy} aria-invalid={invalid} />}
        </Field>
        <Field label="Condition" required error={fieldErrors.condition}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" value={v.condition} onChange={set('condition')} aria-describedby={describedBy} aria-invalid={invalid}>
              {INSTRUMENT_CONDITIONS.map((c) => <option key={c} value={c}>{CONDITION_LABELS[c]}</option>)}
            </select>
          )}
        </Field>
        <Field label="Kit" error={fieldErrors.kitId} hint={kits.isError ? 'The kits could not be listed.' : undefined}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" value={v.kitId} onChange={set('kitId')} aria-describedby={describedBy} aria-invalid={invalid}>
              <option value="">In no kit (on the shelf)</option>
              {kits.data?.items.map((k) => <option key={k.id} value={k.id}>{k.code} · {k.name}{k.active ? '' : ' (out of service)'}</option>)}
              {v.kitId && !kits.data && <option value={v.kitId}>This kit</option>}
            </select>
          )}
        </Field>
      </div>
      <Field label="Notes" error={fieldErrors.notes}>
        {({ id, describedBy, invalid }) => <textarea id={id} rows={2} className="field-input" value={v.notes} onChange={set('notes')} aria-describedby={describedBy} aria-invalid={invalid} maxLength={2000} />}
      </Field>
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={pending}>{pending ? 'Saving…' : instrument ? 'Save changes' : 'Add instrument'}</button>
        <button type="button" className="btn-secondary" onClick={onCancel}>Cancel</button>
      </div>
    </form>
  );
}
