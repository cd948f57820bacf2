/**
 * Choosing a loaner kit for a walkthrough: the kits with their availability for the dates and how
 * many of the suggested instruments each holds, through the kit library's API
 * (`GET /api/kits?from&to`); the reservation is `POST /api/loans`.
 */
import { useQuery } from '@tanstack/react-query';
import { INSTRUMENT_LABELS, type InstrumentType } from '../../lib/field/instruments';
import { formatDate } from '../../lib/format';
import type { KitSummary } from '../../lib/kits/api-types';
import { api, ApiError } from '../ui/api';

type Kit = Pick<KitSummary, 'id' | 'code' | 'name' | 'homeLocation' | 'active' | 'instrumentTypes' | 'available' | 'calibrationOk'>;

export interface KitChoice {
  kitId: string | null;
  start: string;
  end: string;
}

/** Reserves the kit for the walkthrough. @returns null on success, else the reason in words. */
export async function reserveKit(walkthroughId: string, title: string, c: KitChoice): Promise<{ ok: true; loan: { id: string; status: string } } | { ok: false; message: string }> {
  try {
    const loan = await api<{ id: string; status: string }>('/api/loans', { method: 'POST', body: { kitId: c.kitId, start: c.start, end: c.end, purpose: `Walkthrough: ${title}`, walkthroughId } });
    return { ok: true, loan };
  } catch (e) {
    if (e instanceof ApiError && e.status === 409) return { ok: false, message: `That kit is already reserved for these dates. ${e.message}` };
    if (e instanceof ApiError && e.status === 422) return { ok: false, message: `That kit cannot go out on these dates: ${e.message}` };
    return { ok: false, message: (e as Error).message };
  }
}

export function KitPicker({ value, onChange, suggested }: { value: KitChoice; onChange: (c: KitChoice) => void; suggested: InstrumentType[] }) {
  const ready = /^\d{4}-\d{2}-\d{2}$/.test(value.start) && /^\d{4}-\d{2}-\d{2}$/.test(value.end) && value.end >= value.start;
  const kits = useQuery({
    queryKey: ['kits', value.start, value.end],
    enabled: ready,
    queryFn: () => api<{ items: Kit[] }>(`/api/kits?${new URLSearchParams({ from: value.start, to: value.end })}`),
  });
  const covers = (k: Kit) => suggested.filter((t) => k.instrumentTypes.includes(t)).length;
  const sorted = [...(kits.data?.items ?? [])].filter((k) => k.active).sort((a, b) => Number(b.available === true) - Number(a.available === true) || covers(b) - covers(a) || a.code.localeCompare(b.code));
  return (
    <fieldset className="space-y-3" data-testid="kit-picker">
      <legend className="field-label">Instrument kit</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor="kit-from" className="field-label">Needed from</label>
          <input id="kit-from" type="date" className="field-input min-h-11" value={value.start} onChange={(e) => onChange({ ...value, start: e.target.value })} />
        </div>
        <div>
          <label htmlFor="kit-to" className="field-label">until (inclusive)</label>
          <input id="kit-to" type="date" className="field-input min-h-11" value={value.end} min={value.start} onChange={(e) => onChange({ ...value, end: e.target.value })} />
        </div>
      </div>
      {!ready && <p className="field-error">Give both dates, the second on or after the first.</p>}
      {kits.isFetching && <p role="status" className="text-sm">Looking at the kits for {formatDate(value.start)} – {formatDate(value.end)}…</p>}
      {kits.isError && <p className="notice-error" role="alert">The kits could not be read: {(kits.error as Error).message}</p>}
      {kits.data && (
        <div className="space-y-2" role="radiogroup" aria-label="Kits">
          <label className="flex min-h-11 items-center gap-2 text-sm">
            <input type="radio" name="kit" className="h-5 w-5 accent-line-700" checked={value.kitId === null} onChange={() => onChange({ ...value, kitId: null })} />
            No kit
          </label>
          {sorted.length === 0 && <p className="text-sm text-ink-600">No active kit in the library.</p>}
          {sorted.map((k) => {
            const have = covers(k);
            const out = k.available !== true;
            return (
              <label key={k.id} className={`flex gap-2 rounded-md border p-2 text-sm ${value.kitId === k.id ? 'border-line-600 bg-line-50' : 'border-ink-200'} ${out ? 'opacity-70' : ''}`}>
                <input type="radio" name="kit" className="mt-1 h-5 w-5 shrink-0 accent-line-700" disabled={out} checked={value.kitId === k.id} onChange={() => onChange({ ...value, kitId: k.id })} />
                <span>
                  <span className="figure font-medium">{k.code}</span> {k.name}
                  <span className="block text-xs text-ink-600">
                    {out ? (k.calibrationOk ? 'not available on these dates' : 'an instrument would be past its calibration date') : 'available'}
                    {suggested.length > 0 && ` · holds ${have} of the ${suggested.length} suggested instruments`}
                    {k.homeLocation && ` · kept at ${k.homeLocation}`}
                  </span>
                  {suggested.some((t) => !k.instrumentTypes.includes(t)) && !out && (
                    <span className="block text-xs text-ink-500">Not in this kit: {suggested.filter((t) => !k.instrumentTypes.includes(t)).map((t) => INSTRUMENT_LABELS[t]).join(', ')}</span>
                  )}
                </span>
              </label>
            );
          })}
        </div>
      )}
    </fieldset>
  );
}
