/** The problems of an import, virtualized so ten thousand lines stay smooth, filterable by severity. */
import { useVirtualizer } from '@tanstack/react-virtual';
import { useMemo, useRef, useState } from 'react';

export interface Problem {
  row: number;
  column: string | null;
  code: string;
  message: string;
  severity: 'error' | 'warning';
}

export function ProblemTable({ problems }: { problems: Problem[] }) {
  const [show, setShow] = useState<'all' | 'error' | 'warning'>('all');
  const rows = useMemo(() => (show === 'all' ? problems : problems.filter((p) => p.severity === show)), [problems, show]);
  const parent = useRef<HTMLDivElement>(null);
  const v = useVirtualizer({ count: rows.length, getScrollElement: () => parent.current, estimateSize: () => 44, overscan: 12 });
  if (problems.length === 0) return <p className="notice-info">No problems found.</p>;
  const errors = problems.filter((p) => p.severity === 'error').length;
  return (
    <div className="space-y-2">
      <fieldset className="flex flex-wrap items-center gap-4 text-sm">
        <legend className="sr-only">Show</legend>
        {(
          [
            ['all', `All (${problems.length})`],
            ['error', `Errors (${errors})`],
            ['warning', `Warnings (${problems.length - errors})`],
          ] as const
        ).map(([k, label]) => (
          <label key={k} className="flex items-center gap-1.5">
            <input type="radio" name="problem-filter" checked={show === k} onChange={() => setShow(k)} /> {label}
          </label>
        ))}
      </fieldset>
      <div role="table" aria-label="Problems by file line" aria-rowcount={rows.length} className="rounded-md border border-ink-200 bg-white text-sm">
        <div role="row" className="grid grid-cols-[5rem_7rem_9rem_1fr] border-b border-ink-200 bg-ink-50 px-3 py-2 text-xs font-semibold uppercase tracking-wide text-ink-600">
          <span role="columnheader">Line</span>
          <span role="columnheader">Severity</span>
          <span role="columnheader">Column</span>
          <span role="columnheader">Problem</span>
        </div>
        <div ref={parent} className="max-h-96 overflow-auto" tabIndex={0} aria-label="Scroll the problems">
          <div style={{ height: v.getTotalSize(), position: 'relative' }}>
            {v.getVirtualItems().map((item) => {
              const p = rows[item.index]!;
              return (
                <div
                  role="row"
                  aria-rowindex={item.index + 1}
                  key={item.key}
                  data-index={item.index}
                  ref={v.measureElement}
                  className="absolute left-0 grid w-full grid-cols-[5rem_7rem_9rem_1fr] gap-x-2 border-b border-ink-100 px-3 py-2"
                  style={{ transform: `translateY(${item.start}px)` }}
                >
                  <span role="cell" className="figure">{p.row}</span>
                  <span role="cell">
                    {p.severity === 'error' ? <span className="badge bg-brick-soft text-brick-ink">error</span> : <span className="badge bg-amber-soft text-amber-ink">warning</span>}
                  </span>
                  <span role="cell" className="truncate" title={p.column ?? ''}>{p.column ?? '—'}</span>
                  <span role="cell">
                    {p.message} <span className="figure text-xs text-ink-500">({p.code})</span>
                  </span>
                </div>
              );
            })}
          </div>
        </div>
      </div>
    </div>
  );
}
