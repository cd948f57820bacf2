/**
 * A finding priced as a measure: annual savings per commodity, cost savings, cost and life; the
 * economics (10 CFR 436 / NIST Handbook 135) with the discount rate and its date beside them; the
 * status path with its decisions and history.
 */
import { useMutation, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { COMMODITIES, COMMODITY_LABELS, COMMODITY_UNITS, type Commodity, type Unit } from '../../lib/domain';
import { formatDate, formatMoney, formatNumber } from '../../lib/format';
import { measureInputSchema, MEASURE_STATUS_LABELS, type SavingsLine } from '../../lib/savings/measure-input';
import type { MeasureStatus } from '../../lib/field/walkthrough-form';
import type { MeasureView, RateUsed } from '../../server/measures/view';
import { api, ApiError } from '../ui/api';
import { NumberInput, TextInput } from './inputs';
import { MEASURE_BADGE } from './labels';

export type Rate = RateUsed;

export type Measure = MeasureView;

export const rateText = (r: Rate) => `${formatNumber(r.realDiscountRatePercent, 1)} % real, in force from ${formatDate(r.effectiveFrom)}`;

function Economics({ m, current }: { m: Measure; current: Rate | null }) {
  const e = m.economics;
  if (!e) return <p className="text-sm text-ink-600">No economics yet: save the figures.</p>;
  const r = e.result;
  const at = `at ${formatNumber(e.rate.realDiscountRatePercent, 1)} %, ${formatDate(e.rate.effectiveFrom)}`;
  const rows: [string, string, string][] = [
    ['Net investment', formatMoney(r.netInvestmentUsd), 'cost less incentives'],
    ['Annual savings', formatMoney(r.annualNetSavingsUsd), 'energy + water + O&M'],
    ['Simple payback', r.simplePaybackYears === null ? 'never' : `${formatNumber(r.simplePaybackYears, 1)} yr`, 'undiscounted (10 CFR 436.23)'],
    ['Savings-to-investment ratio', r.sir === null ? '—' : formatNumber(r.sir, 2), at],
    ['Adjusted internal rate of return', r.airrPercent === null ? '—' : `${formatNumber(r.airrPercent, 1)} %`, at],
    ['Present value of savings', formatMoney(r.pvSavingsUsd), at],
    ['Net savings (life cycle)', formatMoney(r.netSavingsUsd), at],
    [`UPV (${m.lifeYears} yr)`, formatNumber(r.upv, 3), at],
    ['UPV* for energy', formatNumber(r.upvStarEnergy, 3), `${at}, escalation ${formatNumber(e.energyEscalationPercent, 1)} %`],
    [`SPV (year ${m.lifeYears})`, formatNumber(r.spv, 4), at],
  ];
  const stale = current && (current.realDiscountRatePercent !== e.rate.realDiscountRatePercent || current.effectiveFrom !== e.rate.effectiveFrom);
  return (
    <div className="space-y-2">
      <table className="data-table" data-testid="economics">
        <caption className="text-left text-xs text-ink-600">Economics per 10 CFR 436 and NIST Handbook 135, discount rate {rateText(e.rate)} ({e.rate.source})</caption>
        <tbody>
          {rows.map(([label, value, note]) => (
            <tr key={label}>
              <th scope="row" className="font-normal">{label}</th>
              <td className="figure text-right">{value}</td>
              <td className="text-xs text-ink-500">{note}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className={`text-sm ${r.costEffective ? 'text-line-800' : 'text-amber-ink'}`}>{r.costEffective ? 'Cost-effective: net savings above zero (SIR above 1).' : 'Not cost-effective at this rate: net savings at or below zero.'}</p>
      {e.notes.map((n) => <p key={n} className="text-sm text-ink-700">{n}</p>)}
      {stale && <p className="notice-warn">Computed {at}; the rate is now {rateText(current)}.{m.status === 'proposed' ? ' Save the figures again to recompute.' : ' A decided measure keeps the rate it was decided at.'}</p>}
    </div>
  );
}

function History({ id }: { id: string }) {
  const q = useQuery({ queryKey: ['measure', id], queryFn: () => api<{ history: { at: string; action: string; by: string; details: Record<string, unknown> }[] }>(`/api/measures/${id}`) });
  if (q.isPending) return <p role="status" className="text-sm">Loading…</p>;
  if (q.isError) return <p className="field-error">{(q.error as Error).message}</p>;
  return (
    <ol className="space-y-1 text-sm">
      {q.data.history.map((h, i) => (
        <li key={i}>
          <span className="figure text-ink-500">{h.at.slice(0, 16).replace('T', ' ')}</span> {h.by}:{' '}
          {h.action === 'measure.status' ? `${String(h.details.from)} → ${String(h.details.to)}${h.details.implementedOn ? ` on ${formatDate(String(h.details.implementedOn))}` : ''}` : h.action === 'measure.create' ? 'priced the finding' : 'changed the figures'}
          {h.details.note ? ` — “${String(h.details.note)}”` : ''}
        </li>
      ))}
    </ol>
  );
}

function blank(m: Measure | null) {
  return {
    savings: m?.savings ?? [],
    annualEnergyCostSavings: m?.annualEnergyCostSavings ?? null,
    annualWaterCostSavings: m?.annualWaterCostSavings ?? null,
    annualOmCostSavings: m?.annualOmCostSavings ?? null,
    installedCost: m?.installedCost ?? null,
    incentives: m?.incentives ?? null,
    lifeYears: m?.lifeYears ?? null,
    energyEscalationPercent: m?.economics?.energyEscalationPercent ?? null,
  };
}

export function MeasureForm({ findingId, measure, rate, canEdit, canApprove, canImplement, onChange }: { findingId: string; measure: Measure | null; rate: Rate | null; canEdit: boolean; canApprove: boolean; canImplement: boolean; onChange: () => void }) {
  const [editing, setEditing] = useState(false);
  const [v, setV] = useState(blank(measure));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [note, setNote] = useState('');
  const [implementedOn, setImplementedOn] = useState('');
  const [showHistory, setShowHistory] = useState(false);
  const save = useMutation({
    mutationFn: (body: unknown) => api<Measure>(`/api/findings/${findingId}/measure`, { method: 'PUT', body }),
    onSuccess: () => {
      setEditing(false);
      onChange();
    },
    onError: (e) => {
      if (e instanceof ApiError) setErrors(e.fields);
      setFormError((e as Error).message);
    },
  });
  const move = useMutation({
    mutationFn: (body: { status: MeasureStatus; implementedOn?: string; note: string }) => api(`/api/measures/${measure!.id}/status`, { method: 'POST', body }),
    onSuccess: () => {
      setNote('');
      setFormError(null);
      onChange();
    },
    onError: (e) => setFormError((e as Error).message),
  });
  const submit = () => {
    setFormError(null);
    const body = Object.fromEntries(Object.entries(v).filter(([, x]) => x !== null));
    const r = measureInputSchema.safeParse(body);
    if (!r.success) {
      setErrors(Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message])));
      setFormError('Check the marked figures.');
      return;
    }
    setErrors({});
    save.mutate(r.data);
  };
  const lines = v.savings;
  const setLine = (i: number, patch: Partial<SavingsLine>) => setV({ ...v, savings: lines.map((l, k) => (k === i ? { ...l, ...patch } : l)) });

  if (!measure && !editing) {
    return canEdit ? <button type="button" className="btn-secondary min-h-11" onClick={() => setEditing(true)}>Price as a measure</button> : <p className="text-sm text-ink-600">Not priced as a measure.</p>;
  }
  return (
    <div className="space-y-3 rounded-md border border-ink-200 p-3" data-testid="measure">
      {measure && (
        <div className="flex flex-wrap items-center gap-2">
          <h4 className="font-medium">Measure</h4>
          <span className={`badge ${MEASURE_BADGE[measure.status].cls}`}>{MEASURE_BADGE[measure.status].label}</span>
          {measure.implementedOn && <span className="text-sm text-ink-600">implemented {formatDate(measure.implementedOn)}</span>}
        </div>
      )}
      {editing ? (
        <form className="space-y-3" aria-label="Measure figures" noValidate onSubmit={(e) => { e.preventDefault(); submit(); }}>
          <fieldset className="space-y-2">
            <legend className="field-label">Annual savings per commodity (in its unit)</legend>
            {lines.map((l, i) => (
              <div key={i} className="grid grid-cols-[1fr_1fr_auto] items-end gap-2">
                <div>
                  <label className="sr-only" htmlFor={`c-${findingId}-${i}`}>Commodity {i + 1}</label>
                  <select id={`c-${findingId}-${i}`} className="field-input min-h-11" value={l.commodity} onChange={(e) => { const c = e.target.value as Commodity; setLine(i, { commodity: c, unit: COMMODITY_UNITS[c][0]! }); }}>
                    {COMMODITIES.map((c) => <option key={c} value={c}>{COMMODITY_LABELS[c]}</option>)}
                  </select>
                </div>
                <div className="flex gap-1">
                  <NumberInput label={`Quantity ${i + 1}`} value={Number.isFinite(l.quantity) ? l.quantity : null} error={errors[`savings.${i}.quantity`]} onChange={(q) => setLine(i, { quantity: q ?? Number.NaN })} />
                  <div>
                    <label className="field-label" htmlFor={`u-${findingId}-${i}`}>Unit<span className="sr-only"> {i + 1}</span></label>
                    <select id={`u-${findingId}-${i}`} className="field-input min-h-11" value={l.unit} onChange={(e) => setLine(i, { unit: e.target.value as Unit })}>
                      {COMMODITY_UNITS[l.commodity].map((u) => <option key={u} value={u}>{u}</option>)}
                    </select>
                  </div>
                </div>
                <button type="button" className="btn-secondary min-h-11" onClick={() => setV({ ...v, savings: lines.filter((_, k) => k !== i) })}>Remove<span className="sr-only"> line {i + 1}</span></button>
              </div>
            ))}
            {errors.savings && <p className="field-error">{errors.savings}</p>}
            <button type="button" className="btn-secondary min-h-11" onClick={() => setV({ ...v, savings: [...lines, { commodity: 'electricity', quantity: Number.NaN, unit: 'kWh' }] })}>Add a commodity</button>
          </fieldset>
          <div className="grid gap-3 sm:grid-cols-2">
            <NumberInput label="Annual energy cost savings" unit="$/yr" value={v.annualEnergyCostSavings} error={errors.annualEnergyCostSavings} onChange={(x) => setV({ ...v, annualEnergyCostSavings: x })} />
            <NumberInput label="Annual water cost savings" unit="$/yr" value={v.annualWaterCostSavings} error={errors.annualWaterCostSavings} onChange={(x) => setV({ ...v, annualWaterCostSavings: x })} />
            <NumberInput label="Annual O&M cost savings" unit="$/yr" hint="negative when it adds upkeep" value={v.annualOmCostSavings} error={errors.annualOmCostSavings} onChange={(x) => setV({ ...v, annualOmCostSavings: x })} />
            <NumberInput label="Installed cost" unit="$" value={v.installedCost} error={errors.installedCost} onChange={(x) => setV({ ...v, installedCost: x })} />
            <NumberInput label="Incentives and rebates" unit="$" value={v.incentives} error={errors.incentives} onChange={(x) => setV({ ...v, incentives: x })} />
            <NumberInput label="Life" unit="years" integer value={v.lifeYears} error={errors.lifeYears} onChange={(x) => setV({ ...v, lifeYears: x })} />
            <NumberInput label="Energy price escalation, real" unit="%/yr" hint="blank: prices constant in real terms" value={v.energyEscalationPercent} error={errors.energyEscalationPercent} onChange={(x) => setV({ ...v, energyEscalationPercent: x })} />
          </div>
          {rate && <p className="text-xs text-ink-600">Economics will be computed at the discount rate in force: {rateText(rate)}.</p>}
          <div className="flex flex-wrap gap-2">
            <button type="submit" className="btn-primary min-h-11" disabled={save.isPending}>Save the measure</button>
            <button type="button" className="btn-secondary min-h-11" onClick={() => { setEditing(false); setV(blank(measure)); setErrors({}); setFormError(null); }}>Cancel</button>
          </div>
        </form>
      ) : (
        measure && (
          <>
            {measure.savings.length > 0 && (
              <p className="text-sm">
                Saves {measure.savings.map((l) => `${formatNumber(l.quantity, 0)} ${l.unit} of ${COMMODITY_LABELS[l.commodity].toLowerCase()}`).join(', ')} a year · cost {formatMoney(measure.installedCost)} · life {measure.lifeYears} yr
              </p>
            )}
            <Economics m={measure} current={rate} />
          </>
        )
      )}
      {formError && <p className="field-error" role="alert">{formError}</p>}
      {measure && !editing && (
        <div className="space-y-2">
          {(canApprove || canImplement || (canEdit && measure.status === 'proposed')) && (
            <TextInput label="Note for the record (optional)" value={note} onChange={setNote} />
          )}
          <div className="flex flex-wrap items-end gap-2">
            {canEdit && measure.status === 'proposed' && <button type="button" className="btn-secondary min-h-11" onClick={() => { setV(blank(measure)); setEditing(true); }}>Change the figures</button>}
            {canApprove && measure.status === 'proposed' && <button type="button" className="btn-primary min-h-11" onClick={() => move.mutate({ status: 'approved', note })}>Approve</button>}
            {canImplement && measure.status === 'approved' && (
              <>
                <div>
                  <label htmlFor={`impl-${measure.id}`} className="field-label">Implemented on</label>
                  <input id={`impl-${measure.id}`} type="date" className="field-input min-h-11" value={implementedOn} onChange={(e) => setImplementedOn(e.target.value)} />
                </div>
                <button type="button" className="btn-primary min-h-11" disabled={!implementedOn} onClick={() => move.mutate({ status: 'implemented', implementedOn, note })}>Record the implementation</button>
              </>
            )}
            {canApprove && (measure.status === 'proposed' || measure.status === 'approved') && <button type="button" className="btn-secondary min-h-11" onClick={() => move.mutate({ status: 'rejected', note })}>Reject</button>}
            {canApprove && (measure.status === 'approved' || measure.status === 'rejected') && <button type="button" className="btn-secondary min-h-11" onClick={() => move.mutate({ status: 'proposed', note })}>Back to {MEASURE_STATUS_LABELS.proposed.toLowerCase()}</button>}
            {canApprove && measure.status === 'implemented' && <button type="button" className="btn-secondary min-h-11" onClick={() => move.mutate({ status: 'approved', note })}>Undo the implementation</button>}
          </div>
          <button type="button" className="text-sm text-line-700 underline" aria-expanded={showHistory} onClick={() => setShowHistory(!showHistory)}>History</button>
          {showHistory && <History id={measure.id} />}
        </div>
      )}
    </div>
  );
}
