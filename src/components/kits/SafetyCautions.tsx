/**
 * The cautions for the hazards a set of instruments brings (src/lib/field/safety.ts), each with
 * its references, and the deferral to the site's rules, local codes and licensed practice.
 */
import { HAZARDS, SAFETY_DEFERRAL } from '../../lib/field/safety';
import { INSTRUMENT_LABELS, type InstrumentType } from '../../lib/field/instruments';

export function hazardsFor(types: readonly string[]) {
  return HAZARDS.filter((h) => h.appliesToInstruments.some((t) => types.includes(t)));
}

export function SafetyCautions({ types, headingLevel = 2 }: { types: readonly string[]; headingLevel?: 2 | 3 }) {
  const hazards = hazardsFor(types);
  if (hazards.length === 0) return null;
  const H = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section className="caution space-y-2" aria-labelledby="kit-safety" data-testid="kit-safety">
      <H id="kit-safety" className="text-base font-semibold text-amber-ink"><span aria-hidden="true">⚠ </span>Safety with these instruments</H>
      <p>{SAFETY_DEFERRAL}</p>
      {hazards.map((h) => (
        <details key={h.id} className="rounded border border-amber-300 bg-white/60 px-3 py-2">
          <summary className="cursor-pointer font-medium">
            {h.title} <span className="font-normal text-ink-700">— {h.appliesToInstruments.filter((t) => types.includes(t)).map((t) => INSTRUMENT_LABELS[t as InstrumentType]).join(', ')}</span>
          </summary>
          <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-800">
            {h.cautions.map((c) => <li key={c}>{c}</li>)}
          </ul>
          {h.references.length > 0 && <p className="mt-2 text-xs text-ink-600">See: {h.references.map((r) => r.title).join('; ')}.</p>}
          <p className="mt-1 text-xs text-ink-600">{h.deferral}</p>
        </details>
      ))}
    </section>
  );
}
