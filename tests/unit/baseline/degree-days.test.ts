import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dailyTemperaturesFromRows, fillSingleMissingDays, packDailyMeans } from '../../../src/lib/baseline/daily-temperatures';
import { periodDegreeDays } from '../../../src/lib/baseline/period-degree-days';
import { buildStationDegreeDays, fillPeriodFromStation, type PeriodFill } from '../../../src/lib/baseline/station-degree-days';
import { BASE_COUNT, BASE_MIN_F } from '../../../src/lib/baseline/grid';

function oneDay(tmaxF: number, tminF: number) {
  return dailyTemperaturesFromRows([{ date: '2024-07-01', tmaxF, tminF }])!;
}

describe('daily degree days against published values (methods.md §3)', () => {
  it('75/65 °F gives 5 CDD65 (NOAA/NWS definition, Lawrence Journal-World, 3 Aug 2003)', () => {
    const t = oneDay(75, 65);
    expect(periodDegreeDays(t, t.firstDay, t.firstDay, 65)).toMatchObject({ hdd: 0, cdd: 5, meanF: 70 });
  });

  it('90/70 °F gives 15 CDD65 (City of Burlington NC FAQ)', () => {
    const t = oneDay(90, 70);
    expect(periodDegreeDays(t, t.firstDay, t.firstDay, 65)).toMatchObject({ hdd: 0, cdd: 15 });
  });

  it('a mean of 40 °F gives 25 HDD65 (WGN-TV weather column, 29 Oct 2017)', () => {
    const t = oneDay(48, 32);
    expect(periodDegreeDays(t, t.firstDay, t.firstDay, 65)).toMatchObject({ hdd: 25, cdd: 0 });
  });

  it('base 18 °C: 10 °C → 8, −4 °C → 22, 20 °C → 0 HDD (Statistics Netherlands, CBS 2015; the arithmetic is unit-free)', () => {
    for (const [mean, hdd] of [[10, 8], [-4, 22], [20, 0]] as const) {
      const t = oneDay(mean, mean);
      expect(periodDegreeDays(t, t.firstDay, t.firstDay, 18)!.hdd).toBe(hdd);
    }
  });

  it('the cumulative station tables give the same published values at base 65 °F', () => {
    const rows = [
      { date: '2024-07-01', tmaxF: 75, tminF: 65 },
      { date: '2024-07-02', tmaxF: 90, tminF: 70 },
      { date: '2024-07-03', tmaxF: 48, tminF: 32 },
    ];
    const st = buildStationDegreeDays(dailyTemperaturesFromRows(rows)!);
    const hdd = new Float64Array(BASE_COUNT);
    const cdd = new Float64Array(BASE_COUNT);
    const fill: PeriodFill = { count: 0, meanF: 0, heatingFrom: 0, coolingTo: 0, rowFrom: 0, rowTo: 0 };
    const k65 = 65 - BASE_MIN_F;
    const expected = [[0, 5], [0, 15], [25, 0]] as const;
    expected.forEach(([h, c], d) => {
      fillPeriodFromStation(st, st.firstDay + d, st.firstDay + d, hdd, cdd, 0, fill);
      expect([hdd[k65], cdd[k65]]).toEqual([h, c]);
    });
  });
});

describe('period degree days (CalTRACK 2.0 §3.3.4–3.3.5)', () => {
  it('average daily degree days over the days with a temperature, at every grid base (property, against a direct sum)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.oneof(fc.integer({ min: -20, max: 110 }), fc.constant(Number.NaN)), { minLength: 40, maxLength: 120 }),
        fc.nat({ max: 30 }),
        fc.integer({ min: 1, max: 60 }),
        (values, offset, length) => {
          const temps = packDailyMeans(1000, Float64Array.from(values));
          const st = buildStationDegreeDays(temps);
          const hdd = new Float64Array(BASE_COUNT);
          const cdd = new Float64Array(BASE_COUNT);
          const fill: PeriodFill = { count: 0, meanF: 0, heatingFrom: 0, coolingTo: 0, rowFrom: 0, rowTo: 0 };
          const start = 1000 + offset;
          const end = start + length - 1;
          fillPeriodFromStation(st, start, end, hdd, cdd, 0, fill);
          for (let k = 0; k < BASE_COUNT; k++) {
            const direct = periodDegreeDays(temps, start, end, BASE_MIN_F + k);
            if (direct === null) {
              expect(fill.count).toBe(0);
              return;
            }
            expect(fill.count).toBe(direct.days);
            expect(hdd[k]).toBeCloseTo(direct.hdd, 9);
            expect(cdd[k]).toBeCloseTo(direct.cdd, 9);
            expect(hdd[k]! > 0).toBe(k >= fill.heatingFrom);
            expect(cdd[k]! > 0).toBe(k <= fill.coolingTo);
          }
        },
      ),
      { numRuns: 150 },
    );
  });

  it('fills a single missing day with the mean of its neighbours and leaves longer gaps missing (methods.md §3)', () => {
    const a = Float64Array.from([50, Number.NaN, 60, Number.NaN, Number.NaN, 70]);
    expect(fillSingleMissingDays(a)).toBe(1);
    expect(a[1]).toBe(55);
    expect(Number.isNaN(a[3]!) && Number.isNaN(a[4]!)).toBe(true);
  });

  it('reads Tmax/Tmin rows in any order; a day missing either extreme is missing', () => {
    const t = dailyTemperaturesFromRows([
      { date: '2024-01-03', tmaxF: 40, tminF: 30 },
      { date: '2024-01-01', tmaxF: 50, tminF: 40 },
      { date: '2024-01-02', tmaxF: null, tminF: 20 },
    ])!;
    // Jan 2 is missing, then filled from its neighbours (45 and 35)
    expect(Array.from(t.meanF)).toEqual([45, 40, 35]);
    expect(t.filledDays).toBe(1);
  });
});
