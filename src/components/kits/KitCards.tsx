/**
 * The kits of the library as cards: what each holds, whether it is free for the dates asked (and
 * why not), where it is now, and the calibration of its instruments, in words.
 */
import { formatDate } from '../../lib/format';
import { INSTRUMENT_LABELS, type InstrumentType } from '../../lib/field/instruments';
import { formatRange } from '../../lib/kits/loan-dates';
import { LOAN_STATUS_LABELS } from '../../lib/kits/loan-states';
import { CalibrationBadge, ConditionBadge } from './Badges';
import { hazardsFor } from './SafetyCautions';
import type { KitSummary } from './types';

function Availability({ kit, today }: { kit: KitSummary; today: string }) {
  if (kit.available === true) return <p className="text-sm font-medium text-line-800" data-available="yes"><span aria-hidden="true">✓ </span>Free for your dates</p>;
  if (kit.available === false)
    return (
      <div className="text-sm text-brick-ink" data-available="no">
        <p className="font-medium"><span aria-hidden="true">✕ </span>Not available for your dates</p>
        <ul className="list-disc pl-5">{kit.unavailableBecause.map((b) => <li key={b}>{b}</li>)}</ul>
      </div>
    );
  const now = kit.now;
  const stuck = kit.instruments.filter((i) => i.calibration.state === 'past-due' || i.condition === 'needs-repair' || i.condition === 'retired').length;
  if (!kit.active || stuck > 0 || kit.instruments.length === 0)
    return <p className="text-sm font-medium text-brick-ink"><span aria-hidden="true">✕ </span>Cannot go out now: {!kit.active ? 'out of service' : kit.instruments.length === 0 ? 'no instruments' : `${stuck} instrument${stuck === 1 ? '' : 's'} past calibration or out of order`}{now ? ` · ${LOAN_STATUS_LABELS[now.status].toLowerCase()} ${formatRange(now)}` : ''}</p>;
  return (
    <p className="text-sm text-ink-700">
      {now ? (now.end < today ? <><span className="font-medium text-brick-ink">Overdue:</span> was due back {formatDate(now.end)}</> : <>{LOAN_STATUS_LABELS[now.status]} now, {formatRange(now)}</>) : 'Free today'}
      {kit.next && <> · next: {formatRange(kit.next)}</>}
    </p>
  );
}

export function KitCards({ kits, today }: { kits: KitSummary[]; today: string }) {
  return (
    <ul className="grid gap-4 md:grid-cols-2 xl:grid-cols-3" aria-label="Kits">
      {kits.map((k) => {
        const past = k.instruments.filter((i) => i.calibration.state === 'past-due').length;
        const soon = k.instruments.filter((i) => i.calibration.state === 'due-soon').length;
        const hazards = hazardsFor(k.instrumentTypes);
        return (
          <li key={k.id} className={`card flex flex-col gap-3 ${k.available === false ? 'border-brick-600/40' : ''}`} data-testid="kit-card">
            <div className="flex items-start justify-between gap-2">
              <div className="min-w-0">
                <h3 className="text-base font-semibold"><a href={`/kits/${k.id}`}><span className="figure">{k.code}</span> · {k.name}</a></h3>
                {k.homeLocation && <p className="text-xs text-ink-500">{k.homeLocation}</p>}
              </div>
              {!k.active && <span className="badge shrink-0 border border-brick-600 bg-brick-soft text-brick-ink">Out of service</span>}
            </div>
            {k.description && <p className="text-sm text-ink-700">{k.description}</p>}
            <Availability kit={k} today={today} />
            <p className="text-sm">
              {k.instruments.length === 0 ? <span className="text-ink-600">No instruments yet.</span> : past > 0 ? <span className="font-medium text-brick-ink"><span aria-hidden="true">✕ </span>{past} instrument{past === 1 ? '' : 's'} past calibration</span> : soon > 0 ? <span className="font-medium text-amber-ink"><span aria-hidden="true">! </span>{soon} calibration{soon === 1 ? '' : 's'} due within 30 days</span> : <span className="text-line-800"><span aria-hidden="true">✓ </span>All within calibration</span>}
              {hazards.length > 0 && <span className="ml-2 text-amber-ink"><span aria-hidden="true">⚠ </span>safety cautions apply</span>}
            </p>
            {k.instruments.length > 0 && (
              <details>
                <summary className="cursor-pointer text-sm text-line-700">{k.instruments.length} instrument{k.instruments.length === 1 ? '' : 's'}</summary>
                <ul className="mt-2 space-y-2 text-sm">
                  {k.instruments.map((i) => (
                    <li key={i.id}>
                      <span className="font-medium">{INSTRUMENT_LABELS[i.type as InstrumentType] ?? i.type}</span> <span className="text-ink-500">{i.model || 'model not recorded'} · <span className="figure">{i.serial}</span></span>
                      {i.notes && <span className="block text-xs text-ink-600">{i.notes}</span>}
                      <span className="mt-0.5 flex flex-wrap gap-1"><CalibrationBadge due={i.calibrationDue} status={i.calibration} />{i.condition !== 'good' && <ConditionBadge condition={i.condition} />}</span>
                    </li>
                  ))}
                </ul>
              </details>
            )}
            <a href={`/kits/${k.id}`} className="btn-secondary mt-auto self-start">Calendar and requests<span className="sr-only"> for {k.code}</span></a>
          </li>
        );
      })}
    </ul>
  );
}
