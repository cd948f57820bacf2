/** Start a portfolio refit and follow its progress. */
import { useEffect, useState } from 'react';
import { api, ApiError } from '../ui/api';

interface RunState {
  running: boolean;
  total: number;
  done: number;
  finishedAt: string | null;
  error: string | null;
  last: { fitted: number; failed: number; seconds: number } | null;
}

export default function RefitButton({ installation, initial }: { installation: string | null; initial: RunState }) {
  const [state, setState] = useState<RunState>(initial);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    if (!state.running) return;
    const t = setInterval(async () => {
      try {
        const s = await api<RunState>('/api/baselines/run');
        setState(s);
        if (!s.running) window.location.reload();
      } catch {
        /* keep polling */
      }
    }, 800);
    return () => clearInterval(t);
  }, [state.running]);
  return (
    <div className="space-y-1 text-right">
      <button
        type="button"
        className="btn-primary"
        disabled={state.running}
        onClick={async () => {
          setError(null);
          try {
            setState(await api<RunState>('/api/baselines/run', { method: 'POST', body: installation ? { installation } : {} }));
          } catch (e) {
            setError(e instanceof ApiError ? e.message : String(e));
          }
        }}
      >
        {state.running ? 'Fitting…' : installation ? `Refit ${installation}` : 'Refit all'}
      </button>
      <p className="text-xs text-ink-500" role="status" aria-live="polite">
        {state.running ? `${state.done} of ${state.total} meters` : state.last ? `Last run: ${state.last.fitted} fitted, ${state.last.failed} without a model, ${state.last.seconds.toFixed(1)} s` : ''}
      </p>
      {(error || state.error) && <p className="field-error" role="alert">{error ?? state.error}</p>}
    </div>
  );
}
