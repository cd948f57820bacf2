import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { PeriodTable, buildPeriodTable } from '../../../src/lib/baseline/bill-periods';
import { packDailyMeans } from '../../../src/lib/baseline/daily-temperatures';
import { isoDateToDay } from '../../../src/lib/baseline/calendar-days';
import { BASE_COUNT } from '../../../src/lib/baseline/grid';

const d = (iso: string): number => isoDateToDay(iso)!;
const yearOfWeather = (missing: number[] = []) => {
  const mean = new Float64Array(366).fill(50);
  for (const m of missing) mean[m] = Number.NaN;
  return packDailyMeans(d('2024-01-01'), mean);
};

describe('bills to periods (methods.md §2)', () => {
  it('a bill starting on the previous bill’s end date loses that shared day to the earlier bill', () => {
    const t = new PeriodTable();
    const dropped = buildPeriodTable(
      { startDay: [d('2024-01-01'), d('2024-01-31')], endDay: [d('2024-01-31'), d('2024-02-29')], quantity: [310, 290] },
      yearOfWeather(),
      t,
    );
    expect(dropped).toEqual([]);
    expect(t.n).toBe(2);
    expect([t.days[0], t.days[1]]).toEqual([31, 29]); // 1–31 Jan; 1–29 Feb
    expect([t.usePerDay[0], t.usePerDay[1]]).toEqual([10, 10]);
    expect(t.sharedReadDates).toBe(1);
  });

  it('sorts bills by start date whatever their input order, keeping each bill’s input index', () => {
    const t = new PeriodTable();
    buildPeriodTable({ startDay: [d('2024-03-01'), d('2024-01-01')], endDay: [d('2024-03-31'), d('2024-01-31')], quantity: [62, 31] }, yearOfWeather(), t);
    expect(Array.from(t.sourceIndex.subarray(0, 2))).toEqual([1, 0]);
    expect(t.startDay[0]).toBe(d('2024-01-01'));
  });

  it('drops and reports a period with temperature on fewer than 90 % of its days (CalTRACK 2.0 §2.2.3.2)', () => {
    // January (31 days): 4 missing days in two runs of 2 (runs of 2 are not interpolated) → 27/31 = 87 %
    // February (29 days): 2 missing in one run → 27/29 = 93 %, kept
    const t = new PeriodTable();
    const dropped = buildPeriodTable(
      { startDay: [d('2024-01-01'), d('2024-02-01')], endDay: [d('2024-01-31'), d('2024-02-29')], quantity: [31, 29] },
      yearOfWeather([3, 4, 10, 11, 40, 41]),
      t,
    );
    expect(t.n).toBe(1);
    expect(dropped).toHaveLength(1);
    expect(dropped[0]).toMatchObject({ index: 0, reason: 'insufficient-temperature' });
    expect(dropped[0]!.temperatureCoverage).toBeCloseTo(27 / 31, 12);
  });

  it('reports invalid dates and quantities instead of using them', () => {
    const t = new PeriodTable();
    const dropped = buildPeriodTable(
      { startDay: [d('2024-02-10'), d('2024-03-01'), d('2024-04-01')], endDay: [d('2024-02-01'), d('2024-03-31'), d('2024-04-30')], quantity: [5, Number.NaN, 30] },
      yearOfWeather(),
      t,
    );
    expect(dropped.map((x) => x.reason)).toEqual(['invalid-dates', 'invalid-quantity']);
    expect(t.n).toBe(1);
  });
});

describe('day-weighted degree-day sums of a series', () => {
  it('equal Σ days·DD_p at every base, with gaps, overlaps, shared read dates and missing days (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ gap: fc.integer({ min: -3, max: 5 }), len: fc.integer({ min: 1, max: 40 }) }), { minLength: 1, maxLength: 30 }),
        fc.array(fc.oneof(fc.integer({ min: 0, max: 100 }), fc.constant(Number.NaN)), { minLength: 1300, maxLength: 1300 }),
        (shape, values) => {
          const startDay: number[] = [];
          const endDay: number[] = [];
          let d = 10;
          for (const s of shape) {
            d += s.gap;
            startDay.push(d);
            endDay.push(d + s.len - 1);
            d += s.len - 1;
          }
          const t = new PeriodTable();
          buildPeriodTable({ startDay, endDay, quantity: startDay.map(() => 1) }, packDailyMeans(0, Float64Array.from(values)), t, 0.5);
          for (let k = 0; k < BASE_COUNT; k++) {
            let h = 0;
            let c = 0;
            for (let i = 0; i < t.n; i++) {
              h += t.days[i]! * t.hdd[i * BASE_COUNT + k]!;
              c += t.days[i]! * t.cdd[i * BASE_COUNT + k]!;
            }
            expect(t.weightedHdd[k]).toBeCloseTo(h, 6);
            expect(t.weightedCdd[k]).toBeCloseTo(c, 6);
          }
        },
      ),
      { numRuns: 150 },
    );
  });
});
