import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  billDays,
  type BillRow,
  calendarizeMonthly,
  calendarYear,
  effectivePeriods,
  federalFiscalYear,
  sumOverWindow,
  trailingMonths,
  usePerDay,
} from '../../../src/lib/bills';
import { dayFromIso, isoFromDay } from '../../../src/lib/weather';

const d = (iso: string): number => {
  const day = dayFromIso(iso);
  if (day === null) throw new Error(iso);
  return day;
};
const bill = (start: string, end: string, quantity: number | null): BillRow => ({ startDay: d(start), endDay: d(end), quantity });

describe('bill periods', () => {
  it('counts both dates', () => {
    // common practice: a bill from the 1st to the 31st covers 31 days
    expect(billDays(d('2024-01-01'), d('2024-01-31'))).toBe(31);
    expect(billDays(5, 4)).toBe(0);
  });

  it('gives a shared read date to the earlier bill, whatever the input order', () => {
    const bills = [bill('2024-02-05', '2024-03-05', 290), bill('2024-01-05', '2024-02-05', 320), bill('2024-03-06', '2024-04-04', 300)];
    const eff = effectivePeriods(bills);
    expect(Array.from(eff.order)).toEqual([1, 0, 2]);
    expect(isoFromDay(eff.start[0] as number)).toBe('2024-02-06');
    expect(Array.from(eff.days)).toEqual([29, 32, 30]);
    expect(usePerDay(290, eff.days[0] as number)).toEqual({ ok: true, value: 10 });
  });

  it('gives no days to a bill that starts after it ends, and skips it as a neighbour', () => {
    const eff = effectivePeriods([bill('2024-01-01', '2024-01-31', 1), bill('2024-01-31', '2024-01-20', 1), bill('2024-01-31', '2024-02-29', 1)]);
    expect(Array.from(eff.days)).toEqual([31, 0, 29]);
    expect(usePerDay(1, 0)).toEqual({ ok: false, reason: 'no-days' });
    expect(usePerDay(null, 30)).toEqual({ ok: false, reason: 'missing-quantity' });
  });
});

describe('calendarization', () => {
  it('spreads a bill evenly over its days (hand case)', () => {
    // Constructed: 17 Jan - 15 Feb 2024 is 30 days, 15 in each month
    const months = calendarizeMonthly([bill('2024-01-17', '2024-02-15', 300)]);
    expect(months).toEqual([
      { year: 2024, month: 1, quantity: 150, coveredDays: 15, daysInMonth: 31 },
      { year: 2024, month: 2, quantity: 150, coveredDays: 15, daysInMonth: 29 },
    ]);
  });

  it('does not count a shared read date twice and shows uncovered months', () => {
    const months = calendarizeMonthly([bill('2024-01-01', '2024-01-31', 310), bill('2024-01-31', '2024-03-01', 300), bill('2024-05-01', '2024-05-31', 31)]);
    expect(months.map((m) => [m.month, m.coveredDays])).toEqual([[1, 31], [2, 29], [3, 1], [4, 0], [5, 31]]);
    expect(months[0]?.quantity).toBeCloseTo(310, 12);
    expect(months[1]?.quantity).toBeCloseTo(290, 12);
    expect(months[2]?.quantity).toBeCloseTo(10, 12);
    expect(months[3]?.quantity).toBe(0);
  });

  it('treats zero as missing only when asked', () => {
    expect(calendarizeMonthly([bill('2024-01-01', '2024-01-31', 0)], { zeroIsMissing: true })).toEqual([]);
    expect(calendarizeMonthly([bill('2024-01-01', '2024-01-31', 0)])).toHaveLength(1);
  });

  it('conserves the total of the bills used (property, constructed random bills)', () => {
    const bills = fc.array(
      fc.record({
        startDay: fc.integer({ min: 19000, max: 20000 }),
        length: fc.integer({ min: 1, max: 120 }),
        quantity: fc.oneof(fc.double({ min: -1e4, max: 1e6, noNaN: true }), fc.constant(null)),
      }),
      { minLength: 1, maxLength: 30 },
    );
    fc.assert(
      fc.property(bills, (raw) => {
        const rows: BillRow[] = raw.map((b) => ({ startDay: b.startDay, endDay: b.startDay + b.length - 1, quantity: b.quantity }));
        const eff = effectivePeriods(rows);
        let expected = 0;
        let scale = 1;
        rows.forEach((r, i) => {
          if (r.quantity !== null && (eff.days[i] as number) > 0) {
            expected += r.quantity;
            scale += Math.abs(r.quantity);
          }
        });
        const months = calendarizeMonthly(rows);
        const total = months.reduce((s, m) => s + m.quantity, 0);
        expect(Math.abs(total - expected)).toBeLessThanOrEqual(1e-12 * scale);
        for (const m of months) expect(m.coveredDays).toBeLessThanOrEqual(m.daysInMonth);
        // the same total over a window spanning every bill
        const all = sumOverWindow(rows, { fromDay: 18000, toDay: 21000 });
        expect(all.ok && Math.abs(all.total - expected)).toBeLessThanOrEqual(1e-9 * scale);
      }),
      { numRuns: 300 },
    );
  });
});

describe('window totals', () => {
  it('US federal fiscal year runs 1 Oct - 30 Sep', () => {
    // Source: 31 U.S.C. 1102: the fiscal year begins on October 1 and ends on September 30
    const fy = federalFiscalYear(2024);
    expect([isoFromDay(fy.fromDay), isoFromDay(fy.toDay)]).toEqual(['2023-10-01', '2024-09-30']);
    expect(fy.toDay - fy.fromDay + 1).toBe(366);
    const t = trailingMonths(2024, 6);
    expect([isoFromDay(t.fromDay), isoFromDay(t.toDay)]).toEqual(['2023-07-01', '2024-06-30']);
    const c = calendarYear(2023);
    expect(c.toDay - c.fromDay + 1).toBe(365);
  });

  it('sums the share of each bill inside the window and reports coverage (hand case)', () => {
    // Constructed: 16 Sep - 15 Oct 2023 (30 days, 600) has 15 days in FY2024 -> 300; the next bill lies inside -> 30
    const r = sumOverWindow([bill('2023-09-16', '2023-10-15', 600), bill('2023-10-16', '2023-11-14', 30)], federalFiscalYear(2024));
    expect(r).toMatchObject({ ok: true, windowDays: 366, coveredDays: 45, billsUsed: 2 });
    expect(r.ok && r.total).toBeCloseTo(330, 12);
    expect(r.ok && r.coverage).toBeCloseTo(45 / 366, 12);
    expect(sumOverWindow([], { fromDay: 10, toDay: 9 })).toEqual({ ok: false, reason: 'empty-window' });
  });

  it('adds up over adjacent windows (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 0, max: 400 }), fc.integer({ min: 1, max: 60 }), fc.integer({ min: 0, max: 5000 })), { maxLength: 20 }),
        fc.integer({ min: 0, max: 500 }),
        (raw, cut) => {
          const rows: BillRow[] = raw.map(([s, len, q]) => ({ startDay: s, endDay: s + len - 1, quantity: q }));
          const a = sumOverWindow(rows, { fromDay: -10, toDay: cut });
          const b = sumOverWindow(rows, { fromDay: cut + 1, toDay: 600 });
          const all = sumOverWindow(rows, { fromDay: -10, toDay: 600 });
          expect(a.ok && b.ok && all.ok && a.total + b.total - all.total).toBeCloseTo(0, 6);
        },
      ),
      { numRuns: 200 },
    );
  });
});
