/** Past imports of an installation: who, when, counts; the original, the report, and undo. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { formatNumber } from '../../lib/format';
import { api } from '../ui/api';

interface ImportRow {
  id: string;
  kind: string;
  status: 'dry-run' | 'committed' | 'undone' | 'failed';
  fileName: string;
  counts: { rows?: number; new?: number; changed?: number; unchanged?: number; rejected?: number };
  problemCount: number;
  uploadedByEmail: string;
  createdAt: string;
  undoneAt: string | null;
}

const STATUS: Record<ImportRow['status'], [string, string]> = {
  committed: ['in effect', 'bg-line-50 text-line-800'],
  undone: ['undone', 'bg-ink-100 text-ink-700'],
  'dry-run': ['checked only', 'bg-ink-100 text-ink-700'],
  failed: ['refused', 'bg-brick-soft text-brick-ink'],
};

export function ImportHistory({ installation }: { installation: string }) {
  const qc = useQueryClient();
  const [all, setAll] = useState(false);
  const list = useQuery({ queryKey: ['imports', installation, all], queryFn: () => api<{ items: ImportRow[] }>(`/api/imports?installation=${installation}&all=${all ? 1 : 0}`) });
  const undo = useMutation({
    mutationFn: (id: string) => api(`/api/imports/${id}`, { method: 'DELETE' }),
    onSettled: () => qc.invalidateQueries({ queryKey: ['imports', installation] }),
  });
  return (
    <section className="card space-y-3" aria-labelledby="history">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="history">Import history for {installation}</h2>
        <label className="flex items-center gap-1.5 text-sm">
          <input type="checkbox" checked={all} onChange={(e) => setAll(e.target.checked)} /> Show checks and refused files too
        </label>
      </div>
      {undo.isError && <p className="notice-error" role="alert">{(undo.error as Error).message}</p>}
      {list.isPending && <p role="status">Loading…</p>}
      {list.isError && <p className="notice-error" role="alert">Could not load the history: {(list.error as Error).message}</p>}
      {list.data && list.data.items.length === 0 && <p className="text-sm text-ink-600">No imports yet.</p>}
      {list.data && list.data.items.length > 0 && (
        <div className="overflow-x-auto">
          <table className="data-table">
            <thead>
              <tr><th scope="col">When (UTC)</th><th scope="col">File</th><th scope="col">By</th><th scope="col" className="text-right">New</th><th scope="col" className="text-right">Changed</th><th scope="col" className="text-right">Rejected</th><th scope="col">Status</th><th scope="col"><span className="sr-only">Actions</span></th></tr>
            </thead>
            <tbody>
              {list.data.items.map((r) => (
                <tr key={r.id}>
                  <td className="figure whitespace-nowrap text-xs">{r.createdAt.replace('T', ' ').slice(0, 16)}</td>
                  <td className="max-w-[16rem] truncate" title={r.fileName}>{r.fileName}</td>
                  <td className="text-xs">{r.uploadedByEmail}</td>
                  <td className="figure text-right">{formatNumber(r.counts.new ?? 0)}</td>
                  <td className="figure text-right">{formatNumber(r.counts.changed ?? 0)}</td>
                  <td className="figure text-right">{formatNumber(r.counts.rejected ?? 0)}</td>
                  <td><span className={`badge ${STATUS[r.status]?.[1] ?? ''}`}>{STATUS[r.status]?.[0] ?? r.status}</span></td>
                  <td className="whitespace-nowrap text-sm">
                    <a href={`/api/imports/${r.id}/report`}>report</a>
                    {r.status !== 'dry-run' && r.status !== 'failed' && <> · <a href={`/api/imports/${r.id}/original`}>original</a></>}
                    {r.status === 'committed' && (
                      <>
                        {' · '}
                        <button
                          type="button"
                          className="text-brick-ink underline"
                          disabled={undo.isPending}
                          onClick={() => {
                            if (window.confirm(`Undo the import of ${r.fileName}? Its ${r.counts.new ?? 0} new bills are removed and ${r.counts.changed ?? 0} changed bills get their earlier values back.`)) undo.mutate(r.id);
                          }}
                        >
                          undo<span className="sr-only"> {r.fileName}</span>
                        </button>
                      </>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
