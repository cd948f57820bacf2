/** The reservation calendar's month grid (ISO 8601 weeks, Monday first), against ECMAScript Date's weekdays. */
import { describe, expect, it } from 'vitest';
import { conflictingHolds, holdsOn, isoWeekday, monthGrid, shiftMonth } from '../../../src/lib/kits/month-grid';
import { dayFromIso } from '../../../src/lib/weather/day-number';

// Source: ECMAScript Date.prototype.getUTCDay (ECMA-262 §21.4.4.13): 0 = Sunday … 6 = Saturday.
const weekdayByDate = (iso: string) => new Date(`${iso}T00:00:00Z`).getUTCDay() || 7;

describe('month grid', () => {
  it('weekdays agree with ECMAScript Date across several centuries', () => {
    for (let d = -200_000; d < 200_000; d += 997) {
      const iso = new Date(d * 86_400_000).toISOString().slice(0, 10);
      expect(isoWeekday(d), iso).toBe(weekdayByDate(iso));
    }
  });

  it('every week runs Monday to Sunday and holds each day of the month once', () => {
    for (let y = 2024; y <= 2028; y++)
      for (let m = 1; m <= 12; m++) {
        const grid = monthGrid(y, m);
        for (const w of grid) {
          expect(w).toHaveLength(7);
          expect(weekdayByDate(w[0]!.iso)).toBe(1);
          for (let k = 1; k < 7; k++) expect(dayFromIso(w[k]!.iso)! - dayFromIso(w[k - 1]!.iso)!).toBe(1);
        }
        const inMonth = grid.flat().filter((c) => c.inMonth).map((c) => c.iso);
        // Source: days in month from ECMAScript Date (day 0 of the next month).
        expect(inMonth).toHaveLength(new Date(Date.UTC(y, m, 0)).getUTCDate());
        expect(inMonth[0]).toBe(`${y}-${String(m).padStart(2, '0')}-01`);
      }
  });

  it('a February starting on a Monday fills exactly four weeks; one starting on a Sunday does not', () => {
    expect(weekdayByDate('2026-02-01')).toBe(7); // Sunday: so the grid starts on Monday 26 January
    expect(monthGrid(2026, 2)[0]![0]!.iso).toBe('2026-01-26');
    expect(monthGrid(2026, 2)).toHaveLength(5);
    expect(monthGrid(2027, 2)).toHaveLength(4); // 1 Feb 2027 is a Monday, 28 days
    expect(weekdayByDate('2027-02-01')).toBe(1);
  });

  it('finds the holds on a day and those a new range would clash with (constructed)', () => {
    const holds = [
      { start: '2026-03-02', end: '2026-03-04', id: 1 },
      { start: '2026-03-10', end: '2026-03-10', id: 2 },
    ];
    expect(holdsOn('2026-03-04', holds).map((h) => h.id)).toEqual([1]);
    expect(holdsOn('2026-03-05', holds)).toEqual([]);
    expect(conflictingHolds({ start: '2026-03-04', end: '2026-03-10' }, holds).map((h) => h.id)).toEqual([1, 2]);
    expect(conflictingHolds({ start: '2026-03-05', end: '2026-03-09' }, holds)).toEqual([]);
  });

  it('moves across year ends', () => {
    expect(shiftMonth(2026, 12, 1)).toEqual({ year: 2027, month: 1 });
    expect(shiftMonth(2026, 1, -1)).toEqual({ year: 2025, month: 12 });
    expect(shiftMonth(2026, 5, -17)).toEqual({ year: 2024, month: 12 });
  });
});
