/**
 * One kit: what is in it (with the safety cautions its instruments bring), its reservation
 * calendar beside the request form, and its loans. Custodians also edit the kit and its
 * instruments and act on its loans here.
 */
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { formatRange } from '../../lib/kits/loan-dates';
import { isHolding } from '../../lib/kits/loan-states';
import { api } from '../ui/api';
import { QueryProvider } from '../ui/query';
import { InstrumentList } from './InstrumentList';
import { KitForm } from './KitForm';
import { LoanList } from './LoanList';
import { LoanRequestForm } from './LoanRequestForm';
import { ReservationCalendar } from './ReservationCalendar';
import { SafetyCautions } from './SafetyCautions';
import type { KitDetail, Loan, Viewer } from './types';

interface Props {
  kitId: string;
  viewer: Viewer;
  loanId: string | null;
  walkthroughId: string | null;
  start: string | null;
  end: string | null;
}

function Page({ kitId, viewer, loanId, walkthroughId, start, end }: Props) {
  const qc = useQueryClient();
  const kit = useQuery({ queryKey: ['kit', kitId], queryFn: () => api<KitDetail>(`/api/kits/${kitId}`) });
  const loans = useQuery({ queryKey: ['loans', { kit: kitId }], queryFn: () => api<{ items: Loan[] }>(`/api/loans?kit=${kitId}&limit=500`) });
  const [range, setRange] = useState({ start: start ?? '', end: end ?? start ?? '' });
  const [pickingEnd, setPickingEnd] = useState(false);
  const [editing, setEditing] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);

  if (kit.isPending) return <p role="status" className="card">Loading the kit…</p>;
  if (kit.isError) return <p className="notice-error" role="alert">{(kit.error as Error).message}</p>;
  const k = kit.data;
  const pick = (iso: string) => {
    if (!pickingEnd || !range.start || iso < range.start) {
      setRange({ start: iso, end: iso });
      setPickingEnd(true);
    } else {
      setRange({ start: range.start, end: iso });
      setPickingEnd(false);
    }
  };
  const types = [...new Set(k.instruments.map((i) => i.type))];
  const past = k.instruments.filter((i) => i.calibration.state === 'past-due').length;
  const soon = k.instruments.filter((i) => i.calibration.state === 'due-soon').length;
  const current = (loans.data?.items ?? []).filter((l) => isHolding(l.status)).sort((a, b) => (a.start < b.start ? -1 : 1));
  const earlier = (loans.data?.items ?? []).filter((l) => !isHolding(l.status));
  const instruments = (
    <section className="card space-y-2" aria-labelledby="instruments-heading">
      <h2 id="instruments-heading">Instruments</h2>
      <InstrumentList instruments={k.instruments} canManage={viewer.canManageKits} kitId={k.id} />
    </section>
  );

  return (
    <div className="space-y-6">
      <section className="card space-y-3" aria-labelledby="kit-title">
        <div className="flex flex-wrap items-start justify-between gap-3">
          <div>
            <h1 id="kit-title"><span className="figure">{k.code}</span> · {k.name}</h1>
            {k.description && <p className="mt-1 max-w-3xl text-sm text-ink-700">{k.description}</p>}
            <p className="mt-1 text-sm text-ink-600">{k.homeLocation ? `Lives at ${k.homeLocation}. ` : ''}{k.instruments.length} instrument{k.instruments.length === 1 ? '' : 's'}.</p>
          </div>
          <div className="flex flex-wrap items-center gap-2">
            {k.active ? <span className="badge bg-line-50 text-line-800">In service</span> : <span className="badge border border-brick-600 bg-brick-soft text-brick-ink">Out of service</span>}
            {past > 0 && <span className="badge border border-brick-600 bg-brick-soft text-brick-ink"><span aria-hidden="true">✕&nbsp;</span>{past} past calibration</span>}
            {soon > 0 && <span className="badge border border-amber-400 bg-amber-soft text-amber-ink"><span aria-hidden="true">!&nbsp;</span>{soon} due within 30 days</span>}
            {viewer.canManageKits && <button type="button" className="btn-secondary" aria-expanded={editing} onClick={() => setEditing(!editing)}>Edit kit</button>}
          </div>
        </div>
        {editing && <KitForm kit={k} onDone={() => setEditing(false)} onCancel={() => setEditing(false)} />}
      </section>

      <SafetyCautions types={types} />

      <div className={`grid gap-6 ${viewer.canRequest ? 'lg:grid-cols-[minmax(0,1fr)_24rem]' : 'xl:grid-cols-2'}`}>
        <section className="card space-y-3" aria-labelledby="calendar-heading">
          <h2 id="calendar-heading">Reservations</h2>
          <ReservationCalendar holds={k.calendar} today={k.today} selection={range.start && range.end ? range : null} onPick={viewer.canRequest ? pick : undefined} focusMonth={range.start || null} />
        </section>
        {!viewer.canRequest && instruments}
        {viewer.canRequest && (
          <section className="card">
            {notice && <p className="notice-info mb-3" role="status">{notice}</p>}
            <LoanRequestForm
              kit={k}
              viewer={viewer}
              range={range}
              onRange={(r) => setRange(r)}
              initialWalkthrough={walkthroughId}
              onStale={() => void qc.invalidateQueries({ queryKey: ['kit', kitId] })}
              onRequested={(loan) => {
                setNotice(`Requested: loan ${loan.ref}, ${formatRange(loan)}. The custodian has been told; you will get a mail when it is decided.`);
                setRange({ start: '', end: '' });
                void qc.invalidateQueries();
              }}
            />
          </section>
        )}
      </div>

      {viewer.canRequest && instruments}

      <section className="card space-y-3" aria-labelledby="kit-loans-heading">
        <h2 id="kit-loans-heading">Loans of this kit</h2>
        {viewer.scoped && <p className="text-sm text-ink-600">Loans of your installations; others show on the calendar as dates only.</p>}
        {loans.isPending && <p role="status">Loading loans…</p>}
        {loans.isError && <p className="notice-error" role="alert">{(loans.error as Error).message}</p>}
        {loans.data && (
          <>
            <h3 className="text-base font-semibold">Current and coming</h3>
            <LoanList loans={current} showKit={false} highlightId={loanId} empty="No loan holds this kit now or later." label="Current and coming loans" />
            <details open={earlier.some((l) => l.id === loanId)}>
              <summary className="cursor-pointer text-base font-semibold">Earlier, declined and cancelled ({earlier.length})</summary>
              <div className="mt-2"><LoanList loans={earlier} showKit={false} highlightId={loanId} empty="None." label="Earlier loans" /></div>
            </details>
          </>
        )}
      </section>
    </div>
  );
}

export default function KitPage(props: Props) {
  return (
    <QueryProvider>
      <Page {...props} />
    </QueryProvider>
  );
}
