import { describe, expect, it } from 'vitest';
import {
  coveredDays,
  fiscalYearOf,
  fiscalYearWindow,
  inclusiveDays,
  overlapDays,
  previousWindow,
  rolling12Window,
} from '../../../src/lib/benchmark/windows';

describe('US federal fiscal year', () => {
  it('FY2024 runs 1 Oct 2023 to 30 Sep 2024', () => {
    // Source: 31 U.S.C. 1102 (fiscal year begins 1 October, ends 30 September)
    const w = fiscalYearWindow(2024);
    expect(w.start).toBe('2023-10-01');
    expect(w.end).toBe('2024-09-30');
    expect(w.label).toBe('FY2024');
    // 29 Feb 2024 falls inside: 366 days (Gregorian leap-year rule)
    expect(w.days).toBe(366);
    expect(fiscalYearWindow(2023).days).toBe(365);
  });

  it('assigns October to the next fiscal year', () => {
    // Source: 31 U.S.C. 1102
    expect(fiscalYearOf('2023-09-30')).toBe(2023);
    expect(fiscalYearOf('2023-10-01')).toBe(2024);
    expect(fiscalYearOf('2024-01-15')).toBe(2024);
    expect(fiscalYearOf('2024-12-31')).toBe(2025);
  });

  it('previous window of FY2024 is FY2023', () => {
    expect(previousWindow(fiscalYearWindow(2024))).toEqual(fiscalYearWindow(2023));
  });

  it('rejects malformed input', () => {
    expect(() => fiscalYearWindow(2024.5)).toThrow();
    expect(() => fiscalYearOf('2024-13-01')).toThrow();
  });
});

describe('12-month rolling window', () => {
  it('ends on the last day of the month and starts 11 months earlier', () => {
    // Calendar arithmetic (common practice: 12 calendar months ending with the given month)
    expect(rolling12Window('2024-06')).toMatchObject({
      start: '2023-07-01',
      end: '2024-06-30',
      days: 366,
    });
    expect(rolling12Window('2024-01')).toMatchObject({
      start: '2023-02-01',
      end: '2024-01-31',
      days: 365,
    });
    expect(rolling12Window('2023-12')).toMatchObject({
      start: '2023-01-01',
      end: '2023-12-31',
      days: 365,
    });
    expect(rolling12Window('2024-02').end).toBe('2024-02-29');
  });

  it('previous window is the same months a year earlier', () => {
    expect(previousWindow(rolling12Window('2024-06'))).toEqual(rolling12Window('2023-06'));
  });

  it('rejects a malformed month', () => {
    expect(() => rolling12Window('2024-6')).toThrow();
  });
});

describe('coverage days', () => {
  it('counts both ends of a period (methods §2: days = end − start + 1)', () => {
    expect(inclusiveDays('2024-01-01', '2024-01-31')).toBe(31);
    expect(inclusiveDays('2024-02-01', '2024-01-31')).toBe(0);
  });

  it('clips a bill period to the window', () => {
    // 2023-10-01..2023-10-14 inside FY2024: 14 days (hand count)
    expect(overlapDays(fiscalYearWindow(2024), '2023-09-15', '2023-10-14')).toBe(14);
    expect(overlapDays(fiscalYearWindow(2024), '2023-08-01', '2023-08-31')).toBe(0);
  });

  it('counts overlapping bills once and skips gaps (constructed)', () => {
    const w = fiscalYearWindow(2024);
    const periods = [
      { start: '2023-10-01', end: '2023-10-31' }, // 31
      { start: '2023-10-31', end: '2023-11-30' }, // shared read day: +30
      { start: '2023-11-15', end: '2023-11-20' }, // duplicate inside: +0
      { start: '2024-01-01', end: '2024-01-31' }, // after a December gap: +31
      { start: '2024-09-20', end: '2024-10-20' }, // clipped at 30 Sep: +11
    ];
    expect(coveredDays(w, periods)).toBe(31 + 30 + 31 + 11);
    expect(coveredDays(w, [])).toBe(0);
  });
});
