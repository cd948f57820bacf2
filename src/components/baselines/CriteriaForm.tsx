/** The acceptance criteria of baselines, editable by analysts; saving re-judges every baseline. */
import { useState } from 'react';
import { api, ApiError } from '../ui/api';

interface Criteria { maxCvrmse: number; minPeriods: number; minDays: number }

export default function CriteriaForm({ initial, defaults }: { initial: Criteria; defaults: Criteria }) {
  const [cv, setCv] = useState(String(Math.round(initial.maxCvrmse * 1000) / 10));
  const [periods, setPeriods] = useState(String(initial.minPeriods));
  const [days, setDays] = useState(String(initial.minDays));
  const [message, setMessage] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  return (
    <details className="card">
      <summary className="cursor-pointer font-medium">Acceptance criteria</summary>
      <form
        className="mt-3 flex flex-wrap items-end gap-3"
        onSubmit={async (e) => {
          e.preventDefault();
          setError(null);
          setMessage(null);
          try {
            await api('/api/settings/baseline-acceptance', { method: 'PUT', body: { maxCvrmse: Number(cv) / 100, minPeriods: Number(periods), minDays: Number(days) } });
            setMessage('Saved. Every baseline is being judged again.');
          } catch (err) {
            setError(err instanceof ApiError ? err.message : String(err));
          }
        }}
      >
        <div><label htmlFor="c-cv" className="field-label">Largest CV(RMSE), %</label><input id="c-cv" inputMode="decimal" className="field-input w-28 figure" value={cv} onChange={(e) => setCv(e.target.value)} /></div>
        <div><label htmlFor="c-p" className="field-label">Fewest bill periods</label><input id="c-p" inputMode="numeric" className="field-input w-28 figure" value={periods} onChange={(e) => setPeriods(e.target.value)} /></div>
        <div><label htmlFor="c-d" className="field-label">Fewest days</label><input id="c-d" inputMode="numeric" className="field-input w-28 figure" value={days} onChange={(e) => setDays(e.target.value)} /></div>
        <button type="submit" className="btn-secondary">Save criteria</button>
        <p className="w-full text-xs text-ink-500">Defaults: CV(RMSE) ≤ {defaults.maxCvrmse * 100} % (ASHRAE Guideline 14, whole-building energy from monthly data), ≥ {defaults.minPeriods} periods and ≥ {defaults.minDays} days (CalTRACK 2.0 §2.2.1.1). The 15 % / 5 % limits of calibrated simulation do not apply to regression baselines.</p>
        {message && <p className="notice-info w-full" role="status">{message}</p>}
        {error && <p className="notice-error w-full" role="alert">{error}</p>}
      </form>
    </details>
  );
}
