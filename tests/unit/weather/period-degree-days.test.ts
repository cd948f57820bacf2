import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  buildDegreeDayTable,
  CALTRACK_MIN_TEMPERATURE_COVERAGE,
  heatingDegreeDays,
  periodCoverage,
  periodDegreeDayMatrix,
  periodDegreeDays,
} from '../../../src/lib/weather';
import { dailyMeans, seriesFrom } from './series-arbitraries';

describe('period degree days (CalTRACK 2.0 §3.3.4-3.3.5)', () => {
  it('total equals the sum of the daily values and perDay = total / days elapsed (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -200, max: 1000 }).map((t) => t / 10), { minLength: 1, maxLength: 120 }),
        fc.double({ min: 20, max: 100, noNaN: true }),
        (means, base) => {
          const table = buildDegreeDayTable(seriesFrom(500, means));
          const r = periodDegreeDays(table, 'hdd', base, 500, 500 + means.length - 1);
          let daily = 0;
          for (const t of means) daily += heatingDegreeDays(t, base);
          expect(r.ok).toBe(true);
          if (!r.ok) return;
          expect(Math.abs(r.total - daily)).toBeLessThanOrEqual(1e-9 * Math.max(1, daily));
          expect(r.perDay * means.length).toBeCloseTo(r.total, 9);
          expect(r.coverage).toBe(1);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('hand case: 75/65, 90/70 and 50/30 °F days at base 65', () => {
    // Source: Lawrence Journal-World 2003 (5 CDD65), City of Burlington NC (15 CDD65), WGN-TV 2017 (25 HDD65)
    const table = buildDegreeDayTable(seriesFrom(0, [70, 80, 40]));
    const cdd = periodDegreeDays(table, 'cdd', 65, 0, 2);
    const hdd = periodDegreeDays(table, 'hdd', 65, 0, 2);
    expect(cdd).toMatchObject({ ok: true, total: 20, daysElapsed: 3 });
    expect(cdd.ok && cdd.perDay).toBeCloseTo(20 / 3, 12);
    expect(hdd).toMatchObject({ ok: true, total: 25 });
  });

  it('needs temperature on 90 % of the days', () => {
    // Constructed: 10 days, one missing (90 %) passes; two missing (80 %) fails
    const nine = [50, 50, 50, 50, null, 50, 50, 50, 50, 50];
    const eight = [50, 50, 50, 50, null, null, 50, 50, 50, 50];
    expect(CALTRACK_MIN_TEMPERATURE_COVERAGE).toBe(0.9);
    const ok = periodDegreeDays(buildDegreeDayTable(seriesFrom(0, nine)), 'hdd', 65, 0, 9);
    expect(ok).toMatchObject({ ok: true, total: 135, daysWithData: 9, coverage: 0.9 });
    // CalTRACK divides by days elapsed; the observed-day average is also given
    expect(ok.ok && ok.perDay).toBeCloseTo(13.5, 12);
    expect(ok.ok && ok.perDayObserved).toBeCloseTo(15, 12);
    const low = periodDegreeDays(buildDegreeDayTable(seriesFrom(0, eight)), 'hdd', 65, 0, 9);
    expect(low).toMatchObject({ ok: false, reason: 'insufficient-temperature-coverage', coverage: 0.8 });
    expect(periodDegreeDays(buildDegreeDayTable(seriesFrom(0, nine)), 'hdd', 65, 5, 4)).toMatchObject({
      ok: false,
      reason: 'empty-period',
    });
    // Days beyond the series count as missing
    expect(periodCoverage(buildDegreeDayTable(seriesFrom(0, nine)), 5, 14)).toBeCloseTo(0.5, 12);
  });

  it('the matrix for many bills equals one period at a time (property)', () => {
    fc.assert(
      fc.property(
        dailyMeans,
        fc.array(fc.tuple(fc.integer({ min: -10, max: 400 }), fc.integer({ min: 0, max: 40 })), { minLength: 1, maxLength: 12 }),
        (means, periods) => {
          const table = buildDegreeDayTable(seriesFrom(0, means));
          const starts = periods.map(([s]) => s);
          const ends = periods.map(([s, len]) => s + len - 1);
          const m = periodDegreeDayMatrix(table, 'hdd', starts, ends);
          expect(m.nBases).toBe(61);
          periods.forEach(([s, len], p) => {
            if (len === 0) {
              expect(m.coverage[p]).toBe(0);
              return;
            }
            for (const base of [30, 47, 65, 90]) {
              const one = periodDegreeDays(table, 'hdd', base, s, s + len - 1, { minCoverage: 0 });
              expect(one.ok).toBe(true);
              if (!one.ok) return;
              expect(m.perDay[(base - 30) * m.nPeriods + p]).toBeCloseTo(one.perDay, 9);
              expect(m.coverage[p]).toBeCloseTo(one.coverage, 12);
            }
          });
        },
      ),
      { numRuns: 200 },
    );
  });
});
