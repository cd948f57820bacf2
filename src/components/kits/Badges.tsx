/**
 * Calibration, condition and loan status as words with a mark, never by colour alone: every
 * badge says what it means in text; colour only repeats it.
 */
import { formatDate } from '../../lib/format';
import { CONDITION_LABELS, type InstrumentCondition } from '../../lib/kits/kit-readiness';
import { LOAN_STATUS_LABELS, type LoanStatus } from '../../lib/kits/loan-states';
import type { CalibrationStatus } from '../../lib/kits/calibration';

export function CalibrationBadge({ due, status }: { due: string | null; status: CalibrationStatus }) {
  const left = status.daysLeft ?? 0;
  switch (status.state) {
    case 'past-due':
      return <span className="badge border border-brick-600 bg-brick-soft text-brick-ink" data-calibration="past-due"><span aria-hidden="true">✕&nbsp;</span>Past calibration: was due {formatDate(due)} ({-left} day{left === -1 ? '' : 's'} ago)</span>;
    case 'due-soon':
      return <span className="badge border border-amber-400 bg-amber-soft text-amber-ink" data-calibration="due-soon"><span aria-hidden="true">!&nbsp;</span>Calibration due {formatDate(due)} ({left === 0 ? 'today' : `in ${left} day${left === 1 ? '' : 's'}`})</span>;
    case 'ok':
      return <span className="badge bg-line-50 text-line-800" data-calibration="ok"><span aria-hidden="true">✓&nbsp;</span>Calibrated until {formatDate(due)}</span>;
    default:
      return <span className="badge bg-ink-100 text-ink-700" data-calibration="untracked">No calibration kept</span>;
  }
}

export function ConditionBadge({ condition }: { condition: string }) {
  const label = CONDITION_LABELS[condition as InstrumentCondition] ?? condition;
  const style = condition === 'needs-repair' ? 'border border-brick-600 bg-brick-soft text-brick-ink' : condition === 'retired' ? 'bg-ink-200 text-ink-700' : condition === 'fair' ? 'bg-ink-100 text-ink-800' : 'bg-ink-50 text-ink-700';
  return <span className={`badge ${style}`}>{condition === 'needs-repair' && <span aria-hidden="true">✕&nbsp;</span>}Condition: {label}</span>;
}

const STATUS_STYLE: Record<LoanStatus, string> = {
  requested: 'bg-amber-soft text-amber-ink',
  approved: 'bg-line-100 text-line-800',
  shipped: 'bg-line-700 text-white',
  'in-use': 'bg-line-800 text-white',
  returned: 'bg-ink-200 text-ink-800',
  inspected: 'bg-ink-100 text-ink-700',
  declined: 'bg-brick-soft text-brick-ink',
  cancelled: 'bg-ink-100 text-ink-600',
};

export function LoanStatusBadge({ status, overdue = false }: { status: LoanStatus; overdue?: boolean }) {
  return (
    <span className="inline-flex flex-wrap gap-1">
      <span className={`badge ${STATUS_STYLE[status]}`}>{LOAN_STATUS_LABELS[status]}</span>
      {overdue && <span className="badge border border-brick-600 bg-brick-soft text-brick-ink"><span aria-hidden="true">!&nbsp;</span>Overdue</span>}
    </span>
  );
}
