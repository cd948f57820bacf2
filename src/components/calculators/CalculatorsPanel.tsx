/**
 * The field calculators, any of FIELD_CALCULATORS drawn from its metadata: the safety cautions
 * first where the work involves live equipment, combustion, rotating machinery, ladders or
 * mechanical rooms; then the inputs with their units and messages, the formula, the result with
 * its steps, the published sources and the limits of the method. A result can go into a finding.
 */
import { useMemo, useState } from 'react';
import { FIELD_CALCULATORS, type CalculatorId, type CalcOutcome, type RegisteredCalculator, type SourceCitation } from '../../lib/field';
import { formatNumber } from '../../lib/format';
import { SafetyCautions } from './SafetyCautions';

const CONFIDENCE: Record<SourceCitation['confidence'], string> = { primary: 'read in the source', secondary: 'as published by a third party', memory: 'not yet confirmed' };

function digits(v: number): number {
  const a = Math.abs(v);
  return a === 0 || a >= 100 ? 0 : a >= 10 ? 1 : a >= 1 ? 2 : 3;
}

/** The result as text for a finding or the clipboard: inputs used, steps, source. */
export function resultText(calc: RegisteredCalculator, outcome: CalcOutcome<unknown>): string {
  if (!outcome.ok) return '';
  const lines = outcome.steps.map((s) => `${s.label}: ${formatNumber(s.value, digits(s.value))}${s.unit ? ` ${s.unit}` : ''}`);
  return [`${calc.meta.title}`, ...lines, ...outcome.notes, `Source: ${calc.meta.sources.map((s) => s.title).join('; ')}.`].join('\n');
}

function Calculator({ calc, onCopy }: { calc: RegisteredCalculator; onCopy?: ((text: string) => void) | undefined }) {
  const [raw, setRaw] = useState<Record<string, string>>({});
  const [touched, setTouched] = useState<Set<string>>(new Set());
  const [copied, setCopied] = useState<string | null>(null);
  const input = useMemo(() => {
    const out: Record<string, unknown> = {};
    for (const i of calc.meta.inputs) {
      const v = (raw[i.name] ?? '').trim();
      if (v === '') continue;
      out[i.name] = i.kind === 'number' ? Number(v.replace(/,/g, '')) : v;
    }
    return out;
  }, [raw, calc]);
  const outcome = calc.run(input);
  const started = touched.size > 0;
  const issues = !outcome.ok && outcome.issues ? Object.fromEntries(outcome.issues.map((i) => [i.field, i.message])) : {};
  const text = resultText(calc, outcome);
  return (
    <div className="space-y-4" data-testid="calculator">
      <p className="text-sm text-ink-700">{calc.meta.summary}</p>
      <SafetyCautions hazards={calc.hazards} deferral={calc.safetyDeferral} />
      <form className="grid gap-3 sm:grid-cols-2" onSubmit={(e) => e.preventDefault()} aria-label={`${calc.meta.title}: inputs`} noValidate>
        {calc.meta.inputs.map((i) => {
          const id = `calc-${calc.meta.id}-${i.name}`;
          const err = touched.has(i.name) ? issues[i.name] : undefined;
          return (
            <div key={i.name}>
              <label htmlFor={id} className="field-label">
                {i.label}
                {i.unit && <span className="font-normal text-ink-600"> ({i.unit})</span>}
                {i.required && <span className="text-brick-ink" aria-hidden="true"> *</span>}
              </label>
              {i.kind === 'choice' ? (
                <select id={id} className="field-input min-h-11" value={raw[i.name] ?? ''} aria-invalid={!!err} aria-describedby={err ? `${id}-e` : i.help ? `${id}-h` : undefined} onChange={(e) => { setRaw({ ...raw, [i.name]: e.target.value }); setTouched(new Set([...touched, i.name])); }}>
                  <option value="">Choose…</option>
                  {i.choices?.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
                </select>
              ) : (
                <input id={id} inputMode="decimal" className="field-input figure min-h-11" value={raw[i.name] ?? ''} aria-invalid={!!err} aria-describedby={err ? `${id}-e` : i.help ? `${id}-h` : undefined} onChange={(e) => setRaw({ ...raw, [i.name]: e.target.value })} onBlur={() => setTouched(new Set([...touched, i.name]))} />
              )}
              {i.help && <p id={`${id}-h`} className="field-hint">{i.help}</p>}
              {err && <p id={`${id}-e`} className="field-error" role="alert">{err}</p>}
            </div>
          );
        })}
      </form>
      <div className="text-sm" data-testid="calc-formula">
        <p className="font-medium">Formula</p>
        <ul className="mt-1 space-y-0.5 break-words font-mono text-xs text-ink-800">{calc.meta.formulas.map((f) => <li key={f}>{f}</li>)}</ul>
      </div>
      <div aria-live="polite" className="space-y-2">
        {outcome.ok ? (
          <div className="rounded-md border border-line-200 bg-line-50 p-3" data-testid="calc-result">
            <table className="w-full text-sm">
              <caption className="sr-only">Result of {calc.meta.title}</caption>
              <tbody>
                {outcome.steps.map((s) => (
                  <tr key={s.label}>
                    <th scope="row" className="py-0.5 pr-2 text-left font-normal text-ink-700">{s.label}</th>
                    <td className="figure py-0.5 text-right font-medium">{formatNumber(s.value, digits(s.value))}{s.unit ? ` ${s.unit}` : ''}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            {outcome.notes.length > 0 && <ul className="mt-2 list-inside list-disc text-sm text-ink-700">{outcome.notes.map((n) => <li key={n}>{n}</li>)}</ul>}
            <div className="mt-3 flex flex-wrap gap-2">
              {onCopy && <button type="button" className="btn-primary min-h-11" onClick={() => onCopy(text)}>Add to a finding</button>}
              <button
                type="button"
                className="btn-secondary min-h-11"
                onClick={() => {
                  void navigator.clipboard?.writeText(text).then(() => setCopied('Copied.'), () => setCopied('Copy was refused by the browser: select the text instead.'));
                }}
              >
                Copy the result
              </button>
              {copied && <span role="status" className="self-center text-sm text-ink-600">{copied}</span>}
            </div>
          </div>
        ) : started && outcome.reason !== 'invalid-input' ? (
          <p className="notice-warn">{outcome.message}</p>
        ) : started ? (
          <div className="text-sm text-ink-700">
            <p>Still needed for a result:</p>
            <ul className="list-inside list-disc">{Object.values(issues).map((m) => <li key={m}>{m}</li>)}</ul>
          </div>
        ) : (
          <p className="text-sm text-ink-600">Enter the readings to see the result.</p>
        )}
      </div>
      <div className="space-y-1 text-sm">
        <p className="font-medium">Sources</p>
        <ul className="list-inside list-disc text-ink-700">
          {calc.meta.sources.map((s) => (
            <li key={s.title}>
              {s.title}, {s.publisher}
              {s.detail ? ` (${s.detail})` : ''} <span className="text-xs text-ink-500">— {CONFIDENCE[s.confidence]}</span>
            </li>
          ))}
        </ul>
        <p className="font-medium">Limits of the method</p>
        <ul className="list-inside list-disc text-ink-700">{calc.meta.limitations.map((l) => <li key={l}>{l}</li>)}</ul>
      </div>
    </div>
  );
}

export default function CalculatorsPanel({ onCopy, initial }: { onCopy?: (text: string) => void; initial?: CalculatorId }) {
  const [id, setId] = useState<CalculatorId>(initial ?? FIELD_CALCULATORS[0]!.meta.id);
  const calc = FIELD_CALCULATORS.find((c) => c.meta.id === id)!;
  return (
    <section className="card space-y-4 p-4 sm:p-5" aria-labelledby="calc-h" data-testid="calculators">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="calc-h">Field calculators</h2>
        <div className="w-full sm:w-auto">
          <label htmlFor="calc-pick" className="field-label">Calculator</label>
          <select id="calc-pick" className="field-input min-h-11" value={id} onChange={(e) => setId(e.target.value as CalculatorId)}>
            {FIELD_CALCULATORS.map((c) => (
              <option key={c.meta.id} value={c.meta.id}>
                {c.meta.title}
                {c.hazards.length ? ' ⚠' : ''}
              </option>
            ))}
          </select>
        </div>
      </div>
      <h3 className="text-base font-semibold">{calc.meta.title}</h3>
      <Calculator key={id} calc={calc} onCopy={onCopy} />
    </section>
  );
}
