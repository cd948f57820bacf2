/**
 * Loans as a list: kit, dates, who and what for, the status in words, the moves the viewer may
 * make (each with a note; at inspection, the condition each instrument came back in), and the
 * loan's events on request.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { formatDate } from '../../lib/format';
import { CONDITION_LABELS, INSTRUMENT_CONDITIONS, instrumentName, type InstrumentCondition } from '../../lib/kits/kit-readiness';
import { formatRange } from '../../lib/kits/loan-dates';
import { LOAN_STATUS_LABELS, type LoanStatus } from '../../lib/kits/loan-states';
import { api, ApiError } from '../ui/api';
import { LoanStatusBadge } from './Badges';
import type { KitDetail, Loan, LoanDetail } from './types';

function MoveForm({ loan, to, verb, onClose }: { loan: Loan; to: LoanStatus; verb: string; onClose: () => void }) {
  const qc = useQueryClient();
  const id = useId();
  const [note, setNote] = useState('');
  const [conditions, setConditions] = useState<Record<string, InstrumentCondition>>({});
  const kit = useQuery({ queryKey: ['kit', loan.kitId], queryFn: () => api<KitDetail>(`/api/kits/${loan.kitId}`), enabled: to === 'inspected' });
  const move = useMutation({
    mutationFn: () =>
      api<LoanDetail>(`/api/loans/${loan.id}/transition`, {
        method: 'POST',
        body: { to, note, conditions: Object.entries(conditions).map(([instrumentId, condition]) => ({ instrumentId, condition })) },
      }),
    onSuccess: async () => {
      await qc.invalidateQueries();
      onClose();
    },
  });
  return (
    <form
      className="mt-2 space-y-2 rounded-md border border-ink-200 bg-ink-50 p-3"
      aria-label={`${verb}: loan ${loan.ref}`}
      onSubmit={(e) => {
        e.preventDefault();
        move.mutate();
      }}
      onKeyDown={(e) => e.key === 'Escape' && onClose()}
    >
      <label htmlFor={`${id}-note`} className="field-label">Note {to === 'declined' ? '(say why)' : '(optional)'}</label>
      <textarea id={`${id}-note`} autoFocus rows={2} maxLength={1000} className="field-input" value={note} onChange={(e) => setNote(e.target.value)} />
      {to === 'inspected' && (
        <fieldset className="space-y-1">
          <legend className="field-label">Condition each instrument came back in</legend>
          {kit.isPending && <p role="status" className="text-sm">Loading the kit…</p>}
          {kit.data?.instruments.map((i) => (
            <div key={i.id} className="grid items-center gap-1 sm:grid-cols-[1fr_12rem]">
              <label htmlFor={`${id}-${i.id}`} className="text-sm">{instrumentName(i)}</label>
              <select id={`${id}-${i.id}`} className="field-input" value={conditions[i.id] ?? i.condition} onChange={(e) => setConditions({ ...conditions, [i.id]: e.target.value as InstrumentCondition })}>
                {INSTRUMENT_CONDITIONS.map((c) => <option key={c} value={c}>{CONDITION_LABELS[c]}</option>)}
              </select>
            </div>
          ))}
        </fieldset>
      )}
      {move.isError && <p className="field-error" role="alert">{move.error instanceof ApiError ? move.error.message : String(move.error)}</p>}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className={to === 'declined' || to === 'cancelled' ? 'btn-danger' : 'btn-primary'} disabled={move.isPending || (to === 'declined' && note.trim().length === 0)}>{move.isPending ? 'Saving…' : verb}</button>
        <button type="button" className="btn-secondary" onClick={onClose}>Back</button>
      </div>
    </form>
  );
}

function Events({ loanId }: { loanId: string }) {
  const q = useQuery({ queryKey: ['loan', loanId], queryFn: () => api<LoanDetail>(`/api/loans/${loanId}`) });
  if (q.isPending) return <p role="status" className="text-sm">Loading…</p>;
  if (q.isError) return <p className="field-error" role="alert">{(q.error as Error).message}</p>;
  return (
    <ol className="mt-2 space-y-1 border-l-2 border-ink-200 pl-3 text-sm" aria-label="What happened">
      {q.data.events.map((e) => (
        <li key={e.id}>
          <span className="font-medium">{LOAN_STATUS_LABELS[e.to]}</span> — {e.by || 'someone'}, <time dateTime={e.at}>{formatDate(e.at)} {e.at.slice(11, 16)} UTC</time>
          {e.note && <span className="block text-ink-600">“{e.note}”</span>}
        </li>
      ))}
    </ol>
  );
}

export function LoanCard({ loan, showKit = true, highlight = false }: { loan: Loan; showKit?: boolean; highlight?: boolean }) {
  const [acting, setActing] = useState<{ to: LoanStatus; verb: string } | null>(null);
  const [open, setOpen] = useState(highlight);
  return (
    <li id={`loan-${loan.id}`} className={`rounded-md border p-3 ${highlight ? 'border-line-600 ring-2 ring-line-200' : 'border-ink-200'} ${loan.overdue ? 'border-l-4 border-l-brick-600' : ''}`} data-testid="loan">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0">
          <p className="font-medium">
            {showKit && <><a href={`/kits/${loan.kitId}?loan=${loan.id}`} className="figure">{loan.kitCode}</a> · </>}
            <span>{formatRange(loan)}</span> <span className="text-sm font-normal text-ink-600">({loan.days} day{loan.days === 1 ? '' : 's'})</span>
          </p>
          <p className="text-sm text-ink-700">{loan.purpose}</p>
          <p className="text-xs text-ink-500">
            Loan <span className="figure">{loan.ref}</span>
            {loan.installationCode && <> · {loan.installationCode}</>}
            {loan.requestedBy && <> · asked by {loan.requestedBy.name}</>}
            {loan.walkthrough && <> · walkthrough “{loan.walkthrough.title}”{loan.walkthrough.plannedOn && ` on ${formatDate(loan.walkthrough.plannedOn)}`}</>}
          </p>
        </div>
        <LoanStatusBadge status={loan.status} overdue={loan.overdue} />
      </div>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        {loan.moves.map((m) => (
          <button key={m.to} type="button" className={m.to === 'declined' || m.to === 'cancelled' ? 'btn-secondary text-brick-ink' : 'btn-secondary'} aria-expanded={acting?.to === m.to} onClick={() => setActing(acting?.to === m.to ? null : m)}>
            {m.verb}<span className="sr-only"> loan {loan.ref}</span>
          </button>
        ))}
        <button type="button" className="text-sm text-line-700 underline" aria-expanded={open} onClick={() => setOpen(!open)}>{open ? 'Hide' : 'Show'} what happened<span className="sr-only"> to loan {loan.ref}</span></button>
      </div>
      {acting && <MoveForm loan={loan} to={acting.to} verb={acting.verb} onClose={() => setActing(null)} />}
      {open && <Events loanId={loan.id} />}
    </li>
  );
}

export function LoanList({ loans, empty, showKit = true, highlightId = null, label }: { loans: Loan[]; empty: string; showKit?: boolean; highlightId?: string | null; label: string }) {
  if (loans.length === 0) return <p className="text-sm text-ink-600">{empty}</p>;
  return (
    <ul className="space-y-2" aria-label={label}>
      {loans.map((l) => <LoanCard key={l.id} loan={l} showKit={showKit} highlight={l.id === highlightId} />)}
    </ul>
  );
}
