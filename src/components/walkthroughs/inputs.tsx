/**
 * Labelled inputs for the field form, sized for a thumb: text, long text, numbers that keep what
 * was typed even when it is not a number yet (the error says so; nothing typed is thrown away),
 * choices, and yes / no / not known.
 */
import { useEffect, useId, useState } from 'react';
import { Field } from '../ui/Field';

const input = 'field-input min-h-11 text-base sm:text-sm';

interface Base {
  label: string;
  hint?: string | undefined;
  error?: string | undefined;
  disabled?: boolean | undefined;
}

export function TextInput({ value, onChange, long, ...f }: Base & { value: string; onChange: (v: string) => void; long?: boolean }) {
  return (
    <Field label={f.label} hint={f.hint} error={f.error}>
      {({ id, describedBy, invalid }) =>
        long ? (
          <textarea id={id} rows={3} className={input} aria-describedby={describedBy} aria-invalid={invalid} disabled={f.disabled} value={value} onChange={(e) => onChange(e.target.value)} />
        ) : (
          <input id={id} className={input} aria-describedby={describedBy} aria-invalid={invalid} disabled={f.disabled} value={value} onChange={(e) => onChange(e.target.value)} />
        )
      }
    </Field>
  );
}

/** A number or nothing. What is typed stays in the box; the value changes only when it reads as a number. */
export function NumberInput({ value, onChange, unit, integer, ...f }: Base & { value: number | null; onChange: (v: number | null) => void; unit?: string | undefined; integer?: boolean }) {
  const [text, setText] = useState(value === null ? '' : String(value));
  const [bad, setBad] = useState<string | null>(null);
  useEffect(() => {
    // Follow changes from outside (a reload), not our own echo.
    const parsed = text.trim() === '' ? null : Number(text.replace(/,/g, ''));
    if (parsed !== value && !(parsed !== null && Number.isNaN(parsed))) setText(value === null ? '' : String(value));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value]);
  const change = (t: string) => {
    setText(t);
    const s = t.trim().replace(/,/g, '');
    if (s === '') {
      setBad(null);
      onChange(null);
      return;
    }
    const n = Number(s);
    if (!Number.isFinite(n)) return setBad('Enter a number (digits, one decimal point).');
    if (integer && !Number.isInteger(n)) return setBad('Enter a whole number.');
    setBad(null);
    onChange(n);
  };
  const label = unit ? `${f.label} (${unit})` : f.label;
  return (
    <Field label={label} hint={f.hint} error={bad ?? f.error}>
      {({ id, describedBy, invalid }) => (
        <input id={id} inputMode={integer ? 'numeric' : 'decimal'} className={`${input} figure`} aria-describedby={describedBy} aria-invalid={invalid} disabled={f.disabled} value={text} onChange={(e) => change(e.target.value)} />
      )}
    </Field>
  );
}

export function SelectInput<T extends string>({ value, onChange, choices, ...f }: Base & { value: T | null; onChange: (v: T) => void; choices: readonly { value: T; label: string }[] }) {
  return (
    <Field label={f.label} hint={f.hint} error={f.error}>
      {({ id, describedBy, invalid }) => (
        <select id={id} className={input} aria-describedby={describedBy} aria-invalid={invalid} disabled={f.disabled} value={value ?? ''} onChange={(e) => onChange(e.target.value as T)}>
          {value === null && <option value="">Choose…</option>}
          {choices.map((c) => (
            <option key={c.value} value={c.value}>
              {c.label}
            </option>
          ))}
        </select>
      )}
    </Field>
  );
}

export function CheckInput({ value, onChange, label, disabled }: { value: boolean; onChange: (v: boolean) => void; label: string; disabled?: boolean | undefined }) {
  return (
    <label className="flex min-h-11 cursor-pointer items-center gap-2 text-sm">
      <input type="checkbox" className="h-5 w-5 accent-line-700" checked={value} disabled={disabled} onChange={(e) => onChange(e.target.checked)} />
      {label}
    </label>
  );
}

/** Yes, no, or not known (null). */
export function TriInput({ value, onChange, label, disabled }: { value: boolean | null; onChange: (v: boolean | null) => void; label: string; disabled?: boolean | undefined }) {
  const choices: [string, boolean | null][] = [['Yes', true], ['No', false], ['Not known', null]];
  const name = useId();
  return (
    <fieldset className="space-y-1">
      <legend className="field-label">{label}</legend>
      <div className="flex flex-wrap gap-3">
        {choices.map(([text, v]) => (
          <label key={text} className="flex min-h-11 items-center gap-2 text-sm">
            <input type="radio" name={name} className="h-5 w-5 accent-line-700" checked={value === v} disabled={disabled} onChange={() => onChange(v)} />
            {text}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
