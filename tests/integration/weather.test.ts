/**
 * Weather intake on the database: the local stand-in service and a daily-summaries CSV load daily
 * temperatures; reloading changes nothing; single missing days are interpolated and flagged,
 * longer gaps reported; period degree days agree with the daily definition.
 */
import { describe, expect, it, beforeAll } from 'vitest';
import { fakeDay } from '../../src/server/weather/fake-service';
import { createStation, degreeDaysForPeriod, fetchWeather, importWeatherFile, monthlyDegreeDays, stationDetail } from '../../src/server/weather/stations';
import { dayFromIso, isoFromDay } from '../../src/lib/weather';
import type { Actor } from '../../src/server/authz';
import { actor, twoInstallations } from '../support/fixtures';

let staff: Actor;
let fx: Awaited<ReturnType<typeof twoInstallations>>;
beforeAll(async () => {
  fx = await twoInstallations();
  staff = await actor('installation_staff', [fx.a.id]);
});

// Source: NOAA/NWS definition (methods.md §3): daily mean = (Tmax + Tmin) / 2; HDD = max(0, base − mean).
function expectedHdd(station: string, start: string, end: string, base: number): { total: number; days: number } {
  let total = 0;
  let days = 0;
  for (let d = dayFromIso(start)!; d <= dayFromIso(end)!; d++) {
    const t = fakeDay(station, d);
    if (!t) continue;
    days++;
    total += Math.max(0, base - (t.tmaxF + t.tminF) / 2);
  }
  return { total, days };
}

describe('weather from the service (local stand-in)', () => {
  it('loads a range, then a reload changes nothing', async () => {
    await createStation(staff, { code: 'ALPHA-WX', name: 'Alpha Yard weather', latitude: 40, longitude: -100, elevationFt: 1000, serviceId: 'XXW00000123', installation: 'AAA' });
    const first = await fetchWeather(staff, 'ALPHA-WX', { start: '2021-01-01', end: '2023-12-31' });
    expect(first.counts.rows).toBe(1095);
    expect(first.counts.new).toBe(1095);
    const again = await fetchWeather(staff, 'ALPHA-WX', { start: '2021-01-01', end: '2023-12-31' });
    expect(again.counts).toMatchObject({ new: 0, changed: 0, unchanged: 1095 });
  });

  it('period degree days equal the sum of daily degree days, per day over days elapsed (CalTRACK 2.0 §3.3.4)', async () => {
    // A 30-day period with a temperature on every day (the stand-in drops a day now and then).
    let start = dayFromIso('2022-01-05')!;
    while (expectedHdd('XXW00000123', isoFromDay(start), isoFromDay(start + 29), 65).days < 30) start++;
    const [s, e] = [isoFromDay(start), isoFromDay(start + 29)];
    const hand = expectedHdd('XXW00000123', s, e, 65);
    const r = await degreeDaysForPeriod(staff, { station: 'ALPHA-WX', start: s, end: e, base: 65, unit: 'F' });
    expect(r.days).toBe(30);
    expect(r.hdd.total).toBeCloseTo(hand.total, 9);
    expect(r.hdd.perDay).toBeCloseTo(hand.total / 30, 9);
    expect(r.coverage).toBe(1);
    expect(r.normalYear.years).toBe(3);
  });

  it('single missing days are interpolated and listed; the years stay complete', async () => {
    const d = await stationDetail(staff, 'ALPHA-WX');
    const missing: string[] = [];
    for (let day = dayFromIso('2021-01-01')!; day <= dayFromIso('2023-12-31')!; day++) if (!fakeDay('XXW00000123', day)) missing.push(isoFromDay(day));
    expect(missing.length).toBeGreaterThan(0);
    expect(d.interpolatedDays).toEqual(missing);
    expect(d.gaps).toEqual([]);
    expect(d.coverage.map((c) => c.complete)).toEqual([true, true, true]);
  });

  it('a base in °C gives the °F result times 5/9 (degree-day differences convert by 5/9)', async () => {
    const f = await degreeDaysForPeriod(staff, { station: 'ALPHA-WX', start: '2022-03-01', end: '2022-03-31', base: 65, unit: 'F' });
    // 65 °F = 18.333… °C (methods.md §3).
    const c = await degreeDaysForPeriod(staff, { station: 'ALPHA-WX', start: '2022-03-01', end: '2022-03-31', base: ((65 - 32) * 5) / 9, unit: 'C' });
    expect(c.hdd.total!).toBeCloseTo((f.hdd.total! * 5) / 9, 9);
  });

  it('monthly degree days add up to the year and come with the normal year', async () => {
    const m = await monthlyDegreeDays(staff, { station: 'ALPHA-WX', year: 2022, base: 65, unit: 'F' });
    const y = await degreeDaysForPeriod(staff, { station: 'ALPHA-WX', start: '2022-01-01', end: '2022-12-31', base: 65, unit: 'F' });
    const sum = m.months.reduce((s, x) => s + (x.hdd ?? 0), 0);
    expect(sum).toBeCloseTo(y.hdd.total!, 6);
    expect(m.normal?.years).toEqual([2021, 2022, 2023]);
  });
});

describe('weather from a file', () => {
  it('loads the valid days, refuses the bad lines, and shows gaps and interpolated days', async () => {
    await createStation(staff, { code: 'FILE-WX', name: 'Invented file station', latitude: null, longitude: null, elevationFt: null, serviceId: 'XXC00000001', installation: 'AAA' });
    const { readFileSync } = await import('node:fs');
    const bytes = new Uint8Array(readFileSync(new URL('../fixtures/imports/weather-daily-summaries.csv', import.meta.url)));
    const r = await importWeatherFile(staff, 'FILE-WX', { name: 'weather.csv', bytes }, 'standard');
    // Read by hand from the constructed fixture (see tests/fixtures/imports/README.md): lines 4
    // (Tmin above Tmax), 5 (150 °F), 7 (duplicate date) and 8 (2024-02-30) are refused.
    expect(r.counts).toMatchObject({ rows: 9, new: 5, rejected: 4 });
    expect(r.problems.filter((p) => p.severity === 'error').map((p) => [p.row, p.code])).toEqual([
      [4, 'tmin-above-tmax'],
      [5, 'temperature-out-of-range'],
      [7, 'duplicate-date'],
      [8, 'impossible-date'],
    ]);
    const detail = await stationDetail(staff, 'FILE-WX');
    // Stored: Jan 1, 2 (no Tmax), 5, 6 (Tmax failed QC), 7. Jan 2 and 6 lack a value and Jan 3-4
    // were refused: Jan 2-4 is a gap of three days; Jan 6 alone is interpolated.
    expect(detail.firstDate).toBe('2024-01-01');
    expect(detail.lastDate).toBe('2024-01-07');
    expect(detail.gaps).toEqual([{ start: '2024-01-02', end: '2024-01-04', days: 3 }]);
    expect(detail.interpolatedDays).toEqual(['2024-01-06']);
    expect(detail.coverage[0]!.complete).toBe(false);
  });

  it('installation staff cannot load weather into a station of another installation', async () => {
    const other = await actor('installation_staff', [fx.b.id]);
    await expect(fetchWeather(other, 'ALPHA-WX', { start: '2024-01-01', end: '2024-01-31' })).rejects.toMatchObject({ status: 404 });
  });
});
