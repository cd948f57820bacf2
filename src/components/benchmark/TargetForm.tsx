/** Edit an installation's intensity target (regional manager). */
import { useState } from 'react';
import { api, ApiError } from '../ui/api';

export default function TargetForm({ code, baselineFy, reductionPct, targetFy }: { code: string; baselineFy: number | null; reductionPct: number | null; targetFy: number | null }) {
  const [b, setB] = useState(String(baselineFy ?? ''));
  const [r, setR] = useState(String(reductionPct ?? ''));
  const [t, setT] = useState(String(targetFy ?? ''));
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      aria-label={`Target of ${code}`}
      onSubmit={async (e) => {
        e.preventDefault();
        setError(null);
        setBusy(true);
        try {
          await api(`/api/targets/${code}`, { method: 'PUT', body: { baselineFy: Number(b), reductionPct: Number(r), targetFy: Number(t) } });
          window.location.reload();
        } catch (err) {
          setError(err instanceof ApiError ? err.message : String(err));
        } finally {
          setBusy(false);
        }
      }}
    >
      <div><label htmlFor={`tb-${code}`} className="field-label">Baseline FY</label><input id={`tb-${code}`} inputMode="numeric" className="field-input w-24 figure" value={b} onChange={(e) => setB(e.target.value)} /></div>
      <div><label htmlFor={`tr-${code}`} className="field-label">Reduction %</label><input id={`tr-${code}`} inputMode="decimal" className="field-input w-24 figure" value={r} onChange={(e) => setR(e.target.value)} /></div>
      <div><label htmlFor={`tt-${code}`} className="field-label">by FY</label><input id={`tt-${code}`} inputMode="numeric" className="field-input w-24 figure" value={t} onChange={(e) => setT(e.target.value)} /></div>
      <button type="submit" className="btn-secondary" disabled={busy}>Save</button>
      {error && <p className="field-error w-full" role="alert">{error}</p>}
    </form>
  );
}
