import { quantileSorted as d3QuantileSorted } from 'd3';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  BILL_FLAG_SEVERITY,
  type BillFlag,
  type BillRow,
  billRowCheckMask,
  checkBillSeries,
  quantileSorted,
  ROW_COST_WITHOUT_QUANTITY,
  ROW_ESTIMATED_READ,
  ROW_NEGATIVE_USE,
  type SeriesCheckOptions,
} from '../../../src/lib/bills';
import { dayFromIso, isoFromDay } from '../../../src/lib/weather';

const d = (iso: string): number => dayFromIso(iso) as number;
const ELECTRIC: SeriesCheckOptions = { commodity: 'electricity', todayDay: d('2025-06-30') };

/** Constructed clean series: monthly reads on the 5th with shared read dates, 2024-01-05 .. 2025-01-05. */
function cleanSeries(): BillRow[] {
  const rows: BillRow[] = [];
  for (let m = 0; m < 12; m++) {
    const start = `${2024 + Math.floor(m / 12)}-${String((m % 12) + 1).padStart(2, '0')}-05`;
    const next = m === 11 ? '2025-01-05' : `2024-${String(m + 2).padStart(2, '0')}-05`;
    rows.push({ startDay: d(start), endDay: d(next), quantity: 900 + 25 * ((m * 7) % 12), cost: 120, estimated: false });
  }
  return rows;
}

const codes = (flags: BillFlag[]): string[] => flags.map((f) => f.code);

describe('series checks stay silent on a clean series', () => {
  it('no flags for monthly bills with shared read dates', () => {
    expect(checkBillSeries(cleanSeries(), ELECTRIC)).toEqual([]);
  });
});

describe('each check fires on a small constructed case', () => {
  it('start after end (error)', () => {
    const bills = cleanSeries();
    bills[3] = { ...(bills[3] as BillRow), startDay: (bills[3] as BillRow).endDay + 2 };
    const flags = checkBillSeries(bills, ELECTRIC);
    expect(flags).toContainEqual(expect.objectContaining({ code: 'start-after-end', severity: 'error', bills: [3] }));
  });

  it('future dates relative to today (error)', () => {
    const flags = checkBillSeries(cleanSeries(), { ...ELECTRIC, todayDay: d('2024-12-31') });
    expect(flags).toEqual([expect.objectContaining({ code: 'future-date', severity: 'error', bills: [11] })]);
    expect(flags[0]?.message).toContain('2024-12-31');
  });

  it('duplicate periods (error), listed once with every copy', () => {
    const bills = cleanSeries();
    bills.push({ ...(bills[4] as BillRow) }, { ...(bills[4] as BillRow) });
    const flags = checkBillSeries(bills, ELECTRIC).filter((f) => f.code === 'duplicate-period');
    expect(flags).toEqual([expect.objectContaining({ severity: 'error', bills: [4, 12, 13] })]);
  });

  it('overlaps beyond the shared read date (warning), not the shared date itself', () => {
    const bills = cleanSeries();
    bills[6] = { ...(bills[6] as BillRow), startDay: (bills[5] as BillRow).endDay - 2 };
    const flags = checkBillSeries(bills, ELECTRIC);
    expect(codes(flags)).toEqual(['overlapping-periods']);
    expect(flags[0]).toMatchObject({ severity: 'warning', bills: [5, 6] });
    expect(flags[0]?.message).toContain('share 3 days');
  });

  it('gaps over 3 days (warning); 3 days pass', () => {
    const three = cleanSeries();
    three[6] = { ...(three[6] as BillRow), startDay: (three[5] as BillRow).endDay + 4 };
    expect(checkBillSeries(three, ELECTRIC)).toEqual([]);
    const four = cleanSeries();
    four[6] = { ...(four[6] as BillRow), startDay: (four[5] as BillRow).endDay + 5 };
    expect(checkBillSeries(four, ELECTRIC)).toEqual([expect.objectContaining({ code: 'gap', severity: 'warning', bills: [5, 6] })]);
  });

  it('periods under 25 or over 35 days for monthly billing (CalTRACK 2.0 §2.2.3.4-5)', () => {
    const short = [{ startDay: d('2024-01-01'), endDay: d('2024-01-24'), quantity: 10 }];
    expect(codes(checkBillSeries(short, ELECTRIC))).toEqual(['short-period']);
    expect(checkBillSeries([{ startDay: d('2024-01-01'), endDay: d('2024-01-25'), quantity: 10 }], ELECTRIC)).toEqual([]);
    const long = [{ startDay: d('2024-01-01'), endDay: d('2024-02-05'), quantity: 10 }];
    expect(codes(checkBillSeries(long, ELECTRIC))).toEqual(['long-period']);
    expect(checkBillSeries(long, { ...ELECTRIC, billing: 'bimonthly' })).toEqual([]);
    const veryLong = [{ startDay: d('2024-01-01'), endDay: d('2024-03-15'), quantity: 10 }];
    expect(codes(checkBillSeries(veryLong, { ...ELECTRIC, billing: 'bimonthly' }))).toEqual(['long-period']);
    expect(checkBillSeries(veryLong, { ...ELECTRIC, billing: 'any' })).toEqual([]);
  });

  it('negative use, zero electricity, missing quantity, cost without quantity, estimated read', () => {
    const bills = cleanSeries();
    bills[1] = { ...(bills[1] as BillRow), quantity: -40 };
    bills[2] = { ...(bills[2] as BillRow), quantity: 0 };
    bills[3] = { ...(bills[3] as BillRow), quantity: null, cost: null };
    bills[4] = { ...(bills[4] as BillRow), quantity: null, cost: 88.5 };
    bills[5] = { ...(bills[5] as BillRow), estimated: true };
    const flags = checkBillSeries(bills, ELECTRIC);
    expect(flags.map((f) => [f.code, f.severity, f.bills[0]])).toEqual([
      ['negative-use', 'warning', 1],
      ['zero-electricity', 'warning', 2],
      ['missing-quantity', 'warning', 3],
      ['cost-without-quantity', 'warning', 4],
      ['estimated-read', 'info', 5],
    ]);
    // zero gas is a real reading (CalTRACK 2.0 §2.2.1.4)
    expect(codes(checkBillSeries(bills, { ...ELECTRIC, commodity: 'natural_gas' }))).not.toContain('zero-electricity');
  });

  it('outliers more than 3 IQR above the median use per day (CalTRACK 2.0 §2.3.6)', () => {
    const bills = cleanSeries();
    const q = (bills[7] as BillRow).quantity as number;
    bills[7] = { ...(bills[7] as BillRow), quantity: q * 6 };
    const flags = checkBillSeries(bills, ELECTRIC);
    expect(flags).toEqual([expect.objectContaining({ code: 'outlier', severity: 'warning', bills: [7] })]);
  });
});

describe('flags carry plain messages and never drop bills', () => {
  it('names the period in every message and leaves the input as it was', () => {
    const bills = cleanSeries();
    bills[2] = { ...(bills[2] as BillRow), quantity: -1 };
    const before = structuredClone(bills);
    const [flag] = checkBillSeries(bills, ELECTRIC);
    expect(flag?.message).toContain(isoFromDay((bills[2] as BillRow).startDay));
    expect(bills).toEqual(before);
    for (const sev of Object.values(BILL_FLAG_SEVERITY)) expect(['error', 'warning', 'info']).toContain(sev);
  });

  it('the row mask combines bits without allocating flags', () => {
    const mask = billRowCheckMask({ startDay: 0, endDay: 30, quantity: null, cost: 5, estimated: true }, ELECTRIC);
    expect(mask).toBe(ROW_COST_WITHOUT_QUANTITY | ROW_ESTIMATED_READ);
    expect(billRowCheckMask({ startDay: 0, endDay: 30, quantity: -2 }, ELECTRIC)).toBe(ROW_NEGATIVE_USE);
  });
});

describe('quantiles', () => {
  it('definition 7 matches R and d3-array', () => {
    // Source: R quantile(1:10, c(.25, .5, .75)) = 3.25, 5.5, 7.75 (type 7, R's default) [memory]
    const x = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    expect([0.25, 0.5, 0.75].map((p) => quantileSorted(x, p))).toEqual([3.25, 5.5, 7.75]);
    // Source: d3-array quantileSorted (R-7 method), a general-purpose reference library
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 50 }), fc.double({ min: 0, max: 1, noNaN: true }), (xs, p) => {
        const sorted = [...xs].sort((a, b) => a - b);
        expect(quantileSorted(sorted, p)).toBeCloseTo(d3QuantileSorted(sorted, p) as number, 6);
      }),
    );
    expect(() => quantileSorted([], 0.5)).toThrow(RangeError);
  });
});
