import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { installationInputSchema, type InstallationInput } from '../../lib/schemas/inventory';
import { api } from '../ui/api';
import { showApiError } from '../ui/forms';
import { Field, FormError } from '../ui/Field';

type Props = { mode: 'create' } | { mode: 'edit'; initial: InstallationInput };

export default function InstallationForm(props: Props) {
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, setError: setFieldError, formState } = useForm<InstallationInput>({
    resolver: zodResolver(installationInputSchema) as never,
    defaultValues: props.mode === 'edit' ? props.initial : { code: '', name: '', climate: '', timeZone: 'America/New_York', address: '' },
  });
  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    try {
      if (props.mode === 'create') {
        const r = await api<{ code: string }>('/api/installations', { method: 'POST', body: values });
        window.location.href = `/installations/${r.code}`;
      } else {
        const { code, ...patch } = values;
        await api(`/api/installations/${code}`, { method: 'PATCH', body: patch });
        window.location.href = `/installations/${code}`;
      }
    } catch (e) {
      showApiError(e, setFieldError, setError);
    }
  });
  const e = formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate className="card max-w-2xl space-y-4">
      <FormError message={error} />
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Code" required hint="2–12 capital letters, digits or dashes" error={e.code?.message}>
          {({ id, describedBy, invalid }) => <input id={id} className="field-input figure uppercase" readOnly={props.mode === 'edit'} aria-describedby={describedBy} aria-invalid={invalid} {...register('code')} />}
        </Field>
        <div className="sm:col-span-2">
          <Field label="Name" required error={e.name?.message}>
            {({ id, describedBy, invalid }) => <input id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('name')} />}
          </Field>
        </div>
      </div>
      <Field label="Climate" hint="For example: cold, heating dominated" error={e.climate?.message}>
        {({ id, describedBy, invalid }) => <input id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('climate')} />}
      </Field>
      <Field label="Time zone" required hint="IANA name, e.g. America/Chicago" error={e.timeZone?.message}>
        {({ id, describedBy, invalid }) => <input id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('timeZone')} />}
      </Field>
      <Field label="Address" error={e.address?.message}>
        {({ id, describedBy, invalid }) => <textarea id={id} rows={2} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('address')} />}
      </Field>
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>{props.mode === 'create' ? 'Create installation' : 'Save changes'}</button>
        <a className="btn-secondary" href={props.mode === 'edit' ? `/installations/${props.initial.code}` : '/installations'}>Cancel</a>
      </div>
    </form>
  );
}
