import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dayFromCivil, isoFromDays, isoWeekday } from '../../../src/lib/formats/calendar';
import { parseDateCell } from '../../../src/lib/formats/cell-date';

// Reference implementation for the calendar: ECMAScript Date.UTC / toISOString (ECMA-262
// §21.4.1, proleptic Gregorian calendar, UTC), and Intl.DateTimeFormat (ICU/CLDR) for how
// en-US, en-CA, en-GB and de-DE write dates.
const DAY_MS = 86_400_000;
const dayArb = fc.integer({ min: Date.UTC(1900, 0, 1) / DAY_MS, max: Date.UTC(2099, 11, 31) / DAY_MS });
const isoOf = (day: number): string => new Date(day * DAY_MS).toISOString().slice(0, 10);

describe('calendar arithmetic against Date.UTC', () => {
  it('dayFromCivil, isoFromDays and isoWeekday agree with Date for every day 1900-2099', () => {
    fc.assert(
      fc.property(dayArb, (day) => {
        const d = new Date(day * DAY_MS);
        expect(dayFromCivil(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate())).toBe(day);
        expect(isoFromDays(day)).toBe(isoOf(day));
        expect(isoWeekday(day)).toBe(d.getUTCDay() === 0 ? 7 : d.getUTCDay());
      }),
    );
  });

  it('2025-01-01 is day 20089 since 1970-01-01', () => {
    // Source: Date.UTC(2025, 0, 1) / 86400000 = 20089 (ECMA-262 time values).
    expect(dayFromCivil(2025, 1, 1)).toBe(Date.UTC(2025, 0, 1) / DAY_MS);
  });
});

describe('parseDateCell', () => {
  it('reads dates as en-US, en-CA, en-GB and de-DE write them (Intl.DateTimeFormat)', () => {
    const us = new Intl.DateTimeFormat('en-US', { timeZone: 'UTC' });
    const ca = new Intl.DateTimeFormat('en-CA', { timeZone: 'UTC' });
    const gb = new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', day: '2-digit', month: 'short', year: 'numeric' });
    const de = new Intl.DateTimeFormat('de-DE', { timeZone: 'UTC' });
    fc.assert(
      fc.property(dayArb, (day) => {
        const date = new Date(day * DAY_MS);
        const iso = isoOf(day);
        expect(parseDateCell(us.format(date))).toEqual({ ok: true, iso }); // 1/31/2024
        expect(parseDateCell(ca.format(date))).toEqual({ ok: true, iso }); // 2024-01-31
        expect(parseDateCell(gb.format(date).replace('Sept', 'Sep'))).toEqual({ ok: true, iso }); // 31 Jan 2024
        expect(parseDateCell(de.format(date))).toEqual({ ok: true, iso }); // 31.1.2024
      }),
    );
  });

  it('accepts a date exactly when Date.UTC does not roll it over (so 2/30 and 13/01 fail)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1900, max: 2099 }), fc.integer({ min: 0, max: 14 }), fc.integer({ min: 0, max: 33 }), (y, m, d) => {
        const rolled = new Date(Date.UTC(y, m - 1, d));
        const real = m >= 1 && m <= 12 && rolled.getUTCMonth() === m - 1 && rolled.getUTCDate() === d;
        const parsed = parseDateCell(`${m}/${d}/${y}`);
        expect(parsed.ok).toBe(real);
        if (!parsed.ok) expect(parsed.code).toBe('impossible-date');
      }),
    );
  });

  it('explains impossible dates (constructed cases from the intake requirements)', () => {
    expect(parseDateCell('2/30/2023')).toEqual({
      ok: false,
      code: 'impossible-date',
      why: 'February 2023 has 28 days (dates with slashes are read month/day/year)',
    });
    expect(parseDateCell('13/01/2023')).toMatchObject({ ok: false, code: 'impossible-date', why: expect.stringContaining('no month 13') });
    expect(parseDateCell('5/36/2010')).toMatchObject({ ok: false, code: 'impossible-date', why: expect.stringContaining('May 2010 has 31 days') });
    // Gregorian rule: 1900 is not a leap year, 2000 is (ISO 8601-1 §3.2.1; Date.UTC agrees above).
    expect(parseDateCell('2/29/1900').ok).toBe(false);
    expect(parseDateCell('2/29/2000')).toEqual({ ok: true, iso: '2000-02-29' });
  });

  it('expands two-digit years with the POSIX %y pivot', () => {
    // Source: POSIX.1-2017 strptime: %y 69-99 refer to 1969-1999, 00-68 to 2000-2068.
    expect(parseDateCell('1/5/68')).toEqual({ ok: true, iso: '2068-01-05' });
    expect(parseDateCell('1/5/69')).toEqual({ ok: true, iso: '1969-01-05' });
    expect(parseDateCell('05-Jan-00')).toEqual({ ok: true, iso: '2000-01-05' });
    expect(parseDateCell('1/5/99', 100)).toEqual({ ok: true, iso: '2099-01-05' });
  });

  it('ignores a time after the date and reads yyyymmdd (constructed)', () => {
    expect(parseDateCell('2024-01-31T00:00:00')).toEqual({ ok: true, iso: '2024-01-31' });
    expect(parseDateCell('1/31/2024 12:00 AM')).toEqual({ ok: true, iso: '2024-01-31' });
    expect(parseDateCell('20240131')).toEqual({ ok: true, iso: '2024-01-31' });
    expect(parseDateCell('  2024/01/31 ')).toEqual({ ok: true, iso: '2024-01-31' });
  });

  it('refuses other shapes and years outside 1900-2099 (constructed)', () => {
    for (const bad of ['', 'soon', '2024-1', '1/2024', '31/Foo/2024', '45292', '2024-01-31x', '1/31/024', 'Jan 5 2024']) {
      expect(parseDateCell(bad)).toMatchObject({ ok: false, code: 'bad-date' });
    }
    expect(parseDateCell('1/5/1823')).toMatchObject({ ok: false, code: 'date-out-of-range' });
  });
});
