/**
 * A kit's reservations as a month (ISO weeks, Monday first), in a plain table: each day says in
 * words whether it is held, by which loan, and whether it falls in the range being requested or
 * clashes with a hold. Days are buttons when the calendar picks dates: Tab reaches the month,
 * arrow keys move by day and week, Enter or Space picks.
 */
import { useEffect, useRef, useState } from 'react';
import { formatDate } from '../../lib/format';
import { LOAN_STATUS_LABELS } from '../../lib/kits/loan-states';
import { holdsOn, monthGrid, shiftMonth } from '../../lib/kits/month-grid';
import { addDays, formatRange } from '../../lib/kits/loan-dates';
import type { CalendarEntry } from './types';

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
const WEEKDAYS = [['Mon', 'Monday'], ['Tue', 'Tuesday'], ['Wed', 'Wednesday'], ['Thu', 'Thursday'], ['Fri', 'Friday'], ['Sat', 'Saturday'], ['Sun', 'Sunday']] as const;
// Held days are hatched, days out are solid: the pattern tells them apart without colour.
const HELD = 'bg-[repeating-linear-gradient(135deg,var(--color-line-100)_0_4px,#fff_4px_8px)]';
const OUT = 'bg-line-200';
const isOut = (h: CalendarEntry) => h.status === 'shipped' || h.status === 'in-use';
const isPast = (h: CalendarEntry) => h.status === 'returned' || h.status === 'inspected';

export function holdText(h: CalendarEntry): string {
  const state = LOAN_STATUS_LABELS[h.status].toLowerCase();
  return h.loan ? `loan ${h.loan.ref} (${state}${h.loan.installationCode ? `, ${h.loan.installationCode}` : ''}): ${h.loan.purpose}` : `a loan for another installation (${state})`;
}

export function ReservationCalendar({
  holds,
  today,
  selection,
  onPick,
  focusMonth,
}: {
  holds: CalendarEntry[];
  today: string;
  selection?: { start: string; end: string } | null;
  onPick?: (iso: string) => void;
  /** A date whose month to show (follows the selection's start). */
  focusMonth?: string | null;
}) {
  const [ym, setYm] = useState(() => ({ year: Number(today.slice(0, 4)), month: Number(today.slice(5, 7)) }));
  const [cursor, setCursor] = useState(today);
  const [keyMove, setKeyMove] = useState(false);
  const table = useRef<HTMLTableElement>(null);
  useEffect(() => {
    if (focusMonth && /^\d{4}-\d{2}-\d{2}$/.test(focusMonth)) {
      setYm({ year: Number(focusMonth.slice(0, 4)), month: Number(focusMonth.slice(5, 7)) });
      setCursor(focusMonth);
    }
  }, [focusMonth]);
  useEffect(() => {
    if (keyMove) table.current?.querySelector<HTMLButtonElement>(`[data-day="${cursor}"]`)?.focus();
  }, [cursor, keyMove, ym]);

  const grid = monthGrid(ym.year, ym.month);
  const prefix = `${ym.year}-${String(ym.month).padStart(2, '0')}`;
  const tabbable = cursor.startsWith(prefix) ? cursor : `${prefix}-01`;
  const go = (delta: number) => setYm(shiftMonth(ym.year, ym.month, delta));
  const moveTo = (iso: string) => {
    setKeyMove(true);
    setCursor(iso);
    setYm({ year: Number(iso.slice(0, 4)), month: Number(iso.slice(5, 7)) });
  };
  const onKey = (e: React.KeyboardEvent, iso: string) => {
    const step = { ArrowLeft: -1, ArrowRight: 1, ArrowUp: -7, ArrowDown: 7 }[e.key];
    if (step) {
      e.preventDefault();
      moveTo(addDays(iso, step));
    }
  };
  const inSelection = (iso: string) => !!selection && selection.start <= iso && iso <= selection.end;
  const monthHolds = holds.filter((h) => h.start <= `${prefix}-31` && h.end >= `${prefix}-01`);

  return (
    <div className="space-y-3">
      <div className="flex items-center justify-between gap-2">
        <button type="button" className="btn-secondary px-2.5" onClick={() => go(-1)}><span aria-hidden="true">‹</span><span className="sr-only sm:not-sr-only"> Previous</span><span className="sr-only"> month</span></button>
        <h3 className="text-base font-semibold whitespace-nowrap" aria-live="polite">{MONTHS[ym.month - 1]} {ym.year}</h3>
        <button type="button" className="btn-secondary px-2.5" onClick={() => go(1)}><span className="sr-only sm:not-sr-only">Next </span><span className="sr-only">month</span><span aria-hidden="true">›</span></button>
      </div>
      <table ref={table} className="w-full table-fixed border-collapse text-sm" data-testid="kit-calendar">
        <caption className="sr-only">Reservations in {MONTHS[ym.month - 1]} {ym.year}{onPick ? '. Choose the first and the last day of your loan.' : ''}</caption>
        <thead>
          <tr>{WEEKDAYS.map(([short, long]) => <th key={short} scope="col" className="pb-1 text-center text-xs font-semibold text-ink-600"><abbr title={long} className="no-underline">{short}</abbr></th>)}</tr>
        </thead>
        <tbody>
          {grid.map((week) => (
            <tr key={week[0]!.iso}>
              {week.map((day) => {
                const on = holdsOn(day.iso, holds);
                const selected = inSelection(day.iso);
                const clash = selected && on.some((h) => !isPast(h));
                const held = on.filter((h) => !isPast(h));
                const label = [
                  formatDate(day.iso),
                  day.iso === today ? 'today' : null,
                  ...on.map((h) => `${isPast(h) ? 'was out with' : 'held by'} ${holdText(h)}`),
                  selected ? 'in your dates' : null,
                  clash ? 'clash' : null,
                ].filter(Boolean).join('; ');
                const look = [
                  'relative flex h-14 w-full flex-col items-start rounded border p-1 text-left sm:h-16',
                  day.inMonth ? '' : 'text-ink-600',
                  held.length ? (held.some(isOut) ? `${OUT} border-line-700` : `${HELD} border-line-600`) : on.length ? 'border-ink-300 bg-ink-50' : day.inMonth ? 'border-ink-200 bg-white' : 'border-ink-200 bg-ink-50',
                  selected ? 'ring-2 ring-line-600 ring-offset-1' : '',
                  clash ? 'border-2 border-brick-600' : '',
                ].join(' ');
                const body = (
                  <>
                    <span className={`figure text-xs ${day.iso === today ? 'rounded bg-ink-900 px-1 text-white' : ''}`}>{Number(day.iso.slice(8))}</span>
                    {held.length > 0 && <span className="mt-auto max-w-full truncate rounded bg-white/85 px-0.5 text-[10px] font-medium leading-tight text-ink-800">{held.some(isOut) ? 'out' : 'held'}{held[0]!.loan && <span className="hidden sm:inline"> {held[0]!.loan.ref.slice(0, 4)}</span>}</span>}
                    {held.length === 0 && on.length > 0 && <span className="mt-auto text-[10px] leading-tight text-ink-500">past loan</span>}
                    {clash && <span className="absolute right-0.5 top-0.5 text-[10px] font-bold text-brick-ink" aria-hidden="true">✕</span>}
                  </>
                );
                return (
                  <td key={day.iso} className="p-0.5 align-top">
                    {onPick ? (
                      <button type="button" data-day={day.iso} aria-label={label} aria-pressed={selected} tabIndex={day.iso === tabbable ? 0 : -1} className={`${look} hover:border-line-700 focus-visible:outline-2`} onClick={() => { setCursor(day.iso); onPick(day.iso); }} onKeyDown={(e) => onKey(e, day.iso)} onFocus={() => setCursor(day.iso)}>
                        {body}
                      </button>
                    ) : (
                      <div className={look} aria-label={label} role="img" data-day={day.iso}>{body}</div>
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-700" aria-label="Legend">
        <li className="flex items-center gap-1"><span className={`${HELD} inline-block h-3 w-5 rounded border border-line-600`} aria-hidden="true" /> held (requested or approved)</li>
        <li className="flex items-center gap-1"><span className={`${OUT} inline-block h-3 w-5 rounded border border-line-700`} aria-hidden="true" /> out (shipped or in use)</li>
        {onPick && <li className="flex items-center gap-1"><span className="inline-block h-3 w-5 rounded ring-2 ring-line-600" aria-hidden="true" /> your dates</li>}
        {onPick && <li className="flex items-center gap-1"><span className="inline-block h-3 w-5 rounded border-2 border-brick-600 text-center text-[8px] leading-3 text-brick-ink" aria-hidden="true">✕</span> clash</li>}
      </ul>
      <div>
        <h4 className="text-sm font-semibold text-ink-800">Loans in {MONTHS[ym.month - 1]}</h4>
        {monthHolds.length === 0 ? (
          <p className="text-sm text-ink-600">None: the kit is free all month.</p>
        ) : (
          <ul className="mt-1 space-y-0.5 text-sm" data-testid="kit-calendar-list">
            {monthHolds.map((h, k) => <li key={`${h.start}-${k}`}><span className="figure">{formatRange(h)}</span> — {isPast(h) ? 'was out with' : 'held by'} {holdText(h)}</li>)}
          </ul>
        )}
      </div>
    </div>
  );
}
