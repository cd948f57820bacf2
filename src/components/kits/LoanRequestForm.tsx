/**
 * Asking for a kit: dates (typed, or picked on the calendar beside it), purpose, and optionally
 * the walkthrough it is for. Clashes with loans on the calendar, instruments that would be past
 * calibration and broken date rules show while the dates are chosen; a clash the server finds
 * (someone was quicker) shows its message in place.
 */
import { useMutation, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { formatDate } from '../../lib/format';
import { kitProblems } from '../../lib/kits/kit-readiness';
import { checkLoanDates, formatRange } from '../../lib/kits/loan-dates';
import { conflictingHolds } from '../../lib/kits/month-grid';
import { api, ApiError } from '../ui/api';
import { Field } from '../ui/Field';
import { holdText } from './ReservationCalendar';
import type { KitDetail, Loan, Viewer } from './types';

interface WalkthroughItem {
  id: string;
  title: string;
  buildingNumber?: string;
  installationCode?: string;
  plannedOn: string;
  status: string;
}

export function LoanRequestForm({
  kit,
  viewer,
  range,
  onRange,
  initialWalkthrough,
  onRequested,
  onStale,
}: {
  kit: KitDetail;
  viewer: Viewer;
  range: { start: string; end: string };
  onRange: (r: { start: string; end: string }) => void;
  initialWalkthrough: string | null;
  onRequested: (loan: Loan) => void;
  /** The calendar is out of date (the server found a clash it did not show). */
  onStale: () => void;
}) {
  const [purpose, setPurpose] = useState('');
  const [walkthroughId, setWalkthroughId] = useState(initialWalkthrough ?? '');
  const [installation, setInstallation] = useState(viewer.scoped && viewer.installations.length === 1 ? viewer.installations[0]!.code : '');
  const [serverError, setServerError] = useState<{ message: string; fields: Record<string, string>; status: number } | null>(null);
  const walkthroughs = useQuery({
    queryKey: ['walkthroughs-for-loan'],
    queryFn: () => api<{ items: WalkthroughItem[] }>('/api/walkthroughs?status=planned'),
    retry: false,
    staleTime: 60_000,
  });
  const chosen = walkthroughs.data?.items.find((w) => w.id === walkthroughId) ?? null;
  const complete = !!range.start && !!range.end;
  const dates = complete ? checkLoanDates(range, viewer.today) : null;
  const clashes = complete && dates?.ok ? conflictingHolds(range, kit.calendar.filter((h) => h.status !== 'returned' && h.status !== 'inspected')) : [];
  const problems = complete && dates?.ok ? kitProblems(kit.instruments, range.end) : [];
  const needsInstallation = viewer.scoped && viewer.installations.length > 1 && !walkthroughId;
  const blocked = !kit.active || kit.instruments.length === 0 || clashes.length > 0 || problems.length > 0 || (dates !== null && !dates.ok);

  const submit = useMutation({
    mutationFn: () =>
      api<Loan>('/api/loans', {
        method: 'POST',
        body: { kitId: kit.id, start: range.start, end: range.end, purpose, walkthroughId: walkthroughId || null, installation: walkthroughId ? null : installation || null },
      }),
    onSuccess: (loan) => {
      setPurpose('');
      setServerError(null);
      onRequested(loan);
    },
    onError: (e) => {
      setServerError(e instanceof ApiError ? { message: e.message, fields: e.fields, status: e.status } : { message: String(e), fields: {}, status: 0 });
      if (e instanceof ApiError && e.status === 409) onStale();
    },
  });

  const dateError = (field: 'start' | 'end') => (dates && !dates.ok && dates.field === field ? dates.message : serverError?.fields[field]);
  return (
    <form
      className="space-y-4"
      aria-labelledby="request-heading"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        setServerError(null);
        submit.mutate();
      }}
    >
      <h2 id="request-heading">Ask for this kit</h2>
      {!kit.active && <p className="notice-warn">This kit is out of service: it cannot be borrowed.</p>}
      <p className="text-sm text-ink-600">Dates are inclusive: the kit is yours from the first day to the last. Pick them on the calendar or type them.</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="First day" required error={dateError('start')}>
          {({ id, describedBy, invalid }) => <input id={id} type="date" className="field-input figure" min={viewer.today} value={range.start} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => onRange({ start: e.target.value, end: range.end && range.end >= e.target.value ? range.end : e.target.value })} />}
        </Field>
        <Field label="Last day" required error={dateError('end')}>
          {({ id, describedBy, invalid }) => <input id={id} type="date" className="field-input figure" min={range.start || viewer.today} value={range.end} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => onRange({ start: range.start, end: e.target.value })} />}
        </Field>
      </div>
      {dates?.ok && clashes.length === 0 && problems.length === 0 && <p className="text-sm text-line-800" role="status"><span aria-hidden="true">✓ </span>{formatRange(range)}: {dates.days} day{dates.days === 1 ? '' : 's'}, free on the calendar.</p>}
      {clashes.length > 0 && (
        <div className="notice-error" role="alert" data-testid="clash-warning">
          <p className="font-medium">These dates clash with the calendar:</p>
          <ul className="list-disc pl-5">{clashes.map((h, k) => <li key={k}>{formatRange(h)} — held by {holdText(h)}</li>)}</ul>
        </div>
      )}
      {problems.length > 0 && (
        <div className="notice-error" role="alert">
          <p className="font-medium">The kit cannot go out for these dates:</p>
          <ul className="list-disc pl-5">{problems.map((p) => <li key={p.instrumentId + p.reason}>{p.message}</li>)}</ul>
        </div>
      )}
      <Field label="What is it for?" required error={serverError?.fields.purpose} hint="A few words: the building, the measurements.">
        {({ id, describedBy, invalid }) => <textarea id={id} rows={2} className="field-input" value={purpose} maxLength={500} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => setPurpose(e.target.value)} />}
      </Field>
      {walkthroughs.isSuccess && (
        <Field label="For a walkthrough (optional)" error={serverError?.fields.walkthroughId} hint={chosen ? `Planned for ${formatDate(chosen.plannedOn)}: the loan must include that day.` : 'The loan then counts for the walkthrough’s installation.'}>
          {({ id, describedBy }) => (
            <select id={id} className="field-input" value={walkthroughId} aria-describedby={describedBy} onChange={(e) => {
              setWalkthroughId(e.target.value);
              const w = walkthroughs.data.items.find((x) => x.id === e.target.value);
              if (w && !range.start) onRange({ start: w.plannedOn, end: w.plannedOn });
            }}>
              <option value="">None</option>
              {walkthroughs.data.items.map((w) => <option key={w.id} value={w.id}>{formatDate(w.plannedOn)} · {[w.installationCode, w.buildingNumber].filter(Boolean).join(' ')} · {w.title}</option>)}
            </select>
          )}
        </Field>
      )}
      {!walkthroughId && viewer.installations.length > 0 && !(viewer.scoped && viewer.installations.length === 1) && (
        <Field label={needsInstallation ? 'For installation' : 'For installation (optional)'} required={needsInstallation} error={serverError?.fields.installation}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" value={installation} aria-describedby={describedBy} aria-invalid={invalid} onChange={(e) => setInstallation(e.target.value)}>
              <option value="">{needsInstallation ? 'Choose…' : 'No particular installation'}</option>
              {viewer.installations.map((i) => <option key={i.code} value={i.code}>{i.code} · {i.name}</option>)}
            </select>
          )}
        </Field>
      )}
      {viewer.scoped && viewer.installations.length === 1 && !walkthroughId && <p className="text-sm text-ink-600">For {viewer.installations[0]!.code} · {viewer.installations[0]!.name}.</p>}
      {serverError && (
        <div className="notice-error" role="alert" data-testid="request-error">
          {serverError.status === 409 && <p className="font-medium">Someone reserved these dates first.</p>}
          <p>{serverError.message}</p>
        </div>
      )}
      <button type="submit" className="btn-primary" disabled={submit.isPending || blocked || !complete || purpose.trim().length < 3 || (needsInstallation && !installation)}>
        {submit.isPending ? 'Sending…' : 'Ask for the kit'}
      </button>
    </form>
  );
}
