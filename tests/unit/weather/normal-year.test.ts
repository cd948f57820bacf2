import { describe, expect, it } from 'vitest';
import {
  buildDegreeDayTable,
  completeYears,
  dayFromIso,
  fillSingleMissingDays,
  normalYearDegreeDays,
} from '../../../src/lib/weather';
import { seriesFrom } from './series-arbitraries';

/**
 * Constructed, hand-computable: 2018-07-01 .. 2021-12-31. 2018 is partial; 2019 is 55 °F every day
 * with one missing day (interpolated); 2020 (leap) is 45 °F every day; 2021 is 55 °F with a
 * two-day gap (incomplete).
 */
function station(): ReturnType<typeof seriesFrom> {
  const first = dayFromIso('2018-07-01') as number;
  const last = dayFromIso('2021-12-31') as number;
  const jan2020 = dayFromIso('2020-01-01') as number;
  const dec2020 = dayFromIso('2020-12-31') as number;
  const means: (number | null)[] = [];
  for (let d = first; d <= last; d++) means.push(d >= jan2020 && d <= dec2020 ? 45 : 55);
  means[(dayFromIso('2019-06-15') as number) - first] = null;
  means[(dayFromIso('2021-03-01') as number) - first] = null;
  means[(dayFromIso('2021-03-02') as number) - first] = null;
  return seriesFrom(first, means);
}

describe('normal-year degree days', () => {
  const table = buildDegreeDayTable(fillSingleMissingDays(station()).series);

  it('uses only complete years (single missing days interpolated)', () => {
    expect(completeYears(table)).toEqual([2019, 2020]);
    expect(completeYears(buildDegreeDayTable(station()))).toEqual([2020]);
  });

  it('averages the annual sums: HDD65 = (10·365 + 20·366) / 2', () => {
    const r = normalYearDegreeDays(table, 'hdd', 65);
    expect(r).toMatchObject({ ok: true, yearsUsed: [2019, 2020], annualTotals: [3650, 7320], fewYears: true });
    expect(r.ok && r.value).toBeCloseTo(5485, 9);
  });

  it('works off the grid and in °C', () => {
    // 60.5 °F is off the whole-degree grid: (5.5·365 + 15.5·366) / 2
    const off = normalYearDegreeDays(table, 'hdd', 60.5);
    expect(off.ok && off.value).toBeCloseTo((5.5 * 365 + 15.5 * 366) / 2, 9);
    // CDD at 50 °F: 2019 gives 5·365, 2020 gives 0; in °C·day × 5/9 at base 10 °C (= 50 °F)
    const cdd = normalYearDegreeDays(table, 'cdd', 10, { unit: 'C' });
    expect(cdd.ok && cdd.value).toBeCloseTo(((5 * 365) / 2) * (5 / 9), 9);
  });

  it('can be limited to a range of years and fails without complete years', () => {
    const r = normalYearDegreeDays(table, 'hdd', 65, { fromYear: 2020 });
    expect(r).toMatchObject({ ok: true, value: 7320, yearsUsed: [2020] });
    expect(normalYearDegreeDays(table, 'hdd', 65, { toYear: 2018 })).toEqual({ ok: false, reason: 'no-complete-years' });
  });
});
