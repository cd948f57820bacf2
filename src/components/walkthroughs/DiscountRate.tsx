/**
 * The real discount rate measure economics use: shown with its date and source; administrators and
 * regional managers change it (bounded 3 %–10 %, 10 CFR 436.14). Measures keep the rate they were
 * computed at; proposed ones take the new rate when their figures are saved again.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { discountRateSettingSchema } from '../../lib/economics/discount-rate';
import { formatDate } from '../../lib/format';
import { api, ApiError } from '../ui/api';
import { Field } from '../ui/Field';
import { rateText, type Rate } from './MeasureForm';

export function useDiscountRate() {
  return useQuery({ queryKey: ['discount-rate'], queryFn: () => api<Rate & { bounds: { floorPercent: number; ceilingPercent: number } }>('/api/settings/discount-rate') });
}

export function DiscountRateCard({ canEdit }: { canEdit: boolean }) {
  const qc = useQueryClient();
  const q = useDiscountRate();
  const [draft, setDraft] = useState<{ realDiscountRatePercent: string; effectiveFrom: string; source: string } | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const save = useMutation({
    mutationFn: (body: unknown) => api('/api/settings/discount-rate', { method: 'PUT', body }),
    onSuccess: () => {
      setDraft(null);
      void qc.invalidateQueries({ queryKey: ['discount-rate'] });
    },
    onError: (e) => setErrors(e instanceof ApiError ? { ...e.fields, _: e.message } : { _: String(e) }),
  });
  return (
    <section className="card space-y-3" aria-labelledby="rate-h" data-testid="discount-rate">
      <h2 id="rate-h">Discount rate</h2>
      {q.isPending && <p role="status">Loading…</p>}
      {q.isError && <p className="notice-error" role="alert">{(q.error as Error).message}</p>}
      {q.data && !draft && (
        <>
          <p className="figure text-2xl">{q.data.realDiscountRatePercent} %</p>
          <p className="text-sm text-ink-700">Real rate for life-cycle cost, {rateText(q.data)}. {q.data.source}</p>
          <p className="text-xs text-ink-500">{q.data.setAt ? `Set in Plumbline on ${formatDate(q.data.setAt)}.` : 'The built-in default: enter the current FEMP rate.'} Bounded {q.data.bounds.floorPercent} %–{q.data.bounds.ceilingPercent} % by 10 CFR 436.14.</p>
          {canEdit && <button type="button" className="btn-secondary min-h-11" onClick={() => setDraft({ realDiscountRatePercent: String(q.data.realDiscountRatePercent), effectiveFrom: q.data.effectiveFrom, source: q.data.source })}>Change the rate</button>}
        </>
      )}
      {draft && (
        <form
          className="space-y-3"
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            const r = discountRateSettingSchema.safeParse({ ...draft, realDiscountRatePercent: draft.realDiscountRatePercent.trim() === '' ? undefined : Number(draft.realDiscountRatePercent) });
            if (!r.success) return setErrors(Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message])));
            setErrors({});
            save.mutate(r.data);
          }}
        >
          <Field label="Real discount rate (%)" error={errors.realDiscountRatePercent} required>{({ id, describedBy, invalid }) => <input id={id} inputMode="decimal" className="field-input figure min-h-11" aria-describedby={describedBy} aria-invalid={invalid} value={draft.realDiscountRatePercent} onChange={(e) => setDraft({ ...draft, realDiscountRatePercent: e.target.value })} />}</Field>
          <Field label="In force from" error={errors.effectiveFrom} required>{({ id, describedBy, invalid }) => <input id={id} type="date" className="field-input min-h-11" aria-describedby={describedBy} aria-invalid={invalid} value={draft.effectiveFrom} onChange={(e) => setDraft({ ...draft, effectiveFrom: e.target.value })} />}</Field>
          <Field label="Source" hint="e.g. the year's NISTIR 85-3273 supplement" error={errors.source} required>{({ id, describedBy, invalid }) => <input id={id} className="field-input min-h-11" aria-describedby={describedBy} aria-invalid={invalid} value={draft.source} onChange={(e) => setDraft({ ...draft, source: e.target.value })} />}</Field>
          {errors._ && <p className="field-error" role="alert">{errors._}</p>}
          <div className="flex gap-2">
            <button type="submit" className="btn-primary min-h-11" disabled={save.isPending}>Save the rate</button>
            <button type="button" className="btn-secondary min-h-11" onClick={() => { setDraft(null); setErrors({}); }}>Cancel</button>
          </div>
        </form>
      )}
    </section>
  );
}
