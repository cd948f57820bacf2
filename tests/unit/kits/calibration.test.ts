/** Calibration states and reminder stages on constructed dates (rules of this library; calendar by ECMAScript Date). */
import { describe, expect, it } from 'vitest';
import { announcedStage, CALIBRATION_NOTICE_DAYS, calibrationStatus, reminderToSend } from '../../../src/lib/kits/calibration';
import { kitProblems } from '../../../src/lib/kits/kit-readiness';

describe('calibration status', () => {
  it('is usable through the due date, past due from the day after', () => {
    // Constructed: due 31 March 2026; March has 31 days (Gregorian calendar).
    expect(calibrationStatus('2026-03-31', '2026-03-31')).toEqual({ state: 'due-soon', daysLeft: 0 });
    expect(calibrationStatus('2026-03-31', '2026-04-01')).toEqual({ state: 'past-due', daysLeft: -1 });
    expect(calibrationStatus('2026-03-31', '2026-03-01')).toEqual({ state: 'due-soon', daysLeft: 30 });
    expect(calibrationStatus('2026-03-31', '2026-02-28')).toEqual({ state: 'ok', daysLeft: 31 });
    expect(calibrationStatus(null, '2026-02-28')).toEqual({ state: 'untracked', daysLeft: null });
    expect(CALIBRATION_NOTICE_DAYS).toBe(30);
  });
});

describe('reminder stages', () => {
  const due = '2026-06-30';
  it('sends due-soon once, then past-due once', () => {
    expect(reminderToSend(due, null, '2026-05-30')).toBeNull(); // 31 days ahead
    expect(reminderToSend(due, null, '2026-05-31')).toBe('due-soon');
    expect(reminderToSend(due, '2026-05-31', '2026-05-31')).toBeNull();
    expect(reminderToSend(due, '2026-05-31', '2026-06-30')).toBeNull();
    expect(reminderToSend(due, '2026-05-31', '2026-07-01')).toBe('past-due');
    expect(reminderToSend(due, '2026-07-01', '2026-07-20')).toBeNull();
  });
  it('a job that first runs after the due date sends only the past-due reminder', () => {
    expect(reminderToSend(due, null, '2026-07-03')).toBe('past-due');
  });
  it('a notice for an older due date does not count for the new one', () => {
    expect(announcedStage('2027-06-30', '2026-07-01')).toBeNull();
    expect(reminderToSend('2027-06-30', '2026-07-01', '2027-06-01')).toBe('due-soon');
  });
});

describe('kit problems', () => {
  const base = { model: 'M', calibrationDue: '2026-06-30', condition: 'good' };
  it('names each instrument that may not go out and why', () => {
    const problems = kitProblems(
      [
        { id: 'a', type: 'clamp_ammeter', serial: '1', ...base },
        { id: 'b', type: 'light_meter', serial: '2', ...base, condition: 'retired' },
        { id: 'c', type: 'manometer', serial: '3', ...base, condition: 'needs-repair', calibrationDue: '2026-06-01' },
        { id: 'd', type: 'tape_measure', serial: '4', ...base, calibrationDue: null, condition: 'fair' },
      ],
      '2026-07-01',
    );
    expect(problems.map((p) => `${p.instrumentId}:${p.reason}`)).toEqual(['a:past-calibration', 'b:retired', 'b:past-calibration', 'c:needs-repair', 'c:past-calibration']);
    expect(problems[0]!.message).toBe('Clamp ammeter (M, serial 1): calibration due 30 Jun 2026, before the loan ends on 1 Jul 2026.');
  });
  it('a loan ending on the due date is fine', () => {
    expect(kitProblems([{ id: 'a', type: 'clamp_ammeter', serial: '1', ...base }], '2026-06-30')).toEqual([]);
  });
});
