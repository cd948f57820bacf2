/**
 * Whether a kit may go out for a loan: every instrument in it must be in service (not retired,
 * not waiting for repair) and within calibration on every day of the loan. Each problem names the
 * instrument and the reason, so the person asking can act on it.
 */
import { z } from 'zod';
import { formatDate } from '../format';
import { INSTRUMENT_LABELS, type InstrumentType } from '../field/instruments';
import { calibrationStatus } from './calibration';

export const INSTRUMENT_CONDITIONS = ['good', 'fair', 'needs-repair', 'retired'] as const;
export const instrumentConditionSchema = z.enum(INSTRUMENT_CONDITIONS);
export type InstrumentCondition = z.infer<typeof instrumentConditionSchema>;

export const CONDITION_LABELS: Record<InstrumentCondition, string> = {
  good: 'Good',
  fair: 'Fair',
  'needs-repair': 'Needs repair',
  retired: 'Retired',
};

export interface InstrumentForCheck {
  id: string;
  type: string;
  model: string;
  serial: string;
  calibrationDue: string | null;
  condition: string;
}

export interface InstrumentProblem {
  instrumentId: string;
  reason: 'past-calibration' | 'needs-repair' | 'retired';
  message: string;
}

/** `Clamp ammeter (Model X, serial 123)`: how messages name an instrument. */
export function instrumentName(i: Pick<InstrumentForCheck, 'type' | 'model' | 'serial'>): string {
  const label = INSTRUMENT_LABELS[i.type as InstrumentType] ?? i.type;
  return `${label} (${[i.model, `serial ${i.serial}`].filter(Boolean).join(', ')})`;
}

/**
 * Problems that keep a kit from going out for a loan whose last day is `lastDay`. Calibration is
 * checked against the last day: an instrument within calibration then is within it on every
 * earlier day of the loan.
 * @example kitProblems([{ id: 'a', type: 'light_meter', model: '', serial: '7', calibrationDue: '2026-03-04', condition: 'good' }], '2026-03-05')
 * // [{ instrumentId: 'a', reason: 'past-calibration', message: 'Light meter (serial 7): calibration due 4 Mar 2026, before the loan ends on 5 Mar 2026.' }]
 */
export function kitProblems(instruments: readonly InstrumentForCheck[], lastDay: string): InstrumentProblem[] {
  const out: InstrumentProblem[] = [];
  for (const i of instruments) {
    const name = instrumentName(i);
    if (i.condition === 'retired') out.push({ instrumentId: i.id, reason: 'retired', message: `${name} is retired: take it out of the kit or replace it.` });
    else if (i.condition === 'needs-repair') out.push({ instrumentId: i.id, reason: 'needs-repair', message: `${name} needs repair: it cannot go out until it is marked good or fair.` });
    if (calibrationStatus(i.calibrationDue, lastDay).state === 'past-due')
      out.push({ instrumentId: i.id, reason: 'past-calibration', message: `${name}: calibration due ${formatDate(i.calibrationDue)}, before the loan ends on ${formatDate(lastDay)}.` });
  }
  return out;
}
