import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  buildDailySeries,
  buildDegreeDayTable,
  daysWithTemperature,
  degreeDaySum,
  degreeDaySumF,
  fillDegreeDaySums,
  gridBaseIndex,
} from '../../../src/lib/weather';
import { dailyMeans, naiveSum, seriesFrom } from './series-arbitraries';

const close = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b));

describe('degree-day table against the naive loop (property, constructed random series)', () => {
  it('matches for any range and any base, on and off the grid', () => {
    fc.assert(
      fc.property(
        dailyMeans,
        fc.integer({ min: -5000, max: 20000 }),
        fc.oneof(fc.integer({ min: 30, max: 90 }), fc.double({ min: 10, max: 110, noNaN: true })),
        fc.integer({ min: -20, max: 420 }),
        fc.integer({ min: 0, max: 120 }),
        fc.constantFrom('hdd' as const, 'cdd' as const),
        (means, firstDay, base, offset, length, kind) => {
          const series = seriesFrom(firstDay, means);
          const table = buildDegreeDayTable(series);
          const start = firstDay + offset;
          const end = start + length - 1;
          const fast = degreeDaySumF(table, kind, base, start, end);
          expect(close(fast, naiveSum(series, kind, base, start, end))).toBe(true);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('fills every grid base at once with the same sums', () => {
    fc.assert(
      fc.property(dailyMeans, fc.integer({ min: 0, max: 400 }), fc.integer({ min: 1, max: 60 }), (means, offset, length) => {
        const series = seriesFrom(100, means);
        const table = buildDegreeDayTable(series);
        const out = new Float64Array(table.nBases * 2);
        const start = 100 + offset;
        const end = start + length - 1;
        const days = fillDegreeDaySums(table, 'cdd', start, end, out, 1, 2);
        expect(days).toBe(daysWithTemperature(table, start, end));
        for (let b = 0; b < table.nBases; b++) {
          expect(close(out[1 + 2 * b] as number, naiveSum(series, 'cdd', 30 + b, start, end))).toBe(true);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('uses the grid for whole-°F bases in range only', () => {
    const table = buildDegreeDayTable(seriesFrom(0, [50]), { baseMinF: 40, baseMaxF: 70 });
    expect(table.nBases).toBe(31);
    expect(gridBaseIndex(table, 40)).toBe(0);
    expect(gridBaseIndex(table, 65)).toBe(25);
    expect(gridBaseIndex(table, 65.5)).toBe(-1);
    expect(gridBaseIndex(table, 71)).toBe(-1);
    expect(() => buildDegreeDayTable(seriesFrom(0, [50]), { baseMinF: 60, baseMaxF: 50 })).toThrow(RangeError);
  });
});

describe('degree days in °C through the table', () => {
  it('reproduces the Statistics Netherlands base-18 °C examples', () => {
    // Source: Statistics Netherlands (CBS) 2015: daily mean 10 °C -> 8, -4 °C -> 22, 20 °C -> 0 degree days at 18 °C
    const { series } = buildDailySeries({ days: [0, 1, 2], tmax: [13, -1, 24], tmin: [7, -7, 16], unit: 'C' });
    const table = buildDegreeDayTable(series);
    expect(degreeDaySum(table, 'hdd', 18, 0, 0, 'C')).toBeCloseTo(8, 9);
    expect(degreeDaySum(table, 'hdd', 18, 1, 1, 'C')).toBeCloseTo(22, 9);
    expect(degreeDaySum(table, 'hdd', 18, 2, 2, 'C')).toBeCloseTo(0, 9);
    expect(degreeDaySum(table, 'hdd', 18, 0, 2, 'C')).toBeCloseTo(30, 9);
  });

  it('at 18.333 °C equals the 65 °F figure × 5/9', () => {
    // Source: NOAA/NWS: mean 40 °F -> 25 HDD65 (WGN-TV 2017); degree days convert by × 5/9 (definition)
    const { series } = buildDailySeries({ days: [0], tmax: [50], tmin: [30], unit: 'F' });
    const table = buildDegreeDayTable(series);
    expect(degreeDaySum(table, 'hdd', 65, 0, 0)).toBe(25);
    expect(degreeDaySum(table, 'hdd', ((65 - 32) * 5) / 9, 0, 0, 'C')).toBeCloseTo((25 * 5) / 9, 9);
  });
});
