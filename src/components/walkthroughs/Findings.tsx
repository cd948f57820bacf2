/**
 * Findings of a walkthrough: what was seen (title, category, location, description, photos), each
 * possibly priced as a measure; a calculator result can start a finding or be added to one.
 */
import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { FINDING_CATEGORIES, FINDING_CATEGORY_LABELS, type FindingCategory } from '../../lib/field/walkthrough-form';
import { findingInputSchema } from '../../lib/field/walkthrough-api';
import type { FindingItem } from '../../server/walkthroughs/findings';
import { api, ApiError } from '../ui/api';
import { SelectInput, TextInput } from './inputs';
import { MeasureForm, type Rate } from './MeasureForm';
import { PhotoThumb, type Photo } from './Photos';

export type Finding = FindingItem;

const CATEGORY_CHOICES = FINDING_CATEGORIES.map((c) => ({ value: c, label: FINDING_CATEGORY_LABELS[c] }));
type Draft = { title: string; category: FindingCategory | null; location: string; description: string };

function FindingEditor({ initial, submitLabel, onSubmit, onCancel, busy, serverErrors }: { initial: Draft; submitLabel: string; onSubmit: (d: Draft) => void; onCancel: () => void; busy: boolean; serverErrors: Record<string, string> }) {
  const [d, setD] = useState<Draft>(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const all = { ...serverErrors, ...errors };
  return (
    <form
      className="space-y-3"
      noValidate
      aria-label={submitLabel}
      onSubmit={(e) => {
        e.preventDefault();
        const r = findingInputSchema.safeParse({ ...d, category: d.category ?? undefined });
        if (!r.success) return setErrors(Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message])));
        setErrors({});
        onSubmit(d);
      }}
    >
      <div className="grid gap-3 sm:grid-cols-2">
        <TextInput label="Title" value={d.title} error={all.title} onChange={(title) => setD({ ...d, title })} />
        <SelectInput label="Category" value={d.category} choices={CATEGORY_CHOICES} error={all.category} onChange={(category) => setD({ ...d, category })} />
        <TextInput label="Location" value={d.location} error={all.location} onChange={(location) => setD({ ...d, location })} />
      </div>
      <TextInput label="Description" long value={d.description} error={all.description} onChange={(description) => setD({ ...d, description })} />
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary min-h-11" disabled={busy}>{submitLabel}</button>
        <button type="button" className="btn-secondary min-h-11" onClick={onCancel}>Cancel</button>
      </div>
    </form>
  );
}

export function Findings(props: {
  walkthroughId: string;
  findings: Finding[];
  photos: Photo[];
  canEdit: boolean;
  canPrice: boolean;
  canApprove: boolean;
  canImplement: boolean;
  rate: Rate | null;
  pendingText: string | null;
  onPendingDone: () => void;
  onChange: () => void;
}) {
  const { findings, canEdit } = props;
  const [adding, setAdding] = useState<Draft | null>(null);
  const [editing, setEditing] = useState<string | null>(null);
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [appendTo, setAppendTo] = useState('');
  const fail = (e: unknown) => {
    if (e instanceof ApiError) setServerErrors(e.fields);
    setError((e as Error).message);
  };
  const create = useMutation({
    mutationFn: (d: Draft) => api(`/api/walkthroughs/${props.walkthroughId}/findings`, { method: 'POST', body: d }),
    onSuccess: () => { setAdding(null); setError(null); props.onChange(); },
    onError: fail,
  });
  const patch = useMutation({
    mutationFn: ({ id, body }: { id: string; body: Record<string, unknown> }) => api(`/api/findings/${id}`, { method: 'PATCH', body }),
    onSuccess: () => { setEditing(null); setError(null); props.onChange(); },
    onError: fail,
  });
  const remove = useMutation({
    mutationFn: (id: string) => api(`/api/findings/${id}`, { method: 'DELETE' }),
    onSuccess: props.onChange,
    onError: fail,
  });
  const pending = props.pendingText;
  return (
    <section className="card space-y-4 p-4 sm:p-5" aria-labelledby="findings-h">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="findings-h">Findings <span className="text-sm font-normal text-ink-600">({findings.length})</span></h2>
        {canEdit && !adding && <button type="button" className="btn-primary min-h-11" onClick={() => setAdding({ title: '', category: null, location: '', description: '' })}>Add a finding</button>}
      </div>
      {pending && canEdit && (
        <div className="notice-info space-y-2" role="status">
          <p className="font-medium">A calculator result is ready to go into a finding.</p>
          <pre className="whitespace-pre-wrap font-mono text-xs">{pending}</pre>
          <div className="flex flex-wrap items-end gap-2">
            <button type="button" className="btn-primary min-h-11" onClick={() => { setAdding({ title: pending.split('\n')[0]!, category: null, location: '', description: pending }); props.onPendingDone(); }}>Start a new finding with it</button>
            {findings.length > 0 && (
              <>
                <div>
                  <label htmlFor="append-to" className="field-label">or add it to</label>
                  <select id="append-to" className="field-input min-h-11" value={appendTo} onChange={(e) => setAppendTo(e.target.value)}>
                    <option value="">Choose a finding…</option>
                    {findings.map((f) => <option key={f.id} value={f.id}>{f.title}</option>)}
                  </select>
                </div>
                <button type="button" className="btn-secondary min-h-11" disabled={!appendTo} onClick={() => { const f = findings.find((x) => x.id === appendTo)!; patch.mutate({ id: f.id, body: { description: `${f.description}${f.description ? '\n\n' : ''}${pending}` } }); props.onPendingDone(); }}>Add it</button>
              </>
            )}
            <button type="button" className="btn-secondary min-h-11" onClick={props.onPendingDone}>Dismiss</button>
          </div>
        </div>
      )}
      {adding && <FindingEditor initial={adding} submitLabel="Save the finding" busy={create.isPending} serverErrors={serverErrors} onCancel={() => setAdding(null)} onSubmit={(d) => create.mutate(d)} />}
      {error && <p className="notice-error" role="alert">{error}</p>}
      {findings.length === 0 && !adding && <p className="text-sm text-ink-600">No findings yet.</p>}
      <ul className="space-y-3">
        {findings.map((f) => (
          <li key={f.id} className={`space-y-2 rounded-md border border-ink-200 p-3 ${f.status === 'dismissed' ? 'opacity-70' : ''}`} data-testid="finding">
            {editing === f.id ? (
              <FindingEditor initial={f} submitLabel="Save changes" busy={patch.isPending} serverErrors={serverErrors} onCancel={() => setEditing(null)} onSubmit={(d) => patch.mutate({ id: f.id, body: d })} />
            ) : (
              <>
                <div className="flex flex-wrap items-start justify-between gap-2">
                  <div>
                    <h3 className="font-semibold">{f.title}</h3>
                    <p className="text-sm text-ink-600">{FINDING_CATEGORY_LABELS[f.category]}{f.location ? ` · ${f.location}` : ''}{f.status === 'dismissed' ? ' · dismissed' : ''}</p>
                  </div>
                  {canEdit && (
                    <div className="flex gap-3 text-sm">
                      <button type="button" className="text-line-700 underline" onClick={() => setEditing(f.id)}>edit<span className="sr-only"> {f.title}</span></button>
                      <button type="button" className="text-line-700 underline" onClick={() => patch.mutate({ id: f.id, body: { status: f.status === 'open' ? 'dismissed' : 'open' } })}>{f.status === 'open' ? 'dismiss' : 'reopen'}<span className="sr-only"> {f.title}</span></button>
                      {(!f.measure || f.measure.status === 'proposed' || f.measure.status === 'rejected') && <button type="button" className="text-brick-ink underline" onClick={() => window.confirm(`Delete the finding “${f.title}”${f.measure ? ' and its measure' : ''}?`) && remove.mutate(f.id)}>delete<span className="sr-only"> {f.title}</span></button>}
                    </div>
                  )}
                </div>
                {f.description && <p className="whitespace-pre-line text-sm text-ink-800">{f.description}</p>}
                {f.photoIds.length > 0 && (
                  <div className="flex flex-wrap gap-2">
                    {f.photoIds.map((id) => props.photos.find((p) => p.id === id)).filter((p): p is Photo => !!p).map((p) => <PhotoThumb key={p.id} photo={p} size="h-16 w-16" />)}
                  </div>
                )}
                <MeasureForm findingId={f.id} measure={f.measure} rate={props.rate} canEdit={props.canPrice} canApprove={props.canApprove} canImplement={props.canImplement} onChange={props.onChange} />
              </>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
