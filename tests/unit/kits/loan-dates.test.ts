/** Loan dates: inclusive day counts, overlaps and the request rules, checked against the Gregorian calendar. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addDays, checkLoanDates, daysBetween, loanDays, MAX_LEAD_DAYS, MAX_LOAN_DAYS, rangesOverlap, todayIn } from '../../../src/lib/kits/loan-dates';

// Source: ECMAScript Date (ECMA-262 §21.4.1, proleptic Gregorian calendar in UTC) as an independent
// reference implementation of calendar arithmetic.
const viaDate = (iso: string, n: number) => new Date(Date.parse(`${iso}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

describe('calendar arithmetic', () => {
  it('counts inclusive days across month ends and leap days', () => {
    // Source: Gregorian calendar — February 2028 has 29 days (2028 divisible by 4, not by 100); 2100 is not a leap year.
    expect(loanDays('2028-02-27', '2028-03-01')).toBe(4);
    expect(loanDays('2100-02-27', '2100-03-01')).toBe(3);
    expect(loanDays('2026-03-03', '2026-03-03')).toBe(1);
    expect(loanDays('2026-02-30', '2026-03-03')).toBeNull(); // no 30 February
  });

  it('adds days as ECMAScript Date does', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 60_000 }), fc.integer({ min: -800, max: 800 }), (base, n) => {
        const iso = viaDate('1970-01-01', base);
        expect(addDays(iso, n)).toBe(viaDate(iso, n));
        expect(daysBetween(iso, addDays(iso, n))).toBe(n);
      }),
    );
  });

  it('today in a time zone follows the zone’s calendar (IANA tz database)', () => {
    // Source: IANA time zone database — America/Los_Angeles is UTC−8 in January, Pacific/Auckland UTC+13.
    const instant = new Date('2027-01-15T05:30:00Z');
    expect(todayIn('UTC', instant)).toBe('2027-01-15');
    expect(todayIn('America/Los_Angeles', instant)).toBe('2027-01-14');
    expect(todayIn('Pacific/Auckland', new Date('2027-01-15T12:30:00Z'))).toBe('2027-01-16');
    expect(todayIn('Not/AZone', instant)).toBe('2027-01-15');
  });
});

describe('overlap of inclusive ranges', () => {
  it('shares a day exactly when PostgreSQL’s daterange(a, b, \'[]\') && would', () => {
    // Source: PostgreSQL documentation, Range Types (§8.17) — '[]' includes both bounds; && is "overlaps".
    // Constructed vectors:
    expect(rangesOverlap({ start: '2026-03-01', end: '2026-03-05' }, { start: '2026-03-05', end: '2026-03-07' })).toBe(true);
    expect(rangesOverlap({ start: '2026-03-01', end: '2026-03-05' }, { start: '2026-03-06', end: '2026-03-07' })).toBe(false);
    expect(rangesOverlap({ start: '2026-03-02', end: '2026-03-02' }, { start: '2026-03-01', end: '2026-03-05' })).toBe(true);
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 40 }), { minLength: 4, maxLength: 4 }), ([a, b, c, e]) => {
        const r1 = { start: addDays('2026-01-01', Math.min(a!, b!)), end: addDays('2026-01-01', Math.max(a!, b!)) };
        const r2 = { start: addDays('2026-01-01', Math.min(c!, e!)), end: addDays('2026-01-01', Math.max(c!, e!)) };
        // By enumeration of the days of each range.
        const days = (r: typeof r1) => Array.from({ length: loanDays(r.start, r.end)! }, (_, k) => addDays(r.start, k));
        const shared = days(r1).some((x) => days(r2).includes(x));
        expect(rangesOverlap(r1, r2)).toBe(shared);
      }),
    );
  });
});

describe('request rules', () => {
  const today = '2026-12-01';
  it('accepts a loan from today, up to the longest allowed', () => {
    expect(checkLoanDates({ start: today, end: addDays(today, MAX_LOAN_DAYS - 1) }, today)).toEqual({ ok: true, days: MAX_LOAN_DAYS });
  });
  it('names the rule each bad request breaks, and the field', () => {
    expect(checkLoanDates({ start: '2026-12-05', end: '2026-12-04' }, today)).toMatchObject({ ok: false, reason: 'end-before-start', field: 'end' });
    expect(checkLoanDates({ start: '2026-11-30', end: '2026-12-04' }, today)).toMatchObject({ ok: false, reason: 'start-in-past', field: 'start', message: expect.stringContaining('30 Nov 2026') });
    expect(checkLoanDates({ start: today, end: addDays(today, MAX_LOAN_DAYS) }, today)).toMatchObject({ ok: false, reason: 'too-long', message: expect.stringContaining(`${MAX_LOAN_DAYS + 1}`) });
    expect(checkLoanDates({ start: addDays(today, MAX_LEAD_DAYS + 1), end: addDays(today, MAX_LEAD_DAYS + 2) }, today)).toMatchObject({ ok: false, reason: 'too-far-ahead' });
    expect(checkLoanDates({ start: '2026-13-01', end: '2026-12-04' }, today)).toMatchObject({ ok: false, reason: 'not-a-date', field: 'start' });
  });
  it('a loan already under way is not refused for its past start', () => {
    expect(checkLoanDates({ start: '2026-11-20', end: '2026-12-04' }, today, false)).toEqual({ ok: true, days: 15 });
  });
});
