/** The cautions of the hazards a piece of field work involves, with the deferral to local codes and licensed practice. Shown before any input. */
import type { Hazard } from '../../lib/field/safety';

export function SafetyCautions({ hazards, deferral }: { hazards: readonly Hazard[]; deferral: string | null }) {
  if (hazards.length === 0) return null;
  return (
    <section className="caution space-y-2" aria-label="Safety cautions" data-testid="safety-cautions">
      <p className="font-semibold">Before you measure</p>
      {hazards.map((h) => (
        <div key={h.id}>
          <p className="font-medium">{h.title}</p>
          <ul className="list-inside list-disc space-y-0.5">
            {h.cautions.map((c) => <li key={c}>{c}</li>)}
          </ul>
          {h.references.length > 0 && <p className="text-xs">See {h.references.map((r) => r.title).join('; ')}.</p>}
        </div>
      ))}
      {deferral && <p className="text-sm font-medium">{deferral}</p>}
    </section>
  );
}
