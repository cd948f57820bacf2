/** The instruments to bring and why, read from the building's signature; hazards named where the instrument involves one. */
import type { HazardId } from '../../lib/field/calculator';
import { hazardById } from '../../lib/field/safety';
import type { InstrumentSuggestions } from '../../lib/field/suggest-instruments';

export function Suggestions({ s }: { s: Pick<InstrumentSuggestions, 'instruments' | 'notChecked'> }) {
  const signature = s.instruments.filter((i) => i.basis === 'signature');
  const routine = s.instruments.filter((i) => i.basis === 'routine');
  const hazards = (ids: HazardId[]) => ids.map((h) => hazardById(h).title.toLowerCase()).join('; ');
  return (
    <div className="space-y-3" data-testid="suggestions">
      {signature.length === 0 ? (
        <p className="text-sm text-ink-700">Nothing in this building's figures calls for a particular instrument: bring the routine kit.</p>
      ) : (
        <ul className="space-y-2">
          {signature.map((i) => (
            <li key={i.type} className="rounded-md border border-ink-200 p-2 text-sm">
              <p className="font-medium">{i.label}</p>
              <ul className="list-inside list-disc text-ink-700">{i.reasons.map((r) => <li key={r}>{r}</li>)}</ul>
              {i.hazards.length > 0 && <p className="text-xs text-amber-ink">Cautions apply: {hazards(i.hazards)}.</p>}
            </li>
          ))}
        </ul>
      )}
      <p className="text-sm text-ink-700"><span className="font-medium">Routine kit:</span> {routine.map((i) => i.label).join(', ')}.</p>
      {s.notChecked.length > 0 && (
        <details className="text-sm text-ink-600">
          <summary className="cursor-pointer">Not checked ({s.notChecked.length})</summary>
          <ul className="list-inside list-disc">{s.notChecked.map((n) => <li key={n}>{n}</li>)}</ul>
        </details>
      )}
    </div>
  );
}
