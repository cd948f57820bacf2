import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  civilFromDay,
  dayFromCivil,
  dayFromIso,
  dayFromYmd,
  daysInMonth,
  firstDayOfMonthIndex,
  isoFromDay,
  monthIndexOfDay,
} from '../../../src/lib/weather';

const MS_PER_DAY = 86_400_000;

describe('day numbers', () => {
  it('agrees with the ECMAScript Date.UTC reference for years 1600-2400', () => {
    // Source: ECMA-262 Date.UTC / toISOString (proleptic Gregorian, UTC), the platform's reference implementation
    const min = Date.UTC(1600, 0, 1) / MS_PER_DAY;
    const max = Date.UTC(2400, 11, 31) / MS_PER_DAY;
    fc.assert(
      fc.property(fc.integer({ min, max }), (day) => {
        const iso = new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
        expect(isoFromDay(day)).toBe(iso);
        expect(dayFromIso(iso)).toBe(day);
        const c = civilFromDay(day);
        expect(dayFromCivil(c.year, c.month, c.day)).toBe(day);
      }),
      { numRuns: 2000 },
    );
  });

  it('anchors the epoch and leap days', () => {
    // Source: definition of the day number used here (days since 1970-01-01 UTC)
    expect(dayFromIso('1970-01-01')).toBe(0);
    expect(isoFromDay(-1)).toBe('1969-12-31');
    // Source: Gregorian rule: 2000 is a leap year (divisible by 400), 1900 and 2100 are not
    expect(daysInMonth(2000, 2)).toBe(29);
    expect(daysInMonth(1900, 2)).toBe(28);
    expect(daysInMonth(2024, 2)).toBe(29);
    expect(dayFromYmd(2100, 2, 29)).toBeNull();
  });

  it('rejects text that is not an existing ISO date', () => {
    for (const bad of ['2023-02-29', '2024-13-01', '2024-04-31', '2024-1-5', '05/03/2024', '', '2024-00-10']) {
      expect(dayFromIso(bad)).toBeNull();
    }
  });

  it('walks months by index', () => {
    const jan = dayFromIso('2024-01-15') as number;
    expect(monthIndexOfDay(jan)).toBe(2024 * 12);
    expect(isoFromDay(firstDayOfMonthIndex(2024 * 12 + 1))).toBe('2024-02-01');
    expect(isoFromDay(firstDayOfMonthIndex(2024 * 12 + 12))).toBe('2025-01-01');
  });
});
