import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { USE_TYPES, USE_TYPE_LABELS } from '../../lib/domain';
import { buildingInputSchema } from '../../lib/schemas/inventory';
import { api } from '../ui/api';
import { showApiError } from '../ui/forms';
import { Field, FormError } from '../ui/Field';

// The form edits strings; the shared schema coerces and checks them exactly as the API will.
const formSchema = buildingInputSchema.extend({
  yearBuilt: z.preprocess((v) => (v === '' || v === null ? null : v), buildingInputSchema.shape.yearBuilt),
  occupants: z.preprocess((v) => (v === '' || v === null ? null : v), buildingInputSchema.shape.occupants),
  lastEvaluatedOn: z.preprocess((v) => (v === '' ? null : v), buildingInputSchema.shape.lastEvaluatedOn),
});
type Values = z.input<typeof formSchema>;

interface Props {
  mode: 'create' | 'edit';
  installations: { code: string; name: string }[];
  initial?: Partial<Values> & { id?: string };
}

export default function BuildingForm({ mode, installations, initial }: Props) {
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, setError: setFieldError, formState } = useForm<Values>({
    resolver: zodResolver(formSchema) as never,
    defaultValues: { useType: 'office', notes: '', ...initial },
  });
  const onSubmit = handleSubmit(async (raw) => {
    setError(null);
    const values = formSchema.parse(raw);
    try {
      if (mode === 'create') {
        const r = await api<{ id: string }>('/api/buildings', { method: 'POST', body: values });
        window.location.href = `/buildings/${r.id}`;
      } else {
        const { installation: _i, ...patch } = values;
        await api(`/api/buildings/${initial!.id}`, { method: 'PATCH', body: patch });
        window.location.href = `/buildings/${initial!.id}`;
      }
    } catch (e) {
      showApiError(e, setFieldError, setError);
    }
  });
  const e = formState.errors;
  const msg = (x: { message?: unknown } | undefined) => (typeof x?.message === 'string' ? x.message : undefined);
  return (
    <form onSubmit={onSubmit} noValidate className="card max-w-3xl space-y-4">
      <FormError message={error} />
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Installation" required error={msg(e.installation)}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" disabled={mode === 'edit'} aria-describedby={describedBy} aria-invalid={invalid} {...register('installation')}>
              {installations.map((i) => (
                <option key={i.code} value={i.code}>{i.code} — {i.name}</option>
              ))}
            </select>
          )}
        </Field>
        <Field label="Building number" required error={msg(e.number)}>
          {({ id, describedBy, invalid }) => <input id={id} className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('number')} />}
        </Field>
        <Field label="Use type" required error={msg(e.useType)}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('useType')}>
              {USE_TYPES.map((u) => <option key={u} value={u}>{USE_TYPE_LABELS[u]}</option>)}
            </select>
          )}
        </Field>
      </div>
      <Field label="Name" required error={msg(e.name)}>
        {({ id, describedBy, invalid }) => <input id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('name')} />}
      </Field>
      <div className="grid gap-4 sm:grid-cols-4">
        <Field label="Gross floor area (ft²)" required error={msg(e.grossAreaFt2)}>
          {({ id, describedBy, invalid }) => <input id={id} inputMode="decimal" className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('grossAreaFt2')} />}
        </Field>
        <Field label="Year built" error={msg(e.yearBuilt)}>
          {({ id, describedBy, invalid }) => <input id={id} inputMode="numeric" className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('yearBuilt')} />}
        </Field>
        <Field label="Occupants" error={msg(e.occupants)}>
          {({ id, describedBy, invalid }) => <input id={id} inputMode="numeric" className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('occupants')} />}
        </Field>
        <Field label="Last evaluated" hint="Date of the last walkthrough audit" error={msg(e.lastEvaluatedOn)}>
          {({ id, describedBy, invalid }) => <input id={id} type="date" className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('lastEvaluatedOn')} />}
        </Field>
      </div>
      <Field label="Notes" error={msg(e.notes)}>
        {({ id, describedBy, invalid }) => <textarea id={id} rows={3} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('notes')} />}
      </Field>
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>{mode === 'create' ? 'Create building' : 'Save changes'}</button>
        <a className="btn-secondary" href={mode === 'edit' ? `/buildings/${initial?.id}` : '/buildings'}>Cancel</a>
      </div>
    </form>
  );
}
