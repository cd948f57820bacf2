/**
 * The field form, section by section, for a phone held in one hand: each section folds, can be
 * marked complete, and list sections add and remove rows (a removed row can be brought back
 * until the next removal). Every change goes to the autosave at once.
 */
import { useState } from 'react';
import { SECTION_IDS, SECTION_LABELS, type SectionId, type WalkthroughForm } from '../../lib/field/walkthrough-form';
import { SECTION_SPECS, type FieldSpec, type Row } from './form-fields';
import { CheckInput, NumberInput, SelectInput, TextInput, TriInput } from './inputs';

type Values = Record<string, unknown>;

function FieldView({ spec, values, onChange, error, disabled }: { spec: FieldSpec; values: Values; onChange: (key: string, v: unknown) => void; error?: string | undefined; disabled: boolean }) {
  const v = values[spec.key];
  const set = (x: unknown) => onChange(spec.key, x);
  switch (spec.kind) {
    case 'text':
    case 'long':
      return <TextInput label={spec.label} hint={spec.hint} error={error} disabled={disabled} long={spec.kind === 'long'} value={String(v ?? '')} onChange={set} />;
    case 'number':
    case 'int':
      return <NumberInput label={spec.label} hint={spec.hint} error={error} disabled={disabled} unit={spec.kind === 'number' ? spec.unit : undefined} integer={spec.kind === 'int'} value={(v as number | null) ?? null} onChange={set} />;
    case 'select':
      return <SelectInput label={spec.label} hint={spec.hint} error={error} disabled={disabled} value={(v as string | null) ?? null} choices={spec.choices} onChange={set} />;
    case 'check':
      return <CheckInput label={spec.label} disabled={disabled} value={v === true} onChange={set} />;
    case 'tri':
      return <TriInput label={spec.label} disabled={disabled} value={(v as boolean | null) ?? null} onChange={set} />;
  }
}

function Fields({ fields, values, onChange, errors, prefix, disabled }: { fields: FieldSpec[]; values: Values; onChange: (key: string, v: unknown) => void; errors: Record<string, string>; prefix: string; disabled: boolean }) {
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      {fields.map((f) => (
        <div key={f.key} className={f.kind === 'long' ? 'sm:col-span-2' : ''}>
          <FieldView spec={f} values={values} onChange={onChange} error={errors[`${prefix}.${f.key}`]} disabled={disabled} />
        </div>
      ))}
    </div>
  );
}

function newId(): string {
  return typeof crypto !== 'undefined' && 'randomUUID' in crypto ? crypto.randomUUID() : `r${Date.now()}${Math.random().toString(36).slice(2, 8)}`;
}

function Section({ id, form, setSection, errors, disabled }: { id: SectionId; form: WalkthroughForm; setSection: <K extends SectionId>(id: K, v: WalkthroughForm[K]) => void; errors: Record<string, string>; disabled: boolean }) {
  const spec = SECTION_SPECS[id];
  const section = form[id] as unknown as Values & { completed: boolean };
  const [open, setOpen] = useState<Set<string>>(new Set());
  const [removed, setRemoved] = useState<{ row: Row; index: number } | null>(null);
  const update = (patch: Values) => setSection(id, { ...section, ...patch } as never);
  const rows = spec.kind === 'list' ? ((section[spec.listKey] as Row[]) ?? []) : [];
  const sectionErrors = Object.entries(errors).filter(([k]) => k.startsWith(`${id}.`));
  return (
    <section id={`section-${id}`} aria-labelledby={`h-${id}`} className="card scroll-mt-28 space-y-4 p-4 sm:p-5" data-testid={`section-${id}`}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id={`h-${id}`}>
          {SECTION_LABELS[id]}
          {section.completed && <span className="badge ml-2 bg-line-50 align-middle text-line-800">complete</span>}
        </h2>
        <CheckInput label="Section complete" disabled={disabled} value={section.completed} onChange={(v) => update({ completed: v })} />
      </div>
      {sectionErrors.length > 0 && (
        <p className="field-error" role="alert">
          Not saved: {sectionErrors.length} field{sectionErrors.length > 1 ? 's' : ''} to correct in this section.
        </p>
      )}
      {spec.kind === 'plain' ? (
        <Fields fields={spec.fields} values={section} prefix={id} errors={errors} disabled={disabled} onChange={(k, v) => update({ [k]: v })} />
      ) : (
        <div className="space-y-3">
          {rows.length === 0 && <p className="text-sm text-ink-600">No rows yet.</p>}
          {rows.map((r, i) => {
            const isOpen = open.has(r.id);
            const label = spec.summary(r) || 'New row';
            return (
              <div key={r.id} className="rounded-md border border-ink-200" data-testid={`${id}-row`}>
                <button
                  type="button"
                  className="flex min-h-11 w-full items-center justify-between gap-2 px-3 py-2 text-left text-sm"
                  aria-expanded={isOpen}
                  aria-controls={`row-${r.id}`}
                  onClick={() => setOpen((s) => new Set(s.has(r.id) ? [...s].filter((x) => x !== r.id) : [...s, r.id]))}
                >
                  <span className="min-w-0 truncate">
                    <span className="figure text-ink-500">{i + 1}.</span> {label}
                    {Object.keys(errors).some((k) => k.startsWith(`${id}.${spec.listKey}.${i}.`)) && <span className="ml-1 text-brick-ink">(check)</span>}
                  </span>
                  <span aria-hidden="true">{isOpen ? '▾' : '▸'}</span>
                </button>
                {isOpen && (
                  <div id={`row-${r.id}`} className="space-y-3 border-t border-ink-100 p-3">
                    <Fields
                      fields={spec.fields}
                      values={r}
                      prefix={`${id}.${spec.listKey}.${i}`}
                      errors={errors}
                      disabled={disabled}
                      onChange={(k, v) => update({ [spec.listKey]: rows.map((x) => (x.id === r.id ? { ...x, [k]: v } : x)) })}
                    />
                    {!disabled && (
                      <button
                        type="button"
                        className="btn-secondary min-h-11"
                        onClick={() => {
                          setRemoved({ row: r, index: i });
                          update({ [spec.listKey]: rows.filter((x) => x.id !== r.id) });
                        }}
                      >
                        Remove row {i + 1}
                      </button>
                    )}
                  </div>
                )}
              </div>
            );
          })}
          {removed && !disabled && (
            <p className="notice-info flex flex-wrap items-center justify-between gap-2" role="status">
              Row {removed.index + 1} removed.
              <button
                type="button"
                className="btn-secondary min-h-11"
                onClick={() => {
                  const next = [...rows];
                  next.splice(Math.min(removed.index, next.length), 0, removed.row);
                  update({ [spec.listKey]: next });
                  setRemoved(null);
                }}
              >
                Undo
              </button>
            </p>
          )}
          {!disabled && (
            <button
              type="button"
              className="btn-secondary min-h-11 w-full sm:w-auto"
              onClick={() => {
                const row = spec.newRow(newId());
                setOpen((s) => new Set([...s, row.id]));
                setRemoved(null);
                update({ [spec.listKey]: [...rows, row] });
              }}
            >
              {spec.addLabel}
            </button>
          )}
        </div>
      )}
    </section>
  );
}

export function FieldForm({ form, setSection, errors, disabled }: { form: WalkthroughForm; setSection: <K extends SectionId>(id: K, v: WalkthroughForm[K]) => void; errors: Record<string, string>; disabled: boolean }) {
  return (
    <div className="space-y-4">
      <nav aria-label="Form sections" className="flex gap-2 overflow-x-auto pb-1">
        {SECTION_IDS.map((id) => (
          <a key={id} href={`#section-${id}`} className={`badge shrink-0 whitespace-nowrap px-3 py-1.5 text-sm no-underline ${form[id].completed ? 'bg-line-50 text-line-800' : 'bg-white text-ink-700 ring-1 ring-ink-200'}`}>
            {form[id].completed ? '✓ ' : ''}
            {SECTION_LABELS[id]}
          </a>
        ))}
      </nav>
      {SECTION_IDS.map((id) => (
        <Section key={id} id={id} form={form} setSection={setSection} errors={errors} disabled={disabled} />
      ))}
    </div>
  );
}
