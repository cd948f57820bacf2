/**
 * Loans on the library page: the custodian's queue (what waits for a decision, to ship, out, back
 * to inspect), the viewer's own loans, and every loan the viewer may see.
 */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '../ui/api';
import { LoanList } from './LoanList';
import type { Loan, Viewer } from './types';

type Tab = 'queue' | 'mine' | 'all';

const QUEUE: { title: string; statuses: Loan['status'][]; empty: string }[] = [
  { title: 'Waiting for a decision', statuses: ['requested'], empty: 'No request waits.' },
  { title: 'To ship', statuses: ['approved'], empty: 'Nothing to ship.' },
  { title: 'Out now', statuses: ['shipped', 'in-use'], empty: 'No kit is out.' },
  { title: 'Back, to inspect', statuses: ['returned'], empty: 'Nothing to inspect.' },
];

function Queue() {
  const q = useQuery({ queryKey: ['loans', 'queue'], queryFn: () => api<{ items: Loan[] }>('/api/loans?status=requested,approved,shipped,in-use,returned&limit=1000') });
  if (q.isPending) return <p role="status">Loading the queue…</p>;
  if (q.isError) return <p className="notice-error" role="alert">{(q.error as Error).message}</p>;
  const byStart = [...q.data.items].sort((a, b) => (a.start < b.start ? -1 : a.start > b.start ? 1 : 0));
  return (
    <div className="space-y-5" data-testid="loan-queue">
      {QUEUE.map((g) => {
        const items = byStart.filter((l) => g.statuses.includes(l.status));
        const late = items.filter((l) => l.overdue).length;
        return (
          <section key={g.title} aria-label={g.title}>
            <h3 className="mb-2 text-base font-semibold">{g.title} <span className="font-normal text-ink-600">({items.length}{late ? `, ${late} overdue` : ''})</span></h3>
            <LoanList loans={items} empty={g.empty} label={g.title} />
          </section>
        );
      })}
    </div>
  );
}

function Listing({ mine }: { mine: boolean }) {
  const q = useQuery({ queryKey: ['loans', mine ? 'mine' : 'all'], queryFn: () => api<{ items: Loan[] }>(`/api/loans?limit=300${mine ? '&mine=1' : ''}`) });
  if (q.isPending) return <p role="status">Loading loans…</p>;
  if (q.isError) return <p className="notice-error" role="alert">{(q.error as Error).message}</p>;
  return <LoanList loans={q.data.items} empty={mine ? 'You have not asked for a kit yet. Open a kit to ask for it.' : 'No loans yet.'} label={mine ? 'My loans' : 'Loans'} />;
}

export function LoanBoard({ viewer }: { viewer: Viewer }) {
  const tabs: [Tab, string][] = [
    ...(viewer.canManageLoans ? ([['queue', 'To act on']] as [Tab, string][]) : []),
    ...(viewer.canRequest ? ([['mine', 'My loans']] as [Tab, string][]) : []),
    ['all', viewer.scoped ? 'Loans of my installations' : 'All loans'],
  ];
  const [tab, setTab] = useState<Tab>(tabs[0]![0]);
  return (
    <section className="card space-y-4" aria-labelledby="loans-heading">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="loans-heading">Loans</h2>
        <div className="flex flex-wrap gap-1" role="group" aria-label="Which loans">
          {tabs.map(([id, label]) => (
            <button key={id} type="button" aria-pressed={tab === id} className={tab === id ? 'btn-primary' : 'btn-secondary'} onClick={() => setTab(id)}>{label}</button>
          ))}
        </div>
      </div>
      {tab === 'queue' && <Queue />}
      {tab === 'mine' && <Listing mine />}
      {tab === 'all' && <Listing mine={false} />}
    </section>
  );
}
