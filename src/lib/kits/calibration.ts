/**
 * Calibration state of an instrument on a given day, and the reminder stages. An instrument may
 * be used up to and including its calibration due date; from the day after it is past due and
 * may not go out. Reminders go out in two stages, once each per due date: when the due date is
 * CALIBRATION_NOTICE_DAYS or fewer days away, and when it has passed.
 */
import { dayFromIso } from '../weather/day-number';

/** Days ahead of the due date from which an instrument counts as due soon (common practice: a month's notice to send it away). */
export const CALIBRATION_NOTICE_DAYS = 30;

export type CalibrationState = 'untracked' | 'ok' | 'due-soon' | 'past-due';
export type ReminderStage = 'due-soon' | 'past-due';

export interface CalibrationStatus {
  state: CalibrationState;
  /** Days from `onDay` to the due date (negative when past due); null when untracked. */
  daysLeft: number | null;
}

function day(iso: string): number {
  const d = dayFromIso(iso);
  if (d === null) throw new Error(`not an ISO date: ${iso}`);
  return d;
}

/**
 * Calibration state of an instrument with due date `due` on `onDay`. An instrument without a due
 * date (a tape measure, a flashlight) is `untracked`.
 * @example calibrationStatus('2026-03-31', '2026-03-10') // { state: 'due-soon', daysLeft: 21 }
 */
export function calibrationStatus(due: string | null, onDay: string): CalibrationStatus {
  if (!due) return { state: 'untracked', daysLeft: null };
  const left = day(due) - day(onDay);
  if (left < 0) return { state: 'past-due', daysLeft: left };
  if (left <= CALIBRATION_NOTICE_DAYS) return { state: 'due-soon', daysLeft: left };
  return { state: 'ok', daysLeft: left };
}

const RANK: Record<ReminderStage, number> = { 'due-soon': 1, 'past-due': 2 };

/**
 * The stage already announced for the current due date, read from the day the last reminder
 * went out: after the due date → past-due; within the notice window → due-soon; earlier (a
 * reminder for an older due date) or never → none.
 */
export function announcedStage(due: string, noticeOn: string | null): ReminderStage | null {
  if (!noticeOn) return null;
  const left = day(due) - day(noticeOn);
  if (left < 0) return 'past-due';
  if (left <= CALIBRATION_NOTICE_DAYS) return 'due-soon';
  return null;
}

/**
 * The reminder to send `today` for an instrument, or null: the current stage if it is later than
 * the one already announced. Sending it and recording `today` as the notice day makes a second
 * run on the same day send nothing.
 */
export function reminderToSend(due: string | null, noticeOn: string | null, today: string): ReminderStage | null {
  if (!due) return null;
  const { state } = calibrationStatus(due, today);
  if (state !== 'due-soon' && state !== 'past-due') return null;
  const sent = announcedStage(due, noticeOn);
  return sent && RANK[sent] >= RANK[state] ? null : state;
}
