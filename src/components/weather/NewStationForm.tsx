import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { stationInputSchema } from '../../lib/schemas/weather';
import { api } from '../ui/api';
import { Field, FormError } from '../ui/Field';
import { showApiError } from '../ui/forms';

const formSchema = stationInputSchema.extend({
  latitude: z.preprocess((v) => (v === '' ? null : v), stationInputSchema.shape.latitude),
  longitude: z.preprocess((v) => (v === '' ? null : v), stationInputSchema.shape.longitude),
  elevationFt: z.preprocess((v) => (v === '' ? null : v), stationInputSchema.shape.elevationFt),
  serviceId: z.preprocess((v) => (v === '' ? null : v), stationInputSchema.shape.serviceId),
});
type Values = z.input<typeof formSchema>;

export default function NewStationForm({ installations }: { installations: { code: string; name: string }[] }) {
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, setError: setFieldError, formState } = useForm<Values>({ resolver: zodResolver(formSchema) as never, defaultValues: { installation: installations[0]?.code } });
  const onSubmit = handleSubmit(async (raw) => {
    setError(null);
    const values = formSchema.parse(raw);
    try {
      const s = await api<{ code: string }>('/api/weather/stations', { method: 'POST', body: values });
      window.location.href = `/weather/${s.code}`;
    } catch (e) {
      showApiError(e, setFieldError, setError);
    }
  });
  const msg = (x: { message?: unknown } | undefined) => (typeof x?.message === 'string' ? x.message : undefined);
  return (
    <form onSubmit={onSubmit} noValidate className="card max-w-3xl space-y-4" aria-labelledby="new-station">
      <h2 id="new-station">New weather station</h2>
      <FormError message={error} />
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Code" required error={msg(formState.errors.code)}>{({ id, describedBy, invalid }) => <input id={id} className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('code')} />}</Field>
        <div className="sm:col-span-2"><Field label="Name" required error={msg(formState.errors.name)}>{({ id, describedBy, invalid }) => <input id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('name')} />}</Field></div>
        <Field label="Weather-service id" hint="GHCN-Daily id, e.g. USW00014739" error={msg(formState.errors.serviceId)}>{({ id, describedBy, invalid }) => <input id={id} className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('serviceId')} />}</Field>
        <Field label="Latitude" error={msg(formState.errors.latitude)}>{({ id, describedBy, invalid }) => <input id={id} inputMode="decimal" className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('latitude')} />}</Field>
        <Field label="Longitude" error={msg(formState.errors.longitude)}>{({ id, describedBy, invalid }) => <input id={id} inputMode="decimal" className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('longitude')} />}</Field>
        <Field label="Elevation (ft)" error={msg(formState.errors.elevationFt)}>{({ id, describedBy, invalid }) => <input id={id} inputMode="decimal" className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('elevationFt')} />}</Field>
        <Field label="For installation" required error={msg(formState.errors.installation)}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('installation')}>
              {installations.map((i) => <option key={i.code} value={i.code}>{i.code} — {i.name}</option>)}
            </select>
          )}
        </Field>
      </div>
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>Add station</button>
    </form>
  );
}
