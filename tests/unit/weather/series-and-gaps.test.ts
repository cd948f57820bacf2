import { describe, expect, it } from 'vitest';
import {
  buildDailySeries,
  coverageByYear,
  DAY_INTERPOLATED,
  DAY_MISSING,
  DAY_OBSERVED,
  dayFromIso,
  dailyObservationSchema,
  fillSingleMissingDays,
  missingRanges,
} from '../../../src/lib/weather';
import { seriesFrom } from './series-arbitraries';

describe('buildDailySeries', () => {
  it('stores (Tmax + Tmin) / 2 in °F and marks absent days missing', () => {
    // Source: mean-temperature method (NOAA/NWS); 15 °C = 59 °F (definition of the scales)
    const { series } = buildDailySeries({ days: [12, 10], tmax: [20, 20], tmin: [10, 10], unit: 'C' });
    expect(series.firstDay).toBe(10);
    expect(Array.from(series.status)).toEqual([DAY_OBSERVED, DAY_MISSING, DAY_OBSERVED]);
    expect(series.meanF[0]).toBeCloseTo(59, 12);
    expect(series.meanF[2]).toBeCloseTo(59, 12);
  });

  it('reports duplicates and invalid days instead of using them', () => {
    const r = buildDailySeries({
      days: [0, 0, 1, 2, 3, 4],
      tmax: [50, 70, 40, null, 200, 60],
      tmin: [30, 50, 45, 30, 150, 40],
      unit: 'F',
    });
    expect(r.duplicateDays).toEqual([0]);
    // day 1: Tmin above Tmax; day 2: no Tmax; day 3: beyond the world record high (56.7 °C = 134 °F)
    expect(r.invalidDays).toEqual([1, 2, 3]);
    expect(r.series.meanF[0]).toBe(40);
    expect(Array.from(r.series.status)).toEqual([1, 0, 0, 0, 1]);
  });

  it('handles an empty input', () => {
    expect(buildDailySeries({ days: [], tmax: [], tmin: [], unit: 'F' }).series.status.length).toBe(0);
  });

  it('validates observations at the boundary', () => {
    expect(dailyObservationSchema.safeParse({ date: '2024-02-30', tmax: 1, tmin: 0 }).success).toBe(false);
    expect(dailyObservationSchema.safeParse({ date: '2024-02-29', tmax: null, tmin: 0 }).success).toBe(true);
  });
});

describe('single-day interpolation and gap ranges', () => {
  // Constructed: 40, _, 50, _, _, 60, _
  const raw = seriesFrom(100, [40, null, 50, null, null, 60, null]);

  it('fills an isolated missing day with the mean of its neighbours and flags it', () => {
    const { series, filledDays } = fillSingleMissingDays(raw);
    expect(filledDays).toEqual([101]);
    expect(series.meanF[1]).toBe(45);
    expect(series.status[1]).toBe(DAY_INTERPOLATED);
    // longer gaps and a gap at the end stay missing; the input is not modified
    expect(Array.from(series.status.slice(3))).toEqual([0, 0, 1, 0]);
    expect(raw.status[1]).toBe(DAY_MISSING);
  });

  it('reports the remaining gaps as ranges', () => {
    const { series } = fillSingleMissingDays(raw);
    expect(missingRanges(series)).toEqual([
      { startDay: 103, endDay: 104, days: 2 },
      { startDay: 106, endDay: 106, days: 1 },
    ]);
    expect(missingRanges(raw)).toHaveLength(3);
  });
});

describe('coverage per year', () => {
  it('counts observed, interpolated and missing days per calendar year', () => {
    // Constructed: 2023-12-30 .. 2024-01-03 with 2024-01-01 missing (then interpolated)
    const first = dayFromIso('2023-12-30') as number;
    const { series } = fillSingleMissingDays(seriesFrom(first, [30, 32, null, 36, 38]));
    const [y2023, y2024] = coverageByYear(series);
    expect(y2023).toMatchObject({ year: 2023, daysInYear: 365, observedDays: 2, interpolatedDays: 0, missingDays: 363 });
    expect(y2024).toMatchObject({ year: 2024, daysInYear: 366, observedDays: 2, interpolatedDays: 1, missingDays: 363 });
    expect(y2024?.coverage).toBeCloseTo(3 / 366, 12);
    expect(y2024?.complete).toBe(false);
  });
});
