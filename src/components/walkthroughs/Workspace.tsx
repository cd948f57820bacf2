/**
 * One walkthrough on site: the field form with its autosave and save state always in view, the
 * photos, the findings and their measures, the calculators, and the plan with the kit. Works at a
 * phone's width; everything is reachable by keyboard.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRef, useState, type KeyboardEvent } from 'react';
import type { InstrumentSuggestions } from '../../lib/field/suggest-instruments';
import type { WalkthroughForm, WalkthroughStatus } from '../../lib/field/walkthrough-form';
import type { SectionGap } from '../../lib/field/walkthrough-lifecycle';
import { formatDate, formatMoney, formatNumber } from '../../lib/format';
import CalculatorsPanel from '../calculators/CalculatorsPanel';
import type { WalkthroughListItem } from '../../server/walkthroughs/service';
import { api, ApiError } from '../ui/api';
import { QueryProvider } from '../ui/query';
import { useDiscountRate } from './DiscountRate';
import { FieldForm } from './FieldForm';
import { Findings, type Finding } from './Findings';
import { KitPicker, reserveKit, type KitChoice } from './KitPicker';
import { WALKTHROUGH_BADGE } from './labels';
import type { Rate } from './MeasureForm';
import { Photos, type Photo } from './Photos';
import { Suggestions } from './Suggestions';
import { useAutosave, type SaveState } from './use-autosave';

export interface Walkthrough extends Omit<WalkthroughListItem, 'findings' | 'measures'> {
  flag: { id: string; reason: string; open: boolean } | null;
  form: WalkthroughForm;
  formVersion: number;
  gaps: SectionGap[];
  photos: Photo[];
  findings: Finding[];
  rollup: { count: number; inPlay: { annualCostSavings: { total: number }; netInvestment: number; simplePaybackYears: number | null } };
}

export interface Permissions {
  field: boolean;
  plan: boolean;
  approve: boolean;
  implement: boolean;
  requestKit: boolean;
}

const SAVE_TEXT: Record<SaveState, string> = {
  saved: 'All changes saved',
  unsaved: 'Unsaved changes…',
  saving: 'Saving…',
  offline: 'Offline: your edits are kept on this device',
  conflict: 'Not saved: changed elsewhere',
  invalid: 'Not saved: check the marked fields',
  error: 'Not saved',
  closed: 'Read only',
};
const SAVE_CLS: Record<SaveState, string> = {
  saved: 'text-line-800',
  unsaved: 'text-ink-700',
  saving: 'text-ink-700',
  offline: 'text-amber-ink',
  conflict: 'text-brick-ink',
  invalid: 'text-brick-ink',
  error: 'text-brick-ink',
  closed: 'text-ink-600',
};

const TABS = ['form', 'photos', 'findings', 'calculators', 'plan'] as const;
type Tab = (typeof TABS)[number];

function PlanTab({ w, perms, onChange }: { w: Walkthrough; perms: Permissions; onChange: () => void }) {
  const s = useQuery({ queryKey: ['suggestions', w.id], queryFn: () => api<InstrumentSuggestions>(`/api/walkthroughs/${w.id}/suggestions`) });
  const [kit, setKit] = useState<KitChoice>({ kitId: null, start: w.plannedOn, end: w.plannedOn });
  const [msg, setMsg] = useState<{ ok: boolean; text: string } | null>(null);
  const holding = w.loan && !['declined', 'cancelled', 'returned', 'inspected'].includes(w.loan.status);
  const reserve = useMutation({
    mutationFn: () => reserveKit(w.id, w.title, kit),
    onSuccess: (r) => {
      setMsg(r.ok ? { ok: true, text: 'The kit is requested: the custodian will confirm.' } : { ok: false, text: r.message });
      if (r.ok) onChange();
    },
  });
  return (
    <div className="space-y-4">
      <section className="card space-y-3 p-4 sm:p-5" aria-labelledby="bring-h">
        <h2 id="bring-h">What to bring</h2>
        {s.isPending && <p role="status">Reading the building’s figures…</p>}
        {s.isError && <p className="notice-error" role="alert">{(s.error as Error).message}</p>}
        {s.data && <Suggestions s={s.data} />}
      </section>
      <section className="card space-y-3 p-4 sm:p-5" aria-labelledby="kit-h">
        <h2 id="kit-h">Kit</h2>
        {w.loan ? <p className="text-sm">Kit <span className="figure">{w.loan.kitCode}</span>, loan {w.loan.status}. <a href="/kits">Kit library</a></p> : <p className="text-sm text-ink-600">No kit reserved.</p>}
        {!holding && perms.requestKit && w.status !== 'completed' && w.status !== 'cancelled' && (
          <form className="space-y-3" onSubmit={(e) => { e.preventDefault(); setMsg(null); if (kit.kitId) reserve.mutate(); }}>
            <KitPicker value={kit} onChange={setKit} suggested={(s.data?.instruments ?? []).filter((i) => i.basis === 'signature').map((i) => i.type)} />
            <button type="submit" className="btn-primary min-h-11" disabled={!kit.kitId || reserve.isPending}>Reserve the kit</button>
          </form>
        )}
        {msg && (msg.ok ? <p className="notice-info" role="status">{msg.text}</p> : <p className="notice-warn" role="alert">{msg.text}</p>)}
      </section>
    </div>
  );
}

function CompleteDialog({ gaps, onConfirm, onClose, busy }: { gaps: SectionGap[]; onConfirm: () => void; onClose: () => void; busy: boolean }) {
  return (
    <div role="dialog" aria-modal="true" aria-labelledby="complete-h" className="fixed inset-0 z-40 flex items-end justify-center bg-ink-900/40 p-2 sm:items-center sm:p-4" onKeyDown={(e) => e.key === 'Escape' && onClose()}>
      <div className="card max-h-[90vh] w-full max-w-lg space-y-3 overflow-y-auto">
        <h2 id="complete-h">Not everything is complete</h2>
        <ul className="space-y-2 text-sm" data-testid="completion-gaps">
          {gaps.map((g) => (
            <li key={g.section}>
              <span className="font-medium">{g.label}</span>
              {g.notMarked && <span className="text-ink-600"> — not marked complete</span>}
              {g.missing.length > 0 && <ul className="list-inside list-disc text-ink-700">{g.missing.slice(0, 6).map((m) => <li key={m}>{m}</li>)}{g.missing.length > 6 && <li>and {g.missing.length - 6} more</li>}</ul>}
            </li>
          ))}
        </ul>
        <div className="flex flex-wrap gap-2">
          <button type="button" autoFocus className="btn-secondary min-h-11" onClick={onClose}>Back to the form</button>
          <button type="button" className="btn-primary min-h-11" disabled={busy} onClick={onConfirm}>Complete anyway</button>
        </div>
      </div>
    </div>
  );
}

function Editor({ w, perms, rate, tab, setTab }: { w: Walkthrough; perms: Permissions; rate: Rate | null; tab: Tab; setTab: (t: Tab) => void }) {
  const qc = useQueryClient();
  const key = ['walkthrough', w.id];
  const editable = perms.field && (w.status === 'planned' || w.status === 'in-progress');
  const auto = useAutosave({
    id: w.id,
    form: w.form,
    version: w.formVersion,
    editable,
    onSaved: (r) => qc.setQueryData<Walkthrough>(key, (old) => (old ? { ...old, status: r.status as WalkthroughStatus, progress: r.progress, formVersion: r.formVersion } : old)),
  });
  const [pendingText, setPendingText] = useState<string | null>(null);
  const [gaps, setGaps] = useState<SectionGap[] | null>(null);
  const [statusError, setStatusError] = useState<string | null>(null);
  const refresh = () => void qc.invalidateQueries();
  const move = useMutation({
    mutationFn: (body: { status: WalkthroughStatus; acknowledgeIncomplete?: boolean; note?: string }) => api<Walkthrough>(`/api/walkthroughs/${w.id}/status`, { method: 'POST', body }),
    onSuccess: (data) => {
      setGaps(null);
      setStatusError(null);
      qc.setQueryData(key, data);
    },
    onError: (e) => {
      const d = e instanceof ApiError ? (e.details as { reason?: string; gaps?: SectionGap[] } | null) : null;
      if (d?.reason === 'incomplete' && d.gaps) setGaps(d.gaps);
      else setStatusError((e as Error).message);
    },
  });
  const complete = async () => {
    setStatusError(null);
    if (auto.dirtyCount() > 0) await auto.saveNow();
    if (auto.dirtyCount() > 0) return setStatusError('Some edits are not saved yet: save them before completing.');
    move.mutate({ status: 'completed' });
  };
  const completed = auto.form;
  const progress = { done: Object.values(completed).filter((s) => s.completed).length, total: Object.keys(completed).length };
  const tabRefs = useRef<Record<string, HTMLButtonElement | null>>({});
  const onTabKey = (e: KeyboardEvent) => {
    const i = TABS.indexOf(tab);
    const next = e.key === 'ArrowRight' ? TABS[(i + 1) % TABS.length] : e.key === 'ArrowLeft' ? TABS[(i + TABS.length - 1) % TABS.length] : null;
    if (next) {
      e.preventDefault();
      setTab(next);
      tabRefs.current[next]?.focus();
    }
  };
  const tabLabel: Record<Tab, string> = { form: 'Form', photos: `Photos (${w.photos.length})`, findings: `Findings (${w.findings.length})`, calculators: 'Calculators', plan: 'Plan & kit' };
  return (
    <div className="space-y-4">
      <div className="sticky top-0 z-30 -mx-6 border-b border-ink-200 bg-white/95 px-6 py-2 backdrop-blur">
        <div className="flex flex-wrap items-center justify-between gap-x-3 gap-y-1 text-sm">
          <span className={`badge ${WALKTHROUGH_BADGE[w.status].cls}`} data-testid="walkthrough-status">{WALKTHROUGH_BADGE[w.status].label}</span>
          <span role="status" aria-live="polite" className={`font-medium ${SAVE_CLS[auto.state]}`} data-testid="save-state">
            {SAVE_TEXT[auto.state]}
            {auto.state === 'saved' && auto.savedAt ? ` ${auto.savedAt.slice(11, 16)} UTC` : ''}
          </span>
          <span className="figure text-ink-600" aria-label={`${progress.done} of ${progress.total} sections complete`}>
            {progress.done}/{progress.total} sections
          </span>
        </div>
        <div className="mt-1 h-1.5 w-full overflow-hidden rounded bg-ink-100" aria-hidden="true">
          <div className="h-full bg-line-600" style={{ width: `${(100 * progress.done) / progress.total}%` }} />
        </div>
      </div>

      {auto.state === 'conflict' && (
        <div className="notice-error space-y-2" role="alert">
          <p>{auto.message ?? 'This walkthrough was saved from somewhere else since you opened it.'} Your edits are kept on this device{auto.draftAt ? ` (from ${auto.draftAt.slice(0, 16).replace('T', ' ')} UTC)` : ''}.</p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary min-h-11" onClick={() => void auto.resolve(true).then(refresh)}>Load the newer version and apply my edits</button>
            <button type="button" className="btn-secondary min-h-11" onClick={() => window.confirm('Drop the edits made on this device?') && void auto.resolve(false).then(refresh)}>Load the newer version, drop my edits</button>
          </div>
        </div>
      )}
      {(auto.state === 'error' || auto.state === 'offline') && auto.message && (
        <p className={auto.state === 'error' ? 'notice-error' : 'notice-warn'} role="alert">
          {auto.message} <button type="button" className="underline" onClick={() => void auto.saveNow()}>Try again now</button>
        </p>
      )}

      <div className="flex flex-wrap gap-2">
        {perms.field && w.status === 'in-progress' && <button type="button" className="btn-primary min-h-11" onClick={() => void complete()}>Complete the walkthrough</button>}
        {(perms.field || perms.plan) && w.status === 'completed' && <button type="button" className="btn-secondary min-h-11" onClick={() => move.mutate({ status: 'in-progress', note: 'reopened' })}>Reopen</button>}
        {perms.plan && (w.status === 'planned' || w.status === 'in-progress') && (
          <button type="button" className="btn-secondary min-h-11" onClick={() => { const note = window.prompt('Why is the walkthrough cancelled?'); if (note !== null) move.mutate({ status: 'cancelled', note }); }}>Cancel the walkthrough</button>
        )}
        {perms.plan && w.status === 'cancelled' && <button type="button" className="btn-secondary min-h-11" onClick={() => move.mutate({ status: 'planned' })}>Plan it again</button>}
      </div>
      {statusError && <p className="notice-error" role="alert">{statusError}</p>}
      {gaps && <CompleteDialog gaps={gaps} busy={move.isPending} onClose={() => setGaps(null)} onConfirm={() => move.mutate({ status: 'completed', acknowledgeIncomplete: true })} />}

      <div role="tablist" aria-label="Walkthrough" className="flex gap-1 overflow-x-auto border-b border-ink-200" onKeyDown={onTabKey}>
        {TABS.map((t) => (
          <button
            key={t}
            ref={(el) => { tabRefs.current[t] = el; }}
            role="tab"
            id={`tab-${t}`}
            aria-selected={tab === t}
            aria-controls={`panel-${t}`}
            tabIndex={tab === t ? 0 : -1}
            className={`min-h-11 shrink-0 whitespace-nowrap border-b-2 px-3 text-sm font-medium ${tab === t ? 'border-line-700 text-line-800' : 'border-transparent text-ink-600 hover:text-ink-900'}`}
            onClick={() => setTab(t)}
          >
            {tabLabel[t]}
          </button>
        ))}
      </div>
      <div role="tabpanel" id={`panel-${tab}`} aria-labelledby={`tab-${tab}`}>
        {tab === 'form' && <FieldForm form={auto.form} setSection={auto.setSection} errors={auto.fieldErrors} disabled={!editable} />}
        {tab === 'photos' && <Photos walkthroughId={w.id} photos={w.photos} findings={w.findings.map((f) => ({ id: f.id, title: f.title }))} editable={editable} onChange={refresh} />}
        {tab === 'findings' && (
          <div className="space-y-4">
            {w.rollup.count > 0 && (
              <p className="text-sm text-ink-700" data-testid="walkthrough-rollup">
                {w.rollup.count} measure{w.rollup.count === 1 ? '' : 's'}: {formatMoney(w.rollup.inPlay.annualCostSavings.total)}/yr for {formatMoney(w.rollup.inPlay.netInvestment)}, payback {w.rollup.inPlay.simplePaybackYears === null ? '—' : `${formatNumber(w.rollup.inPlay.simplePaybackYears, 1)} yr`} (rejected ones left out).
              </p>
            )}
            <Findings
              walkthroughId={w.id}
              findings={w.findings}
              photos={w.photos}
              canEdit={perms.field && w.status !== 'cancelled'}
              canPrice={(perms.field || perms.approve) && w.status !== 'cancelled'}
              canApprove={perms.approve}
              canImplement={perms.implement}
              rate={rate}
              pendingText={pendingText}
              onPendingDone={() => setPendingText(null)}
              onChange={refresh}
            />
          </div>
        )}
        {tab === 'calculators' && <CalculatorsPanel {...(perms.field && w.status !== 'cancelled' ? { onCopy: (t: string) => { setPendingText(t); setTab('findings'); } } : {})} />}
        {tab === 'plan' && <PlanTab w={w} perms={perms} onChange={refresh} />}
      </div>
    </div>
  );
}

function Workspace({ initial, perms }: { initial: Walkthrough; perms: Permissions }) {
  const rate = useDiscountRate().data ?? null;
  const q = useQuery({ queryKey: ['walkthrough', initial.id], queryFn: () => api<Walkthrough>(`/api/walkthroughs/${initial.id}`), initialData: initial });
  const [tab, setTab] = useState<Tab>('form');
  const w = q.data;
  const editable = perms.field && (w.status === 'planned' || w.status === 'in-progress');
  return (
    <>
      {q.isError && <p className="notice-error" role="alert">{(q.error as Error).message}</p>}
      {/* A new editor (and autosave) when the walkthrough opens or closes for edits. */}
      <Editor key={String(editable)} w={w} perms={perms} rate={rate} tab={tab} setTab={setTab} />
      {w.flag && <p className="mt-4 text-sm text-ink-600">Answers the flag “{w.flag.reason}”{w.flag.open ? '' : ' (cleared)'} · planned for {formatDate(w.plannedOn)}</p>}
    </>
  );
}

export default function WorkspaceIsland(props: { initial: Walkthrough; perms: Permissions }) {
  return (
    <QueryProvider>
      <Workspace {...props} />
    </QueryProvider>
  );
}
