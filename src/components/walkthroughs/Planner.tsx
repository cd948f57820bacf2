/**
 * Planning a walkthrough from a flagged building: the building, the date, an auditor assigned to
 * its installation, the instruments its figures call for (with the reasons), and a kit from the
 * loaner library for the dates. The walkthrough is created first, then the kit reserved; if the
 * kit cannot be had, the walkthrough stays planned and another kit can be tried.
 */
import { useMutation, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { InstrumentSuggestions } from '../../lib/field/suggest-instruments';
import { walkthroughPlanSchema } from '../../lib/field/walkthrough-api';
import { USE_TYPE_LABELS, type UseType } from '../../lib/domain';
import { formatDate, formatNumber } from '../../lib/format';
import { api, ApiError } from '../ui/api';
import { QueryProvider } from '../ui/query';
import { Field } from '../ui/Field';
import { KitPicker, reserveKit, type KitChoice } from './KitPicker';
import { Suggestions } from './Suggestions';

interface Context {
  building: { id: string; number: string; name: string; useType: string; grossAreaFt2: number; yearBuilt: number | null; lastEvaluatedOn: string | null; installationCode: string; installationName: string };
  flag: { id: string; reason: string; flaggedAt: string } | null;
  auditors: { id: string; name: string }[];
  openWalkthroughs: { id: string; title: string; plannedOn: string; status: string }[];
  suggestions: InstrumentSuggestions;
}
interface Flagged { buildingId: string; buildingNumber: string; installationCode: string; reason: string }

const addDays = (iso: string, n: number) => new Date(Date.parse(`${iso}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

function BuildingChooser({ flagged, onPick }: { flagged: Flagged[]; onPick: (id: string) => void }) {
  const [q, setQ] = useState('');
  const search = useQuery({
    queryKey: ['building-search', q],
    enabled: q.trim().length >= 2,
    queryFn: () => api<{ items: { id: string; number: string; name: string; installationCode: string }[] }>(`/api/buildings?${new URLSearchParams({ q: q.trim() })}`),
  });
  return (
    <section className="card space-y-4" aria-labelledby="choose-h">
      <h2 id="choose-h">Which building?</h2>
      {flagged.length > 0 ? (
        <div className="space-y-2">
          <p className="text-sm text-ink-700">Flagged for a walkthrough:</p>
          <ul className="space-y-1">
            {flagged.map((f) => (
              <li key={f.buildingId}>
                <button type="button" className="btn-secondary min-h-11 w-full justify-start text-left" onClick={() => onPick(f.buildingId)}>
                  <span className="figure">{f.installationCode} {f.buildingNumber}</span>
                  <span className="truncate text-ink-600">— {f.reason}</span>
                </button>
              </li>
            ))}
          </ul>
        </div>
      ) : (
        <p className="text-sm text-ink-600">No building is flagged at the moment.</p>
      )}
      <Field label="Or find a building by number or name">
        {({ id }) => <input id={id} type="search" className="field-input min-h-11" value={q} onChange={(e) => setQ(e.target.value)} />}
      </Field>
      {search.isError && <p className="field-error">{(search.error as Error).message}</p>}
      {search.data && (
        <ul className="space-y-1">
          {search.data.items.slice(0, 20).map((b) => (
            <li key={b.id}>
              <button type="button" className="btn-secondary min-h-11 w-full justify-start text-left" onClick={() => onPick(b.id)}>
                <span className="figure">{b.installationCode} {b.number}</span> {b.name}
              </button>
            </li>
          ))}
          {search.data.items.length === 0 && <li className="text-sm text-ink-600">No building matches.</li>}
        </ul>
      )}
    </section>
  );
}

function PlanForm({ ctx, today }: { ctx: Context; today: string }) {
  const b = ctx.building;
  const firstDate = addDays(today, 7);
  const [title, setTitle] = useState(`Walkthrough of ${b.installationCode} ${b.number} ${b.name}`);
  const [plannedOn, setPlannedOn] = useState(firstDate);
  const [auditorId, setAuditorId] = useState(ctx.auditors.length === 1 ? ctx.auditors[0]!.id : '');
  const [answersFlag, setAnswersFlag] = useState(ctx.flag !== null);
  const [kit, setKit] = useState<KitChoice>({ kitId: null, start: firstDate, end: addDays(firstDate, 1) });
  const [kitTouched, setKitTouched] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [created, setCreated] = useState<string | null>(null);
  const [kitProblem, setKitProblem] = useState<string | null>(null);
  const suggested = ctx.suggestions.instruments.filter((i) => i.basis === 'signature').map((i) => i.type);
  const submit = useMutation({
    mutationFn: async () => {
      let id = created;
      if (!id) {
        const body = { buildingId: b.id, title, plannedOn, auditorId: auditorId || null, flagId: answersFlag && ctx.flag ? ctx.flag.id : null };
        const parsed = walkthroughPlanSchema.safeParse(body);
        if (!parsed.success) {
          setErrors(Object.fromEntries(parsed.error.issues.map((i) => [i.path.join('.'), i.message])));
          throw new Error('Check the marked fields.');
        }
        id = (await api<{ id: string }>('/api/walkthroughs', { method: 'POST', body })).id;
        setCreated(id);
      }
      if (kit.kitId) {
        const r = await reserveKit(id, title, kit);
        if (!r.ok) {
          setKitProblem(r.message);
          return null;
        }
      }
      return id;
    },
    onSuccess: (id) => {
      if (id) window.location.href = `/walkthroughs/${id}`;
    },
    onError: (e) => {
      if (e instanceof ApiError) setErrors(e.fields);
    },
  });
  return (
    <form className="space-y-6" noValidate onSubmit={(e) => { e.preventDefault(); setKitProblem(null); submit.mutate(); }} aria-label="Plan a walkthrough">
      <section className="card space-y-2" aria-labelledby="b-h">
        <h2 id="b-h"><span className="figure">{b.installationCode} {b.number}</span> · {b.name}</h2>
        <p className="text-sm text-ink-600">{USE_TYPE_LABELS[b.useType as UseType] ?? b.useType} · {formatNumber(b.grossAreaFt2)} ft² · built {b.yearBuilt ?? '—'} · last evaluated {b.lastEvaluatedOn ? formatDate(b.lastEvaluatedOn) : 'never'}</p>
        {ctx.flag && <p className="text-sm"><span className="badge bg-brick-soft text-brick-ink">flagged</span> {ctx.flag.reason}</p>}
        {ctx.openWalkthroughs.length > 0 && (
          <p className="notice-warn">Already planned for this building: {ctx.openWalkthroughs.map((w, i) => <span key={w.id}>{i > 0 && ', '}<a href={`/walkthroughs/${w.id}`}>{w.title}</a> ({formatDate(w.plannedOn)})</span>)}.</p>
        )}
      </section>
      <section className="card space-y-4" aria-labelledby="when-h">
        <h2 id="when-h">When and who</h2>
        <div className="grid gap-4 sm:grid-cols-2">
          <Field label="Title" required error={errors.title}>{({ id, describedBy, invalid }) => <input id={id} className="field-input min-h-11" aria-describedby={describedBy} aria-invalid={invalid} value={title} disabled={!!created} onChange={(e) => setTitle(e.target.value)} />}</Field>
          <Field label="Date" required error={errors.plannedOn}>
            {({ id, describedBy, invalid }) => (
              <input id={id} type="date" className="field-input min-h-11" aria-describedby={describedBy} aria-invalid={invalid} value={plannedOn} disabled={!!created} onChange={(e) => { setPlannedOn(e.target.value); if (!kitTouched && /^\d{4}-\d{2}-\d{2}$/.test(e.target.value)) setKit({ ...kit, start: e.target.value, end: addDays(e.target.value, 1) }); }} />
            )}
          </Field>
          <Field label="Auditor" error={errors.auditorId} hint={ctx.auditors.length === 0 ? `No auditor is assigned to ${b.installationCode}: an administrator assigns them on the People page.` : `Auditors assigned to ${b.installationCode}`}>
            {({ id, describedBy, invalid }) => (
              <select id={id} className="field-input min-h-11" aria-describedby={describedBy} aria-invalid={invalid} value={auditorId} disabled={!!created} onChange={(e) => setAuditorId(e.target.value)}>
                <option value="">Not assigned yet</option>
                {ctx.auditors.map((a) => <option key={a.id} value={a.id}>{a.name}</option>)}
              </select>
            )}
          </Field>
          {ctx.flag && (
            <label className="flex min-h-11 items-center gap-2 self-end text-sm">
              <input type="checkbox" className="h-5 w-5 accent-line-700" checked={answersFlag} disabled={!!created} onChange={(e) => setAnswersFlag(e.target.checked)} />
              Answers the flag (cleared when the walkthrough is completed)
            </label>
          )}
        </div>
      </section>
      <section className="card space-y-4" aria-labelledby="bring-h">
        <h2 id="bring-h">What to bring</h2>
        <Suggestions s={ctx.suggestions} />
        <KitPicker value={kit} suggested={suggested} onChange={(c) => { setKitTouched(true); setKit(c); }} />
      </section>
      {created && kitProblem && (
        <div className="notice-warn space-y-2" role="alert">
          <p>The walkthrough is planned. The kit was not reserved: {kitProblem}</p>
          <p>Choose another kit or dates and try again, or <a href={`/walkthroughs/${created}`}>go to the walkthrough without a kit</a>.</p>
        </div>
      )}
      {submit.isError && <p className="notice-error" role="alert">{(submit.error as Error).message}</p>}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary min-h-11" disabled={submit.isPending}>{created ? (kit.kitId ? 'Reserve this kit' : 'Go on without a kit') : kit.kitId ? 'Plan and reserve the kit' : 'Plan the walkthrough'}</button>
        <a className="btn-secondary min-h-11" href="/walkthroughs">Cancel</a>
      </div>
    </form>
  );
}

function Planner({ buildingId, flagged, today }: { buildingId: string | null; flagged: Flagged[]; today: string }) {
  const [id, setId] = useState(buildingId);
  const ctx = useQuery({ queryKey: ['planning', id], enabled: !!id, queryFn: () => api<Context>(`/api/walkthroughs/planning?building=${id}`) });
  if (!id) return <BuildingChooser flagged={flagged} onPick={(b) => { history.replaceState(null, '', `?building=${b}`); setId(b); }} />;
  if (ctx.isPending) return <p role="status">Reading the building’s figures…</p>;
  if (ctx.isError) return <p className="notice-error" role="alert">{(ctx.error as Error).message}</p>;
  return <PlanForm ctx={ctx.data} today={today} />;
}

export default function PlannerIsland(props: { buildingId: string | null; flagged: Flagged[]; today: string }) {
  return (
    <QueryProvider>
      <Planner {...props} />
    </QueryProvider>
  );
}
