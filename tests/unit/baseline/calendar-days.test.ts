import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dayToIsoDate, firstDayOfYear, isoDateToDay, yearOfDay } from '../../../src/lib/baseline/calendar-days';

describe('calendar day numbers', () => {
  it('agree with the JavaScript Date implementation (ECMAScript proleptic Gregorian UTC) for years 1000–9999', () => {
    fc.assert(
      fc.property(fc.integer({ min: -354_285, max: 2_932_896 }), (day) => {
        const iso = new Date(day * 86_400_000).toISOString().slice(0, 10);
        expect(dayToIsoDate(day)).toBe(iso);
        expect(isoDateToDay(iso)).toBe(day);
        expect(yearOfDay(day)).toBe(Number(iso.slice(0, 4)));
      }),
      { numRuns: 2000 },
    );
    expect(firstDayOfYear(2024)).toBe(Date.UTC(2024, 0, 1) / 86_400_000);
  });

  it('rejects dates that do not exist and accepts leap days (common practice)', () => {
    expect(isoDateToDay('2024-02-29')).not.toBeNull();
    for (const bad of ['2023-02-29', '2024-02-30', '2023-13-01', '2023-04-31', '2023-1-01', 'yesterday', '']) expect(isoDateToDay(bad)).toBeNull();
    expect(isoDateToDay(' 2024-03-01 ')).toBe(isoDateToDay('2024-03-01'));
  });
});
