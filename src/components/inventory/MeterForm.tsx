import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { COMMODITIES, COMMODITY_LABELS, COMMODITY_UNITS, type Commodity } from '../../lib/domain';
import { meterInputSchema } from '../../lib/schemas/inventory';
import { api } from '../ui/api';
import { showApiError } from '../ui/forms';
import { Field, FormError } from '../ui/Field';

type Values = z.input<typeof meterInputSchema>;

export default function MeterForm({ buildingId, suggestedCode }: { buildingId: string; suggestedCode: string }) {
  const [open, setOpen] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, watch, setError: setFieldError, formState } = useForm<Values>({
    resolver: zodResolver(meterInputSchema) as never,
    defaultValues: { buildingId, code: suggestedCode, commodity: 'electricity', unit: 'kWh', account: '', heatContentKbtuPerUnit: null },
  });
  const commodity = watch('commodity') as Commodity;
  if (!open)
    return (
      <button type="button" className="btn-secondary" onClick={() => setOpen(true)}>
        Add a meter
      </button>
    );
  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    try {
      await api('/api/meters', { method: 'POST', body: { ...values, heatContentKbtuPerUnit: values.heatContentKbtuPerUnit === ('' as never) ? null : values.heatContentKbtuPerUnit } });
      window.location.reload();
    } catch (e) {
      showApiError(e, setFieldError, setError);
    }
  });
  const msg = (x: { message?: unknown } | undefined) => (typeof x?.message === 'string' ? x.message : undefined);
  return (
    <form onSubmit={onSubmit} noValidate className="card space-y-4" aria-label="New meter">
      <FormError message={error} />
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Meter code" required error={msg(formState.errors.code)}>
          {({ id, describedBy, invalid }) => <input id={id} className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('code')} />}
        </Field>
        <Field label="Commodity" required error={msg(formState.errors.commodity)}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('commodity')}>
              {COMMODITIES.map((c) => <option key={c} value={c}>{COMMODITY_LABELS[c]}</option>)}
            </select>
          )}
        </Field>
        <Field label="Billing unit" required error={msg(formState.errors.unit)}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('unit')}>
              {COMMODITY_UNITS[commodity].map((u) => <option key={u} value={u}>{u}</option>)}
            </select>
          )}
        </Field>
        <Field label="Utility account" error={msg(formState.errors.account)}>
          {({ id, describedBy, invalid }) => <input id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('account')} />}
        </Field>
        {(commodity === 'natural_gas' || commodity === 'district_steam') && (
          <Field label={`Heat content (kBtu per ${watch('unit')})`} hint={commodity === 'natural_gas' ? 'As the utility states it per billing unit; leave empty for the U.S. average of 1.036 kBtu per cubic foot (EIA)' : 'As stated by the steam supplier, per billing unit'} required={commodity === 'district_steam'} error={msg(formState.errors.heatContentKbtuPerUnit)}>
            {({ id, describedBy, invalid }) => <input id={id} inputMode="decimal" className="field-input figure" aria-describedby={describedBy} aria-invalid={invalid} {...register('heatContentKbtuPerUnit', { setValueAs: (v) => (v === '' || v === null ? null : Number(v)) })} />}
          </Field>
        )}
      </div>
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>Add meter</button>
        <button type="button" className="btn-secondary" onClick={() => setOpen(false)}>Cancel</button>
      </div>
    </form>
  );
}
